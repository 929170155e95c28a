/**
 * The central distributions: normal, Student's t, F and chi-square. Cumulative
 * probabilities, upper tails computed directly (never as 1 - cdf, which collapses below
 * 1e-16), quantiles and critical values.
 *
 * Most functions are thin wrappers over @stdlib, which measures at 1e-12 or better (see the
 * comparison tests in test/stats/distributions). Three @stdlib functions measured short, and are
 * replaced here (figures from test/stats/distributions/central.test.ts):
 * - F cdf: @stdlib's takes the lower tail as the complement of an upper incomplete beta
 *   function, and returns 0 for lower tails below about 1e-16 (F = 1.58e-20 on 1 and 100 df,
 *   true value 1e-10). Here the incomplete beta function is evaluated on whichever side is
 *   the small one.
 * - F quantile: @stdlib's inverts the incomplete beta function to about 1e-8 in the lower
 *   tail at large df2, and overflows to Infinity for critical values on df2 < 2 at small
 *   tail probabilities. Here its answer (or, for upper quantiles, the inverse of the upper
 *   tail's own incomplete beta function) is polished by Newton's method on ln P against
 *   ln f, using the accurate tails above.
 * - normal quantile: @stdlib's loses relative accuracy in the lower tail (P(Z <= x) off by
 *   2e-5 relative at p = 1e-12); its answer is polished by Newton's method on ln P with the
 *   complementary error function.
 */
import tCdfStdlib from '@stdlib/stats-base-dists-t-cdf';
import tQuantileStdlib from '@stdlib/stats-base-dists-t-quantile';
import chi2CdfStdlib from '@stdlib/stats-base-dists-chisquare-cdf';
import chi2QuantileStdlib from '@stdlib/stats-base-dists-chisquare-quantile';
import normalCdfStdlib from '@stdlib/stats-base-dists-normal-cdf';
import normalQuantileStdlib from '@stdlib/stats-base-dists-normal-quantile';
import betainc from '@stdlib/math-base-special-betainc';
import betaincinv from '@stdlib/math-base-special-betaincinv';
import betaln from '@stdlib/math-base-special-betaln';
import gammainc from '@stdlib/math-base-special-gammainc';
import erfc from '@stdlib/math-base-special-erfc';
import * as pm from '../math/portable.ts';

const LN_SQRT_2PI = 0.5 * pm.log(2 * Math.PI);

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
  if (Number.isNaN(p) || p < 0 || p > 1) return NaN;
  if (p === 0) return -Infinity;
  if (p === 1) return Infinity;
  // Work on the smaller tail: P(Z <= x) = p for p < 1/2, P(Z > x) = 1 - p (exact) otherwise.
  const lower = p < 0.5;
  const target = pm.log(lower ? p : 1 - p);
  let x = normalQuantileStdlib(p, 0, 1);
  if (!Number.isFinite(x)) x = (lower ? -1 : 1) * Math.sqrt(-2 * target);
  for (let i = 0; i < 8; i++) {
    // Newton on ln(tail) in x: d ln P / dx = +-phi(x) / P.
    const tail = lower ? normalUpper(-x) : normalUpper(x);
    const logDens = -0.5 * x * x - LN_SQRT_2PI;
    const slope = (lower ? 1 : -1) * pm.exp(logDens - pm.log(tail));
    const step = (pm.log(tail) - target) / slope;
    if (!Number.isFinite(step)) break;
    x -= step;
    if (Math.abs(step) <= 1e-16 * Math.max(1, Math.abs(x))) break;
  }
  return x;
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

function validF(df1: number, df2: number): boolean {
  return df1 > 0 && df2 > 0; // false for NaN too
}

/** P(F <= f) for the F distribution with df1 and df2 degrees of freedom. */
export function fCdf(f: number, df1: number, df2: number): number {
  if (Number.isNaN(f) || !validF(df1, df2)) return NaN;
  if (f <= 0) return 0;
  if (f === Infinity) return 1;
  // P(F <= f) = I_x(df1/2, df2/2) with x = df1 f / (df1 f + df2); evaluate on the side whose
  // argument is below 1/2, where it is known to full relative precision.
  const denom = df1 * f + df2;
  if (df1 * f <= df2) return betainc((df1 * f) / denom, df1 / 2, df2 / 2, true, false);
  return betainc(df2 / denom, df2 / 2, df1 / 2, true, true);
}

