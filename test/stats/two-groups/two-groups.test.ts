import { describe, expect, it } from 'vitest';
import ttest from '@stdlib/stats-ttest';
import ttest2 from '@stdlib/stats-ttest2';
import { twoSample, paired } from '../../../src/stats/two-groups/index.ts';
import { StatsInputError } from '../../../src/stats/summary/index.ts';
import { statsMsg } from '../../../src/messages/stats.ts';

const F = (a: readonly number[]): Float64Array => Float64Array.from(a);

/** Must round to the printed figure (half a unit in its last place). */
function expectPrinted(actual: number, printed: number, decimals: number): void {
  const half = 0.5 * 10 ** -decimals * (1 + 1e-9);
  if (!(Math.abs(actual - printed) <= half)) {
    throw new Error(`expected ${printed} (to ${decimals} decimals), got ${actual}`);
  }
}

/** Relative error check that fails the test. */
function expectRel(actual: number, expected: number, tol: number, what = ''): void {
  const err = Math.abs(actual - expected) / Math.abs(expected);
  if (!(err <= tol)) {
    throw new Error(`${what}: expected ${expected}, got ${actual} (relative error ${err} > ${tol})`);
  }
}

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

// source: Student (1908), "The probable error of a mean", Biometrika 6 (from memory):
// additional hours of sleep of ten patients under two drugs.
const drug1 = [0.7, -1.6, -0.2, -1.2, -0.1, 3.4, 3.7, 0.8, 0.0, 2.0];
const drug2 = [1.9, 0.8, 1.1, 0.1, -0.1, 4.4, 5.5, 1.6, 4.6, 3.4];
const stacked = F([...drug1, ...drug2]);
const byDrug = {
  codes: Int32Array.from({ length: 20 }, (_, i) => (i < 10 ? 0 : 1)),
  levels: ['drug 1', 'drug 2'],
};

describe('paired, on the sleep data', () => {
  it('reproduces every published figure', () => {
    // source: docs/references.md section 2 (Student 1908; from memory, confirmed with scipy 1.10.1)
    const r = paired(F(drug1), F(drug2));
    expectPrinted(r.estimate, -1.58, 10);
    expectPrinted(r.sd, 1.22999548, 8);
    expectPrinted(r.t, -4.0621277, 7);
    expect(r.df).toBe(9);
    expectPrinted(r.p, 0.0028329, 7);
    expectPrinted(r.low, -2.4598858, 7);
    expectPrinted(r.high, -0.7001142, 7);
    expect(r.n).toBe(10);
    expect(r.level).toBe(0.95);
    expectRel(r.se, r.sd / Math.sqrt(10), 1e-15, 'se');
  });

  it('agrees with @stdlib/stats-ttest', () => {
    // source: @stdlib/stats-ttest 0.2.3 (paired form, ttest(x, y))
    const ref = ttest(drug1, drug2, { alpha: 0.01 });
    const r = paired(F(drug1), F(drug2), 0.99);
    expectRel(r.t, ref.statistic, 1e-13, 't');
    expectRel(r.p, ref.pValue, 1e-12, 'p');
    expectRel(r.low, ref.ci[0]!, 1e-12, 'low');
    expectRel(r.high, ref.ci[1]!, 1e-12, 'high');
  });
});

describe('twoSample, on the sleep data treated as unpaired', () => {
  it('pooled form reproduces the published figures', () => {
    // source: docs/references.md section 2 (scipy 1.10.1 stats.ttest_ind, equal_var=True)
    const r = twoSample(stacked, byDrug, 0.95, true);
    expectPrinted(r.estimate, -1.58, 10);
    expectPrinted(r.t, -1.8608135, 7);
    expect(r.df).toBe(18);
    expectPrinted(r.p, 0.0791867, 7);
    expectPrinted(r.pooled_variance, 3.6047778, 7);
    expectPrinted(r.low, -3.363874, 7);
    expectPrinted(r.high, 0.203874, 7);
    expect(r.n).toBe(20);
    expect(r.first_level).toBe('drug 1');
    expect(r.second_level).toBe('drug 2');
    expect(r.first_n).toBe(10);
    expect(r.second_n).toBe(10);
    expect(r.equal_variance).toBe(true);
    // a pooled variance weights each group's variance by its degrees of freedom
    // (common practice, no source)
    expectRel(r.pooled_variance, (9 * r.first_sd ** 2 + 9 * r.second_sd ** 2) / 18, 1e-14, 'pooled');
  });

  it('Welch form reproduces the published figures', () => {
    // source: docs/references.md section 2 (scipy 1.10.1 stats.ttest_ind, equal_var=False)
    const r = twoSample(stacked, byDrug, 0.95, false);
    expectPrinted(r.t, -1.8608135, 7);
    expectPrinted(r.df, 17.776474, 6);
    expectPrinted(r.p, 0.0793941, 7);
    expectPrinted(r.low, -3.3654832, 7);
    expectPrinted(r.high, 0.2054832, 7);
    expect(r.pooled_variance).toBeNaN();
    expect(r.equal_variance).toBe(false);
  });

  it('estimate is first level minus second, whatever the row order', () => {
    const flipped = { codes: byDrug.codes.map((c) => 1 - c), levels: ['drug 2', 'drug 1'] };
    const r = twoSample(stacked, flipped);
    expectPrinted(r.estimate, 1.58, 10);
    expectPrinted(r.t, 1.8608135, 7);
  });
});

