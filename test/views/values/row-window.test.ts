import { describe, expect, it } from 'vitest';
import {
  MAX_SCROLL_HEIGHT,
  OVERSCAN,
  ROWS_WITHOUT_LAYOUT,
  isScaled,
  rowTopAt,
  rowTopIn,
  rowWindow,
  scrollHeightOf,
  scrollToEnd,
  scrollToShowRow,
  topRowAt,
  type RowFrame,
  type RowWindow,
} from '../../../src/views/values/row-window.ts';

// The frames below are made up; the checks are the geometry a grid needs to be usable:
// the drawn rows cover the viewport, the pads and rows add up to the scroll height, and
// every row can be scrolled to and is then shown whole. (common practice, no source)

/** Throws unless the window covers the viewport at this scroll position and adds up. */
function expectCovers(w: RowWindow, scrollTop: number, f: RowFrame): void {
  const height = scrollHeightOf(f);
  const at = Math.min(Math.max(0, scrollTop), height - f.viewport);
  expect(w.padTop + (w.last - w.first) * f.rowHeight + w.padBottom).toBeCloseTo(height, 3);
  expect(w.padTop).toBeGreaterThanOrEqual(0);
  expect(w.padBottom).toBeGreaterThanOrEqual(0);
  // the drawn block reaches from above the viewport's top to below its bottom
  expect(w.padTop).toBeLessThanOrEqual(at + 1e-6);
  expect(w.padTop + (w.last - w.first) * f.rowHeight).toBeGreaterThanOrEqual(Math.min(height, at + f.viewport) - 1e-6);
}

/** Throws unless row `row` lies wholly inside the viewport at this scroll position. */
function expectShown(row: number, scrollTop: number, f: RowFrame): void {
  const w = rowWindow(scrollTop, f);
  expect(row).toBeGreaterThanOrEqual(w.first);
  expect(row).toBeLessThan(w.last);
  const y = rowTopIn(w, row, f.rowHeight);
  expect(y).toBeCloseTo(rowTopAt(row, scrollTop, f), 6);
  expect(y).toBeGreaterThanOrEqual(scrollTop - 1e-6);
  expect(y + f.rowHeight).toBeLessThanOrEqual(scrollTop + f.viewport + 1e-6);
}

describe('a grid that fits under the cap', () => {
  const f: RowFrame = { rows: 100_000, rowHeight: 26, viewport: 260 };

  it('gives each row its own pixels', () => {
    expect(isScaled(f)).toBe(false);
    expect(scrollHeightOf(f)).toBe(2_600_000);
    expect(rowTopAt(123, 999_999, f)).toBe(123 * 26);
    expect(topRowAt(26 * 500, f)).toBe(500);
  });

  it('draws the first rows at the top, with a margin below', () => {
    const w = rowWindow(0, f);
    expect(w).toEqual({ first: 0, last: 11 + OVERSCAN, padTop: 0, padBottom: (100_000 - 11 - OVERSCAN) * 26 });
    expectCovers(w, 0, f);
  });

  it('draws the rows around the middle with a margin either side', () => {
    const w = rowWindow(50_000 * 26 + 5, f);
    expect(w.first).toBe(50_000 - OVERSCAN);
    expect(w.last).toBe(50_011 + OVERSCAN);
    expect(w.padTop).toBe((50_000 - OVERSCAN) * 26);
    expectCovers(w, 50_000 * 26 + 5, f);
  });

  it('draws the last row at the end and never past it', () => {
    const end = scrollToEnd(f);
    expect(end).toBe(2_600_000 - 260);
    const w = rowWindow(end, f);
    expect(w.last).toBe(100_000);
    expect(w.padBottom).toBe(0);
    expectShown(99_999, end, f);
    expect(rowWindow(1e12, f).last).toBe(100_000);
  });

  it('draws nothing for no rows, and a first screenful before layout', () => {
    expect(rowWindow(0, { ...f, rows: 0 })).toEqual({ first: 0, last: 0, padTop: 0, padBottom: 0 });
    const w = rowWindow(0, { ...f, viewport: 0 });
    expect([w.first, w.last]).toEqual([0, ROWS_WITHOUT_LAYOUT]);
  });

  it('scrolls just enough to show a row, and not at all when it is shown', () => {
    // row 20's bottom at 21 rows
    expect(scrollToShowRow(20, 0, f)).toBe(21 * 26 - 260);
    expect(scrollToShowRow(5, 100 * 26, f)).toBe(5 * 26);
    expect(scrollToShowRow(3, 0, f)).toBe(0);
    expect(scrollToShowRow(-1, 300, f)).toBe(300);
  });
});

