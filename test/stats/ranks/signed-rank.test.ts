import { describe, expect, it } from 'vitest';
import wilcoxon from '@stdlib/stats-wilcoxon';
import signrankCdf from '@stdlib/stats-base-dists-signrank-cdf';
import {
  signedRank,
  signedRankCounts,
  signedRankExactP,
  averageRanks,
} from '../../../src/stats/ranks/index.ts';
import { StatsInputError } from '../../../src/stats/summary/index.ts';
import { F, expectRel, twoSidedFromNull, uniforms } from './helpers.ts';

// source: Student (1908), Biometrika 6 (from memory; docs/references.md section 2)
const drug1 = [0.7, -1.6, -0.2, -1.2, -0.1, 3.4, 3.7, 0.8, 0.0, 2.0];
const drug2 = [1.9, 0.8, 1.1, 0.1, -0.1, 4.4, 5.5, 1.6, 4.6, 3.4];

describe('exact null distribution of the signed rank sum', () => {
  it('matches @stdlib/stats-base-dists-signrank-cdf for n = 1 .. 40', () => {
    // source: @stdlib/stats-base-dists-signrank-cdf 0.2.3
    let worst = 0;
    for (let n = 1; n <= 40; n++) {
      const c = signedRankCounts(n);
      let cum = 0;
      for (let s = 0; s < c.length; s++) {
        cum += c[s]!;
        const ours = cum / 2 ** n;
        worst = Math.max(worst, expectRel(ours, signrankCdf(s, n), 1e-12, `n ${n}, s ${s}`));
      }
    }
    expect(worst).toBeLessThan(1e-12);
  });

  it('counts add up to 2^n and are symmetric', () => {
    for (const n of [5, 17, 50, 53]) {
      const c = signedRankCounts(n);
      let total = 0;
      for (const v of c) total += v;
      expect(total).toBe(2 ** n);
      for (let s = 0; s < c.length; s++) expect(c[s]).toBe(c[c.length - 1 - s]);
    }
    expect(() => signedRankCounts(54)).toThrow(RangeError);
  });

  it('gives the handbook critical values, two-sided 5%', () => {
    // source: table of critical values of Wilcoxon's signed rank statistic, two-sided 5%,
    // in any statistics handbook (from memory): n 10 -> 8, 20 -> 52, 30 -> 137, 50 -> 434.
    // The critical value T is the largest with P(V <= T) <= 0.025.
    for (const [n, crit] of [
      [10, 8],
      [20, 52],
      [30, 137],
      [50, 434],
    ] as const) {
      expect(signedRankExactP(crit, n)).toBeLessThanOrEqual(0.05);
      expect(signedRankExactP(crit + 1, n)).toBeGreaterThan(0.05);
    }
  });
});

