/**
 * A field typed over in a table is read into the arrays of the column it replaces
 * (cells/table/model-rows.ts, src/doc/csv-columns.ts `patchNumberColumn` in place), and
 * sums and variances borrow the column's cached reading instead of copying it
 * (src/functions/columns.ts). The old column's values are then gone: the engine, which
 * stops re-evaluating at a value that did not change (sameValue), and the page's ledger,
 * which sends only the rows that changed (changedRows), must still tell the new column from
 * it. (They do so by a mark on the column written over, and the decimal texts, never
 * written in place, would tell them apart too; so this checks the outcome, edit after
 * edit, not one of those two ways alone.)
 *
 * Checked as the evaluation worker runs: splice edits of fields, one after another, each
 * followed by an update of the engine that kept everything from before and by the message
 * to the page. After every edit each cell's value must be what a fresh engine gives for the
 * same document, and what the page decodes must be what the worker holds.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { CELL_KINDS } from '../../cells/kinds.ts';
import { ColumnReceiver, ColumnSender } from '../../src/app/column-ledger.ts';
import { applyEdit, cellsTouched } from '../../src/doc/edits.ts';
import { readDocument } from '../../src/doc/format.ts';
import { BUILTINS } from '../../src/functions/index.ts';
import { Engine } from '../../src/graph/engine.ts';
import { type Table, type Value } from '../../src/lang/values.ts';
import { shown, typeOver } from './typed-over.ts';


// long enough for the page's ledger to keep the columns (LEDGER_MIN_LENGTH)
const ROWS = 300;

function startText(): string {
  const lines = ['plot,a,b'];
  for (let i = 0; i < ROWS; i++) lines.push(`${i + 1},${(i % 7) + 1}.5,${1000000 + (i % 5) / 10}`);
  return [
    'furrow 1',
    'title: typed over',
    '',
    '--- table t',
    lines.join('\n'),
    '',
    '--- formula',
    'y = t.a',
    '',
    '--- formula',
    'z = y',
    '',
    '--- formula',
    's = sum(t.a)',
    '',
    '--- formula',
    'm = mean(z)',
    '',
    '--- formula',
    'v = variance(t.b)',
    '',
    '--- formula',
    'w = sd(t.a) + sum(t.b)',
    '',
    '--- formula',
    'q = median(t.a)',
    '',
  ].join('\n');
}


const numberText = fc.oneof(
  fc.constantFrom('', ' ', '0', '-0', '2.5', '1e3', '1000000.3', '7', '7.0', '12345678901234567890'),
  fc.integer({ min: -99999, max: 99999 }).map((k) => (k / 100).toString()),
);
const fieldText = fc.oneof({ weight: 12, arbitrary: numberText }, { weight: 1, arbitrary: fc.constantFrom('x', 'n/a') });

describe('fields typed over in place', () => {
  it('every cell, and what the page decodes, is what a fresh evaluation gives, edit after edit', () => {
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.nat({ max: ROWS - 1 }), fc.integer({ min: 1, max: 2 }), fieldText), { minLength: 1, maxLength: 12 }), (edits) => {
        let doc = readDocument(startText(), { kinds: CELL_KINDS }).document;
        const engine = new Engine({ registry: BUILTINS, kinds: CELL_KINDS });
        const sender = new ColumnSender();
        const receiver = new ColumnReceiver();
        const send = (ran: readonly string[]): void => {
          const batch = sender.batch();
          const wire = ran.map((id) => {
            const s = engine.state(id)!;
            return { id, ...batch.encode(id, { value: s.value as Value, parts: s.parts }) };
          });
          const arrived = structuredClone(wire);
          batch.commit([]);
          const values = receiver.decodeAll(arrived, []);
          arrived.forEach((r, i) => expect(shown(values[i]!.value as Value)).toBe(shown(engine.state(r.id)!.value as Value)));
        };
        send(engine.update(doc));
        for (const [row, col, text] of edits) {
          const edit = typeOver(doc, row, col, text);
          doc = applyEdit(doc, edit).document;
          send(engine.update(doc, { touched: cellsTouched(edit) }));
          const fresh = new Engine({ registry: BUILTINS, kinds: CELL_KINDS });
          fresh.update(doc);
          for (const name of ['t', 'y', 'z', 's', 'm', 'v', 'w', 'q']) expect(shown(engine.valueOf(name)), name).toBe(shown(fresh.valueOf(name)));
        }
      }),
      { numRuns: Number(process.env.RUNS ?? 60), seed: process.env.SEED === undefined ? 20261203 : Number(process.env.SEED) },
    );
  });

  it('typing along a row reads each column again in its changed row, in place, whatever the lengths typed', () => {
    let doc = readDocument(startText(), { kinds: CELL_KINDS }).document;
    const engine = new Engine({ registry: BUILTINS, kinds: CELL_KINDS });
    engine.update(doc);
    const arrays = () => {
      const t = engine.valueOf('t') as Table;
      return [t.columns[1]!.values, t.columns[2]!.values];
    };
    const before = arrays();
    // a, then b, then a again... in one row and the next, typed longer and shorter
    const steps: [number, number, string][] = [
      [3, 1, '12.25'],
      [3, 2, '7'],
      [4, 1, '3'],
      [4, 2, '1000000.123'],
      [5, 1, ''],
      [5, 2, '2.5'],
    ];
    for (const [row, col, text] of steps) {
      const edit = typeOver(doc, row, col, text);
      doc = applyEdit(doc, edit).document;
      engine.update(doc, { touched: cellsTouched(edit) });
      const fresh = new Engine({ registry: BUILTINS, kinds: CELL_KINDS });
      fresh.update(doc);
      for (const name of ['t', 's', 'v', 'w']) expect(shown(engine.valueOf(name)), `${name} after ${text}`).toBe(shown(fresh.valueOf(name)));
    }
    // never built afresh: each column's values are still the arrays it was first read into
    const after = arrays();
    expect(after[0]).toBe(before[0]);
    expect(after[1]).toBe(before[1]);
  });

  it('an edit that gives a field its old value back still reaches the cells that read the column', () => {
    let doc = readDocument(startText(), { kinds: CELL_KINDS }).document;
    const engine = new Engine({ registry: BUILTINS, kinds: CELL_KINDS });
    engine.update(doc);
    const s0 = engine.valueOf('s') as number;
    // 1.5 -> 9.5 -> 1.5: the second edit writes the same arrays back to what they first held
    for (const text of ['9.5', '1.5']) {
      const edit = typeOver(doc, 0, 1, text);
      doc = applyEdit(doc, edit).document;
      engine.update(doc, { touched: cellsTouched(edit) });
    }
    expect(engine.valueOf('s')).toBe(s0);
    const edit = typeOver(doc, 0, 1, '9.5');
    doc = applyEdit(doc, edit).document;
    const ran = engine.update(doc, { touched: cellsTouched(edit) });
    // y holds the column itself and z holds y: they and the cells that read them ran
    expect(ran).toEqual(expect.arrayContaining(doc.cells.slice(1, 5).map((c) => c.id)));
    expect(engine.valueOf('s')).toBe(s0 + 8);
    expect(engine.valueOf('m')).toBeCloseTo((s0 + 8) / ROWS, 12);
  });
});
