/**
 * The two column ledgers (src/app/column-ledger.ts): whatever the worker's cells hold from
 * message to message (new tables, tables with a few elements changed, columns shared
 * between cells, cells removed, messages that were never posted), the page decodes the
 * very values the worker had, and both sides hold the same columns. And a field edit in
 * a 100,000-row table travels in a message of a few hundred bytes.
 */
import { serialize } from 'node:v8';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ColumnReceiver, ColumnSender, LEDGER_MIN_LENGTH, changedRows, type CellValues, type WireValue } from '../../src/app/column-ledger.ts';
import { noteColumnChange, noteWrittenOver } from '../../src/lang/column-changes.ts';
import {
  booleanColumn,
  decimalAt,
  numberColumn,
  record,
  table,
  textColumn,
  type Column,
  type Table,
  type TextRanges,
  type Value,
} from '../../src/lang/values.ts';

/** A number column whose decimal texts are ranges of one text, as a table reading makes them. */
function numbers(texts: readonly string[], name = 'y'): Column {
  const from = new Int32Array(texts.length);
  const to = new Int32Array(texts.length);
  let source = '';
  texts.forEach((t, i) => {
    from[i] = source.length;
    source += t;
    to[i] = source.length;
    source += ',';
  });
  const missing = Uint8Array.from(texts, (t) => (t === '' ? 1 : 0));
  const values = Float64Array.from(texts, (t) => (t === '' ? NaN : Number(t)));
  const ranges: TextRanges = { source, from, to };
  return numberColumn(values, missing, name, ranges);
}

/** A value with every column spelled out, decimal texts included, for comparing. */
function plain(v: Value): unknown {
  if (typeof v !== 'object') return v;
  switch (v.kind) {
    case 'column':
      return {
        type: v.type,
        name: v.name,
        order: v.order ?? null,
        values: Array.from(v.values as ArrayLike<unknown>, (x) => (typeof x === 'number' && Number.isNaN(x) ? 'NaN' : Object.is(x, -0) ? '-0' : x)),
        missing: v.missing === null ? null : Array.from(v.missing),
        decimals: v.type === 'number' && v.decimals !== null ? Array.from({ length: v.values.length }, (_, i) => decimalAt(v.decimals!, i)) : null,
      };
    case 'table':
      return { names: v.names, rows: v.rows, columns: v.columns.map(plain) };
    case 'record':
      return { tag: v.tag, fields: [...v.fields].map(([k, x]) => [k, plain(x)]) };
    default:
      return v;
  }
}

/** Sends one message: encodes, clones as postMessage would, decodes; or drops it unsent. */
function deliver(sender: ColumnSender, receiver: ColumnReceiver, ran: ReadonlyMap<string, CellValues>, gone: readonly string[], posted = true): { bytes: number; decoded: Map<string, Value[]> } {
  const batch = sender.batch();
  const wire = [...ran].map(([id, v]) => ({ id, ...batch.encode(id, v) }));
  const bytes = serialize(wire).length;
  const decoded = new Map<string, Value[]>();
  if (!posted) return { bytes, decoded };
  const arrived = structuredClone(wire);
  batch.commit(gone);
  const values = receiver.decodeAll(arrived, gone);
  arrived.forEach((r, i) => decoded.set(r.id, [values[i]!.value, ...(values[i]!.parts ?? [])]));
  return { bytes, decoded };
}

const text = fc.oneof(fc.constantFrom('', '0', '-0', '1.50', '2', '1e3', '-7.25'), fc.integer({ min: -999, max: 999 }).map(String));

