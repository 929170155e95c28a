/**
 * The central distributions (normal, t, F, chi-square).
 *
 * 1. jstat against our functions (which are @stdlib 0.2/0.3 with three corrections, see
 *    src/stats/distributions/central.ts) on a grid of arguments whose tail probabilities run from 0.5
 *    down to 1e-12. The worst relative errors of jstat are printed, split into the body
 *    (tail probability >= 1e-3) and the far tail (1e-12 <= tail < 1e-3); they document why
 *    jstat is not used (the rule: 1e-10 in the body, 1e-6 in the far tail).
 * 2. Our functions against things that do not come from @stdlib: handbook values and exact
 *    closed forms, at 1e-12 relative.
 * 3. Round trips quantile -> cdf, and critical values at levels close to 1.
 */
import { describe, expect, it } from 'vitest';
import {
  chi2Cdf,
  chi2Quantile,
  chi2Upper,
  fCdf,
  fCritical,
  fQuantile,
  fUpper,
  normalCdf,
  normalQuantile,
  normalUpper,
  tCdf,
  tCritical,
  tQuantile,
  tTwoSided,
  tUpper,
} from '../../../src/stats/distributions/index.ts';
import { expectPrinted, expectRel, jStat, relErr, Worst } from './helpers.ts';

const TAILS = [0.5, 0.3, 0.1, 0.05, 0.01, 1e-3, 1e-4, 1e-6, 1e-8, 1e-10, 1e-12];
const zone = (tail: number): string => (tail >= 1e-3 ? 'body' : 'far tail');

describe('jstat 1.9.6 against the reference implementations', () => {
  // source: jstat 1.9.6 compared with @stdlib (stats-base-dists-* 0.2.3 / 0.3.1, with the
  // corrections of src/stats/distributions/central.ts)
  it('t distribution', () => {
    const w = new Worst();
    for (const df of [1, 2, 3, 5, 10, 30, 100, 1000]) {
      for (const a of TAILS) {
        const t = -tQuantile(a, df); // P(T > t) = a
        const z = zone(a);
        w.add(`cdf, ${z}`, relErr(jStat.studentt.cdf(-t, df), tCdf(-t, df)), `df ${df}, tail ${a}`);
        w.add(`cdf, ${z}`, relErr(jStat.studentt.cdf(t, df), tCdf(t, df)), `df ${df}, tail ${a}`);
        w.add(`upper as 1 - cdf, ${z}`, relErr(1 - jStat.studentt.cdf(t, df), tUpper(t, df)), `df ${df}, tail ${a}`);
        w.add(`quantile, ${z}`, relErr(jStat.studentt.inv(a, df), tQuantile(a, df)), `df ${df}, p ${a}`);
        w.add(`quantile, ${z}`, relErr(jStat.studentt.inv(1 - a, df), tQuantile(1 - a, df)), `df ${df}, p 1-${a}`);
      }
    }
    w.print('jstat t: worst relative error');
    // The comparison itself is sound (same parameterization) where jstat is usable at all.
    expect(w.get('cdf, body')).toBeLessThan(1e-4);
    expect(w.get('quantile, body')).toBeLessThan(1e-4);
  });

  it('F distribution', () => {
    const w = new Worst();
    const pairs: [number, number][] = [[1, 5], [1, 18], [2, 27], [3, 15], [3, 20], [5, 60], [10, 1000], [2, 1000]];
    for (const [d1, d2] of pairs) {
      for (const a of TAILS) {
        const f = fCritical(1 - a, d1, d2); // P(F > f) = a
        const fl = fQuantile(a, d1, d2); // P(F <= fl) = a
        const z = zone(a);
        const at = `df ${d1},${d2}, tail ${a}`;
        w.add(`cdf, ${z}`, relErr(jStat.centralF.cdf(fl, d1, d2), fCdf(fl, d1, d2)), at);
        w.add(`cdf, ${z}`, relErr(jStat.centralF.cdf(f, d1, d2), fCdf(f, d1, d2)), at);
        w.add(`upper as 1 - cdf, ${z}`, relErr(1 - jStat.centralF.cdf(f, d1, d2), fUpper(f, d1, d2)), at);
        w.add(`quantile, ${z}`, relErr(jStat.centralF.inv(a, d1, d2), fl), at);
        w.add(`quantile, ${z}`, relErr(jStat.centralF.inv(1 - a, d1, d2), f), at);
      }
    }
    w.print('jstat F: worst relative error');
    expect(w.get('cdf, body')).toBeLessThan(1e-4);
  });

  it('chi-square distribution', () => {
    const w = new Worst();
    for (const df of [1, 2, 5, 10, 50, 200]) {
      for (const a of TAILS) {
        const x = chi2Quantile(1 - a, df);
        const xl = chi2Quantile(a, df);
        const z = zone(a);
        const at = `df ${df}, tail ${a}`;
        w.add(`cdf, ${z}`, relErr(jStat.chisquare.cdf(xl, df), chi2Cdf(xl, df)), at);
        w.add(`cdf, ${z}`, relErr(jStat.chisquare.cdf(x, df), chi2Cdf(x, df)), at);
        w.add(`upper as 1 - cdf, ${z}`, relErr(1 - jStat.chisquare.cdf(x, df), chi2Upper(x, df)), at);
        w.add(`quantile, ${z}`, relErr(jStat.chisquare.inv(a, df), xl), at);
        w.add(`quantile, ${z}`, relErr(jStat.chisquare.inv(1 - a, df), x), at);
      }
    }
    w.print('jstat chi-square: worst relative error');
    expect(w.get('cdf, body')).toBeLessThan(1e-4);
  });

  it('normal distribution', () => {
    const w = new Worst();
    for (const a of TAILS) {
      const x = -normalQuantile(a);
      const z = zone(a);
      const at = `tail ${a}`;
      w.add(`cdf, ${z}`, relErr(jStat.normal.cdf(-x, 0, 1), normalCdf(-x)), at);
      w.add(`cdf, ${z}`, relErr(jStat.normal.cdf(x, 0, 1), normalCdf(x)), at);
      w.add(`upper as 1 - cdf, ${z}`, relErr(1 - jStat.normal.cdf(x, 0, 1), normalUpper(x)), at);
      w.add(`quantile, ${z}`, relErr(jStat.normal.inv(a, 0, 1), normalQuantile(a)), at);
      w.add(`quantile, ${z}`, relErr(jStat.normal.inv(1 - a, 0, 1), normalQuantile(1 - a)), at);
    }
    w.print('jstat normal: worst relative error');
    expect(w.get('cdf, body')).toBeLessThan(1e-4);
  });
});