describe('signedRank', () => {
  it('matches a brute-force sign enumeration on small samples without ties', () => {
    // source: the definition; all 2^n sign patterns of the ranks enumerated in the test
    const next = uniforms(3);
    for (let trial = 0; trial < 30; trial++) {
      const n = 3 + (trial % 10);
      const a = Array.from({ length: n }, () => next() * 10);
      const b = Array.from({ length: n }, () => next() * 10);
      const r = signedRank(F(a), F(b));
      expect(r.method).toBe('exact');
      expect(r.zeros).toBe(0);
      // Brute force: V for every sign pattern on the observed |differences|.
      const abs = a.map((v, i) => Math.abs(v - b[i]!));
      const ranks = abs.map((v) => 1 + abs.filter((w) => w < v).length);
      const observed = ranks.reduce((s, rk, i) => s + (a[i]! > b[i]! ? rk : 0), 0);
      const all = new Float64Array(2 ** n);
      for (let pattern = 0; pattern < all.length; pattern++) {
        let v = 0;
        for (let i = 0; i < n; i++) if (pattern & (1 << i)) v += ranks[i]!;
        all[pattern] = v;
      }
      expect(r.statistic).toBe(observed);
      expectRel(r.p, twoSidedFromNull(all, observed), 1e-12, `trial ${trial}`);
    }
  });

  it('agrees with @stdlib/stats-wilcoxon (exact, no ties, no zeros)', () => {
    // source: @stdlib/stats-wilcoxon 0.2.3. Its exact two-sided p is twice one tail without
    // the cap at 1, so the comparison uses samples whose statistic is off the centre.
    const next = uniforms(11);
    let compared = 0;
    for (let trial = 0; trial < 40; trial++) {
      const n = 6 + (trial % 30);
      const a = Array.from({ length: n }, () => next() * 10 + 0.8);
      const b = Array.from({ length: n }, () => next() * 10);
      const r = signedRank(F(a), F(b));
      const ref = wilcoxon(a, b);
      if (ref.pValue > 0.9) continue;
      expect(r.method).toBe('exact');
      expect(r.statistic).toBe(ref.statistic);
      expectRel(r.p, ref.pValue, 1e-12, `trial ${trial}`);
      compared++;
    }
    expect(compared).toBeGreaterThan(30);
  });

  it('sleep data: one zero dropped, one tie, normal approximation as @stdlib/stats-wilcoxon', () => {
    // source: @stdlib/stats-wilcoxon 0.2.3 on the sleep data: statistic 0,
    // p 0.009090698015925103 (normal approximation with tie and continuity corrections)
    const r = signedRank(F(drug1), F(drug2));
    expect(r.zeros).toBe(1);
    expect(r.n).toBe(9);
    expect(r.tie_groups).toBe(1);
    expect(r.statistic).toBe(0);
    expect(r.method).toBe('normal');
    const ref = wilcoxon(drug1, drug2);
    expectRel(r.p, ref.pValue, 1e-12, 'p');
    // by hand: V = 0, centre 9 * 10 / 4 = 22.5, variance 9 * 10 * 19 / 24 - 6 / 48 = 71.125,
    // z = -(22.5 - 0.5) / sqrt(71.125)
    expectRel(r.z, -22 / Math.sqrt(71.125), 1e-14, 'z');
  });

  it('normal approximation with ties agrees with @stdlib/stats-wilcoxon on larger samples', () => {
    // source: @stdlib/stats-wilcoxon 0.2.3 (normal approximation, tie and continuity corrected)
    const next = uniforms(5);
    for (let trial = 0; trial < 20; trial++) {
      const n = 20 + trial * 7;
      // integers in a narrow range: many tied |differences|, no zeros
      const a: number[] = [];
      const b: number[] = [];
      for (let i = 0; i < n; i++) {
        const d = (1 + Math.floor(next() * 6)) * (next() < 0.4 ? -1 : 1);
        const base = Math.floor(next() * 50);
        a.push(base + d);
        b.push(base);
      }
      const r = signedRank(F(a), F(b));
      const ref = wilcoxon(a, b);
      expect(r.method).toBe('normal');
      expect(r.statistic).toBe(ref.statistic);
      expectRel(r.p, ref.pValue, 1e-9, `trial ${trial}`);
    }
  });

  it('uses the normal approximation with ties, and above 50 differences without them', () => {
    const n = 60;
    const a = F(Array.from({ length: n }, (_, i) => i + 1 + (i % 3 === 0 ? 0.5 : -0.25)));
    const b = F(Array.from({ length: n }, (_, i) => i + 1));
    const r = signedRank(a, b);
    expect(r.tie_groups).toBeGreaterThan(0); // |d| takes two values: 0.5 and 0.25
    const distinct = F(Array.from({ length: n }, (_, i) => (i + 1) * (i % 2 === 0 ? 1 : -1)));
    const r2 = signedRank(distinct, new Float64Array(n));
    expect(r2.tie_groups).toBe(0);
    expect(r2.method).toBe('normal');
    // by hand: V = 1 + 3 + ... + 59 = 900, centre 60 * 61 / 4 = 915, variance
    // 60 * 61 * 121 / 24 = 18452.5, z = -(15 - 0.5) / sqrt(18452.5)
    expect(r2.statistic).toBe(900);
    expectRel(r2.z, -14.5 / Math.sqrt(18452.5), 1e-14, 'z');
  });

  it('treats differences equal in decimal as tied although binary rounding splits them', () => {
    // 3.4 - 4.4 = -1.0000000000000004 and 1.2 - 2.2 = -1.0000000000000002 in binary
    const a = F([3.4, 1.2, 5, 7.5]);
    const b = F([4.4, 2.2, 2, 1.5]);
    expect(a[0]! - b[0]!).not.toBe(a[1]! - b[1]!); // the case is meaningful
    const r = signedRank(a, b);
    expect(r.tie_groups).toBe(1);
    expect(r.method).toBe('normal');
    // by hand: |d| = 1, 1, 3, 6 -> ranks 1.5, 1.5, 3, 4; positive: 3 + 4 = 7
    expect(r.statistic).toBe(7);
  });

  it('rejects all-zero differences and unequal lengths', () => {
    expect(() => signedRank(F([1, 2]), F([1, 2]))).toThrow(StatsInputError);
    expect(() => signedRank(F([1, 2]), F([1]))).toThrow(/same length/);
  });
});

describe('averageRanks', () => {
  it('gives midranks and the tie total', () => {
    // by hand: 10 20 20 30 30 30 -> ranks 1, 2.5, 2.5, 5, 5, 5; t^3 - t: 6 + 24 = 30
    const r = averageRanks(F([30, 20, 10, 30, 20, 30]));
    expect(Array.from(r.ranks)).toEqual([5, 2.5, 1, 5, 2.5, 5]);
    expect(r.tieTerm).toBe(30);
    expect(r.tieGroups).toBe(2);
  });
});
