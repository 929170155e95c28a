/**
 * A table edited in one field reads that field's line again, not the whole body: counted
 * on a 100,000-row table. And whatever the edit, reading again from what was kept gives
 * the same table, or the same error, as reading the new body in full.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { CELL_KINDS } from '../../../cells/kinds.ts';
import { tableWork } from '../../../cells/table/model-rows.ts';
import { analyseTable } from '../../../cells/table/model.ts';
import type { Cell, Document } from '../../../src/doc/document.ts';
import { applyEdit, cellsTouched, type Edit } from '../../../src/doc/edits.ts';
import { readDocument } from '../../../src/doc/format.ts';
import { BUILTINS } from '../../../src/functions/index.ts';
import type { AnalyseEnv, CellAnalysis } from '../../../src/graph/cell-kind.ts';
import { Engine } from '../../../src/graph/engine.ts';
import { toJson } from '../../../src/lang/json.ts';
import { decimalAt, isNumberColumn, isTable, type Value } from '../../../src/lang/values.ts';

const NO_FILES: AnalyseEnv = { files: { read: () => undefined } };

/** The table's value (or its error) as JSON, for comparing two readings. */
function reading(a: CellAnalysis): string {
  if (a.problem !== null) return `error: ${a.problem.message} @${a.problem.from}-${a.problem.to}`;
  const v = a.evaluate({} as never).value as Value;
  // the decimal texts too: the exact decimal shift reads them, and JSON does not show them
  const texts = isTable(v) ? v.columns.map((c) => (isNumberColumn(c) && c.decimals !== null ? Array.from({ length: c.values.length }, (_, i) => decimalAt(c.decimals!, i)) : null)) : null;
  return `${toJson(v)} ${JSON.stringify(texts)}`;
}

