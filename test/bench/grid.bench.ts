/**
 * The table grid on 100,000 rows: reading the body, one field edit (spliced into the body
 * against writing the whole table again), pasting a 1,000 x 3 block from a spreadsheet, and
 * copying one. Prints figures; never fails a build, but each bench checks what it made.
 */
import { cpus } from 'node:os';
import { afterAll, bench, describe } from 'vitest';
import { parseCsv } from '../../src/doc/csv.ts';
import { writeCsv } from '../../src/doc/csv-write.ts';
import { fieldsIn, isRefusal, pasteBlock, readBodyGrid, setField, sourceOfBody, type BodyGrid } from '../../cells/table/grid-model.ts';
import { blockToTsv, readBlock } from '../../cells/table/grid-paste.ts';

const N = 100_000;
const methods = ['open', 'spindle', 'vase'];
const lines = ['plot,block,method,yield_kg'];
for (let i = 0; i < N; i++) lines.push(`${i + 1},${(i % 8) + 1},${methods[i % 3]},${(30 + ((i * 7919) % 1000) / 100).toFixed(2)}`);
const body = `${lines.join('\n')}\n\n`;
const grid = readBodyGrid(body);
const tsvLines: string[] = [];
for (let i = 0; i < 1000; i++) tsvLines.push(`${(i % 8) + 1}\t${methods[(i + 1) % 3]}\t${(40 + (i % 50) / 10).toFixed(1)}`);
const tsv = `${tsvLines.join('\r\n')}\r\n`;
const notes: string[] = [`body: ${N.toLocaleString('en-US')} rows, ${(body.length / 1e6).toFixed(2)} MB`];

function check(ok: boolean, what: string): void {
  if (!ok) throw new Error(`bench made the wrong result: ${what}`);
}

describe(`table grid, ${N.toLocaleString('en-US')} rows (${cpus()[0]?.model ?? 'unknown CPU'})`, () => {
  bench('read the body (parseCsv alone)', () => {
    check(parseCsv(body).rows.length === N, 'row count');
  });
  bench('read the body as a grid (parseCsv, row ranges, column counts)', () => {
    check(readBodyGrid(body).rows.length === N, 'row count');
  });

  let g: BodyGrid = grid;
  let k = 0;
  bench('one field edit, spliced into the body (row 50,000)', () => {
    k++;
    g = setField(g, 50_000, 3, `${k}.5`);
    // the shell sends the body on: make the string flat as a postMessage would
    check(g.text.charCodeAt(g.text.length - 1) === 10, 'body end');
  });
  bench('one field edit, writing the whole table again (writeCsv, for comparison)', () => {
    const rows = grid.rows.slice();
    const row = rows[50_000]!.slice();
    row[3] = '9.5';
    rows[50_000] = row;
    check(writeCsv(grid.header, rows).length > 0, 'text');
  });

  bench('paste a 1,000 x 3 tab-separated block at row 50,000 (read + splice)', () => {
    const b = readBlock(tsv);
    if (!b.ok) throw new Error(b.message);
    const p = pasteBlock(grid, { r0: 50_000, r1: 50_000, c0: 1, c1: 1 }, b.rows);
    check(!isRefusal(p) && p.grid.rows.length === N && p.grid.rows[50_999]![2] === b.rows[999]![1], 'pasted rows');
  });
  bench('paste a 1,000 x 3 block at the last row (grows the table by 999 rows)', () => {
    const b = readBlock(tsv);
    if (!b.ok) throw new Error(b.message);
    const p = pasteBlock(grid, { r0: N - 1, r1: N - 1, c0: 0, c1: 0 }, b.rows);
    check(!isRefusal(p) && p.grid.rows.length === N + 999, 'grown rows');
  });
  bench('paste a 1,000 x 3 block at the last column (adds 2 columns: whole table written)', () => {
    const b = readBlock(tsv);
    if (!b.ok) throw new Error(b.message);
    const p = pasteBlock(grid, { r0: 0, r1: 0, c0: 3, c1: 3 }, b.rows);
    check(!isRefusal(p) && p.grid.header.length === 6, 'grown columns');
  });
  bench('copy a 1,000 x 3 selection as tab-separated text', () => {
    const t = blockToTsv(fieldsIn(sourceOfBody(grid), { r0: 50_000, r1: 50_999, c0: 1, c1: 3 }));
    check(t.split('\n').length === 1000, 'copied lines');
  });
});

afterAll(() => {
  for (const n of notes) console.log(n);
});
