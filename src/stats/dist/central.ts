/**
 * Probability distributions used by the analyses: cumulative probabilities, upper tails
 * computed directly (never as 1 - cdf, which collapses below 1e-16), and quantiles.
 *
 * Implementation choice per function (measured in test/stats/dist): t, F, chi-square and the
 * normal come from @stdlib (accurate to 1e-12 or better); jstat is not accurate enough for
 * them (about 1e-7, see the comparison tests).
 */
import tCdfStdlib from '@stdlib/stats-base-dists-t-cdf';
import tQuantileStdlib from '@stdlib/stats-base-dists-t-quantile';
import fCdfStdlib from '@stdlib/stats-base-dists-f-cdf';
import fQuantileStdlib from '@stdlib/stats-base-dists-f-quantile';
import chi2CdfStdlib from '@stdlib/stats-base-dists-chisquare-cdf';
import chi2QuantileStdlib from '@stdlib/stats-base-dists-chisquare-quantile';
import normalCdfStdlib from '@stdlib/stats-base-dists-normal-cdf';
import normalQuantileStdlib from '@stdlib/stats-base-dists-normal-quantile';
import betainc from '@stdlib/math-base-special-betainc';
import gammainc from '@stdlib/math-base-special-gammainc';
import erfc from '@stdlib/math-base-special-erfc';

// ---- normal -------------------------------------------------------------------------

/** Standard normal cumulative probability P(Z <= x). */
export function normalCdf(x: number): number {
  return normalCdfStdlib(x, 0, 1);
}

/** Standard normal upper tail P(Z > x), computed directly. */
export function normalUpper(x: number): number {
  return 0.5 * erfc(x / Math.SQRT2);
}

/** Standard normal quantile: the x with P(Z <= x) = p. */
export function normalQuantile(p: number): number {
  return normalQuantileStdlib(p, 0, 1);
}

// ---- Student's t --------------------------------------------------------------------

/** P(T <= t) for Student's t with df degrees of freedom. */
export function tCdf(t: number, df: number): number {
  return tCdfStdlib(t, df);
}

/** P(T > t), computed directly through symmetry. */
export function tUpper(t: number, df: number): number {
  return tCdfStdlib(-t, df);
}

/** Two-sided p-value P(|T| >= |t|). */
export function tTwoSided(t: number, df: number): number {
  if (Number.isNaN(t)) return NaN;
  return Math.min(1, 2 * tCdfStdlib(-Math.abs(t), df));
}

/** The t with P(T <= t) = p. */
export function tQuantile(p: number, df: number): number {
  return tQuantileStdlib(p, df);
}

/** Two-sided critical value: the t with P(|T| <= t) = level. */
export function tCritical(level: number, df: number): number {
  // Upper quantile at (1 - level) / 2, taken from the lower tail by symmetry so that a
  // level close to 1 keeps its digits.
  return -tQuantileStdlib((1 - level) / 2, df);
}

// ---- F --------------------------------------------------------------------------------

/** P(F <= f) for the F distribution with df1 and df2 degrees of freedom. */
export function fCdf(f: number, df1: number, df2: number): number {
  return fCdfStdlib(f, df1, df2);
}

/** Upper tail P(F > f), computed directly from the incomplete beta function. */
export function fUpper(f: number, df1: number, df2: number): number {
  if (Number.isNaN(f)) return NaN;
  if (f <= 0) return 1;
  if (f === Infinity) return 0;
  // P(F > f) = I_{df2 / (df2 + df1 f)}(df2 / 2, df1 / 2)
  const x = df2 / (df2 + df1 * f);
  return betainc(x, df2 / 2, df1 / 2, true, false);
}

/** The f with P(F <= f) = p. */
export function fQuantile(p: number, df1: number, df2: number): number {
  return fQuantileStdlib(p, df1, df2);
}

/** Critical value: the f with P(F > f) = 1 - level. */
export function fCritical(level: number, df1: number, df2: number): number {
  return fQuantileStdlib(level, df1, df2);
}

// ---- chi-square -------------------------------------------------------------------------

/** P(X <= x) for chi-square with df degrees of freedom. */
export function chi2Cdf(x: number, df: number): number {
  return chi2CdfStdlib(x, df);
}

/** Upper tail P(X > x), computed directly from the upper incomplete gamma function. */
export function chi2Upper(x: number, df: number): number {
  if (Number.isNaN(x)) return NaN;
  if (x <= 0) return 1;
  return gammainc(x / 2, df / 2, true, true);
}

/** The x with P(X <= x) = p. */
export function chi2Quantile(p: number, df: number): number {
  return chi2QuantileStdlib(p, df);
}
