import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseCsv } from '../../../src/doc/csv.ts';
import { csvLine, writeCsv } from '../../../src/doc/csv-write.ts';
import { countRows } from '../../../cells/table/grid-checks.ts';
import { HEADER_ROW } from '../../../cells/table/grid-keys.ts';
import {
  clearRect,
  deleteColumns,
  deleteRows,
  fieldsIn,
  insertColumns,
  insertRows,
  isRefusal,
  pasteBlock,
  readBodyGrid,
  renameColumn,
  setField,
  setFieldUsingUp,
  sourceOfBody,
  sourceOfTable,
  bodyOfText,
  writeBodyGrid,
  type BodyGrid,
  type Refusal,
} from '../../../cells/table/grid-model.ts';
import { gridMsg } from '../../../src/messages/grid.ts';
import { tableFromGrid } from '../../../cells/table/model.ts';

/** Reads the grid's text again and checks that it says what the grid holds, ranges and counts included. */
function expectConsistent(g: BodyGrid): void {
  const again = parseCsv(g.text);
  expect(again.header).toEqual(g.header);
  expect(again.rows).toEqual(g.rows);
  expect(again.rowRanges.map((r) => [r[0], r[1]])).toEqual(Array.from(g.starts, (s, i) => [s, g.ends[i]]));
  expect(g.text.slice(g.headerFrom, g.headerTo)).toBe(csvLine(g.header));
  const k = countRows(g.rows, g.header.length);
  expect(Array.from(g.counts.filled)).toEqual(Array.from(k.filled));
  expect(Array.from(g.counts.numbers)).toEqual(Array.from(k.numbers));
  expect(Array.from(g.counts.booleans)).toEqual(Array.from(k.booleans));
}

function ok<T>(x: T): Exclude<T, Refusal> {
  if (isRefusal(x)) throw new Error(`refused: ${x.refused}`);
  return x as Exclude<T, Refusal>;
}

const TREES = 'row,method,yield_kg\n1,open,41.2\n1,spindle,38.9\n2,open,40.1\n\n';

describe('writing rows', () => {
  it('quotes fields with commas, quotes, line breaks and edge spaces, like writeCsv', () => {
    expect(csvLine(['Smith, J.', 'said "hi"', 'a\nb', ' pad', 'plain'])).toBe('"Smith, J.","said ""hi""","a\nb"," pad",plain');
    expect(csvLine([''])).toBe('""');
    expect(csvLine(['', ''])).toBe(',');
  });
  it('writes exactly what writeCsv writes, for any fields', () => {
    const field = fc.oneof(fc.string(), fc.constantFrom('', ' ', ',', '"', '\n', '\r\n', 'a, b', ' x ', '\ufeffz', '1.5'));
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 4 }), fc.array(fc.array(field, { minLength: 4, maxLength: 4 }), { maxLength: 6 }), (w, raw) => {
        const header = ['a', 'b', 'c', 'd'].slice(0, w);
        const rows = raw.map((r) => r.slice(0, w));
        const ours = writeBodyGrid(header, rows).text;
        expect(ours).toBe(`${writeCsv(header, rows)}\n`);
      }),
      { numRuns: 400 },
    );
  });
});