describe('twoSample against @stdlib/stats-ttest2 on random unbalanced data', () => {
  it('matches t, df, p and the interval in both forms', () => {
    // source: @stdlib/stats-ttest2 0.2.3
    const next = uniforms(99);
    let worst = 0;
    for (let trial = 0; trial < 50; trial++) {
      const n1 = 2 + Math.floor(next() * 15);
      const n2 = 2 + Math.floor(next() * 15);
      const a = Array.from({ length: n1 }, () => 50 + 10 * next());
      const b = Array.from({ length: n2 }, () => 52 + 25 * next() * next());
      const y = F([...a, ...b]);
      const groups = { codes: Int32Array.from(y, (_, i) => (i < n1 ? 0 : 1)), levels: ['a', 'b'] };
      for (const equal of [true, false]) {
        const level = trial % 2 === 0 ? 0.95 : 0.9;
        const ref = ttest2(a, b, { variance: equal ? 'equal' : 'unequal', alpha: 1 - level });
        const r = twoSample(y, groups, level, equal);
        const errs = [
          Math.abs(r.t - ref.statistic) / Math.abs(ref.statistic),
          Math.abs(r.df - ref.df) / ref.df,
          Math.abs(r.p - ref.pValue) / ref.pValue,
          Math.abs(r.low - ref.ci[0]!) / Math.abs(ref.ci[0]!),
          Math.abs(r.high - ref.ci[1]!) / Math.abs(ref.ci[1]!),
        ];
        for (const e of errs) worst = Math.max(worst, e);
      }
    }
    expect(worst).toBeLessThan(1e-10);
  });
});

describe('input checks', () => {
  it('rejects what cannot be compared', () => {
    const three = { codes: Int32Array.from([0, 1, 2, 0]), levels: ['a', 'b', 'c'] };
    expect(() => twoSample(F([1, 2, 3, 4]), three)).toThrow(StatsInputError);
    const lonely = { codes: Int32Array.from([0, 0, 0]), levels: ['a', 'b'] };
    expect(() => twoSample(F([1, 2, 3]), lonely)).toThrow(statsMsg.emptyGroup('a', 3, 'b', 0));
    const oneEach = { codes: Int32Array.from([0, 1, 1]), levels: ['a', 'b'] };
    expect(() => twoSample(F([1, 2, 3]), oneEach, 0.95, false)).toThrow(statsMsg.separateTooFew('a', 1, 'b', 2));
    expect(() => twoSample(F([1, 2, 3]), oneEach, 1.5)).toThrow(statsMsg.badLevel(1.5));
    expect(() => paired(F([1, 2]), F([1]))).toThrow(/same length/);
    expect(() => paired(F([1]), F([2]))).toThrow(statsMsg.pairedTooFew(1));
  });

  it('pooled form works with a single value in one group', () => {
    const oneEach = { codes: Int32Array.from([0, 1, 1]), levels: ['a', 'b'] };
    const r = twoSample(F([1, 2, 4]), oneEach);
    // by hand: estimate 1 - 3 = -2; pooled variance (0 + 2) / 1 = 2; se sqrt(2 (1 + 1/2))
    expect(r.df).toBe(1);
    expectRel(r.pooled_variance, 2, 1e-15, 'pooled');
    expectRel(r.se, Math.sqrt(3), 1e-15, 'se');
  });
});
