/**
 * The page's side of the evaluation worker: sends the document when one is opened and then
 * each edit the store applied, marks the cells the worker says an edit may change as
 * 'pending' when the answer is slow (so the page says which numbers are about to change),
 * and folds the worker's results into per-cell states.
 */
import type { BuiltinInfo, CellViewState, NameCatalogue } from '../../cells/view-api.ts';
import type { Document } from '../doc/document.ts';
import type { Edit } from '../doc/edits.ts';
import { ColumnReceiver } from './column-ledger.ts';
import type { FromWorker, ToWorker } from './protocol.ts';
import type { Value } from '../lang/values.ts';

export interface BridgeEvents {
  /** States changed (after a result, or when cells were marked pending). */
  onStates(changed: ReadonlySet<string>): void;
  /** The worker reported a fault it could not put on a cell. */
  onFailure(message: string): void;
}

/** Creates the worker; separated so tests can give a fake. */
export type WorkerFactory = () => Worker;

/** How long an evaluation may take before its cells are shown as re-evaluating. */
export const PENDING_DELAY_MS = 80;

const defaultWorker: WorkerFactory = () => new Worker(new URL('./worker.ts', import.meta.url), { type: 'module', name: 'furrow-evaluation' });

export class EvaluationBridge {
  private readonly worker: Worker;
  private seq = 0;
  private readonly states = new Map<string, CellViewState>();
  /** Cells marked pending, with the update that marked them. */
  private readonly pending = new Map<string, number>();
  /** Updates sent and not yet answered. */
  private readonly unanswered = new Set<number>();
  /** When each unanswered update was sent. */
  private readonly sentAt = new Map<number, number>();
  private builtins: readonly BuiltinInfo[] = [];
  private cellNames: NameCatalogue['cells'] = [];
  /** The page's document, sent again if the worker falls out of step. */
  private readonly current: () => Document;
  /** Milliseconds the worker took for the last update. */
  lastMillis = 0;
  /** Where a long update stands, while it runs. */
  step: { id: string; done: number; total: number } | null = null;
  /** Resolves each time a result arrives (tests and the performance check wait on it). */
  private waiters: (() => void)[] = [];
  private readonly events: BridgeEvents;
  /** The long columns held here, which results refer to instead of sending them again. */
  private columns = new ColumnReceiver();

  constructor(events: BridgeEvents, current: () => Document, factory: WorkerFactory = defaultWorker) {
    this.events = events;
    this.current = current;
    this.worker = factory();
    this.worker.onmessage = (e: MessageEvent<FromWorker>) => this.receive(e.data);
    this.worker.onerror = (e) => events.onFailure(`The evaluation worker stopped: ${e.message || 'unknown error'}. Reload the page; your document is saved.`);
  }

  /** The state of a cell, if known. */
  state(id: string): CellViewState | null {
    return this.states.get(id) ?? null;
  }

  /** What completion may offer. */
  catalogue(): NameCatalogue {
    // the same object while nothing in it changed: every cell view takes it as a property,
    // and a new one at each render would update every cell of the document
    if (this.shownCatalogue.builtins !== this.builtins || this.shownCatalogue.cells !== this.cellNames) {
      this.shownCatalogue = { builtins: this.builtins, cells: this.cellNames };
    }
    return this.shownCatalogue;
  }

  private shownCatalogue: NameCatalogue = { builtins: [], cells: [] };

  /** True while an update has not come back. */
  get busy(): boolean {
    return this.unanswered.size > 0;
  }

  /** Sends CSV files that tables may name; the cells that read them re-evaluate. */
  files(files: ReadonlyArray<readonly [string, string | undefined]>): void {
    this.post({ type: 'files', seq: this.next(), files });
  }

  /** Sends a document opened (or reloaded): the worker evaluates all of it. */
  load(doc: Document, forget = false): void {
    this.post(forget ? { type: 'load', seq: this.next(), doc, forget } : { type: 'load', seq: this.next(), doc });
  }

  /** Sends an edit the store applied: the worker applies it to its document too. */
  edit(edit: Edit): void {
    this.post({ type: 'edit', seq: this.next(), edit });
  }

  /** Resolves when the worker has answered every update sent so far. */
  settled(): Promise<void> {
    if (this.unanswered.size === 0) return Promise.resolve();
    return new Promise((resolve) => this.waiters.push(resolve));
  }

  private next(): number {
    const seq = ++this.seq;
    this.unanswered.add(seq);
    this.sentAt.set(seq, performance.now());
    return seq;
  }

  private post(m: ToWorker): void {
    this.worker.postMessage(m);
  }