describe('a body read as a grid', () => {
  it('turns an imported text into a body ending in a blank line of its own line end', () => {
    expect(bodyOfText('a,b\r\n1,2\r\n\r\n\r\n')).toBe('a,b\r\n1,2\r\n\r\n');
    expect(bodyOfText('a,b\n1,2')).toBe('a,b\n1,2\n\n');
    expect(bodyOfText('\n\n')).toBe('\n');
    expect(parseCsv(bodyOfText('a,b\r\n1,2\r\n')).rows).toEqual([['1', '2']]);
  });
  it('keeps the ranges of rows and header, and the line end the body uses', () => {
    const g = readBodyGrid(TREES);
    expectConsistent(g);
    expect(g.eol).toBe('\n');
    expect(readBodyGrid('a,b\r\n1,2\r\n').eol).toBe('\r\n');
  });
  it('one field edit splices that row only; the rest of the body keeps its bytes', () => {
    const body = 'row,method,yield_kg\r\n1,"open",41.2\r\n\r\n1,spindle,38.9\r\n2,open,40.1\r\n\r\n';
    const g = setField(readBodyGrid(body), 1, 2, '12,5');
    expectConsistent(g);
    expect(g.text).toBe('row,method,yield_kg\r\n1,"open",41.2\r\n\r\n1,spindle,"12,5"\r\n2,open,40.1\r\n\r\n');
    expect(g.rows[1]).toEqual(['1', 'spindle', '12,5']);
    // the same text gives the same grid back: nothing to send
    expect(setField(g, 1, 2, '12,5')).toBe(g);
  });
  it('a field set in a grid that is used up gives the grid setField gives, counts included, in the same list of rows', () => {
    const field = fc.constantFrom('', '1', '22', 'x', 'true', '4.5', 'a,b');
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.nat(), fc.nat(), field), { minLength: 1, maxLength: 8 }), (steps) => {
        let kept = readBodyGrid('a,b,c\n1,22,333\n4,x,666\n7,88,true\n\n');
        let used = readBodyGrid(kept.text);
        for (const [r, c, f] of steps) {
          const rows = used.rows;
          kept = setField(kept, r % 3, c % 3, f);
          const next = setFieldUsingUp(used, r % 3, c % 3, f);
          expect(next.rows).toBe(rows);
          expect(next.text).toBe(kept.text);
          expect(next.rows).toEqual(kept.rows);
          expectConsistent(next);
          used = next;
        }
      }),
      { seed: 20261203, numRuns: 200 },
    );
  });
  it('after any run of field edits, row insertions and deletions, says what reading its text again says', () => {
    // ranges shared with the grid before when a field is retyped with as many characters
    const field = fc.constantFrom('', '1', '22', '333', 'a b', 'x,y', 'q"', ' s');
    const step = fc.oneof(
      fc.tuple(fc.constant('set' as const), fc.nat(), fc.nat(), field),
      fc.tuple(fc.constant('insert' as const), fc.nat(), fc.integer({ min: 1, max: 3 }), field),
      fc.tuple(fc.constant('delete' as const), fc.nat(), fc.nat({ max: 2 }), field),
    );
    fc.assert(
      fc.property(fc.array(step, { minLength: 1, maxLength: 12 }), (steps) => {
        let g = readBodyGrid('a,b,c\n1,22,333\n4,55,666\n7,88,999\n\n');
        for (const [kind, x, y, f] of steps) {
          const n = g.rows.length;
          if (kind === 'set' && n > 0) g = setField(g, x % n, y % 3, f);
          else if (kind === 'insert') g = insertRows(g, x % (n + 1), y);
          else if (kind === 'delete' && n > 0) g = deleteRows(g, x % n, Math.min(n - 1, (x % n) + y));
          const again = readBodyGrid(g.text);
          expect(g.rows).toEqual(again.rows);
          expect(Array.from(g.starts)).toEqual(Array.from(again.starts));
          expect(Array.from(g.ends)).toEqual(Array.from(again.ends));
          expect(g.headerTo).toBe(again.headerTo);
        }
      }),
      { seed: 20261202, numRuns: 500 },
    );
  });

  it('renames a column in the header line; refuses a duplicate or an empty name', () => {
    const g = ok(renameColumn(readBodyGrid(TREES), 2, ' yield (kg) '));
    expectConsistent(g);
    expect(g.header).toEqual(['row', 'method', 'yield (kg)']);
    expect(renameColumn(g, 0, 'method')).toEqual({ refused: gridMsg.columnNameTaken('method', 2) });
    expect(renameColumn(g, 0, '   ')).toEqual({ refused: gridMsg.columnNameEmpty() });
    expect(renameColumn(g, 0, 'a\nb')).toEqual({ refused: gridMsg.columnNameLineBreak() });
    // the column's own name again is no change
    expect(renameColumn(g, 1, 'method')).toBe(g);
  });
  it('inserts and deletes rows anywhere, appending after a body without a final line end', () => {
    let g = readBodyGrid('a,b\n1,2');
    g = insertRows(g, 1);
    expectConsistent(g);
    expect(g.text).toBe('a,b\n1,2\n,');
    g = insertRows(g, 0, 2);
    expectConsistent(g);
    expect(g.rows).toEqual([['', ''], ['', ''], ['1', '2'], ['', '']]);
    g = deleteRows(g, 0, 1);
    expectConsistent(g);
    g = deleteRows(g, 1, 1);
    expectConsistent(g);
    expect(g.text).toBe('a,b\n1,2');
    g = deleteRows(g, 0, 0);
    expectConsistent(g);
    expect(g.rows).toEqual([]);
    g = insertRows(g, 0);
    expectConsistent(g);
    expect(g.text).toBe('a,b\n,');
  });
  it('keeps an empty field of a one-column table as ""', () => {
    let g = readBodyGrid('x\n1\n2\n\n');
    g = setField(g, 0, 0, '');
    expectConsistent(g);
    expect(g.rows).toEqual([[''], ['2']]);
    g = insertRows(g, 2);
    expectConsistent(g);
    expect(g.rows).toEqual([[''], ['2'], ['']]);
  });
  it('clears a rectangle of fields but never the column names', () => {
    const g = clearRect(readBodyGrid(TREES), { r0: HEADER_ROW, r1: 1, c0: 1, c1: 2 });
    expectConsistent(g);
    expect(g.header).toEqual(['row', 'method', 'yield_kg']);
    expect(g.rows).toEqual([['1', '', ''], ['1', '', ''], ['2', 'open', '40.1']]);
    expect(clearRect(g, { r0: 0, r1: 1, c0: 1, c1: 2 })).toBe(g);
  });
  it('inserts columns named column_N for their place, unique, and deletes columns but not all', () => {
    let g = insertColumns(readBodyGrid(TREES), 3);
    expectConsistent(g);
    expect(g.header).toEqual(['row', 'method', 'yield_kg', 'column_4']);
    g = insertColumns(g, 1);
    expect(g.header).toEqual(['row', 'column_2', 'method', 'yield_kg', 'column_4']);
    g = insertColumns(g, 3);
    // column_4 is taken, so the next free number
    expect(g.header).toEqual(['row', 'column_2', 'method', 'column_5', 'yield_kg', 'column_4']);
    expectConsistent(g);
    g = ok(deleteColumns(g, 1, 3));
    expect(g.header).toEqual(['row', 'yield_kg', 'column_4']);
    expect(g.rows[0]).toEqual(['1', '41.2', '']);
    expectConsistent(g);
    expect(deleteColumns(g, 0, 2)).toEqual({ refused: gridMsg.lastColumn() });
  });
});

