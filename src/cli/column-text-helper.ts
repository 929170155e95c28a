/**
 * A second thread for `furrow run --json`: a million fitted values take about a second to
 * turn into text on one thread, and the machine has at least two cores. The helper makes the
 * text of half of each long number column (src/cli/json-stream.ts decides which half) while
 * the main thread makes the other half and writes.
 *
 * The helper never changes the output: it runs the same `numbersJsonBytes` as the main
 * thread, and when it cannot start or fails, the main thread makes the text itself.
 */
import type { Worker } from 'node:worker_threads';
import { numbersJsonBytes } from '../lang/json.ts';
import type { ColumnBytes } from './json-stream.ts';
import type { ColumnTextAnswer, ColumnTextRequest } from './column-text-worker.ts';

interface Job {
  readonly values: Float64Array;
  readonly missing: Uint8Array | null;
  readonly resolve: (bytes: Uint8Array) => void;
}

export class ColumnTextHelper implements ColumnBytes {
  private worker: Worker | null = null;
  private started = false;
  private nextId = 0;
  private readonly jobs = new Map<number, Job>();

  /** `script` is the built worker (build/cli/column-text-worker.mjs). */
  constructor(private readonly script: string | URL) {}

  /** Whether a thread of its own makes the text (false before the first request, and after it failed or closed). */
  get threaded(): boolean {
    return this.worker !== null;
  }

  numbers(values: Float64Array, missing: Uint8Array | null, from: number, to: number): Promise<Uint8Array> {
    // copies: the column stays the engine's, the copies move to the helper and are gone
    const part = values.slice(from, to);
    const marks = missing === null ? null : missing.slice(from, to);
    return new Promise((resolve) => {
      const worker = this.ensureWorker();
      if (worker === null) {
        resolve(numbersJsonBytes(part, marks));
        return;
      }
      const id = this.nextId++;
      this.jobs.set(id, { values: part, missing: marks, resolve });
      // while an answer is awaited the thread keeps the process alive, and only then
      worker.ref();
      const request: ColumnTextRequest = { id, values: part, missing: marks };
      worker.postMessage(request);
    });
  }

  /**
   * Ends the helper thread (the process can end without it). Called once the output is
   * written, or has failed: answers still owed are dropped, not made here instead.
   */
  close(): void {
    const w = this.worker;
    this.worker = null;
    this.started = true;
    this.jobs.clear();
    if (w !== null) void w.terminate();
  }

  private ensureWorker(): Worker | null {
    if (this.started) return this.worker;
    this.started = true;
    const threads = threadsModule();
    if (threads === null) return null;
    try {
      const w = new threads.Worker(this.script);
      w.on('message', (a: ColumnTextAnswer) => {
        const job = this.jobs.get(a.id);
        this.jobs.delete(a.id);
        job?.resolve(a.bytes);
        if (this.jobs.size === 0) w.unref();
      });
      // a helper that fails hands its work back: the main thread makes those texts itself
      const fail = (): void => {
        this.worker = null;
        for (const job of this.jobs.values()) job.resolve(numbersJsonBytes(job.values, job.missing));
        this.jobs.clear();
      };
      w.on('error', fail);
      w.on('exit', fail);
      // idle, it must never keep the process alive
      w.unref();
      this.worker = w;
    } catch {
      this.worker = null;
    }
    return this.worker;
  }
}

/**
 * Node's threads module, taken when the first long column comes: most runs never need it.
 * `process.getBuiltinModule` (Node 20.16 and later) gives it without a module loader, and
 * keeps the command line's build free of `import()` (bin/code-cache.js compiles only such
 * chunks from V8's code cache). Null elsewhere: the main thread then makes all the text.
 */
function threadsModule(): typeof import('node:worker_threads') | null {
  const proc = (globalThis as { process?: { getBuiltinModule?: (id: string) => unknown } }).process;
  return (proc?.getBuiltinModule?.('node:worker_threads') as typeof import('node:worker_threads') | undefined) ?? null;
}
