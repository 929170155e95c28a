/**
 * Count, sum, mean, variance and standard deviation of complete cases.
 *
 * Sums are compensated (Neumaier 1974) and the variance is formed from deviations about the
 * mean (two passes, with the Chan, Golub and LeVeque correction term), because trial data
 * often carry many constant leading digits (yields of 1012.3, 1012.7, ...) and the textbook
 * one-pass formula sum(x^2) - n mean^2 loses them.
 *
 * Empty input: count 0, sum 0, mean NaN. Fewer than two values: variance and sd NaN.
 */

/** The number of values. */
export function count(x: Float64Array): number {
  return x.length;
}

/**
 * Sum by Neumaier's improvement of Kahan summation: the running compensation also catches
 * the low-order part when an addend is larger than the running sum.
 * source: A. Neumaier (1974), "Rundungsfehleranalyse einiger Verfahren zur Summation
 * endlicher Summen", ZAMM 54, 39-51.
 */
export function sum(x: Float64Array): number {
  let s = 0;
  let c = 0;
  for (let i = 0; i < x.length; i++) {
    const v = x[i]!;
    const t = s + v;
    if (Math.abs(s) >= Math.abs(v)) c += s - t + v;
    else c += v - t + s;
    s = t;
  }
  // an infinite term makes the compensation Infinity - Infinity; the plain sum is the answer
  return Number.isFinite(s) ? s + c : s;
}

/** Arithmetic mean (compensated sum over n); NaN for empty input. */
export function mean(x: Float64Array): number {
  if (x.length === 0) return NaN;
  return sum(x) / x.length;
}

/**
 * Sum of squared deviations about the mean, sum((x - mean)^2), with the correction
 * term of the corrected two-pass algorithm, which removes the error left in the mean.
 * source: T. F. Chan, G. H. Golub, R. J. LeVeque (1983), "Algorithms for computing the
 * sample variance: analysis and recommendations", The American Statistician 37, 242-247.
 */
export function sumSquaredDeviations(x: Float64Array, centre: number = mean(x)): number {
  const n = x.length;
  if (n === 0) return NaN;
  // Compensated sums of d^2 and d, so that long columns keep their digits too.
  let s2 = 0;
  let c2 = 0;
  let s1 = 0;
  let c1 = 0;
  for (let i = 0; i < n; i++) {
    const d = x[i]! - centre;
    const q = d * d;
    let t = s2 + q;
    c2 += s2 >= q ? s2 - t + q : q - t + s2;
    s2 = t;
    t = s1 + d;
    c1 += Math.abs(s1) >= Math.abs(d) ? s1 - t + d : d - t + s1;
    s1 = t;
  }
  const ss = s2 + c2;
  const sd = s1 + c1;
  return Math.max(0, ss - (sd * sd) / n);
}

/** Sample variance with divisor n - 1; NaN for fewer than two values. */
export function variance(x: Float64Array): number {
  const n = x.length;
  if (n < 2) return NaN;
  return sumSquaredDeviations(x) / (n - 1);
}

/** Sample standard deviation, the square root of {@link variance}. */
export function sd(x: Float64Array): number {
  return Math.sqrt(variance(x));
}

/** Smallest value; NaN for empty input or when any value is NaN. */
export function min(x: Float64Array): number {
  if (x.length === 0) return NaN;
  let m = Infinity;
  for (let i = 0; i < x.length; i++) {
    const v = x[i]!;
    if (Number.isNaN(v)) return NaN;
    if (v < m) m = v;
  }
  return m;
}

/** Largest value; NaN for empty input or when any value is NaN. */
export function max(x: Float64Array): number {
  if (x.length === 0) return NaN;
  let m = -Infinity;
  for (let i = 0; i < x.length; i++) {
    const v = x[i]!;
    if (Number.isNaN(v)) return NaN;
    if (v > m) m = v;
  }
  return m;
}
