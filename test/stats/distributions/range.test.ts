/**
 * The studentized range distribution (src/stats/distributions/range.ts).
 */
import betainc from '@stdlib/math-base-special-betainc';
import { describe, expect, it } from 'vitest';
import {
  normalUpper,
  rangeCdf,
  rangeCritical,
  rangeQuantile,
  rangeUpper,
  rangeUpperQuantile,
  tTwoSided,
} from '../../../src/stats/distributions/index.ts';
import { MAX_GROUPS, normalRange, normalRangeDirect, rangeTable } from '../../../src/stats/distributions/range.ts';
import { expectPrinted, expectRel, jStat, relErr, Worst } from './helpers.ts';

describe('handbook values', () => {
  // source: docs/references.md section 5 (handbook tables; values from scipy 1.10.1)
  const rows: [number, number, number, number, number][] = [
    // groups, df, level, printed quantile, significant digits printed
    [3, 12, 0.95, 3.772929, 7],
    [4, 20, 0.95, 3.958294, 7],
    [10, 60, 0.95, 4.646324, 7],
    [2, 2, 0.95, 6.08487, 6],
    [3, 5, 0.95, 4.601726, 7],
    [5, 10, 0.95, 4.654293, 7],
    [20, 2, 0.99, 37.943462, 8],
    [20, 60, 0.99, 6.014883, 7],
    [10, 1000, 0.95, 4.484302, 7],
  ];
  it.each(rows)('quantile, %i groups, %i df, level %f', (k, df, level, printed, digits) => {
    const q = rangeCritical(level, k, df);
    expectPrinted(q, printed, digits, `range critical ${k}, ${df}, ${level}`);
    expect(rangeQuantile(level, k, df)).toBe(q);
    // The quantile solves its own equation far more tightly than the printed digits show.
    expectRel(rangeUpper(q, k, df), 1 - level, 1e-11, 'upper tail at the critical value');
  });

  it('upper tail, 3 groups, 12 df, q = 5', () => {
    // source: docs/references.md section 5
    expectRel(rangeUpper(5, 3, 12), 0.010599582, 1e-6, 'range upper 3, 12, 5');
  });

  it('upper tail, 2 groups, 60 df, q = 12: the exact t identity', () => {
    // With two groups Q / sqrt(2) is |T| on the same df, so P(Q > 12) = P(|T_60| > 8.485...).
    // Checked two ways: against @stdlib's t (source: @stdlib/stats-base-dists-t-cdf 0.2.3) and
    // against a Simpson integration of the t density written out here (common practice, no
    // source), which is independent of every library.
    const t = 12 / Math.SQRT2;
    const simpson = tTailBySimpson(t, 60);
    expectRel(2 * simpson, tTwoSided(t, 60), 1e-10, 'Simpson against @stdlib t');
    expectRel(rangeUpper(12, 2, 60), 2 * simpson, 1e-10, 'range upper 2, 60, 12');
    // docs/references.md section 5 prints 7.3206996e-12 for this row; that value is 5.0e-4 above the exact
    // identity (both checks above agree with each other to 1e-10), so it is reported here
    // rather than used.
    console.log(
      `range upper 2 groups, 60 df, q 12: ${rangeUpper(12, 2, 60)}; exact identity ${2 * simpson}; ` +
        `docs/references.md section 5: 7.3206996e-12 differs by ${relErr(7.3206996e-12, 2 * simpson).toExponential(2)}`,
    );
  });
});

/** P(T > t) on df degrees of freedom by Simpson's rule on the density (t > 0). */
function tTailBySimpson(t: number, df: number): number {
  // ln Gamma by recurrence up to 20 and Stirling's series (Abramowitz and Stegun 6.1.40).
  const lgamma = (x0: number): number => {
    let x = x0;
    let r = 0;
    while (x < 20) {
      r -= Math.log(x);
      x += 1;
    }
    const i = 1 / x;
    return r + (x - 0.5) * Math.log(x) - x + 0.5 * Math.log(2 * Math.PI) + i / 12 - i ** 3 / 360 + i ** 5 / 1260 - i ** 7 / 1680;
  };
  const c = lgamma((df + 1) / 2) - lgamma(df / 2) - 0.5 * Math.log(df * Math.PI);
  const dens = (x: number): number => Math.exp(c - ((df + 1) / 2) * Math.log1p((x * x) / df));
  const n = 200_000;
  const len = 30;
  const h = len / n;
  let s = dens(t) + dens(t + len);
  for (let i = 1; i < n; i++) s += (i % 2 === 1 ? 4 : 2) * dens(t + i * h);
  return (s * h) / 3;
}