describe('handbook values', () => {
  // source: docs/references.md section 5 (handbook tables; values from scipy 1.10.1)
  it('critical values', () => {
    expectPrinted(tQuantile(0.975, 18), 2.100922, 7, 't 18 df, 2.5% upper');
    expectPrinted(tCritical(0.95, 18), 2.100922, 7, 't 18 df, two-sided 95%');
    expectPrinted(tCritical(0.95, 9), 2.262157, 7, 't 9 df, two-sided 95%');
    expectPrinted(normalQuantile(0.975), 1.959964, 7, 'normal 2.5% upper');
    expectPrinted(fCritical(0.95, 1, 18), 4.413873, 7, 'F 1,18 5%');
    expectPrinted(fCritical(0.95, 3, 15), 3.287382, 7, 'F 3,15 5%');
    expectPrinted(fCritical(0.99, 2, 27), 5.488118, 7, 'F 2,27 1%');
    expectPrinted(chi2Quantile(0.95, 1), 3.841459, 7, 'chi-square 1 df 5%');
  });

  it('far tails computed directly', () => {
    expectPrinted(tUpper(40, 10), 1.1404289e-12, 8, 't upper, 10 df, t = 40');
    expectPrinted(fUpper(100, 3, 20), 3.2682418e-12, 8, 'F upper, 3 and 20 df, F = 100');
  });
});

/** P(Z > x) from series and continued fractions, independent of any library. */
function normalUpperIndependent(x: number): number {
  const phi = Math.exp(-0.5 * x * x) / Math.sqrt(2 * Math.PI);
  if (x >= 2.5) {
    // source: Laplace's continued fraction, Abramowitz and Stegun 26.2.14, evaluated backward
    let f = x;
    for (let k = 300; k >= 1; k--) f = x + k / f;
    return phi / f;
  }
  // source: Abramowitz and Stegun 26.2.10 (series of Phi about 0)
  let term = x;
  let sum = x;
  for (let n = 1; n < 200; n++) {
    term *= (-x * x) / (2 * n);
    sum += term / (2 * n + 1);
  }
  return 0.5 - sum / Math.sqrt(2 * Math.PI);
}

