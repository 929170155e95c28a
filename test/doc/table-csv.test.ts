/**
 * Tables saved as CSV from the page: they read back as the same table, typed decimals keep
 * their text, computed numbers their shortest round-trip form, and a text a spreadsheet would
 * run as a formula is guarded.
 */
import { describe, expect, it } from 'vitest';
import { parseCsv } from '../../src/doc/csv.ts';
import { tableCsv } from '../../src/doc/table-csv.ts';
import { toJson } from '../../src/lang/json.ts';
import { isError, type Table } from '../../src/lang/values.ts';
import { doc, evalFormula, run } from '../helpers.ts';

describe('tableCsv', () => {
  it('a data table reads back as the same table, decimals as typed', () => {
    const { states } = run(doc('--- table t', 'block,trt,y', '1,a,10.50', '1,b,', '2,"x,y",1e3', ''));
    const t = states[0]!.value as Table;
    const text = tableCsv(t);
    expect(text).toBe('block,trt,y\n1,a,10.50\n1,b,\n2,"x,y",1e3\n');
    const again = run(doc('--- table t', text.trimEnd(), '')).states[0]!.value;
    expect(toJson(again)).toBe(toJson(t));
  });
  it('computed numbers in their shortest round-trip form, so they read back as the same doubles', () => {
    const means = evalFormula('one_way(t.y, t.g).means', '--- table t', 'g,y', 'a,1', 'a,2', 'b,2', 'b,4.1', 'b,3', '');
    if (isError(means)) throw new Error(means.message);
    const grid = parseCsv(tableCsv(means as Table));
    expect(grid.header).toEqual(['level', 'n', 'mean', 'se', 'low', 'high']);
    const mean = (means as Table).columns[2]!;
    expect(Number(grid.rows[1]![2])).toBe((mean.values as Float64Array)[1]);
  });
  it('guards texts that a spreadsheet would run as formulas (common practice, no source)', () => {
    const t = evalFormula('group_stats(t.y, t.g)', '--- table t', 'g,y', '"=cmd()",1', '"@x",2', '"-1 dose",3', '');
    const text = tableCsv(t as Table);
    expect(text).toContain("'=cmd()");
    expect(text).toContain("'@x");
    expect(text).toContain("'-1 dose");
  });
});