describe('the column ledgers of the worker and the page', () => {
  it('the page decodes exactly what the worker held, message after message', () => {
    // one step: which cell runs and what becomes of its value
    const step = fc.record({
      cell: fc.constantFrom('a', 'b', 'c', 'd'),
      what: fc.constantFrom('new', 'patch', 'share', 'alias', 'record', 'number', 'gone', 'unsent'),
      length: fc.constantFrom(3, LEDGER_MIN_LENGTH, 700),
      seed: fc.nat(),
      texts: fc.array(text, { minLength: 1, maxLength: 8 }),
      kind: fc.constantFrom('number', 'text', 'boolean'),
    });
    fc.assert(
      fc.property(fc.array(fc.array(step, { minLength: 1, maxLength: 3 }), { minLength: 1, maxLength: 12 }), (messages) => {
        const sender = new ColumnSender();
        const receiver = new ColumnReceiver();
        const held = new Map<string, Value>();
        // what the page shows for each cell, and as what it was decoded: a column patched in
        // place must never be one that another cell still shows
        const shown = new Map<string, { values: Value[]; when: unknown }>();
        for (const message of messages) {
          const ran = new Map<string, CellValues>();
          const gone: string[] = [];
          let posted = true;
          for (const s of message) {
            const pick = (i: number): string => s.texts[(s.seed + i) % s.texts.length]!;
            const fresh = (name: string): Column => {
              if (s.kind === 'text') return textColumn(Array.from({ length: s.length }, (_, i) => pick(i)), null, name);
              if (s.kind === 'boolean') return booleanColumn(Uint8Array.from({ length: s.length }, (_, i) => (s.seed + i) % 3 === 0 ? 1 : 0), null, name);
              return numbers(Array.from({ length: s.length }, (_, i) => pick(i)), name);
            };
            const before = held.get(s.cell);
            let value: Value;
            if (s.what === 'gone') {
              if (!held.has(s.cell) || ran.has(s.cell)) continue;
              gone.push(s.cell);
              continue;
            } else if (s.what === 'unsent') {
              posted = false;
              value = table(['x'], [fresh('x')]);
            } else if (s.what === 'patch' && before !== undefined && typeof before === 'object' && before.kind === 'table') {
              // a few elements of the first column changed, as a table read again makes it
              const t = before as Table;
              const base = t.columns[0]!;
              const n = base.values.length;
              const rows = Int32Array.from(new Set([s.seed % n, (s.seed * 7) % n]));
              let next: Column;
              if (base.type === 'number') {
                const texts = Array.from({ length: n }, (_, i) => decimalAt(base.decimals!, i)!);
                rows.forEach((r, j) => (texts[r] = s.texts[j % s.texts.length]!));
                next = numbers(texts, base.name ?? 'x');
              } else if (base.type === 'text') {
                const vs = base.values.slice();
                rows.forEach((r, j) => (vs[r] = s.texts[j % s.texts.length]!));
                next = textColumn(vs, null, base.name);
              } else {
                const vs = base.values.slice();
                rows.forEach((r) => (vs[r] = 1 - vs[r]!));
                next = booleanColumn(vs, null, base.name);
              }
              if (s.seed % 2 === 0) noteColumnChange(next, base, rows);
              value = table(t.names, [next, ...t.columns.slice(1)]);
            } else if (s.what === 'share') {
              // a column another cell holds, in a table of this one (as `y = big.y` does)
              const other = [...held.values()].find((v) => typeof v === 'object' && v.kind === 'table') as Table | undefined;
              value = table(['x'], [other === undefined ? fresh('x') : other.columns[0]!]);
            } else if (s.what === 'alias') {
              // another column with the same arrays as a column of this message or an earlier
              // one (a column with its levels put in order is one): on the page the two share
              // them when one message carries both
              const tables = [...[...ran.values()].map((v) => v.value), ...held.values()].filter((v): v is Table => typeof v === 'object' && v.kind === 'table');
              const other = tables[s.seed % Math.max(1, tables.length)];
              value = table(['x'], [other === undefined ? fresh('x') : ({ ...other.columns[0]!, name: 'alias' } as Column)]);
            } else if (s.what === 'record') {
              value = record([
                ['column', fresh('r')],
                ['n', s.seed],
              ]);
            } else if (s.what === 'number') {
              value = s.seed;
            } else {
              value = table(['x', 'w'], [fresh('x'), fresh('w')]);
            }
            ran.set(s.cell, { value, parts: s.seed % 3 === 0 ? [value] : null });
          }
          const { decoded } = deliver(sender, receiver, ran, gone, posted);
          if (!posted) continue;
          for (const [cell, v] of ran) {
            held.set(cell, v.value);
            const got = decoded.get(cell)!;
            expect(plain(got[0]!)).toEqual(plain(v.value));
            if (v.parts !== null) expect(plain(got[1]!)).toEqual(plain(v.parts[0]!));
            shown.set(cell, { values: got, when: got.map(plain) });
          }
          for (const cell of gone) {
            held.delete(cell);
            shown.delete(cell);
          }
          for (const [cell, { values, when }] of shown) expect(values.map(plain), `${cell} as the page shows it`).toEqual(when);
          expect(receiver.heldCount).toBe(sender.heldCount);
        }
      }),
      { numRuns: Number(process.env.RUNS ?? 300), seed: process.env.SEED === undefined ? 20261202 : Number(process.env.SEED) },
    );
  });

  it('a field edit in a 100,000-row table travels as the changed element, and the page holds no column twice', () => {
    const n = 100_000;
    const sender = new ColumnSender();
    const receiver = new ColumnReceiver();
    const texts = Array.from({ length: n }, (_, i) => String((i % 10) + 1));
    const k = numbers(Array.from({ length: n }, (_, i) => String(i + 1)), 'k');
    const y0 = numbers(texts, 'y');
    const first = deliver(sender, receiver, new Map([['big', { value: table(['k', 'y'], [k, y0]), parts: null }]]), []);
    expect(first.bytes).toBeGreaterThan(2_000_000);
    texts[0] = '20';
    const y1 = numbers(texts, 'y');
    const second = deliver(sender, receiver, new Map([['big', { value: table(['k', 'y'], [k, y1]), parts: null }], ['total', { value: 550_019, parts: null }]]), []);
    // measured, not a bound on speed: the size of the message is the point
    expect(second.bytes).toBeLessThan(1_000);
    expect(plain(second.decoded.get('big')![0]!)).toEqual(plain(table(['k', 'y'], [k, y1])));
    expect(receiver.heldCount).toBe(2);
    expect(sender.heldCount).toBe(2);
    // no other cell shows the old column: the new one took over its arrays
    const yShown = (d: Map<string, Value[]>): Column => (d.get('big')![0] as Table).columns[1]!;
    expect(yShown(second.decoded).values).toBe(yShown(first.decoded).values);
    // with another cell showing it, the old column stays as it was and the new one is a copy
    const z = deliver(sender, receiver, new Map([['view', { value: table(['y'], [y1]), parts: null }]]), []);
    texts[1] = '30';
    const y2 = numbers(texts, 'y');
    const third = deliver(sender, receiver, new Map([['big', { value: table(['k', 'y'], [k, y2]), parts: null }]]), []);
    expect(third.bytes).toBeLessThan(1_000);
    expect(yShown(third.decoded).values).not.toBe(yShown(second.decoded).values);
    expect((z.decoded.get('view')![0] as Table).columns[0]!.values[1]).toBe(2);
    expect(yShown(third.decoded).values[1]).toBe(30);
  });

  it('finds the rows where two columns differ, and declines columns of another kind or too many changes', () => {
    const a = numbers(['1', '2', '3.0', '']);
    expect(Array.from(changedRows(a, numbers(['1', '2', '3.00', '']), 4)!)).toEqual([2]);
    expect(Array.from(changedRows(a, numbers(['1', '', '3.0', '4']), 4)!)).toEqual([1, 3]);
    expect(changedRows(a, numbers(['1', '', '3.0', '4']), 1)).toBeNull();
    expect(changedRows(a, numbers(['1', '2', '3.0', ''], 'other'), 4)).toBeNull();
    expect(changedRows(a, textColumn(['1', '2', '3.0', ''], null, 'y'), 4)).toBeNull();
    expect(changedRows(a, numbers(['1', '2', '3.0']), 4)).toBeNull();
  });

  it('declines to compare a column written over in place with its successor, and compares other columns that share an array', () => {
    const values = Float64Array.of(1, 2, 3);
    const a = numberColumn(values, null, 'y');
    const b = numberColumn(values, null, 'y');
    expect(changedRows(a, b, 10)).toEqual(new Int32Array(0));
    noteWrittenOver(a);
    expect(changedRows(a, b, 10)).toBeNull();
    expect(changedRows(a, a, 10)).toEqual(new Int32Array(0));
  });
});
