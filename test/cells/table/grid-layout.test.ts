import { describe, expect, it } from 'vitest';
import { readBodyGrid, sourceOfBody } from '../../../cells/table/grid-model.ts';
import { MAX_COLUMN_CH, MIN_COLUMN_CH, columnWidths, oneLine } from '../../../cells/table/grid-layout.ts';

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
  it('shows a line break as a mark', () => {
    expect(oneLine('a\r\nb')).toBe('a ↵ b');
  });
});
