import { describe, expect, it } from 'vitest';
import { cellText, MAX_SCROLL_HEIGHT, planColumn, rowWindow } from '../../../src/views/values/grid-model.ts';
import { booleanColumn, numberColumn, textColumn } from '../../../src/lang/values.ts';

describe('cell texts', () => {
  it('shows typed numbers as they were typed', () => {
    const c = numberColumn(new Float64Array([41.2, 38.9, 40]), null, 'yield_kg', ['41.20', '38.9', '40.0']);
    const plan = planColumn(c);
    expect(plan.typed).toBe(true);
    expect([0, 1, 2].map((i) => cellText(c, i, plan).text)).toEqual(['41.20', '38.9', '40.0']);
  });

  it('lines computed numbers up on one count of decimals', () => {
    const c = numberColumn(new Float64Array([1.5, 22.25, 0.125]));
    expect([0, 1, 2].map((i) => cellText(c, i).text)).toEqual(['1.5000', '22.2500', '0.1250']);
  });

  it('marks missing elements, not NaN', () => {
    const c = numberColumn(new Float64Array([1, NaN, NaN]), new Uint8Array([0, 1, 0]));
    expect(cellText(c, 1)).toEqual({ text: 'missing', missing: true });
    expect(cellText(c, 2)).toEqual({ text: 'NaN', missing: false });
  });

  it('writes p-value columns as the trade does', () => {
    const c = numberColumn(new Float64Array([0.0019, 0.00001]), null, 'p');
    expect(cellText(c, 0).text).toBe('0.0019');
    expect(cellText(c, 1).text).toBe('< 0.001');
  });

  it('writes a computed column named for a result by the digits policy of that quantity', () => {
    // the same text a record field of that name gets (common practice, no source)
    const se = numberColumn(new Float64Array([0.61742, 1.5]), null, 'se');
    expect([0, 1].map((i) => cellText(se, i).text)).toEqual(['0.6174', '1.500']);
    const f = numberColumn(new Float64Array([13.8525]), null, 'f');
    expect(cellText(f, 0).text).toBe('13.9');
  });

  it('writes texts and booleans plainly, left aligned', () => {
    const t = textColumn(['open', ''], new Uint8Array([0, 1]));
    const b = booleanColumn(new Uint8Array([1, 0]));
    expect(planColumn(t).align).toBe('text');
    expect(cellText(t, 0).text).toBe('open');
    expect(cellText(t, 1).missing).toBe(true);
    expect([cellText(b, 0).text, cellText(b, 1).text]).toEqual(['true', 'false']);
  });

  it('keeps one plan per column object', () => {
    const c = numberColumn(new Float64Array([1.25]));
    expect(planColumn(c)).toBe(planColumn(c));
  });
});

describe('rowWindow', () => {
  it('draws the rows in view plus a margin', () => {
    // 25 px rows, 400 px viewport (16 rows), scrolled to row 100
    const w = rowWindow(2500, 400, 25, 1000, 8);
    expect(w.first).toBe(92);
    expect(w.last).toBe(124);
    expect(w.padTop).toBe(92 * 25);
    expect(w.padBottom).toBe((1000 - 124) * 25);
    // the drawn rows plus the padding make up the whole height
    expect(w.padTop + (w.last - w.first) * 25 + w.padBottom).toBe(1000 * 25);
  });

  it('clamps at the top and the bottom', () => {
    const top = rowWindow(-50, 400, 25, 1000);
    expect(top.first).toBe(0);
    const end = rowWindow(1e9, 400, 25, 1000);
    expect(end.last).toBe(1000);
    expect(end.padBottom).toBe(0);
  });

  it('draws a few dozen rows of a million, within a height a browser allows', () => {
    const rows = 1_000_000;
    const rh = 25;
    const viewport = 400;
    for (const scroll of [0, 1234567, MAX_SCROLL_HEIGHT / 2, MAX_SCROLL_HEIGHT - viewport]) {
      const w = rowWindow(scroll, viewport, rh, rows);
      expect(w.last - w.first).toBeLessThanOrEqual(16 + 16);
      expect(w.last - w.first).toBeGreaterThanOrEqual(16);
      const total = w.padTop + (w.last - w.first) * rh + w.padBottom;
      expect(total).toBeCloseTo(MAX_SCROLL_HEIGHT, 6);
      // the rows drawn cover the viewport
      expect(w.padTop).toBeLessThanOrEqual(Math.min(scroll, MAX_SCROLL_HEIGHT - viewport) + 1e-6);
      expect(w.padTop + (w.last - w.first) * rh).toBeGreaterThanOrEqual(Math.min(scroll, MAX_SCROLL_HEIGHT - viewport) + viewport - 1e-6);
    }
    // scrolled to the end, the last row is drawn
    expect(rowWindow(MAX_SCROLL_HEIGHT - viewport, viewport, rh, rows).last).toBe(rows);
    // half way down the bar, the rows are half way through the data
    const mid = rowWindow((MAX_SCROLL_HEIGHT - viewport) / 2, viewport, rh, rows, 0);
    expect(Math.abs(mid.first - (rows - 16) / 2)).toBeLessThanOrEqual(1);
  });

  it('draws nothing for no rows', () => {
    expect(rowWindow(0, 400, 25, 0)).toEqual({ first: 0, last: 0, padTop: 0, padBottom: 0 });
  });
});
