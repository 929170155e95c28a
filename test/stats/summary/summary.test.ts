import { describe, expect, it } from 'vitest';
import {
  count,
  sum,
  mean,
  variance,
  sd,
  min,
  max,
  median,
  quantile,
  groupStats,
  StatsInputError,
} from '../../../src/stats/summary/index.ts';

const F = (a: readonly number[]): Float64Array => Float64Array.from(a);

/** Relative error check that fails the test. */
function expectRel(actual: number, expected: number, tol: number): void {
  const err = Math.abs(actual - expected) / Math.abs(expected);
  if (!(err <= tol)) {
    throw new Error(`expected ${expected}, got ${actual} (relative error ${err} > ${tol})`);
  }
}

/**
 * Checks a value against a figure printed with `decimals` decimals: it must round to it
 * (half a unit in the last printed place, plus a hair for the printed figure's own binary
 * representation).
 */
function expectPrinted(actual: number, printed: number, decimals: number): void {
  const half = 0.5 * 10 ** -decimals * (1 + 1e-9);
  if (!(Math.abs(actual - printed) <= half)) {
    throw new Error(`expected ${printed} (to ${decimals} decimals), got ${actual}`);
  }
}

/** Small seeded generator (mulberry32), for reproducible test data. */
function uniforms(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/**
 * Exact mean and variance of doubles by rational arithmetic: every double is an integer
 * times a power of two, so scaling by 2^shift makes the values integers and BigInt sums
 * are exact. Returns the correctly rounded results.
 */
function exactMoments(x: Float64Array, shift: number): { mean: number; variance: number } {
  const scale = 2 ** shift;
  const ints = Array.from(x, (v) => {
    const s = v * scale; // exact: multiplication by a power of two
    if (!Number.isInteger(s)) throw new Error(`shift ${shift} too small for ${v}`);
    return BigInt(s);
  });
  const n = BigInt(ints.length);
  let s1 = 0n;
  let s2 = 0n;
  for (const v of ints) {
    s1 += v;
    s2 += v * v;
  }
  // variance = (n s2 - s1^2) / (n (n - 1)) / scale^2; divide with enough extra digits.
  const num = n * s2 - s1 * s1;
  const den = n * (n - 1n) * BigInt(scale) * BigInt(scale);
  const digits = 10n ** 30n;
  const variance = Number((num * digits) / den) / 1e30;
  const meanValue = Number((s1 * digits) / (n * BigInt(scale))) / 1e30;
  return { mean: meanValue, variance };
}

// Plant weights, source: Dobson (1983), An Introduction to Statistical Modelling (from memory).
const control = [4.17, 5.58, 5.18, 6.11, 4.5, 4.61, 5.17, 4.53, 5.33, 5.14];
const trt1 = [4.81, 4.17, 4.41, 3.59, 5.87, 3.83, 6.03, 4.89, 4.32, 4.69];
const trt2 = [6.31, 5.12, 5.54, 5.5, 5.37, 5.29, 4.92, 6.15, 5.8, 5.26];

describe('sum', () => {
  it('keeps the small addends that plain summation loses', () => {
    // source: A. Neumaier (1974), ZAMM 54 (the case that defeats Kahan's compensation)
    const x = F([1, 1e100, 1, -1e100]);
    let plain = 0;
    for (const v of x) plain += v;
    expect(plain).toBe(0); // the case is meaningful: naive summation gets it wrong
    expect(sum(x)).toBe(2);
  });

  it('an infinite term gives an infinite sum, not NaN (IEEE 754 arithmetic, common practice)', () => {
    expect(sum(F([1, Infinity]))).toBe(Infinity);
    expect(sum(F([-Infinity, 5, 1e300]))).toBe(-Infinity);
    expect(Number.isNaN(sum(F([Infinity, -Infinity])))).toBe(true);
  });

  it('is exact to rounding on a long sum of decimals', () => {
    // 0.1 added 10^5 times: exact value of the stored doubles from rational arithmetic.
    const x = new Float64Array(100_000).fill(0.1);
    const exact = exactMoments(x, 60).mean * x.length;
    expectRel(sum(x), exact, 1e-15);
    expect(count(x)).toBe(100_000);
  });

  it('gives 0 for empty input', () => {
    expect(sum(new Float64Array(0))).toBe(0);
    expect(count(new Float64Array(0))).toBe(0);
  });
});

describe('mean, variance, sd', () => {
  it('match exact rational arithmetic on data with a large offset', () => {
    // source: definitions (sum / n; sum of squared deviations / (n - 1)), computed exactly
    const next = uniforms(20260101);
    const x = new Float64Array(1000);
    for (let i = 0; i < x.length; i++) x[i] = 1e8 + Math.round(next() * 1000) / 100;
    const exact = exactMoments(x, 30);
    expectRel(mean(x), exact.mean, 1e-15);
    expectRel(variance(x), exact.variance, 1e-12);
    expectRel(sd(x), Math.sqrt(exact.variance), 1e-12);
    // The one-pass textbook formula loses the variance here; the test data are hard enough.
    let s1 = 0;
    let s2 = 0;
    for (const v of x) {
      s1 += v;
      s2 += v * v;
    }
    const onePass = (s2 - (s1 * s1) / x.length) / (x.length - 1);
    expect(Math.abs(onePass - exact.variance) / exact.variance).toBeGreaterThan(1e-6);
  });

  it('give the hand-computed values of a small sample', () => {
    // source: definitions, by hand: x = 2, 4, 4, 4, 5, 5, 7, 9 has mean 5 and squared
    // deviations summing to 32, so variance 32 / 7.
    const x = F([2, 4, 4, 4, 5, 5, 7, 9]);
    expect(mean(x)).toBe(5);
    expectRel(variance(x), 32 / 7, 1e-15);
    expectRel(sd(x), Math.sqrt(32 / 7), 1e-15);
  });

  it('return NaN where the quantity is undefined', () => {
    expect(mean(new Float64Array(0))).toBeNaN();
    expect(variance(F([3]))).toBeNaN();
    expect(sd(F([3]))).toBeNaN();
    expect(variance(F([3, 3, 3]))).toBe(0);
  });
});

describe('min, max', () => {
  it('find the extremes', () => {
    const x = F([3, -1.5, 8, 2]);
    expect(min(x)).toBe(-1.5);
    expect(max(x)).toBe(8);
    expect(min(F([-Infinity, 1]))).toBe(-Infinity);
  });
  it('give NaN for empty input or a NaN value', () => {
    expect(min(new Float64Array(0))).toBeNaN();
    expect(max(new Float64Array(0))).toBeNaN();
    expect(max(F([1, NaN, 2]))).toBeNaN();
    expect(min(F([1, NaN, 2]))).toBeNaN();
  });
});

describe('quantile (Hyndman and Fan 1996, definition 7)', () => {
  // source: R. J. Hyndman, Y. Fan (1996), The American Statistician 50, 361-365:
  // definition 7 is Q(p) = (1 - g) x(j) + g x(j+1) with j = floor(n p + m), g = n p + m - j,
  // m = 1 - p (one-based order statistics). Values below are worked by hand from it.
  const x = F([3, 1, 4, 1, 5, 9, 2, 6]); // sorted: 1 1 2 3 4 5 6 9
  it('gives the hand-worked values', () => {
    expect(quantile(x, 0)).toBe(1);
    expect(quantile(x, 1)).toBe(9);
    expectRel(quantile(x, 0.25), 1.75, 1e-15); // j = 2, g = 0.75: 1 + 0.75 (2 - 1)
    expectRel(quantile(x, 0.5), 3.5, 1e-15); // j = 4, g = 0.5
    expectRel(quantile(x, 0.9), 6.9, 1e-15); // j = 7, g = 0.3: 6 + 0.3 (9 - 6)
    expect(quantile(F([7]), 0.3)).toBe(7);
    expectRel(quantile(F([1, 2, 3, 4, 5, 6, 7, 8, 9, 10]), 0.33), 3.97, 1e-15);
  });

  it('agrees with the published form of the definition on random data', () => {
    const next = uniforms(7);
    for (let trial = 0; trial < 200; trial++) {
      const n = 1 + Math.floor(next() * 40);
      const data = new Float64Array(n);
      for (let i = 0; i < n; i++) data[i] = Math.round((next() - 0.5) * 2000) / 10;
      const sorted = Float64Array.from(data).sort();
      const p = next();
      const m = 1 - p;
      const j = Math.floor(n * p + m);
      const g = n * p + m - j;
      const xj = sorted[Math.min(Math.max(j, 1), n) - 1]!;
      const xj1 = sorted[Math.min(j + 1, n) - 1]!;
      const expected = (1 - g) * xj + g * xj1;
      const got = quantile(data, p);
      const scale = Math.max(1, Math.abs(expected));
      if (!(Math.abs(got - expected) <= 1e-12 * scale)) {
        throw new Error(`n ${n}, p ${p}: expected ${expected}, got ${got}`);
      }
    }
  });

  it('median is the middle value or the mean of the middle two', () => {
    expect(median(F([5, 1, 3]))).toBe(3);
    expect(median(F([5, 1, 3, 4]))).toBe(3.5);
    expect(median(new Float64Array(0))).toBeNaN();
    expect(median(F([1, NaN, 3]))).toBeNaN();
    // source: plant weights above, control group sorted by hand: middle values 5.14, 5.17
    expectRel(median(F(control)), 5.155, 1e-14);
  });

  it('rejects a probability outside [0, 1]', () => {
    expect(() => quantile(x, 1.5)).toThrow(StatsInputError);
    expect(() => quantile(x, -0.1)).toThrow(StatsInputError);
    expect(() => quantile(x, NaN)).toThrow(StatsInputError);
  });
});

describe('groupStats', () => {
  const y = F([...control, ...trt1, ...trt2]);
  const codes = Int32Array.from({ length: 30 }, (_, i) => Math.floor(i / 10));
  const groups = { codes, levels: ['control', 'treatment 1', 'treatment 2'] };

  it('reproduces the published sums of squares of the plant weights', () => {
    const g = groupStats(y, groups);
    expect(g.level).toEqual(['control', 'treatment 1', 'treatment 2']);
    expect(Array.from(g.n)).toEqual([10, 10, 10]);
    // source: by hand from the data: the group totals are 50.32, 46.61 and 55.26
    expectRel(g.mean[0]!, 5.032, 1e-14);
    expectRel(g.mean[1]!, 4.661, 1e-14);
    expectRel(g.mean[2]!, 5.526, 1e-14);
    // source: Dobson (1983) via docs/references.md section 3: within SS 10.49209 (df 27) and
    // between SS 3.76634 (df 2); the pooled variance weights each group's variance by its
    // degrees of freedom (common practice, no source).
    let within = 0;
    let between = 0;
    const grand = mean(y);
    for (let j = 0; j < 3; j++) {
      within += (g.n[j]! - 1) * g.sd[j]! ** 2;
      between += g.n[j]! * (g.mean[j]! - grand) ** 2;
      expectRel(g.se[j]!, g.sd[j]! / Math.sqrt(10), 1e-15);
    }
    expectPrinted(within, 10.49209, 5);
    expectPrinted(between, 3.76634, 5);
  });

  it('reports empty and single-value levels without failing', () => {
    const g = groupStats(F([1, 2, 4]), { codes: Int32Array.from([0, 0, 2]), levels: ['a', 'b', 'c'] });
    expect(Array.from(g.n)).toEqual([2, 0, 1]);
    expect(g.mean[0]).toBe(1.5);
    expect(g.mean[1]).toBeNaN();
    expect(g.sd[1]).toBeNaN();
    expect(g.mean[2]).toBe(4);
    expect(g.sd[2]).toBeNaN();
    expect(g.se[2]).toBeNaN();
  });

  it('rejects codes that do not match the data', () => {
    expect(() => groupStats(F([1, 2]), { codes: Int32Array.from([0]), levels: ['a'] })).toThrow(
      StatsInputError,
    );
    expect(() => groupStats(F([1, 2]), { codes: Int32Array.from([0, 3]), levels: ['a'] })).toThrow(
      StatsInputError,
    );
  });
});
