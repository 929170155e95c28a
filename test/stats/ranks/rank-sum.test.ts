import { describe, expect, it } from 'vitest';
import {
  rankSum,
  mannWhitneyProbabilities,
  rankSumExactP,
  RANK_SUM_EXACT_MAX,
} from '../../../src/stats/ranks/index.ts';
import { StatsInputError } from '../../../src/stats/summary/index.ts';
import { F, expectRel, forEachSubset, twoSidedFromNull, uniforms } from './helpers.ts';

function twoGroups(a: readonly number[], b: readonly number[]) {
  return {
    y: F([...a, ...b]),
    groups: {
      codes: Int32Array.from({ length: a.length + b.length }, (_, i) => (i < a.length ? 0 : 1)),
      levels: ['first', 'second'],
    },
  };
}

describe('exact null distribution of the Mann-Whitney count', () => {
  it('matches brute-force enumeration of all rank subsets', () => {
    // source: the definition; every one of the C(m + n, m) equally likely subsets of ranks
    for (const [m, n] of [
      [1, 1],
      [1, 7],
      [3, 4],
      [5, 5],
      [4, 9],
      [10, 10],
    ] as const) {
      const freq = new Float64Array(m * n + 1);
      let total = 0;
      forEachSubset(m + n, m, (mask) => {
        let w = 0;
        for (let i = 0; i < mask.length; i++) if (mask[i]) w += i + 1;
        freq[w - (m * (m + 1)) / 2]!++;
        total++;
      });
      const p = mannWhitneyProbabilities(m, n);
      expect(p.length).toBe(m * n + 1);
      for (let u = 0; u <= m * n; u++) {
        expectRel(p[u]!, freq[u]! / total, 1e-13, `m ${m}, n ${n}, u ${u}`);
      }
      const swapped = mannWhitneyProbabilities(n, m);
      for (let u = 0; u <= m * n; u++) expectRel(swapped[u]!, p[u]!, 1e-13, 'swapped sizes');
    }
    expect(Array.from(mannWhitneyProbabilities(0, 4))).toEqual([1]);
  });

  it('gives the handbook critical values of U, two-sided 5%', () => {
    // source: table of critical values of the Mann-Whitney U, two-sided 5%, in any
    // statistics handbook (from memory): 5 and 5 -> 2, 10 and 10 -> 23, 20 and 20 -> 127.
    for (const [m, n, crit] of [
      [5, 5, 2],
      [10, 10, 23],
      [20, 20, 127],
    ] as const) {
      expect(rankSumExactP(crit, m, n)).toBeLessThanOrEqual(0.05);
      expect(rankSumExactP(crit + 1, m, n)).toBeGreaterThan(0.05);
    }
  });

  it('sums to 1 and is symmetric at the largest exact size', () => {
    const p = mannWhitneyProbabilities(RANK_SUM_EXACT_MAX, RANK_SUM_EXACT_MAX);
    let total = 0;
    for (const v of p) total += v;
    expectRel(total, 1, 1e-12, 'total');
    let worst = 0;
    for (let u = 0; u < p.length; u++) {
      const a = p[u]!;
      const b = p[p.length - 1 - u]!;
      worst = Math.max(worst, Math.abs(a - b) / Math.max(a, b));
    }
    expect(worst).toBeLessThan(1e-12);
  });
});