describe('a grid past the cap (1,000,000 rows of 26 px: 26,000,000 px)', () => {
  const f: RowFrame = { rows: 1_000_000, rowHeight: 26, viewport: 400 };
  const room = MAX_SCROLL_HEIGHT - 400;

  it('keeps the scroll height at the cap', () => {
    expect(isScaled(f)).toBe(true);
    expect(scrollHeightOf(f)).toBe(MAX_SCROLL_HEIGHT);
    expect(scrollToEnd(f)).toBe(room);
  });

  it('shows the first row at the top', () => {
    const w = rowWindow(0, f);
    expect(w.first).toBe(0);
    expect(w.padTop).toBe(0);
    expectShown(0, 0, f);
    expectCovers(w, 0, f);
  });

  it('shows the last row whole at the end of the scroll range', () => {
    const w = rowWindow(room, f);
    expect(w.last).toBe(1_000_000);
    expect(w.padBottom).toBeCloseTo(0, 6);
    // the last row's bottom is the viewport's bottom
    expect(rowTopIn(w, 999_999, 26) + 26).toBeCloseTo(room + 400, 6);
    expectShown(999_999, room, f);
    // scrolled past the range (a box a little taller than the viewport), still the end
    expect(rowWindow(room + 50, f).last).toBe(1_000_000);
  });

  it('maps the middle of the range to the middle of the rows', () => {
    const top = topRowAt(room / 2, f);
    expect(top).toBeCloseTo((1_000_000 - 400 / 26) / 2, 6);
    const w = rowWindow(room / 2, f, 0);
    expect(w.first).toBe(Math.floor(top));
    expectCovers(rowWindow(room / 2, f), room / 2, f);
  });

  it('draws a few dozen rows, inside the scroll height, wherever it is scrolled', () => {
    for (const s of [0, 1, 13, 100, 1234.5, 1_234_567, room / 3, room - 1, room]) {
      const w = rowWindow(s, f);
      expect(w.last - w.first).toBeGreaterThanOrEqual(Math.ceil(400 / 26));
      expect(w.last - w.first).toBeLessThanOrEqual(Math.ceil(400 / 26) + 2 * OVERSCAN + 2);
      expectCovers(w, s, f);
    }
  });

  it('scrolls to any row and then shows it whole (whole-pixel scroll positions)', () => {
    const targets = [0, 1, 2, 17, 500, 123_457, 500_000, 777_777, 999_984, 999_998, 999_999];
    for (const from of [0, 4_000_000, room]) {
      for (const row of targets) {
        const s = scrollToShowRow(row, from, f);
        expect(Number.isInteger(s)).toBe(true);
        expect(s).toBeGreaterThanOrEqual(0);
        expect(s).toBeLessThanOrEqual(room);
        expectShown(row, s, f);
      }
    }
    // a row already shown leaves the scroll where it is
    const s = scrollToShowRow(500_000, 0, f);
    expect(scrollToShowRow(500_000, s, f)).toBe(s);
  });

  it('moves rows continuously with the scroll position', () => {
    // between the ends (one viewport each, moved pixel for pixel), one pixel of scroll moves
    // the rows by the ratio of the rows' remaining height to the remaining range
    const ratio = ((1_000_000 - 400 / 26) * 26 - 2 * 400) / (room - 2 * 400);
    const a = topRowAt(2_000_000, f);
    const b = topRowAt(2_000_001, f);
    expect((b - a) * 26).toBeCloseTo(ratio, 6);
    // at the ends, pixel for pixel
    expect((topRowAt(101, f) - topRowAt(100, f)) * 26).toBeCloseTo(1, 9);
    expect((topRowAt(room - 100, f) - topRowAt(room - 101, f)) * 26).toBeCloseTo(1, 6);
    // and no jump where the pieces meet
    for (const joint of [400, room - 400]) expect((topRowAt(joint + 1e-3, f) - topRowAt(joint - 1e-3, f)) * 26).toBeLessThan(0.01);
  });
});

describe('a grid exactly at the cap', () => {
  it('is not scaled, and its last row is reachable', () => {
    const f: RowFrame = { rows: 1000, rowHeight: 25, viewport: 400, maxHeight: 25_000 };
    expect(isScaled(f)).toBe(false);
    expectShown(999, scrollToShowRow(999, 0, f), f);
    const g: RowFrame = { ...f, rows: 1001 };
    expect(isScaled(g)).toBe(true);
    expectShown(1000, scrollToShowRow(1000, 0, g), g);
  });
});