describe('reading a table again after an edit', () => {
  it('one field edit in a 100,000-row table reads one row and builds one column', () => {
    const rows: string[] = ['plot,block,variety,yield'];
    for (let i = 0; i < 100_000; i++) rows.push(`${i + 1},${(i % 4) + 1},v${i % 7},${(40 + (i % 13) / 10).toFixed(1)}`);
    const text = `furrow 1\ntitle: big\n\n--- table plots\n${rows.join('\n')}\n\n--- formula\ntotal = sum(plots.yield)\n`;
    let doc = readDocument(text, { kinds: CELL_KINDS }).document;
    const engine = new Engine({ registry: BUILTINS, kinds: CELL_KINDS });
    const before = { ...tableWork };
    engine.update(doc);
    expect(tableWork.rowsRead - before.rowsRead).toBe(100_001);
    const total0 = engine.valueOf('total') as number;
    const plots0 = engine.valueOf('plots');
    if (plots0 === undefined || !isTable(plots0)) throw new Error('plots is not a table');

    // row 50,000's yield, 40.x -> 99.5, as the grid sends it: the whole body with one field changed
    const table = doc.cells[0]!;
    const lines = table.body.split('\n');
    const old = lines[50_000]!;
    lines[50_000] = old.replace(/,[^,]*$/, ',99.5');
    const edit: Edit = { type: 'body', id: table.id, body: lines.join('\n') };
    doc = applyEdit(doc, edit).document;
    const mark = { ...tableWork };
    engine.update(doc, { touched: cellsTouched(edit) });
    const read = tableWork.rowsRead - mark.rowsRead;
    const built = tableWork.columnsBuilt - mark.columnsBuilt;
    expect(read).toBe(1);
    expect(built).toBe(1);
    const oldYield = Number(old.split(',')[3]);
    expect(engine.valueOf('total') as number).toBeCloseTo(total0 - oldYield + 99.5, 6);
    const plots = engine.valueOf('plots');
    if (plots === undefined || !isTable(plots)) throw new Error('plots is not a table');
    const y = plots.columns[3]!;
    if (!isNumberColumn(y)) throw new Error('yield is not numbers');
    expect(y.values[49_999]).toBe(99.5);
    expect(y.decimals === null ? null : decimalAt(y.decimals, 49_999)).toBe('99.5');
    // the untouched columns are the very same objects as before
    expect(plots.columns.slice(0, 3).every((c, j) => c === plots0.columns[j])).toBe(true);
    console.log(`    measured: one field edit in a 100,000-row table read ${read} row(s), built ${built} column(s)`);
  });

  it('gives what a full reading gives, for any edit of a small table', () => {
    const field = fc.oneof(fc.constantFrom('', '1', '2.5', '-3', 'x', 'true', 'a b'), fc.stringMatching(/^[0-9a-z.]{0,4}$/));
    const body = fc
      .tuple(fc.integer({ min: 1, max: 4 }), fc.integer({ min: 0, max: 6 }))
      .chain(([w, h]) =>
        fc.tuple(fc.array(fc.array(field, { minLength: w, maxLength: w }), { minLength: h, maxLength: h }), fc.constant(w)),
      )
      .map(([rows, w]) => `${Array.from({ length: w }, (_, j) => `c${j}`).join(',')}\n${rows.map((r) => `${r.join(',')}\n`).join('')}\n`);
    const splice = fc.tuple(fc.nat(), fc.nat({ max: 6 }), fc.stringMatching(/^[0-9a-z,.\n" -]{0,6}$/));
    fc.assert(
      fc.property(body, fc.array(splice, { minLength: 1, maxLength: 4 }), (start, splices) => {
        let doc: Document = { header: 'furrow 1', cells: [{ id: 'c1', marker: 'table t', eol: '\n', body: start }] } as unknown as Document;
        // two readings kept apart (a kept reading is read again at most once, KeptTable)
        let analysis = analyseTable(doc.cells[0]!, NO_FILES);
        let analysisCompared = analyseTable(doc.cells[0]!, NO_FILES);
        for (const [at, cut, insert] of splices) {
          const b = doc.cells[0]!.body;
          const from = at % (b.length + 1);
          const to = Math.min(b.length, from + cut);
          if (insert === b.slice(from, to)) continue;
          // made by a splice, the cell says where it changed (spliceOf); a copy of it does not,
          // and the two bodies are compared instead: both read as the full reader does
          doc = applyEdit(doc, { type: 'splice', id: 'c1', from, to, text: insert }).document;
          const cell = doc.cells[0]!;
          const again = analyseTable(cell, { ...NO_FILES, previous: analysis });
          const compared = analyseTable({ ...cell }, { ...NO_FILES, previous: analysisCompared });
          const full = analyseTable(cell, NO_FILES);
          expect(reading(again)).toBe(reading(full));
          expect(reading(compared)).toBe(reading(full));
          analysis = again;
          analysisCompared = compared;
        }
      }),
      { numRuns: Number(process.env.RUNS ?? 400), seed: process.env.SEED === undefined ? 20261202 : Number(process.env.SEED) },
    );
  });

  it('gives what a full reading gives when fields of a table of numbers are typed over, one at a time', () => {
    // number fields as people type them: signs, decimals, exponents, spaces, empty; now and
    // then a word, which turns the column to text
    const number = fc.oneof(
      fc.constantFrom('', ' ', '0', '-0', '1', '10', '2.50', '-3.125', '1e3', '4E-2', ' 7 ', '.5', '5.', '12345678901234567890'),
      fc.integer({ min: -100000, max: 100000 }).map((k) => (k / 100).toString()),
    );
    const field = fc.oneof({ weight: 9, arbitrary: number }, { weight: 1, arbitrary: fc.constantFrom('x', 'true', 'n/a') });
    const table = fc
      .tuple(fc.integer({ min: 1, max: 3 }), fc.integer({ min: 1, max: 12 }))
      .chain(([w, h]) => fc.array(fc.array(number, { minLength: w, maxLength: w }), { minLength: h, maxLength: h }));
    const edit = fc.tuple(fc.nat(), fc.nat(), field);
    fc.assert(
      fc.property(table, fc.array(edit, { minLength: 1, maxLength: 6 }), (rows, edits) => {
        const w = rows[0]!.length;
        const grid = rows.map((r) => r.slice());
        const bodyOf = (): string => `${Array.from({ length: w }, (_, j) => `c${j}`).join(',')}\n${grid.map((r) => `${r.join(',')}\n`).join('')}\n`;
        let cell: Cell = { id: 'c1', marker: 'table t', eol: '\n', body: bodyOf() };
        let analysis = analyseTable(cell, NO_FILES);
        for (const [r, c, text] of edits) {
          grid[r % grid.length]![c % w] = text;
          cell = { ...cell, body: bodyOf() };
          const again = analyseTable(cell, { ...NO_FILES, previous: analysis });
          const full = analyseTable(cell, NO_FILES);
          expect(reading(again)).toBe(reading(full));
          analysis = again;
        }
      }),
      { numRuns: Number(process.env.RUNS ?? 400), seed: process.env.SEED === undefined ? 20261203 : Number(process.env.SEED) },
    );
  });
});
