import { describe, expect, it } from 'vitest';
import anova1 from '@stdlib/stats-anova1';
import {
  shapiroWilk,
  shapiroWilkCoefficients,
  brownForsythe,
  studentizedFlags,
} from '../../../src/stats/diagnostics/index.ts';
import { StatsInputError } from '../../../src/stats/summary/index.ts';

const F = (a: readonly number[]): Float64Array => Float64Array.from(a);

/** Absolute error check that fails the test. */
function expectAbs(actual: number, expected: number, tol: number, what: string): void {
  if (!(Math.abs(actual - expected) <= tol)) {
    throw new Error(`${what}: expected ${expected} +- ${tol}, got ${actual}`);
  }
}

/** Must round to the printed figure (half a unit in its last place). */
function expectPrinted(actual: number, printed: number, decimals: number, what: string): void {
  expectAbs(actual, printed, 0.5 * 10 ** -decimals * (1 + 1e-9), what);
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

// source: Dobson (1983), plant weights (from memory; docs/references.md section 3)
const control = [4.17, 5.58, 5.18, 6.11, 4.5, 4.61, 5.17, 4.53, 5.33, 5.14];
const trt1 = [4.81, 4.17, 4.41, 3.59, 5.87, 3.83, 6.03, 4.89, 4.32, 4.69];
const trt2 = [6.31, 5.12, 5.54, 5.5, 5.37, 5.29, 4.92, 6.15, 5.8, 5.26];
// source: Student (1908), sleep data (from memory; docs/references.md section 2)
const drug1 = [0.7, -1.6, -0.2, -1.2, -0.1, 3.4, 3.7, 0.8, 0.0, 2.0];
const drug2 = [1.9, 0.8, 1.1, 0.1, -0.1, 4.4, 5.5, 1.6, 4.6, 3.4];

describe('shapiroWilk (Royston 1995, AS R94)', () => {
  // source: scipy 1.10.1 stats.shapiro, via docs/references.md section 6 (asked: W to 1e-6, p to
  // 1e-4). The p-values are checked to 1e-5, tighter than asked: the measured differences
  // are at most 2e-6 (scipy's routine works in single precision), and at 1e-4 a change of one
  // unit in the last digit of a published coefficient (3.7e-5 in p) would go unnoticed.
  it('control plant weights', () => {
    const r = shapiroWilk(F(control));
    expectAbs(r.w, 0.9566815, 1e-6, 'W');
    expectAbs(r.p, 0.7474745, 1e-5, 'p');
    expect(r.n).toBe(10);
  });
  it('the ten paired sleep differences', () => {
    const r = shapiroWilk(F(drug1.map((v, i) => v - drug2[i]!)));
    expectAbs(r.w, 0.8298714, 1e-6, 'W');
    expectAbs(r.p, 0.0333416, 1e-5, 'p');
  });
  it('all thirty plant weights (the n >= 12 branch)', () => {
    const r = shapiroWilk(F([...control, ...trt1, ...trt2]));
    expectAbs(r.w, 0.9826829, 1e-6, 'W');
    expectAbs(r.p, 0.8915055, 1e-5, 'p');
  });

  it('does not depend on order, location or scale', () => {
    const base = shapiroWilk(F(control));
    const reversed = shapiroWilk(F(control.slice().reverse()));
    expect(reversed.w).toBe(base.w);
    // 1e6 + 3 v is itself rounded to the spacing of doubles near 1e6 (1.2e-10), which moves
    // the data by about 1e-10 relative to their spread of 6; W may move by as much.
    const moved = shapiroWilk(F(control.map((v) => 1e6 + 3 * v)));
    expectAbs(moved.w, base.w, 1e-9, 'W after shifting and scaling');
    expectAbs(moved.p, base.p, 1e-8, 'p after shifting and scaling');
  });

  it('coefficients form a unit vector, extreme pair first', () => {
    for (const n of [3, 4, 5, 6, 11, 12, 50, 5000]) {
      const a = shapiroWilkCoefficients(n);
      let ss = 0;
      for (const v of a) ss += 2 * v * v;
      expectAbs(ss, 1, 1e-12, `sum of squares, n ${n}`);
      for (let i = 1; i < a.length; i++) expect(a[i]!).toBeLessThan(a[i - 1]!);
    }
    // source: Shapiro and Wilk (1965), Biometrika 52: for n = 3 the coefficient is 1/sqrt(2)
    expectAbs(shapiroWilkCoefficients(3)[0]!, Math.SQRT1_2, 1e-16, 'a for n = 3');
  });

  it('n = 3 uses the exact distribution', () => {
    // source: Shapiro and Wilk (1965): for n = 3, P(W <= w) = (6 / pi)(asin(sqrt(w)) - pi / 3),
    // with W ranging from 3/4 to 1. Worked by hand: x = 0, 1, 3 gives b^2 = 9 / 2 and
    // sum of squares 14 / 3, so W = 27 / 28.
    const r = shapiroWilk(F([0, 1, 3]));
    expectAbs(r.w, 27 / 28, 1e-15, 'W');
    expectAbs(r.p, (6 / Math.PI) * (Math.asin(Math.sqrt(27 / 28)) - Math.PI / 3), 1e-14, 'p');
    expectAbs(shapiroWilk(F([0, 1, 2])).p, 1, 1e-12, 'p of an evenly spaced triple');
    expectAbs(shapiroWilk(F([0, 0, 1])).w, 0.75, 1e-15, 'smallest W for n = 3');
  });

  it('rejection rates under normal data stay near the nominal level (seeded simulation)', () => {
    // A gross-error check of every branch (n = 3, 4-5, 6-11, >= 12): a wrong coefficient or
    // branch moves these rates far more. It is not a measure of the approximation's accuracy:
    // Royston's p is itself approximate (measured here with 200,000 samples at n = 12:
    // P(p <= 0.01) = 0.0084, P(p <= 0.05) = 0.0480). Allowed: 20% of the level plus four
    // binomial standard errors of the simulation.
    const next = uniforms(2026);
    const normal = (): number => {
      let a = next();
      while (a === 0) a = next();
      return Math.sqrt(-2 * Math.log(a)) * Math.cos(2 * Math.PI * next());
    };
    const reps = 20000;
    for (const n of [3, 4, 5, 8, 11, 12, 40]) {
      const x = new Float64Array(n);
      let at1 = 0;
      let at5 = 0;
      let at10 = 0;
      for (let r = 0; r < reps; r++) {
        for (let i = 0; i < n; i++) x[i] = normal();
        const p = shapiroWilk(x).p;
        if (p <= 0.01) at1++;
        if (p <= 0.05) at5++;
        if (p <= 0.1) at10++;
      }
      for (const [count, alpha] of [
        [at1, 0.01],
        [at5, 0.05],
        [at10, 0.1],
      ] as const) {
        const rate = count / reps;
        const tol = 0.2 * alpha + 4 * Math.sqrt((alpha * (1 - alpha)) / reps);
        expectAbs(rate, alpha, tol, `rejection rate at ${alpha}, n ${n}`);
      }
    }
  });

  it('finds clearly skewed data non-normal', () => {
    const next = uniforms(8);
    const x = F(Array.from({ length: 200 }, () => -Math.log(1 - next()))); // exponential
    expect(shapiroWilk(x).p).toBeLessThan(1e-6);
  });

  it('rejects samples it does not cover', () => {
    expect(() => shapiroWilk(F([1, 2]))).toThrow(StatsInputError);
    expect(() => shapiroWilk(new Float64Array(5001).map((_, i) => i))).toThrow(/3 to 5000/);
    expect(() => shapiroWilk(F([2, 2, 2, 2]))).toThrow(/all values are equal/);
  });
});

describe('brownForsythe', () => {
  const y = F([...control, ...trt1, ...trt2]);
  const groups = {
    codes: Int32Array.from({ length: 30 }, (_, i) => Math.floor(i / 10)),
    levels: ['control', 'treatment 1', 'treatment 2'],
  };

  it('plant weights: the published statistic and p', () => {
    // source: scipy 1.10.1 stats.levene(center='median'), via docs/references.md section 6
    const r = brownForsythe(y, groups);
    expectPrinted(r.f, 1.1191857, 7, 'F');
    expectPrinted(r.p, 0.3412266, 7, 'p');
    expect(r.df1).toBe(2);
    expect(r.df2).toBe(27);
    // by hand from the sorted groups: medians (5.14 + 5.17) / 2, (4.41 + 4.69) / 2,
    // (5.37 + 5.50) / 2
    expectAbs(r.median[0]!, 5.155, 1e-14, 'median');
    expectAbs(r.median[1]!, 4.55, 1e-14, 'median');
    expectAbs(r.median[2]!, 5.435, 1e-14, 'median');
  });

  it('equals the one-way analysis of |y - median| by @stdlib/stats-anova1', () => {
    // source: @stdlib/stats-anova1 0.2.3; medians computed here by sorting
    const next = uniforms(41);
    let worst = 0;
    for (let trial = 0; trial < 20; trial++) {
      const k = 2 + (trial % 4);
      const raw: number[] = [];
      const deviations: number[] = [];
      const labels: string[] = [];
      const codes: number[] = [];
      for (let j = 0; j < k; j++) {
        const nj = 3 + Math.floor(next() * 10);
        const part = Array.from({ length: nj }, () => (1 + j) * next() * next() * 10);
        const sorted = part.slice().sort((a, b) => a - b);
        const mid = Math.floor(nj / 2);
        const med = nj % 2 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2;
        for (const v of part) {
          raw.push(v);
          deviations.push(Math.abs(v - med));
          labels.push(`g${j}`);
          codes.push(j);
        }
      }
      const ref = anova1(deviations, labels);
      const ours = brownForsythe(F(raw), {
        codes: Int32Array.from(codes),
        levels: Array.from({ length: k }, (_, j) => `g${j}`),
      });
      worst = Math.max(
        worst,
        Math.abs(ours.f - ref.statistic) / ref.statistic,
        Math.abs(ours.p - ref.pValue) / ref.pValue,
      );
    }
    expect(worst).toBeLessThan(1e-10);
  });

  it('rejects a single group and spreads that cannot vary', () => {
    expect(() =>
      brownForsythe(F([1, 2, 3]), { codes: Int32Array.from([0, 0, 0]), levels: ['a'] }),
    ).toThrow(StatsInputError);
    // two values per group: both deviations from the median are equal in every group
    expect(() =>
      brownForsythe(F([1, 3, 5, 9]), { codes: Int32Array.from([0, 0, 1, 1]), levels: ['a', 'b'] }),
    ).toThrow(/do not vary/);
  });
});

describe('studentizedFlags', () => {
  it('flags |r| above the threshold, and only those', () => {
    // common practice, no source: |r| > 3 as the line for a residual worth a second look
    const r = studentizedFlags(F([0.5, -3.2, 3, 4.1, NaN, -2.99, -7]));
    expect(Array.from(r.flagged)).toEqual([0, 1, 0, 1, 0, 0, 1]);
    expect(Array.from(r.indices)).toEqual([1, 3, 6]);
    expect(r.threshold).toBe(3);
    const r2 = studentizedFlags(F([0.5, -2.5, 2.1]), 2);
    expect(Array.from(r2.indices)).toEqual([1, 2]);
    expect(() => studentizedFlags(F([1]), 0)).toThrow(RangeError);
  });
});