describe('exact closed forms, to 1e-12 relative', () => {
  const ARGS = [0.01, 0.1, 0.5, 1, 2, 3, 5, 10, 30, 100, 1e3, 1e4, 1e6, 1e9, 1e12];
  const TOL = 1e-12;

  it('t with 1 df is Cauchy; t with 2 df', () => {
    for (const t of ARGS) {
      // source: the Cauchy distribution, P(T > t) = atan(1/t) / pi (common practice, no source)
      const cauchy = Math.atan2(1, t) / Math.PI;
      expectRel(tUpper(t, 1), cauchy, TOL, `t upper 1 df at ${t}`);
      expectRel(tCdf(-t, 1), cauchy, TOL, `t cdf 1 df at ${-t}`);
      expectRel(tCdf(t, 1), 1 - cauchy, TOL, `t cdf 1 df at ${t}`);
      // source: Johnson, Kotz and Balakrishnan, Continuous Univariate Distributions 2, eq.
      // 28.7: P(T <= t) = 1/2 + t / (2 sqrt(2 + t^2)) for 2 df, here in cancellation-free form
      const r = Math.sqrt(2 + t * t);
      const upper2 = 1 / (r * (r + t));
      expectRel(tUpper(t, 2), upper2, TOL, `t upper 2 df at ${t}`);
      expectRel(tCdf(t, 2), 1 - upper2, TOL, `t cdf 2 df at ${t}`);
    }
  });

  it('chi-square with even df is a Poisson sum', () => {
    for (const x of [0.001, 0.1, 1, 3, 10, 30, 55, 80, 200, 600]) {
      // source: P(chi2_2 > x) = exp(-x/2) (common practice, no source)
      expectRel(chi2Upper(x, 2), Math.exp(-x / 2), TOL, `chi2 upper 2 df at ${x}`);
      expectRel(chi2Cdf(x, 2), -Math.expm1(-x / 2), TOL, `chi2 cdf 2 df at ${x}`);
      // source: Abramowitz and Stegun 26.4.21: P(chi2_2m > x) = exp(-x/2) sum_{j<m} (x/2)^j / j!
      for (const m of [2, 5]) {
        let term = 1;
        let sum = 1;
        for (let j = 1; j < m; j++) {
          term *= x / 2 / j;
          sum += term;
        }
        expectRel(chi2Upper(x, 2 * m), Math.exp(-x / 2) * sum, TOL, `chi2 upper ${2 * m} df at ${x}`);
      }
    }
  });

  it('F with 2 numerator or 2 denominator degrees of freedom', () => {
    for (const f of ARGS) {
      for (const nu of [1, 5, 20, 1000]) {
        // source: JKB 2, ch. 27: P(F > f) = (1 + 2 f / nu)^(-nu/2) for df1 = 2
        const lg = -(nu / 2) * Math.log1p((2 * f) / nu);
        if (lg > -700) expectRel(fUpper(f, 2, nu), Math.exp(lg), TOL, `F upper 2,${nu} at ${f}`);
        expectRel(fCdf(f, 2, nu), -Math.expm1(lg), TOL, `F cdf 2,${nu} at ${f}`);
        // P(F <= f) = x^(df1/2), x = df1 f / (df1 f + 2), for df2 = 2 (same source)
        const x = (nu * f) / (nu * f + 2);
        expectRel(fCdf(f, nu, 2), Math.pow(x, nu / 2), TOL, `F cdf ${nu},2 at ${f}`);
      }
    }
  });

  it('t squared is F(1, df): tTwoSided(t, df) = fUpper(t^2, 1, df)', () => {
    // source: JKB 2, ch. 27 (the square of t on nu df is F on 1 and nu df)
    for (const df of [1, 2, 3, 7, 18, 60, 500]) {
      for (const t of [0.05, 0.5, 1, 2, 4, 8, 15, 40, 100, 1e4]) {
        const p = tTwoSided(t, df);
        if (p > 1e-300) expectRel(fUpper(t * t, 1, df), p, TOL, `t^2 = F at t ${t}, df ${df}`);
      }
    }
  });

  it('normal against a series and a continued fraction', () => {
    for (const x of [0, 0.3, 0.5, 1, 1.5, 2, 2.4, 2.6, 3, 4, 5, 6, 7, 7.034, 8, 10, 15, 20, 30]) {
      const ref = normalUpperIndependent(x);
      expectRel(normalUpper(x), ref, TOL, `normal upper at ${x}`);
      expectRel(normalCdf(-x), ref, TOL, `normal cdf at ${-x}`);
    }
  });
});