describe('pasting a block', () => {
  const block3 = [
    ['7', 'vase', '39.0'],
    ['8', 'open', '44,1'],
  ];
  it('lands a three-column block as three columns at the selection', () => {
    const p = ok(pasteBlock(readBodyGrid(TREES), { r0: 1, r1: 1, c0: 0, c1: 0 }, block3));
    expectConsistent(p.grid);
    expect(p.grid.header.length).toBe(3);
    expect(p.grid.rows).toEqual([['1', 'open', '41.2'], ['7', 'vase', '39.0'], ['8', 'open', '44,1']]);
    expect(p.rect).toEqual({ r0: 1, r1: 2, c0: 0, c1: 2 });
    expect([p.addedRows, p.addedColumns]).toEqual([0, 0]);
  });
  it('grows the table with rows and uniquely named columns', () => {
    const p = ok(pasteBlock(readBodyGrid(TREES), { r0: 2, r1: 2, c0: 2, c1: 2 }, block3));
    expectConsistent(p.grid);
    expect(p.grid.header).toEqual(['row', 'method', 'yield_kg', 'column_4', 'column_5']);
    expect(p.grid.rows).toEqual([
      ['1', 'open', '41.2', '', ''],
      ['1', 'spindle', '38.9', '', ''],
      ['2', 'open', '7', 'vase', '39.0'],
      ['', '', '8', 'open', '44,1'],
    ]);
    expect([p.addedRows, p.addedColumns]).toEqual([1, 2]);
  });
  it('takes a block of 300,000 rows (its width found without spreading the rows into arguments)', () => {
    const big = Array.from({ length: 300_000 }, (_, i) => [String(i % 9), 'open', `${40 + (i % 7)}.5`]);
    const p = ok(pasteBlock(readBodyGrid(TREES), { r0: 1, r1: 1, c0: 0, c1: 0 }, big));
    // the first row of the table stays, the block lands from the second on
    expect(p.grid.rows.length).toBe(1 + 300_000);
    expect(p.grid.rows[300_000]).toEqual(['2', 'open', '40.5']); // row 299,999 of the block: 299,999 % 9 = 2, % 7 = 0
    expect(p.addedRows).toBe(1 + 300_000 - 3);
  });
  it('grows rows only by splicing when the columns fit', () => {
    const g = readBodyGrid(TREES);
    const p = ok(pasteBlock(g, { r0: 2, r1: 2, c0: 0, c1: 0 }, block3));
    expectConsistent(p.grid);
    expect(p.grid.text.startsWith('row,method,yield_kg\n1,open,41.2\n1,spindle,38.9\n7,vase,39.0\n8,open,"44,1"')).toBe(true);
    expect(p.grid.text.endsWith('\n\n')).toBe(true);
  });
  it('at the row of names, renames columns with the first line and fills rows from the first', () => {
    const g = readBodyGrid('block,treatment,response\n1,,\n\n');
    const p = ok(pasteBlock(g, { r0: HEADER_ROW, r1: HEADER_ROW, c0: 0, c1: 0 }, [['bench', 'mix', 'strength_mpa'], ...block3]));
    expectConsistent(p.grid);
    expect(p.grid.header).toEqual(['bench', 'mix', 'strength_mpa']);
    expect(p.grid.rows).toEqual(block3);
    expect(pasteBlock(g, { r0: HEADER_ROW, r1: HEADER_ROW, c0: 0, c1: 0 }, [['a', 'a']])).toEqual({
      refused: gridMsg.pasteHeader(gridMsg.columnNameTaken('a', 2)),
    });
  });
  it('fills a larger selection with a single value', () => {
    const p = ok(pasteBlock(readBodyGrid(TREES), { r0: 0, r1: 2, c0: 1, c1: 1 }, [['vase']]));
    expectConsistent(p.grid);
    expect(p.grid.rows.map((r) => r[1])).toEqual(['vase', 'vase', 'vase']);
  });
  it('keeps ranges and counts right through any run of changes', () => {
    const field = fc.constantFrom('', '1', '2.5', 'x', 'a,b', 'q"r', 'line\nbreak', 'true', ' ', '12,5');
    const op = fc.oneof(
      fc.record({ k: fc.constant('set' as const), r: fc.nat(), c: fc.nat(), v: field }),
      fc.record({ k: fc.constant('ins' as const), r: fc.nat(), n: fc.integer({ min: 1, max: 3 }) }),
      fc.record({ k: fc.constant('del' as const), r: fc.nat(), n: fc.integer({ min: 0, max: 2 }) }),
      fc.record({ k: fc.constant('paste' as const), r: fc.nat(), c: fc.nat(), b: fc.array(fc.array(field, { minLength: 1, maxLength: 3 }), { minLength: 1, maxLength: 3 }) }),
      fc.record({ k: fc.constant('clear' as const), r: fc.nat(), c: fc.nat() }),
    );
    fc.assert(
      fc.property(fc.constantFrom(TREES, 'a,b\r\n1,2\r\n3,4', 'x\n\n1\n\n\n2\n', 'a,b\n'), fc.array(op, { maxLength: 12 }), (start, ops) => {
        let g = readBodyGrid(start);
        for (const o of ops) {
          const n = g.rows.length;
          const w = g.header.length;
          if (o.k === 'set' && n > 0) g = setField(g, o.r % n, o.c % w, o.v);
          else if (o.k === 'ins') g = insertRows(g, o.r % (n + 1), o.n);
          else if (o.k === 'del' && n > 0) g = deleteRows(g, o.r % n, (o.r % n) + o.n);
          else if (o.k === 'paste') {
            const r = n > 0 ? o.r % n : 0;
            const p = pasteBlock(g.rows.length === 0 ? insertRows(g, 0) : g, { r0: r, r1: r, c0: o.c % w, c1: o.c % w }, o.b);
            if (!isRefusal(p)) g = p.grid;
          } else if (o.k === 'clear' && n > 0) g = clearRect(g, { r0: o.r % n, r1: o.r % n, c0: 0, c1: o.c % w });
          expectConsistent(g);
        }
      }),
      { numRuns: 300 },
    );
  });
});

describe('fields for copying and showing', () => {
  it('copies a rectangle, names included on the header row', () => {
    const src = sourceOfBody(readBodyGrid(TREES));
    expect(fieldsIn(src, { r0: HEADER_ROW, r1: 0, c0: 1, c1: 2 })).toEqual([
      ['method', 'yield_kg'],
      ['open', '41.2'],
    ]);
  });
  it('shows a table value read from a file with its fields as typed', () => {
    const t = tableFromGrid(parseCsv('plot,yield_kg,ok\n1,41.20,true\n2,,false\n3,1e3,\n'));
    const src = sourceOfTable(t);
    expect(src.rowCount).toBe(3);
    expect([0, 1, 2].map((r) => [src.field(r, 0), src.field(r, 1), src.field(r, 2)])).toEqual([
      ['1', '41.20', 'true'],
      ['2', '', 'false'],
      ['3', '1e3', ''],
    ]);
    expect(Array.from(src.counts.numbers)).toEqual([3, 2, 0]);
    expect(Array.from(src.counts.booleans)).toEqual([0, 0, 2]);
  });
});
