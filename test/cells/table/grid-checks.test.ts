import { describe, expect, it } from 'vitest';
import {
  columnNameProblem,
  columnReading,
  countRows,
  fieldProblem,
  freshColumnName,
  holdsNumbers,
  markedCount,
  tableNameProblem,
} from '../../../cells/table/grid-checks.ts';
import { gridMsg } from '../../../src/messages/grid.ts';
import { columnTypeOf } from '../../../cells/table/model.ts';
import { msg } from '../../../src/messages/language.ts';

describe('the mostly-numbers rule', () => {
  // common practice, no source: at least half of the non-empty fields are numbers
  it('a column holds numbers when at least half of its non-empty fields are numbers', () => {
    expect(holdsNumbers(4, 2)).toBe(true);
    expect(holdsNumbers(5, 2)).toBe(false);
    expect(holdsNumbers(0, 0)).toBe(false);
    expect(holdsNumbers(1, 1)).toBe(true);
  });
  it('marks a decimal comma with the reason and a hint, never reading it as a number', () => {
    expect(fieldProblem('12,5', 'yield_kg', true)).toBe('"12,5" is not a number; the column yield_kg holds numbers (use a point for decimals)');
    expect(fieldProblem(' 12.5 ', 'yield_kg', true)).toBeNull();
    expect(fieldProblem('', 'yield_kg', true)).toBeNull();
    expect(fieldProblem('12,5', 'method', false)).toBeNull();
    expect(fieldProblem('n/a', 'y', true)).toMatch(/leave the field empty for a missing value/);
    expect(fieldProblem('41 kg', 'y', true)).toMatch(/keep units/);
    expect(fieldProblem('1,250', 'y', true)).toMatch(/point for decimals and no thousands separators/);
  });
  it('counts per column what the header shows, agreeing with the table model on what a column reads as', () => {
    const fields = [
      ['41.2', 'open', 'true', ''],
      ['12,5', '1', 'false', ''],
      ['', '2', '', ''],
      ['40', 'vase', 'true', ''],
    ];
    const k = countRows(fields, 4);
    expect([0, 1, 2, 3].map((c) => markedCount(k, c))).toEqual([1, 2, 0, 0]);
    expect([0, 1, 2, 3].map((c) => columnReading(k, c))).toEqual(['text', 'text', 'true/false', 'empty']);
    // the model's own rule on the same fields
    expect([0, 1, 2].map((c) => columnTypeOf(fields.map((r) => r[c]!)))).toEqual(['text', 'text', 'boolean']);
    const clean = countRows([['1'], ['2.5e3'], ['']], 1);
    expect(columnReading(clean, 0)).toBe('numbers');
    expect(markedCount(clean, 0)).toBe(0);
  });
});

describe('names', () => {
  it('refuses a duplicate, an empty or a broken column name', () => {
    const h = ['row', 'method', 'yield_kg'];
    expect(columnNameProblem(h, 0, 'method')).toBe(gridMsg.columnNameTaken('method', 2));
    expect(columnNameProblem(h, 0, ' ')).toBe(gridMsg.columnNameEmpty());
    expect(columnNameProblem(h, 0, 'a\nb')).toBe(gridMsg.columnNameLineBreak());
    expect(columnNameProblem(h, 1, ' method ')).toBeNull();
    expect(columnNameProblem(h, 0, 'yield (kg)')).toBeNull();
  });
  it('gives new columns column_N for their place, or the next free number', () => {
    expect(freshColumnName(new Set(['a', 'b', 'c']), 4)).toBe('column_4');
    expect(freshColumnName(new Set(['column_4', 'column_5']), 4)).toBe('column_6');
  });
  it('a table name must be plain, not a word of the language, not taken by another cell', () => {
    expect(tableNameProblem('trees', 'plots', new Set())).toBeNull();
    expect(tableNameProblem('2021 trial', 'plots', new Set())).toBe(msg.badTableName('2021 trial'));
    expect(tableNameProblem('true', 'plots', new Set())).toBe(gridMsg.tableNameKeyword('true'));
    expect(tableNameProblem('fit', 'plots', new Set(['fit']))).toBe(gridMsg.tableNameTaken('fit'));
    expect(tableNameProblem('  ', 'plots', new Set())).toBe(gridMsg.tableNameEmpty());
  });
});
