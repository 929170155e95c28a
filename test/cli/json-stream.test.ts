/**
 * `furrow run --json` written as it goes (src/cli/json-stream.ts) against the report built
 * in one piece from the canonical JSON of src/lang/json.ts, as the command line built it
 * before it streamed: the two must agree byte for byte on every sample and on values made
 * to cross the slice boundaries; and the writer must wait when the stream is full.
 */
import { spawnSync } from 'node:child_process';
import { EventEmitter } from 'node:events';
import { mkdtempSync, readdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { loadDocument } from '../../src/cli/main.ts';
import { reportPieces, valuePieces, writePieces, type ColumnBytes, type Piece, type PieceSink } from '../../src/cli/json-stream.ts';
import type { CellState } from '../../src/graph/engine.ts';
import { numbersJsonBytes, toJson } from '../../src/lang/json.ts';
import { MISSING, booleanColumn, numberColumn, record, table, textColumn, typeOf, type Column, type Value } from '../../src/lang/values.ts';

/** The report as `furrow run --json` built it before it streamed: one string, from toJson. */
function wholeReport(states: CellState[]): string {
  const cells = states.map((s, i) => {
    const v = s.value;
    const isErr = typeof v === 'object' && v.kind === 'error';
    const err = s.error;
    const fields = [
      `"index":${i}`,
      `"kind":${JSON.stringify(s.kind)}`,
      `"name":${s.name === null ? 'null' : JSON.stringify(s.name)}`,
      `"type":${JSON.stringify(isErr ? 'error' : typeOf(v))}`,
      `"value":${isErr ? 'null' : toJson(v)}`,
      `"error":${err ? toJson(err) : 'null'}`,
    ];
    if (s.warnings.length > 0) fields.push(`"warnings":${JSON.stringify(s.warnings)}`);
    return `{${fields.join(',')}}`;
  });
  return `{"furrow":1,"cells":[${cells.join(',\n')}]}`;
}

const SAMPLES = readdirSync('samples')
  .filter((f) => f.endsWith('.furrow'))
  .map((f) => join('samples', f));

/** A stream stand-in that keeps what it is given and says "full" after `room` characters until drained. */
class SlowSink extends EventEmitter implements PieceSink {
  readonly chunks: string[] = [];
  pending = 0;
  constructor(readonly room: number) {
    super();
  }
  write(chunk: string | Uint8Array): boolean {
    this.chunks.push(typeof chunk === 'string' ? chunk : new TextDecoder().decode(chunk));
    this.pending += chunk.length;
    return this.pending < this.room;
  }
  drain(): void {
    this.pending = 0;
    this.emit('drain');
  }
}

/** Writes to a SlowSink that drains on the next turn of the event loop; returns the text. */
async function streamed(pieces: Iterable<Piece>, bufferChars: number): Promise<string> {
  const sink = new SlowSink(bufferChars);
  sink.on('newListener', (event) => {
    if (event === 'drain') setImmediate(() => sink.drain());
  });
  await writePieces(pieces, sink, '\n', bufferChars);
  return sink.chunks.join('');
}

describe('furrow run --json, streamed', () => {
  it('gives the same bytes as the report built in one piece, on every sample', async () => {
    expect(SAMPLES.length).toBeGreaterThan(0);
    for (const path of SAMPLES) {
      const states = loadDocument(path).engine.states();
      const whole = wholeReport(states);
      expect([...reportPieces(states)].join(''), path).toBe(whole);
      // slices of 3 elements and 100-character buffers cross every boundary there is
      expect([...reportPieces(states, 3)].join(''), path).toBe(whole);
      expect(await streamed(reportPieces(states, 3), 100), path).toBe(`${whole}\n`);
    }
  });

  it('bin/furrow.js writes those bytes to a pipe (two samples: the wiring; the test above covers them all)', () => {
    // the two largest outputs among the samples
    for (const path of ['samples/adhesive-cure.furrow', 'samples/lamb-rations-covariate.furrow']) {
      const r = spawnSync(process.execPath, ['bin/furrow.js', 'run', path, '--json'], { encoding: 'utf8', maxBuffer: 1 << 26 });
      expect(r.status, `${path}\n${r.stderr}`).toBe(0);
      expect(r.stdout, path).toBe(`${wholeReport(loadDocument(path).engine.states())}\n`);
    }
  });

  it('bin/furrow.js writes those bytes for a long table and fit, made on two threads', () => {
    // 60,000 rows: past HELPED_FROM, so the build's helper thread makes half of each number column
    const dir = mkdtempSync(join(tmpdir(), 'furrow-json-long-'));
    const rows = ['block,setting,y'];
    let s = 7;
    for (let b = 1; b <= 3000; b++) {
      for (let t = 1; t <= 20; t++) {
        s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
        rows.push(`${b},s${t},${(50 + t / 4 + (s / 4294967296 - 0.5) * 3).toFixed(3)}`);
      }
    }
    writeFileSync(join(dir, 'long.csv'), `${rows.join('\n')}\n`);
    const path = join(dir, 'long.furrow');
    writeFileSync(path, 'furrow 1\ntitle: Long\n\n--- table long from long.csv\n\n--- formula\nfit = blocked(long.y, long.setting, long.block)\n');
    const r = spawnSync(process.execPath, ['bin/furrow.js', 'run', path, '--json'], { encoding: 'utf8', maxBuffer: 1 << 28 });
    expect(r.status, r.stderr).toBe(0);
    expect(r.stdout === `${wholeReport(loadDocument(path).engine.states())}\n`).toBe(true);
  });

  it('slices long columns exactly at their ends, for every kind of element', () => {
    const numbers = (n: number): Column => {
      const v = new Float64Array(n);
      const missing = new Uint8Array(n);
      for (let i = 0; i < n; i++) {
        v[i] = i % 7 === 0 ? -0 : i % 11 === 0 ? NaN : i % 13 === 0 ? -Infinity : i / 3;
        missing[i] = i % 5 === 4 ? 1 : 0;
      }
      return numberColumn(v, missing);
    };
    const texts = (n: number): Column => textColumn(Array.from({ length: n }, (_, i) => `"q${i}"\\\n\u0001`));
    const booleans = (n: number): Column => booleanColumn(Uint8Array.from({ length: n }, (_, i) => i % 2));
    for (const slice of [1, 2, 4]) {
      for (const n of [0, 1, slice - 1, slice, slice + 1, 2 * slice, 2 * slice + 1, 9]) {
        if (n < 0) continue;
        for (const v of [numbers(n), texts(n), booleans(n)]) {
          const pieces = [...valuePieces(v, slice)];
          expect(pieces.join(''), `slice ${slice}, length ${n}`).toBe(toJson(v));
          if (n > slice) expect(pieces.length).toBeGreaterThan(2);
        }
      }
    }
    const tbl = table(['__proto__', 'y "q"', 'ok'], [texts(5), numbers(5), booleans(5)]);
    const rec = record([
      ['t', tbl],
      ['n', 3],
      ['gone', MISSING],
      ['inner', record([['c', numbers(6)]])],
    ]);
    expect([...valuePieces(tbl, 2)].join('')).toBe(toJson(tbl));
    expect([...valuePieces(rec, 2)].join('')).toBe(toJson(rec));
    expect([...valuePieces(record([]), 2)].join('')).toBe('{}');
  });

  it('gives the same bytes with number columns as bytes and a helper making half of each long one', async () => {
    // a helper that answers late, on a later turn of the event loop, as a thread does
    const asked: [number, number][] = [];
    const late: ColumnBytes = {
      numbers: (values, missing, from, to) => {
        asked.push([from, to]);
        return new Promise((resolve) => setTimeout(() => resolve(numbersJsonBytes(values, missing, from, to)), 5));
      },
    };
    for (const path of SAMPLES) {
      const states = loadDocument(path).engine.states();
      const whole = wholeReport(states);
      expect(await streamed(reportPieces(states, 3, late), 100), path).toBe(`${whole}\n`);
    }
    // a long number column (the helper's share starts at HELPED_FROM elements), with every special value
    const n = 120_001;
    const v = new Float64Array(n);
    const missing = new Uint8Array(n);
    for (let i = 0; i < n; i++) {
      v[i] = i % 7 === 0 ? -0 : i % 11 === 0 ? NaN : i % 13 === 0 ? -Infinity : i % 17 === 0 ? Infinity : (i - 5000) / 3e5;
      missing[i] = i % 5 === 4 ? 1 : 0;
    }
    const long = record([
      ['y', numberColumn(v, missing)],
      ['ok', booleanColumn(Uint8Array.from({ length: n }, (_, i) => i % 3 & 1), Uint8Array.from({ length: n }, (_, i) => (i % 9 === 0 ? 1 : 0)))],
      ['t', table(['a'], [numberColumn(v.slice(0, 60_000))])],
    ]);
    asked.length = 0;
    const pieces = [...valuePieces(long, 8192, late)];
    expect(pieces.some((p) => p instanceof Promise)).toBe(true);
    expect(pieces.some((p) => p instanceof Uint8Array)).toBe(true);
    expect(await streamed(pieces, 1000)).toBe(`${toJson(long)}\n`);
    // the second half of each long number column, and nothing of the boolean column
    expect(asked).toEqual([
      [60_001, 120_001],
      [30_000, 60_000],
    ]);

    // typed columns: one typed as its canonical texts is written here alone, its texts
    // copied; one typed with trailing zeros (2.50) is shared with the helper as before
    const typedColumn = (n: number, text: (i: number) => string): Column => {
      const texts = Array.from({ length: n }, (_, i) => text(i));
      const from = new Int32Array(n);
      const to = new Int32Array(n);
      let at = 0;
      texts.forEach((t, i) => {
        from[i] = at;
        to[i] = at + t.length;
        at += t.length + 1;
      });
      return numberColumn(Float64Array.from(texts, Number), null, null, { source: texts.join(','), from, to });
    };
    const typed = record([
      ['as typed', typedColumn(70_000, (i) => (i % 50 === 0 ? '1e3' : `${(i % 997) - 400}.${(i % 9) + 1}`))],
      ['zeros', typedColumn(60_000, (i) => `${i % 1000}.${i % 10}0`)],
    ]);
    asked.length = 0;
    expect(await streamed([...valuePieces(typed, 8192, late)], 1000)).toBe(`${toJson(typed)}\n`);
    expect(asked).toEqual([[30_000, 60_000]]);
  });

  it('waits for the stream to drain before it makes more text', async () => {
    let pulled = 0;
    function* counted(): Generator<string> {
      for (let i = 0; i < 10; i++) {
        pulled++;
        yield 'abcdefghij';
      }
    }
    const sink = new SlowSink(10);
    const done = writePieces(counted(), sink, '\n', 20);
    // the first write of 20 characters filled the stream: nothing more is pulled until it drains
    await new Promise((r) => setImmediate(r));
    expect(sink.chunks).toEqual(['abcdefghijabcdefghij']);
    expect(pulled).toBe(2);
    sink.drain();
    await new Promise((r) => setImmediate(r));
    expect(sink.chunks.length).toBe(2);
    expect(pulled).toBe(4);
    while (sink.listenerCount('drain') > 0) {
      sink.drain();
      await new Promise((r) => setImmediate(r));
    }
    await done;
    expect(sink.chunks.join('')).toBe(`${'abcdefghij'.repeat(10)}\n`);
  });

  it('rejects when the stream fails while it waits', async () => {
    const sink = new SlowSink(1);
    const done = writePieces(['x'.repeat(5), 'y'], sink, '', 2);
    await new Promise((r) => setImmediate(r));
    sink.emit('error', new Error('pipe closed'));
    await expect(done).rejects.toThrow('pipe closed');
  });
});
