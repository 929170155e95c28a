import { describe, expect, it } from 'vitest';
import { readBodyGrid, setField, sourceOfBody } from '../../../cells/table/grid-model.ts';
import { MAX_COLUMN_CH, MIN_COLUMN_CH, columnWidths, oneLine, widenForRows } from '../../../cells/table/grid-layout.ts';

describe('column widths', () => {
  it('follow the names and fields within bounds', () => {
    const w = columnWidths(sourceOfBody(readBodyGrid(`id,a_longer_name,x\n1,2,${'y'.repeat(80)}\n`)));
    expect(w[0]).toBe(MIN_COLUMN_CH);
    // 13 letters at 1.2 ch each, one for the gap and two for the padding
    expect(w[1]).toBe(Math.ceil('a_longer_name'.length * 1.2) + 3);
    expect(w[2]).toBe(MAX_COLUMN_CH);
  });
  it('measure the last row of a long table, where running numbers are widest', () => {
    // plots numbered 1 to 1,000,000, read as the grid reads a body's fields
    const counts = { filled: new Int32Array(2), numbers: new Int32Array(2), booleans: new Int32Array(2) };
    const w = columnWidths({ header: ['plot', 'y'], rowCount: 1_000_000, field: (r, c) => (c === 0 ? String(r + 1) : '1'), counts });
    // "1000000" is 7 characters, with 2 of room
    expect(w[0]).toBe(9);
  });
  it('widen for rows typed over as a new sample would, and never narrow', () => {
    const g = readBodyGrid('plot,variety\n1,short\n2,tall\n');
    const before = columnWidths(sourceOfBody(g));
    // a longer variety typed into row 2: the same widths as measuring the new grid afresh
    const longer = setField(g, 1, 1, 'a much longer variety name');
    expect(longer.change?.rows).toEqual({ from: 1, to: 2, count: 1 });
    expect(widenForRows(before, sourceOfBody(longer), 1, 2)).toEqual(columnWidths(sourceOfBody(longer)));
    // a shorter one keeps the width the column had
    const shorter = setField(longer, 1, 1, 'x');
    const wide = columnWidths(sourceOfBody(longer));
    expect(widenForRows(wide, sourceOfBody(shorter), 1, 2)).toEqual(wide);
    expect(columnWidths(sourceOfBody(shorter))[1]).toBeLessThan(wide[1]!);
  });
  it('shows a line break as a mark', () => {
    expect(oneLine('a\r\nb')).toBe('a ↵ b');
  });
});