describe('exact identities', () => {
  it('2 groups: P(Q > q) = P(|T| > q / sqrt 2) on the same df, to 1e-10, far tails included', () => {
    // source: the range of two normals is |Z1 - Z2| = sqrt(2) |Z| (common practice, no source)
    const w = new Worst();
    for (const df of [0.5, 1, 1.5, 2, 3, 5, 10, 12, 60, 1000, 1e5]) {
      for (const q of [0.01, 0.3, 1, 2, 3, 5, 8, 12, 20, 40, 100, 1000]) {
        const exact = tTwoSided(q / Math.SQRT2, df);
        if (exact < 1e-280) continue;
        const got = rangeUpper(q, 2, df);
        w.add(exact >= 1e-3 ? 'body' : exact >= 1e-12 ? 'tail to 1e-12' : 'beyond 1e-12', relErr(got, exact), `df ${df}, q ${q}`);
        expectRel(got, exact, 1e-10, `range upper, 2 groups, df ${df}, q ${q}`);
        expectRel(rangeCdf(q, 2, df), 1 - exact, 1e-10, `range cdf, 2 groups, df ${df}, q ${q}`);
      }
    }
    w.print('2 groups against the t identity: worst relative error of rangeUpper');
  });

  it('df = Infinity, 2 groups: P(Q <= q) = 2 Phi(q / sqrt 2) - 1', () => {
    for (const q of [0.001, 0.1, 0.5, 1, 2, 4, 8, 12, 20, 30]) {
      const upper = 2 * normalUpper(q / Math.SQRT2);
      expectRel(rangeUpper(q, 2, Infinity), upper, 1e-12, `upper at ${q}`);
      expectRel(rangeCdf(q, 2, Infinity), 1 - upper, 1e-12, `cdf at ${q}`);
    }
  });

  it('the two tails add up to 1', () => {
    for (const k of [3, 5, 10, 30, 100, MAX_GROUPS]) {
      for (const df of [1, 2, 7, 40, 1e4, Infinity]) {
        for (const q of [0.5, 2, 4, 6, 10, 30]) {
          const s = rangeCdf(q, k, df) + rangeUpper(q, k, df);
          expect(Math.abs(s - 1), `k ${k}, df ${df}, q ${q}`).toBeLessThan(1e-13);
        }
      }
    }
  });
});

describe('the tabulated inner integral', () => {
  it('matches direct evaluation of the range distribution of k normals to 1e-12', () => {
    const out = { cdf: 0, upper: 0, density: 0 };
    const w = new Worst();
    for (const k of [2, 3, 4, 7, 10, 25, 60, 100, MAX_GROUPS]) {
      const table = rangeTable(k);
      for (let x = 0.013; x < 48; x *= 1.09) {
        normalRange(x, table, out);
        const upper = normalRangeDirect(x, k, 'upper');
        expectRel(out.upper, upper, 1e-12, `upper, k ${k}, w ${x}`);
        if (x <= table.split) {
          const lower = normalRangeDirect(x, k, 'lowerScaled') * Math.pow(x, k - 1);
          if (lower > 1e-300) expectRel(out.cdf, lower, 1e-12, `cdf, k ${k}, w ${x}`);
          w.add('cdf', relErr(out.cdf, lower), `k ${k}`);
        }
        w.add('upper', relErr(out.upper, upper), `k ${k}`);
      }
    }
    w.print('tables against direct evaluation: worst relative error');
  });

  it('agrees with jstat (an AS 190 style implementation) where jstat is accurate', () => {
    // source: jstat 1.9.6 jStat.tukey.cdf; docs/libraries.md section 4 measured its absolute error at about
    // 1e-8 for df >= 10 and far worse below, which the printed table shows
    const w = new Worst();
    for (const k of [2, 3, 5, 10, 20]) {
      for (const df of [2, 5, 10, 30, 120]) {
        for (const q of [1, 2, 3, 4, 5, 6, 8]) {
          const diff = Math.abs(jStat.tukey.cdf(q, k, df) - rangeCdf(q, k, df));
          w.add(`absolute difference, df ${df}`, diff, `k ${k}, q ${q}`);
          if (df >= 10) expect(diff, `k ${k}, df ${df}, q ${q}`).toBeLessThan(1e-7);
        }
      }
    }
    for (const [k, df, level] of [[20, 2, 0.99], [3, 12, 0.95], [10, 60, 0.95]] as const) {
      w.add('quantile, relative', relErr(jStat.tukey.inv(level, k, df), rangeCritical(level, k, df)), `k ${k}, df ${df}, ${level}`);
    }
    w.add('upper tail 2, 60, q 12, relative', relErr(1 - jStat.tukey.cdf(12, 2, 60), rangeUpper(12, 2, 60)), '');
    w.print('jstat studentized range against ours');
  });
});