describe('round trips and critical values', () => {
  const PS = [0.5, 0.1, 1e-3, 1e-6, 1e-9, 1e-12, 1e-15];

  it('cdf(quantile(p)) = p and upper(quantile(1 - p)) = 1 - (1 - p)', () => {
    const large = new Worst();
    for (const p of PS) {
      const a = 1 - (1 - p); // the tail actually asked for when 1 - p is rounded
      expectRel(normalCdf(normalQuantile(p)), p, 1e-12, `normal at ${p}`);
      expectRel(normalUpper(normalQuantile(1 - p)), a, 1e-12, `normal at 1 - ${p}`);
      for (const df of [1, 2, 3, 5, 10, 30, 100, 1000]) {
        expectRel(tCdf(tQuantile(p, df), df), p, 1e-12, `t ${df} at ${p}`);
        expectRel(chi2Cdf(chi2Quantile(p, df), df), p, 1e-12, `chi2 ${df} at ${p}`);
        expectRel(chi2Upper(chi2Quantile(1 - p, df), df), a, 1e-12, `chi2 ${df} at 1 - ${p}`);
        for (const d1 of [1, 2, 5, 30]) {
          expectRel(fCdf(fQuantile(p, d1, df), d1, df), p, 1e-12, `F ${d1},${df} at ${p}`);
          expectRel(fUpper(fQuantile(1 - p, d1, df), d1, df), a, 1e-12, `F ${d1},${df} at 1 - ${p}`);
        }
      }
      // Very large denominator df: measured and printed, not asserted (the incomplete beta
      // function of @stdlib is itself good to about 1e-9 there).
      for (const df of [1e5, 1e7]) {
        for (const d1 of [1, 2, 5, 30]) {
          large.add(`F upper round trip, df2 ${df}`, relErr(fUpper(fCritical(1 - p, d1, df), d1, df), a), `${d1}, p ${p}`);
        }
      }
    }
    large.print('F critical values at very large df2: worst relative error of the round trip');
  });

  it('tCritical and fCritical at levels close to 1', () => {
    for (const level of [0.95, 0.999, 1 - 1e-6, 1 - 1e-9, 1 - 1e-12, 1 - 1e-14]) {
      const alpha = 1 - level; // exact in floating point for level >= 1/2
      for (const df of [1, 2, 5, 18, 100]) {
        expectRel(tTwoSided(tCritical(level, df), df), alpha, 1e-12, `tCritical ${level}, ${df}`);
        for (const d1 of [1, 3, 10]) {
          expectRel(fUpper(fCritical(level, d1, df), d1, df), alpha, 1e-12, `fCritical ${level}, ${d1},${df}`);
        }
      }
      // source: closed forms of the two-sided t critical value for 1 df (Cauchy:
      // t = cot(pi alpha / 2)) and 2 df (t = (1 - alpha) sqrt(2 / (alpha (2 - alpha))))
      expectRel(tCritical(level, 1), 1 / Math.tan((Math.PI * alpha) / 2), 1e-12, `tCritical ${level}, 1 df`);
      expectRel(tCritical(level, 2), (1 - alpha) * Math.sqrt(2 / (alpha * (2 - alpha))), 1e-12, `tCritical ${level}, 2 df`);
      // source: JKB 2, ch. 27: for df1 = 2, f = (nu/2)((alpha)^(-2/nu) - 1)
      for (const nu of [5, 27, 1000]) {
        const exact = (nu / 2) * Math.expm1((-2 / nu) * Math.log(alpha));
        expectRel(fCritical(level, 2, nu), exact, 1e-12, `fCritical ${level}, 2,${nu}`);
      }
    }
  });
});