describe('rankSum', () => {
  it('exact p matches the permutation distribution of the data over all labellings', () => {
    // source: the definition; every assignment of the observed values to the two groups
    const next = uniforms(17);
    for (let trial = 0; trial < 12; trial++) {
      const m = 2 + (trial % 6);
      const n = 3 + ((trial * 5) % 7);
      const a = Array.from({ length: m }, () => next() * 5 + (trial % 3));
      const b = Array.from({ length: n }, () => next() * 5);
      const { y, groups } = twoGroups(a, b);
      const r = rankSum(y, groups);
      expect(r.method).toBe('exact');
      // U by its definition: pairs (first, second) with the first larger
      let u = 0;
      for (const x of a) for (const z of b) u += x > z ? 1 : 0;
      expect(r.u).toBe(u);
      const all: number[] = [];
      forEachSubset(m + n, m, (mask) => {
        let cu = 0;
        for (let i = 0; i < y.length; i++) {
          if (!mask[i]) continue;
          for (let j = 0; j < y.length; j++) if (!mask[j] && y[i]! > y[j]!) cu++;
        }
        all.push(cu);
      });
      expectRel(r.p, twoSidedFromNull(F(all), u), 1e-12, `trial ${trial}`);
    }
  });

  it('with ties: normal approximation, tie-corrected, worked from the rank-sum form', () => {
    // source: the textbook large-sample form of W: mean n1 (N + 1) / 2, variance
    // n1 n2 / 12 (N + 1 - sum(t^3 - t) / (N (N - 1))), continuity correction 1/2; here the
    // ranks are worked by hand.
    // values: first 1 2 2 5; second 2 3 3 4 6
    // pooled sorted: 1 | 2 2 2 | 3 3 | 4 | 5 | 6 -> ranks 1 | 3 3 3 | 5.5 5.5 | 7 | 8 | 9
    const { y, groups } = twoGroups([1, 2, 2, 5], [2, 3, 3, 4, 6]);
    const r = rankSum(y, groups);
    expect(r.method).toBe('normal');
    expect(r.tie_groups).toBe(2);
    expect(r.rank_sum).toBe(1 + 3 + 3 + 8);
    expect(r.u).toBe(15 - 10);
    const tie = 3 ** 3 - 3 + (2 ** 3 - 2); // 30
    const variance = ((4 * 5) / 12) * (10 - tie / (9 * 8));
    const z = -(Math.abs(15 - 20) - 0.5) / Math.sqrt(variance);
    expectRel(r.z, z, 1e-14, 'z');
    // two-sided normal tail, by the complementary error function identity
    expectRel(r.p, 2 * (0.5 * erfcByCF(Math.abs(z) / Math.SQRT2)), 1e-9, 'p');
  });

  it('reports levels and sizes, and rejects what cannot be ranked', () => {
    const { y, groups } = twoGroups([1, 4], [2, 3, 5]);
    const r = rankSum(y, groups);
    expect(r.n1).toBe(2);
    expect(r.n2).toBe(3);
    expect(r.first_level).toBe('first');
    expect(r.second_level).toBe('second');
    const same = twoGroups([2, 2], [2, 2]);
    expect(() => rankSum(same.y, same.groups)).toThrow(StatsInputError);
    expect(() =>
      rankSum(F([1, 2, 3]), { codes: Int32Array.from([0, 1, 2]), levels: ['a', 'b', 'c'] }),
    ).toThrow(/exactly two/);
    expect(() =>
      rankSum(F([1, 2, 3]), { codes: Int32Array.from([0, 0, 0]), levels: ['a', 'b'] }),
    ).toThrow(/at least one value/);
  });

  it('above the exact limit uses the normal approximation', () => {
    const n = RANK_SUM_EXACT_MAX + 1;
    const a = Array.from({ length: n }, (_, i) => 2 * i + 1);
    const b = Array.from({ length: n }, (_, i) => 2 * i + 2);
    const { y, groups } = twoGroups(a, b);
    const r = rankSum(y, groups);
    expect(r.method).toBe('normal');
    // by hand: first holds the odd ranks, W = n^2, U = n^2 - n (n + 1) / 2 = n (n - 1) / 2
    expect(r.u).toBe((n * (n - 1)) / 2);
  });
});

/**
 * erfc by Lentz's continued fraction, independent of the code under test, for x >= 0.5.
 * source: M. Abramowitz, I. A. Stegun (1964), Handbook of Mathematical Functions, 7.1.14.
 */
function erfcByCF(x: number): number {
  // erfc(x) = exp(-x^2) / sqrt(pi) * 1 / (x + 1/2 / (x + 1 / (x + 3/2 / (x + 2 / (x + ...)))))
  let f = x;
  let c = x;
  let d = 0;
  for (let k = 1; k < 500; k++) {
    const a = k / 2;
    d = x + a * d;
    d = 1 / d;
    c = x + a / c;
    const delta = c * d;
    f *= delta;
    if (Math.abs(delta - 1) < 1e-16) break;
  }
  return Math.exp(-x * x) / Math.sqrt(Math.PI) / f;
}
