import { describe, expect, it } from 'vitest';
import { tableKind } from '../../../cells/table/kind.ts';
import { firstRowNames, isNewTable, pasteWithNames } from '../../../cells/table/grid-names-row.ts';
import { insertColumns, readBodyGrid } from '../../../cells/table/grid-model.ts';
import { readBlock } from '../../../cells/table/grid-paste.ts';

// A paste whose first row names its columns, into a new table. The rule is ours: a first row
// of names over numbers, as a spreadsheet copies a table. (common practice, no source)

const STARTER = tableKind.template!(() => 'table').body;
const FIRST = { r0: 0, r1: 0, c0: 0, c1: 0 };

function block(text: string): string[][] {
  const b = readBlock(text);
  if (!b.ok) throw new Error(b.message);
  return b.rows.map((r) => r.slice());
}

describe('a new table', () => {
  it('is the table a new cell starts with, or one with no data under untitled columns', () => {
    expect(isNewTable(readBodyGrid(STARTER))).toBe(true);
    expect(isNewTable(readBodyGrid('column_1,column_2\n,\n,\n\n'))).toBe(true);
    expect(isNewTable(readBodyGrid('block,treatment,response\n\n'))).toBe(true);
    expect(isNewTable(insertColumns(readBodyGrid(STARTER), 3))).toBe(true);
  });
  it('is not a table with data or with names of its own', () => {
    expect(isNewTable(readBodyGrid('block,treatment,response\n1,A,\n\n'))).toBe(false);
    expect(isNewTable(readBodyGrid('block,treatment,response\n1,,\n2,,\n\n'))).toBe(false);
    expect(isNewTable(readBodyGrid('plot,yield\n,\n\n'))).toBe(false);
  });
});

describe('a first row of names', () => {
  it('is names over rows with a column of numbers', () => {
    expect(firstRowNames(block('variety,block,yield\nA,1,4.2\nB,1,3.9'))).toBe(true);
    expect(firstRowNames(block('variety\tyield\nA\t4.2\n'))).toBe(true);
  });
  it('is not a row holding a number, an empty field, true/false or a name twice', () => {
    expect(firstRowNames(block('1,A,10.5\n1,B,11.25'))).toBe(false);
    expect(firstRowNames(block('variety,,yield\nA,1,4.2'))).toBe(false);
    expect(firstRowNames(block('variety,true\nA,1'))).toBe(false);
    expect(firstRowNames(block('yield,yield\n1,2'))).toBe(false);
  });
  it('needs numbers below it and a row to stand over', () => {
    expect(firstRowNames(block('variety,site\nA,north\nB,south'))).toBe(false);
    expect(firstRowNames([['variety', 'yield']])).toBe(false);
  });
});

describe('pasting with names', () => {
  it('makes the block the table, first row as names, at the first field of a new table', () => {
    const g = pasteWithNames(readBodyGrid(STARTER), FIRST, block('variety,block,yield\nA,1,4.2\nB,1,3.9'));
    expect(g).not.toBeNull();
    expect(g!.header).toEqual(['variety', 'block', 'yield']);
    expect(g!.rows).toEqual([
      ['A', '1', '4.2'],
      ['B', '1', '3.9'],
    ]);
    expect(g!.text).toBe('variety,block,yield\nA,1,4.2\nB,1,3.9\n\n');
    // the block and yield columns are numbers now, with nothing marked
    expect([g!.counts.numbers[1], g!.counts.numbers[2], g!.counts.filled[0]]).toEqual([2, 2, 2]);
  });
  it('is not offered elsewhere than the first field, nor into a table with data', () => {
    const b = block('variety,block,yield\nA,1,4.2');
    expect(pasteWithNames(readBodyGrid(STARTER), { r0: 1, r1: 1, c0: 0, c1: 0 }, b)).toBeNull();
    expect(pasteWithNames(readBodyGrid(STARTER), { r0: 0, r1: 0, c0: 1, c1: 1 }, b)).toBeNull();
    expect(pasteWithNames(readBodyGrid('block,treatment,response\n1,A,2\n\n'), FIRST, b)).toBeNull();
  });
});
