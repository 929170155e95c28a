/**
 * Probability distributions for the analyses: plain numbers in, numbers out; NaN for invalid
 * parameters (callers validate and word the messages). Upper tails are always computed
 * directly, never as 1 - cdf, which collapses to 0 below about 1e-16.
 *
 * Which implementation each function uses, and why (figures measured by the tests in
 * test/stats/distributions and the benchmarks in test/bench/distributions.bench.ts, Node 20):
 *
 * - normal, t, F, chi-square (central.ts): @stdlib, wrapped. jstat 1.9.6 misses the rule
 *   (1e-10 relative in the body, 1e-6 in the far tail, tail probabilities down to 1e-12):
 *   worst relative errors against our functions were, body / far tail, t cdf 8.8e-8 / 1
 *   (wrong values at 1 df), F cdf 1.5e-8, F upper as 1 - cdf 1.4e-7 / 1.8e-9, F quantile
 *   8.8e-8 / 6.6 (off by a factor 7.6 at 1e-12 on 2 and 1000 df), chi-square cdf 1.0e-10 /
 *   1.0e-10 and quantile 1.3e-6 in the far tail, normal cdf 2.2e-5 in the far tail.
 *   Checked against sources independent of @stdlib to 1e-12 relative: closed forms (t on 1
 *   and 2 df, chi-square on even df, F with 2 numerator or denominator df, t^2 = F(1, df),
 *   a series and continued fraction for the normal), the handbook rows of docs/references.md section 5,
 *   and quantile round trips down to 1e-15. Three @stdlib functions fell short and are
 *   corrected in central.ts: the F cdf (returned 0 for lower tails below ~1e-16), the F
 *   quantile (~1e-8 in the lower tail at large df2; Infinity for critical values on df2 < 2)
 *   and the normal quantile (2e-5 relative in the lower tail at 1e-12). Still measured
 *   short: F critical values on df2 >= 1e7 round-trip to only 1.2e-9 (1e-11 at df2 = 1e5),
 *   the precision of @stdlib's incomplete beta function there. The Newton polish makes fCritical
 *   cost about 0.14 ms (tCritical: 0.0015 ms).
 *
 * - studentized range (range.ts): our own, the double integral of Copenhaver and Holland
 *   (1988) by Gauss-Legendre and Gauss-Kronrod panels, with the inner range distribution
 *   tabulated once per number of groups (about 35 ms, cached) and the upper tail integrated
 *   in its own positive form. jstat's version (AS 190 style) differs from ours by 1.1e-4
 *   absolute at 2 df, 17% in the 0.99 quantile for 20 groups on 2 df, and by a factor 7 in
 *   the tail P(Q > 12) for 2 groups on 60 df. Ours: two groups against the exact t identity
 *   to 1.5e-14 (body) and 7.4e-14 (tails below 1e-12); all nine handbook quantiles to their
 *   printed digits; df = Infinity; 2 to 200 groups (NaN above), df > 0. Time: 0.07-0.09 ms
 *   per cdf or upper tail, 0.25-0.6 ms per quantile (docs/libraries.md section 4: jstat about 7 ms a
 *   quantile).
 *
 * - noncentral t (noncentral-t.ts): our own, the mixture integral over the scale (Owen
 *   1968) with the same panels; 2e-11 from Lenth's series (AS 243) in the body, and agrees
 *   with noncentral F(1, df, delta^2) to 2e-14 into the far tails, where jstat's 1 - cdf
 *   loses everything (6.7e-5 relative at t = 40 on 10 df, and 0 further out). About 0.07 ms.
 *
 * - noncentral F (noncentral-f.ts): our own, the Poisson mixture of incomplete beta
 *   functions as in AS 226 (Lenth 1987, with Frick's 1990 remark), summed outward from the
 *   Poisson mode as in AS 310 (Chattamvelli and Shanmugam 1997), with the beta recurrences
 *   run only in the direction that adds positive terms; df2 = Infinity gives the noncentral
 *   chi-square. 0.005 ms at lambda 10, 0.02 ms at lambda 500.
 *
 * Both noncentral families pass a seeded Monte Carlo of 40,000 draws at four points each
 * (99.9% Clopper-Pearson interval) and reduce to the central functions to 1e-12.
 */
export {
  normalCdf,
  normalUpper,
  normalQuantile,
  tCdf,
  tUpper,
  tTwoSided,
  tQuantile,
  tCritical,
  fCdf,
  fUpper,
  fQuantile,
  fCritical,
  chi2Cdf,
  chi2Upper,
  chi2Quantile,
} from './central.ts';
export { tInterval, type TInterval } from './t-interval.ts';
export { rangeCdf, rangeUpper, rangeQuantile, rangeCritical, rangeUpperQuantile, MAX_GROUPS } from './range.ts';
export { noncentralTCdf, noncentralTUpper } from './noncentral-t.ts';
export { noncentralFCdf, noncentralFUpper } from './noncentral-f.ts';
