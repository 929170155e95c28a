import { describe, expect, it } from 'vitest';
import { cellText, planColumn } from '../../../src/views/values/grid-model.ts';
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
