import { describe, expect, it } from 'vitest';
import { readBodyGrid, sourceOfBody } from '../../../cells/table/grid-model.ts';
import {
  MAX_COLUMN_CH,
  MIN_COLUMN_CH,
  OVERSCAN,
  ROWS_WITHOUT_LAYOUT,
  ROW_HEIGHT,
  columnWidths,
  oneLine,
  scrollToShowRow,
  visibleRows,
} from '../../../cells/table/grid-layout.ts';

describe('the window of rows', () => {
  it('draws the rows in view and a margin either side, never past the ends', () => {
    expect(visibleRows(0, 10 * ROW_HEIGHT, 100_000)).toEqual({ first: 0, last: 11 + OVERSCAN });
    const mid = visibleRows(50_000 * ROW_HEIGHT + 5, 10 * ROW_HEIGHT, 100_000);
    expect(mid).toEqual({ first: 50_000 - OVERSCAN, last: 50_011 + OVERSCAN });
    expect(visibleRows(99_999 * ROW_HEIGHT, 10 * ROW_HEIGHT, 100_000).last).toBe(100_000);
    expect(visibleRows(0, 10 * ROW_HEIGHT, 0)).toEqual({ first: 0, last: 0 });
    expect(visibleRows(0, 0, 100_000)).toEqual({ first: 0, last: ROWS_WITHOUT_LAYOUT });
  });
  it('scrolls just enough to show a row below the sticky names', () => {
    const H = 10 * ROW_HEIGHT;
    expect(scrollToShowRow(3, 0, H, 40)).toBe(0);
    // row 20's bottom at 40 + 21 rows
    expect(scrollToShowRow(20, 0, H, 40)).toBe(40 + 21 * ROW_HEIGHT - H);
    expect(scrollToShowRow(5, 100 * ROW_HEIGHT, H, 40)).toBe(5 * ROW_HEIGHT);
    expect(scrollToShowRow(-1, 300, H, 40)).toBe(300);
  });
});

describe('column widths', () => {
  it('follow the names and fields within bounds', () => {
    const w = columnWidths(sourceOfBody(readBodyGrid(`id,a_longer_name,x\n1,2,${'y'.repeat(80)}\n`)));
    expect(w[0]).toBe(MIN_COLUMN_CH);
    // 13 letters at 1.2 ch each, one for the gap and two for the padding
    expect(w[1]).toBe(Math.ceil('a_longer_name'.length * 1.2) + 3);
    expect(w[2]).toBe(MAX_COLUMN_CH);
  });
  it('shows a line break as a mark', () => {
    expect(oneLine('a\r\nb')).toBe('a ↵ b');
  });
});
