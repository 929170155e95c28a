/**
 * Shapiro-Wilk test of normality by Royston's algorithm AS R94: approximate coefficients
 * from the expected normal order statistics, W as the squared correlation between the
 * sorted data and the coefficients, and the p-value from Royston's normalizing
 * transformations of 1 - W (one for 4 <= n <= 11, one for 12 <= n <= 5000; exact for n = 3).
 * source: P. Royston (1995), "Remark AS R94: A remark on Algorithm AS 181: The W-test for
 * normality", Applied Statistics 44, 547-551; P. Royston (1992), "Approximating the
 * Shapiro-Wilk W-test for non-normality", Statistics and Computing 2, 117-119.
 */
import { normalQuantile, normalUpper } from '../distributions/index.ts';
import { StatsInputError } from '../summary/groups.ts';
import * as pm from '../math/portable.ts';
import { statsMsg } from '../../messages/stats.ts';

/** The result of {@link shapiroWilk}. */
export interface ShapiroWilkResult {
  /** The W statistic, in (0, 1]; values near 1 agree with a normal sample. */
  readonly w: number;
  /** p-value: the upper tail of Royston's normalized 1 - W (small p: W unusually low). */
  readonly p: number;
  /** Sample size. */
  readonly n: number;
}

/** Smallest n the test covers (n = 3 has an exact distribution). */
export const SHAPIRO_WILK_MIN_N = 3;
/** Largest n for which Royston's approximation was fitted. */
export const SHAPIRO_WILK_MAX_N = 5000;

// Polynomial coefficients of AS R94, lowest power first.
const G = [-2.273, 0.459];
const C1 = [0, 0.221157, -0.147981, -2.07119, 4.434685, -2.706056];
const C2 = [0, 0.042981, -0.293762, -1.752461, 5.682633, -3.582633];
const C3 = [0.544, -0.39978, 0.025054, -6.714e-4];
const C4 = [1.3822, -0.77857, 0.062767, -0.0020322];
const C5 = [-1.5861, -0.31082, -0.083751, 0.0038915];
const C6 = [-0.4803, -0.082676, 0.0030302];

function poly(c: readonly number[], x: number): number {
  let r = 0;
  for (let j = c.length - 1; j >= 0; j--) r = r * x + c[j]!;
  return r;
}

/**
 * The coefficients a_1 .. a_{floor(n/2)} of AS R94 (a_1 belongs to the extreme pair), which
 * together with their negatives form a unit vector.
 */
export function shapiroWilkCoefficients(n: number): Float64Array {
  const half = Math.floor(n / 2);
  const a = new Float64Array(half);
  if (n === 3) {
    a[0] = Math.SQRT1_2;
    return a;
  }
  const m = new Float64Array(half);
  let summ2 = 0;
  for (let i = 0; i < half; i++) {
    m[i] = normalQuantile((i + 1 - 0.375) / (n + 0.25));
    summ2 += m[i]! * m[i]!;
  }
  summ2 *= 2;
  const ssumm2 = Math.sqrt(summ2);
  const rsn = 1 / Math.sqrt(n);
  const m1 = m[0]!;
  const a1 = poly(C1, rsn) - m1 / ssumm2;
  let first: number;
  let fac: number;
  if (n > 5) {
    const m2 = m[1]!;
    const a2 = -m2 / ssumm2 + poly(C2, rsn);
    fac = Math.sqrt(
      (summ2 - 2 * m1 * m1 - 2 * m2 * m2) / (1 - 2 * a1 * a1 - 2 * a2 * a2),
    );
    a[1] = a2;
    first = 2;
  } else {
    fac = Math.sqrt((summ2 - 2 * m1 * m1) / (1 - 2 * a1 * a1));
    first = 1;
  }
  a[0] = a1;
  for (let i = first; i < half; i++) a[i] = -m[i]! / fac;
  return a;
}

/**
 * Shapiro-Wilk W and its p-value.
 *
 * @param x - a sample of 3 to 5000 values (complete cases), in any order
 * @throws StatsInputError for n outside 3 .. 5000 or when all values are equal
 */
export function shapiroWilk(x: Float64Array): ShapiroWilkResult {
  const n = x.length;
  if (n < SHAPIRO_WILK_MIN_N || n > SHAPIRO_WILK_MAX_N) {
    throw new StatsInputError(statsMsg.shapiroWilkSize(SHAPIRO_WILK_MIN_N, SHAPIRO_WILK_MAX_N, n));
  }
  const s = Float64Array.from(x).sort();
  const range = s[n - 1]! - s[0]!;
  if (!(range > 0)) {
    throw new StatsInputError(statsMsg.normalityAllEqual());
  }
  const a = shapiroWilkCoefficients(n);
  const half = a.length;

  // Data scaled by the range and centred (two passes), as AS R94 does, so that large
  // constant offsets cost no digits.
  let mean = 0;
  for (let i = 0; i < n; i++) mean += (s[i]! - s[0]!) / range;
  mean /= n;
  let ssa = 0;
  let ssx = 0;
  let sax = 0;
  for (let i = 0; i < n; i++) {
    // Coefficient of the i-th smallest value: -a for the lower half, +a for the upper half,
    // 0 for the middle value of an odd sample. The coefficients sum to zero already.
    const c = i < half ? -a[i]! : i >= n - half ? a[n - 1 - i]! : 0;
    const xc = (s[i]! - s[0]!) / range - mean;
    ssa += c * c;
    ssx += xc * xc;
    sax += c * xc;
  }
  // 1 - W formed directly (AS R94's W1), so that W very close to 1 keeps its digits in the
  // p-value.
  const root = Math.sqrt(ssa * ssx);
  const w1 = Math.max(0, ((root - sax) * (root + sax)) / (ssa * ssx));
  const w = 1 - w1;
  return { w, p: shapiroWilkP(w1, n), n };
}

/** p-value from 1 - W by Royston's approximations (see the module note). */
function shapiroWilkP(w1: number, n: number): number {
  if (n === 3) {
    // Exact distribution for three values: P(W <= w) = (6 / pi) (asin(sqrt(w)) - pi / 3).
    const p = (6 / Math.PI) * (pm.asin(Math.sqrt(1 - w1)) - Math.PI / 3);
    return Math.min(1, Math.max(0, p));
  }
  const y = pm.log(w1);
  if (n <= 11) {
    const gamma = poly(G, n);
    // Beyond the transformation's range: W far below anything the approximation was fitted
    // to; the p-value is then effectively zero.
    if (y >= gamma) return 0;
    const yt = -pm.log(gamma - y);
    const m = poly(C3, n);
    const sd = pm.exp(poly(C4, n));
    return normalUpper((yt - m) / sd);
  }
  const ln = pm.log(n);
  const m = poly(C5, ln);
  const sd = pm.exp(poly(C6, ln));
  return normalUpper((y - m) / sd);
}