  /**
   * The worker's plan for an update: the cells that may change. Say "re-evaluating" only
   * when the answer is slow to come (PENDING_DELAY_MS after the update was sent): a quick
   * evaluation then shows its new values without the page flickering through a pending
   * state first.
   */
  private plan(seq: number, ids: readonly string[]): void {
    if (!this.unanswered.has(seq)) return;
    for (const id of ids) this.pending.set(id, seq);
    const wait = Math.max(0, PENDING_DELAY_MS - (performance.now() - (this.sentAt.get(seq) ?? 0)));
    setTimeout(() => {
      const changed = new Set<string>();
      for (const id of ids) {
        if (this.pending.get(id) !== seq) continue;
        const old = this.states.get(id);
        this.states.set(id, { status: 'pending', value: old?.value ?? null, parts: old?.parts ?? null, warnings: old?.warnings ?? [], error: old?.error ?? null, progress: null });
        changed.add(id);
      }
      if (changed.size > 0) this.events.onStates(changed);
    }, wait);
  }

  private previous = new Map<string, CellViewState>();

  private receive(m: FromWorker): void {
    switch (m.type) {
      case 'ready':
        this.builtins = m.builtins;
        this.events.onStates(new Set());
        return;
      case 'progress': {
        const s = this.states.get(m.id);
        if (s !== undefined) {
          this.states.set(m.id, { ...s, progress: m.fraction });
          this.events.onStates(new Set([m.id]));
        }
        return;
      }
      case 'step': {
        this.step = { id: m.id, done: m.done, total: m.total };
        const s = this.states.get(m.id);
        // the running cell shows a progress bar with the share of the document done
        this.states.set(m.id, { status: 'pending', value: s?.value ?? null, parts: s?.parts ?? null, warnings: s?.warnings ?? [], error: s?.error ?? null, progress: m.total > 0 ? m.done / m.total : null });
        this.events.onStates(new Set([m.id]));
        return;
      }
      case 'planned':
        this.plan(m.seq, m.ids);
        return;
      case 'failure':
        this.clearPending(m.seq, new Set());
        if (m.outOfStep) {
          // the worker's document no longer follows the page's: send the page's again
          this.load(this.current());
          return;
        }
        this.events.onFailure(`Evaluation failed: ${m.message}`);
        return;
      case 'result': {
        const changed = new Set<string>();
        let decoded: { value: Value; parts: Value[] | null }[];
        try {
          decoded = this.columns.decodeAll(m.results, m.gone);
        } catch {
          // the column ledgers fell out of step (they should not): start both afresh, and
          // have the worker send the document's values again, whole
          this.columns = new ColumnReceiver();
          this.clearPending(m.seq, changed);
          this.load(this.current(), true);
          return;
        }
        for (const [i, r] of m.results.entries()) {
          const { value, parts } = decoded[i]!;
          const s: CellViewState = { status: r.status, value, parts, warnings: r.warnings, error: r.error, progress: null };
          this.previous.set(r.id, s);
          // a later update may already have marked this cell again: keep it pending then
          const mark = this.pending.get(r.id);
          if (mark !== undefined && mark > m.seq) this.states.set(r.id, { ...s, status: 'pending' });
          else {
            this.states.set(r.id, s);
            this.pending.delete(r.id);
          }
          changed.add(r.id);
        }
        this.step = null;
        // kept as it was when the names, types and members are the same (most updates)
        if (!sameCellNames(this.cellNames, m.cells)) this.cellNames = m.cells;
        this.lastMillis = m.millis;
        // forget cells that left the document
        for (const id of m.gone) {
          this.states.delete(id);
          this.previous.delete(id);
          this.pending.delete(id);
        }
        this.clearPending(m.seq, changed);
        this.events.onStates(changed);
        return;
      }
    }
  }

  /**
   * Update `seq` is answered: cells it (or an earlier update) marked pending that did not
   * run go back to their last state.
   */
  private clearPending(seq: number, changed: Set<string>): void {
    for (const s of this.unanswered) {
      if (s <= seq) {
        this.unanswered.delete(s);
        this.sentAt.delete(s);
      }
    }
    for (const [id, mark] of [...this.pending]) {
      if (mark > seq) continue;
      this.pending.delete(id);
      const prev = this.previous.get(id);
      const s = this.states.get(id);
      if (s !== undefined && s.status === 'pending') {
        this.states.set(id, prev ?? { ...s, status: 'ok' });
        changed.add(id);
      }
    }
    if (this.unanswered.size === 0) {
      const w = this.waiters;
      this.waiters = [];
      for (const f of w) f();
    }
  }
}

/** True when two lists of the document's names say the same. */
function sameCellNames(a: NameCatalogue['cells'], b: NameCatalogue['cells']): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) {
    const x = a[i]!;
    const y = b[i]!;
    if (x.name !== y.name || x.type !== y.type || x.members.length !== y.members.length) return false;
    for (let k = 0; k < x.members.length; k++) if (x.members[k] !== y.members[k]) return false;
  }
  return true;
}
