import { describe, expect, it } from 'vitest';
import { readBodyGrid, sourceOfBody } from '../../../cells/table/grid-model.ts';
import { MAX_COLUMN_CH, MIN_COLUMN_CH, columnWidths, oneLine } from '../../../cells/table/grid-layout.ts';

describe('column widths', () => {
  it('follow the names and fields within bounds', () => {
    const w = columnWidths(sourceOfBody(readBodyGrid(`id,a_long_name_for_a_column,x\n1,2,${'y'.repeat(80)}\n`)));
    expect(w[0]).toBe(MIN_COLUMN_CH);
    expect(w[1]).toBe('a_long_name_for_a_column'.length + 3);
    expect(w[2]).toBe(MAX_COLUMN_CH);
  });
  it('shows a line break as a mark', () => {
    expect(oneLine('a\r\nb')).toBe('a ↵ b');
  });
});