/** Upper tail P(F > f), computed directly from the incomplete beta function. */
export function fUpper(f: number, df1: number, df2: number): number {
  if (Number.isNaN(f) || !validF(df1, df2)) return NaN;
  if (f <= 0) return 1;
  if (f === Infinity) return 0;
  // P(F > f) = I_{df2 / (df2 + df1 f)}(df2 / 2, df1 / 2)
  const x = df2 / (df2 + df1 * f);
  return betainc(x, df2 / 2, df1 / 2, true, false);
}

/** ln of the F density at f > 0. */
function fLogDensity(f: number, df1: number, df2: number): number {
  const a = df1 / 2;
  const b = df2 / 2;
  const r = (df1 * f) / df2;
  return a * pm.log(df1 / df2) + (a - 1) * pm.log(f) - (a + b) * pm.log1p(r) - betaln(a, b);
}

/**
 * Solves P(F <= f) = prob (upper = false) or P(F > f) = prob (upper = true) by Newton's
 * method on ln P against ln f, from a start given by the inverse incomplete beta function.
 */
function fSolve(prob: number, df1: number, df2: number, upper: boolean): number {
  const a = df1 / 2;
  const b = df2 / 2;
  let f: number;
  if (upper) {
    // P(F > f) = I_y(b, a) with y = df2 / (df2 + df1 f): f = df2 (1 - y) / (df1 y).
    // Called with prob <= 1/2, where y is not close to 1 and 1 - y keeps its digits.
    const y = betaincinv(prob, b, a, false);
    f = (df2 * (1 - y)) / (df1 * y);
  } else {
    const x = betaincinv(prob, a, b, false);
    f = (df2 * x) / (df1 * (1 - x));
  }
  if (!(f > 0 && f < Infinity)) f = 1;
  const target = pm.log(prob);
  let u = pm.log(f);
  for (let i = 0; i < 60; i++) {
    const fu = pm.exp(u);
    const p = upper ? fUpper(fu, df1, df2) : fCdf(fu, df1, df2);
    const slope = (upper ? -1 : 1) * pm.exp(pm.log(fu) + fLogDensity(fu, df1, df2) - pm.log(p));
    let step = (pm.log(p) - target) / slope;
    if (!Number.isFinite(step)) break;
    // Newton on this curve only overshoots far out; keep steps moderate there.
    if (step > 5) step = 5;
    if (step < -5) step = -5;
    u -= step;
    if (Math.abs(step) <= 2e-16 * Math.max(1, Math.abs(u))) break;
  }
  return pm.exp(u);
}

/** The f with P(F <= f) = p. */
export function fQuantile(p: number, df1: number, df2: number): number {
  if (Number.isNaN(p) || !validF(df1, df2) || p < 0 || p > 1) return NaN;
  if (p === 0) return 0;
  if (p === 1) return Infinity;
  return p <= 0.5 ? fSolve(p, df1, df2, false) : fSolve(1 - p, df1, df2, true);
}

/** Critical value: the f with P(F > f) = 1 - level. */
export function fCritical(level: number, df1: number, df2: number): number {
  if (Number.isNaN(level) || !validF(df1, df2) || level < 0 || level > 1) return NaN;
  if (level === 1) return Infinity;
  if (level === 0) return 0;
  const alpha = 1 - level;
  return alpha <= 0.5 ? fSolve(alpha, df1, df2, true) : fSolve(level, df1, df2, false);
}

// ---- chi-square -------------------------------------------------------------------------

/** P(X <= x) for chi-square with df degrees of freedom. */
export function chi2Cdf(x: number, df: number): number {
  return chi2CdfStdlib(x, df);
}

/** Upper tail P(X > x), computed directly from the upper incomplete gamma function. */
export function chi2Upper(x: number, df: number): number {
  if (Number.isNaN(x) || !(df > 0)) return NaN;
  if (x <= 0) return 1;
  return gammainc(x / 2, df / 2, true, true);
}

/** The x with P(X <= x) = p. */
export function chi2Quantile(p: number, df: number): number {
  return chi2QuantileStdlib(p, df);
}