describe('quantiles', () => {
  it('round trip on both tails, levels close to 1 and tiny upper tails', () => {
    for (const k of [2, 3, 6, 15, 50, 100]) {
      for (const df of [1, 2, 5, 20, 200, Infinity]) {
        for (const p of [0.01, 0.2, 0.5, 0.9, 0.95, 0.99, 0.999, 1 - 1e-6]) {
          const q = rangeQuantile(p, k, df);
          if (p >= 0.5) expectRel(rangeUpper(q, k, df), 1 - p, 1e-10, `upper at quantile ${p}, k ${k}, df ${df}`);
          else expectRel(rangeCdf(q, k, df), p, 1e-10, `cdf at quantile ${p}, k ${k}, df ${df}`);
        }
        for (const a of [1e-9, 1e-12, 1e-20]) {
          const q = rangeUpperQuantile(a, k, df);
          expectRel(rangeUpper(q, k, df), a, 1e-10, `upper quantile ${a}, k ${k}, df ${df}`);
        }
      }
    }
  });

  it('tiny lower-tail levels, where the quantile near the centre loses its digits', () => {
    // source: scipy 1.10.1, stats.studentized_range.ppf(1e-10, 3, 5) = 1.9046256359523653e-05
    // (scipy's far tails are good to about 1e-7 here; our round trip below is exact)
    expectRel(rangeQuantile(1e-10, 3, 5), 1.9046256359523653e-5, 2e-8, 'ppf(1e-10, 3, 5)');
    // source: scipy 1.10.1, stats.studentized_range.ppf(1e-6, 3, 5) = 0.001904626285461516
    expectRel(rangeQuantile(1e-6, 3, 5), 0.001904626285461516, 1e-9, 'ppf(1e-6, 3, 5)');
    // exact for 2 groups: P(Q <= q) = P(|T| <= q / sqrt 2) = I_{x^2 / (df + x^2)}(1/2, df/2)
    // (the regularized incomplete beta keeps the digits that 1 - P(|T| > x) loses)
    const q2 = rangeQuantile(1e-12, 2, 10);
    const x2 = (q2 * q2) / 2;
    expectRel(betainc(x2 / (10 + x2), 0.5, 5), 1e-12, 1e-9, 'k = 2 identity at 1e-12');
    for (const [p, k, df] of [[1e-10, 3, 5], [1e-200, 4, 12], [1e-15, 10, 3], [1e-10, 3, Infinity]] as const) {
      const q = rangeQuantile(p, k, df);
      expectRel(rangeCdf(q, k, df), p, 1e-10, `cdf at quantile ${p}, k ${k}, df ${df}`);
    }
  });

  it('increases with the level and with the number of groups', () => {
    let prev = 0;
    for (const level of [0.5, 0.8, 0.9, 0.95, 0.99, 0.999]) {
      const q = rangeCritical(level, 5, 10);
      expect(q).toBeGreaterThan(prev);
      prev = q;
    }
    prev = 0;
    for (const k of [2, 3, 4, 8, 16, 32, 64, 128]) {
      const q = rangeCritical(0.95, k, 10);
      expect(q).toBeGreaterThan(prev);
      prev = q;
    }
  });
});

describe('invalid parameters give NaN', () => {
  it.each([
    ['groups 1', 3, 1, 10],
    ['groups 2.5', 3, 2.5, 10],
    ['groups above the maximum', 3, MAX_GROUPS + 1, 10],
    ['df 0', 3, 3, 0],
    ['df -1', 3, 3, -1],
    ['df NaN', 3, 3, NaN],
    ['q NaN', NaN, 3, 10],
  ])('%s', (_label, q, k, df) => {
    expect(rangeCdf(q, k, df)).toBeNaN();
    expect(rangeUpper(q, k, df)).toBeNaN();
    expect(rangeQuantile(0.95, k, Number.isNaN(q) ? 10 : df)).toBe(Number.isNaN(q) ? rangeQuantile(0.95, k, 10) : NaN);
  });

  it('out-of-range probabilities and edge arguments', () => {
    expect(rangeQuantile(1.5, 3, 10)).toBeNaN();
    expect(rangeQuantile(-0.1, 3, 10)).toBeNaN();
    expect(rangeQuantile(0, 3, 10)).toBe(0);
    expect(rangeQuantile(1, 3, 10)).toBe(Infinity);
    expect(rangeCdf(0, 3, 10)).toBe(0);
    expect(rangeUpper(-1, 3, 10)).toBe(1);
    expect(rangeUpper(Infinity, 3, 10)).toBe(0);
  });
});
