import { describe, expect, it } from 'vitest';
import { bin2d, binByLevel, binOf, evenSample, jitter, roundBins } from '../../src/charts/large.ts';

describe('round bins', () => {
  it('covers the range in at most the bins asked, with a round width', () => {
    for (const [min, max, most] of [
      [0, 1, 10],
      [-3.7, 4.2, 30],
      [99.51, 112.3, 48],
      [1e-6, 3e-6, 20],
      [-1e6, 1e6, 40],
      [5, 5.000001, 7],
    ] as const) {
      const b = roundBins(min, max, most);
      expect(b.count).toBeLessThanOrEqual(most);
      expect(b.count).toBeGreaterThan(0);
      expect(b.start).toBeLessThanOrEqual(min);
      expect(b.start + b.count * b.step).toBeGreaterThan(max);
      const mantissa = b.step / 10 ** Math.floor(Math.log10(b.step) + 1e-9);
      expect([1, 2, 2.5, 5].some((m) => Math.abs(mantissa - m) < 1e-9), `step ${b.step}`).toBe(true);
      expect(binOf(b, min)).toBe(0);
      expect(binOf(b, max)).toBe(b.count - 1);
    }
  });
  it('takes the finest round width that fits', () => {
    // 0 to 1 in 10 bins: width 0.1 would need 11 (1 itself opens an 11th), so 0.2 it is
    expect(roundBins(0, 1, 10)).toEqual({ start: 0, step: 0.2, count: 6 });
    expect(roundBins(0, 0.95, 10)).toEqual({ start: 0, step: 0.1, count: 10 });
  });
  it('gives one bin to a single value', () => {
    const b = roundBins(7, 7, 10);
    expect(b.count).toBe(1);
    expect(binOf(b, 7)).toBe(0);
    expect(b.start).toBeLessThan(7);
    expect(b.start + b.step).toBeGreaterThan(7);
  });
});

describe('binned counts', () => {
  it('puts every finite pair in exactly one cell of the grid', () => {
    const n = 10_000;
    const x = Float64Array.from({ length: n }, (_, i) => Math.sin(i) * 10);
    const y = Float64Array.from({ length: n }, (_, i) => Math.cos(i * 1.3) * 3 + i / n);
    x[5] = NaN;
    const { cells, bx, by } = bin2d(x, y, 20, 15);
    expect(cells.reduce((s, c) => s + c.n, 0)).toBe(n - 1);
    expect(bx.count).toBeLessThanOrEqual(20);
    expect(by.count).toBeLessThanOrEqual(15);
    // count one cell by hand
    const c = cells[Math.floor(cells.length / 2)]!;
    let m = 0;
    for (let i = 0; i < n; i++) if (x[i]! >= c.x0 && x[i]! < c.x1 && y[i]! >= c.y0 && y[i]! < c.y1) m++;
    expect(c.n).toBe(m);
  });
  it('bins within levels', () => {
    const codes = Int32Array.from([0, 0, 1, 1, 1, 2]);
    const y = Float64Array.from([0.1, 0.15, 0.9, 0.95, 0.1, 0.5]);
    const { cells } = binByLevel(codes, ['a', 'b', 'c'], y, 10);
    expect(cells.reduce((s, c) => s + c.n, 0)).toBe(6);
    expect(cells.filter((c) => c.level === 'b').reduce((s, c) => s + c.n, 0)).toBe(3);
    expect(cells.find((c) => c.level === 'a')).toMatchObject({ n: 2 });
  });
});

describe('even samples and jitter', () => {
  it('keeps every k-th position and the extras, in order, without repeats', () => {
    const { at, stride } = evenSample(100_000, 5000, [3, 3, 99_999]);
    expect(stride).toBe(20);
    expect(at[0]).toBe(0);
    expect(at[1]).toBe(3);
    expect(at[2]).toBe(20);
    expect(at[at.length - 1]).toBe(99_999);
    expect(at.length).toBe(5000 + 2);
    for (let i = 1; i < at.length; i++) expect(at[i]!).toBeGreaterThan(at[i - 1]!);
    expect(evenSample(10, 5000).at.length).toBe(10);
  });
  it('spreads points of a level over (-0.35, 0.35), the first in the middle, the same on every run', () => {
    const codes = Int32Array.from({ length: 1000 }, (_, i) => i % 3);
    const j = jitter(codes, 3);
    expect(j[0]).toBe(0);
    for (const v of j) expect(Math.abs(v)).toBeLessThan(0.35);
    expect(Array.from(jitter(codes, 3))).toEqual(Array.from(j));
  });
});
