/**
 * The studentized range distribution: Q = (max - min of k independent N(0, 1)) / s, where
 * df s^2 is chi-square with df degrees of freedom, independent of the normals.
 *
 * Method: the double integral of Copenhaver and Holland (1988), "Computation of the
 * distribution of the maximum studentized range statistic with application to multiple
 * significance testing of simple effects", J. Statist. Comput. Simul. 30, 1-15:
 *   P(Q <= q) = integral over s of f(s) W(q s) ds,
 *   W(w) = P(range of k normals <= w) = k integral phi(z) [Phi(z + w) - Phi(z)]^(k-1) dz,
 * the inner one by 12-point Gauss-Legendre panels, the outer one by 15-point Gauss-Kronrod
 * panels laid out from the integrand's mode (./scale.ts). Three choices of ours keep the
 * upper tail's relative accuracy down to 1e-12 and beyond, and the cost low:
 * - The inner integral is written about the centre of the window, z = u - w/2, and folded onto
 *   u >= 0 (the window probability D(u) = Phi(u + w/2) - Phi(u - w/2) is even in u). For w
 *   above the range's median the integrand of 1 - W(w) is integrated directly,
 *     1 - W(w) = k int_0^inf { phi(u - w/2) [A^(k-1) - D^(k-1)] + phi(u + w/2) [(1 - B)^(k-1) - D^(k-1)] } du
 *   with A = P(Z > u - w/2), B = P(Z > u + w/2), using the exactly known differences A - D = B
 *   and (1 - B) - D = 1 - A, so that x^n - y^n is formed as x^n (1 - (1 - (x - y)/x)^n)
 *   without cancellation. Below the median, W itself is integrated.
 * - The outer integral integrates the upper-tail form f(s) (1 - W(q s)) for P(Q > q), never
 *   1 - P(Q <= q).
 * - W depends on k and w only, so it is evaluated directly at a few hundred w once per k and
 *   kept as piecewise Chebyshev interpolants of ln(1 - W) + w^2/4 and ln(W / w^(k-1)),
 *   accurate to 1e-14 and checked against direct evaluation in the tests. A cdf then costs
 *   a few hundred cheap interpolant evaluations instead of as many inner integrals.
 */
import erfc from '@stdlib/math-base-special-erfc';
import gammaln from '@stdlib/math-base-special-gammaln';
import { gaussLegendre } from './quadrature.ts';
import { evalChebyshev, evalChebyshevDerivative, fitPiecewiseChebyshev, type PiecewiseChebyshev } from './chebyshev.ts';
import { integrateScale, type ScaleIntegrand } from './scale.ts';
import { buildIntervalMax, intervalMax, type IntervalMax } from './bend.ts';
import { normalQuantile, tQuantile } from './central.ts';
import { scaleMode } from './mode.ts';
import * as pm from '../math/portable.ts';

const INNER = gaussLegendre(12);
const INV_SQRT_2PI = 1 / Math.sqrt(2 * Math.PI);

/** P(Z > x) for a standard normal Z, accurate in relative terms for x > 0. */
function upperNormal(x: number): number {
  return 0.5 * erfc(x * Math.SQRT1_2);
}

/** x^n - y^n for 0 <= y <= x, given d = x - y computed without cancellation. */
function powDiff(x: number, d: number, n: number, xn: number): number {
  if (d >= 0.5 * x) return xn - pm.pow(x - d, n);
  return -xn * pm.expm1(n * pm.log1p(-d / x));
}

/**
 * A rough median of the range of k standard normals (twice Blom's approximation to the
 * expected largest normal score); only used to choose which of W and 1 - W to integrate, so
 * a few percent of error costs nothing.
 */
function rangeMedianGuess(k: number): number {
  return 2 * normalQuantile((k - 0.375) / (k + 0.25)) * 0.93;
}

const LEG10 = gaussLegendre(10);

/**
 * P(a < Z <= b) for b - a <= 1, by a 10-point Gauss-Legendre rule on the normal density:
 * relative accuracy near 1e-16 where the difference of two normal probabilities would cancel.
 */
function shortNormalInterval(a: number, b: number): number {
  const half = 0.5 * (b - a);
  const mid = 0.5 * (b + a);
  let s = 0;
  for (let i = 0; i < 10; i++) {
    const x = mid + half * (LEG10.nodes[i] as number);
    s += (LEG10.weights[i] as number) * pm.exp(-0.5 * x * x);
  }
  return s * half * INV_SQRT_2PI;
}

/**
 * Direct evaluation of the inner integral at w > 0 for k groups.
 * mode 'upper': P(range > w) by the upper-tail integrand (relative accuracy far out);
 * mode 'lowerScaled': P(range <= w) / w^(k-1), by the window integrand with the window
 * probability divided by w before it is raised to the power k - 1 (no underflow near 0).
 */
export function normalRangeDirect(w: number, k: number, mode: 'upper' | 'lowerScaled'): number {
  const n = k - 1;
  const c = 0.5 * w;
  const useUpper = mode === 'upper';
  const uMax = useUpper ? Math.min(c + 8.5, 10) : c + 8.5;
  // The window probability raised to the power k - 1 narrows like 1/sqrt(k).
  const h = Math.min(1, 2.2 / Math.sqrt(k));
  const nodes = INNER.nodes;
  const weights = INNER.weights;
  const invW = 1 / w;
  let total = 0;
  for (let lo = 0; lo < uMax; lo += h) {
    const hi = Math.min(lo + h, uMax);
    const half = 0.5 * (hi - lo);
    const mid = 0.5 * (hi + lo);
    let sum = 0;
    for (let j = 0; j < nodes.length; j++) {
      const u = mid + half * (nodes[j] as number);
      const a = u - c;
      const b = u + c;
      const pa = INV_SQRT_2PI * pm.exp(-0.5 * a * a);
      const pb = INV_SQRT_2PI * pm.exp(-0.5 * b * b);
      let v: number;
      if (useUpper) {
        // A = P(Z > a), Ac = P(Z <= a); B = P(Z > b) (b >= 0, so B <= 1/2).
        let A: number;
        let Ac: number;
        if (a >= 0) {
          A = upperNormal(a);
          Ac = 1 - A;
        } else {
          Ac = upperNormal(-a);
          A = 1 - Ac;
        }
        const B = upperNormal(b);
        const Bc = 1 - B;
        v = pa * powDiff(A, B, n, pm.pow(A, n)) + pb * powDiff(Bc, Ac, n, pm.pow(Bc, n));
      } else {
        let D: number;
        if (w <= 1) D = shortNormalInterval(a, b);
        else if (a >= 0) D = upperNormal(a) - upperNormal(b);
        else D = 1 - upperNormal(b) - upperNormal(-a);
        v = (pa + pb) * pm.pow(D * invW, n);
      }
      sum += (weights[j] as number) * v;
    }
    sum *= half;
    total += sum;
    if (sum <= 1e-17 * total && total > 0) break;
  }
  return k * total;
}

/** Results of {@link normalRange}: W(w), 1 - W(w) and the range density W'(w). */
export interface NormalRangeOut {
  cdf: number;
  upper: number;
  density: number;
}

/** Largest w tabulated; beyond it 1 - W(w) < k^2 exp(-w^2 / 4) is below 1e-270. */
const W_MAX = 50;

/**
 * The distribution of the range of k standard normals, tabulated once per k: piecewise
 * Chebyshev approximations of rho(w) = ln(1 - W(w)) + w^2 / 4 on [0, 50] and of
 * lambda(w) = ln(W(w) / w^(k-1)) below the median, both fitted to 1e-14 in absolute terms,
 * so W and 1 - W keep about 1e-14 relative accuracy wherever they are representable.
 */
export interface RangeTable {
  readonly groups: number;
  readonly split: number;
  readonly rho: PiecewiseChebyshev;
  readonly lambda: PiecewiseChebyshev;
  /** Bound of -(ln(1 - W))'' over intervals of w. */
  readonly bendUpper: IntervalMax;
  /** Bound of -(ln W)'' - (k - 1) / w^2 over intervals of w (the power part is exact). */
  readonly bendLower: IntervalMax;
}

function buildTable(k: number): RangeTable {
  const split = rangeMedianGuess(k);
  const rho = fitPiecewiseChebyshev(
    (w) => {
      if (w <= 0) return 0;
      const upper = w > split ? normalRangeDirect(w, k, 'upper') : 1 - normalRangeDirect(w, k, 'lowerScaled') * pm.pow(w, k - 1);
      return pm.log(upper) + 0.25 * w * w;
    },
    0,
    W_MAX,
    [0.5, 1, 2, 3, 4, 6, 8, 12, 16, 24, 32],
    24,
    // rho is ln(1 - W) + w^2/4: the rounding of that sum (about 2e-16 w^2/4) sets a floor.
    (v, w) => 1e-14 * Math.max(1, v) + 4e-16 * 0.25 * w * w,
  );
  const lambda = fitPiecewiseChebyshev(
    (w) => pm.log(normalRangeDirect(Math.max(w, 1e-300), k, 'lowerScaled')),
    0,
    split,
    [0.5, 1, 2, 3, 4],
    24,
    (v) => 1e-14 * Math.max(1, v),
  );
  // How fast ln(1 - W) and ln W bend, by second differences of the (smooth) approximants.
  const lnR = (w: number): number => evalChebyshev(rho, w) - 0.25 * w * w;
  const lnWreduced = (w: number): number =>
    w <= split ? evalChebyshev(lambda, w) : pm.log1p(-pm.exp(lnR(w))) - (k - 1) * pm.log(w);
  const second = (fn: (w: number) => number, w: number): number => {
    const h = Math.max(1e-3 * w, 1e-4);
    const lo = Math.max(w - h, 1e-300);
    return (fn(w + h) - 2 * fn(0.5 * (lo + w + h)) + fn(lo)) / (0.25 * (w + h - lo) * (w + h - lo));
  };
  const bendUpper = buildIntervalMax((w) => -second(lnR, Math.min(w, W_MAX - 0.01)), W_MAX, 0.05);
  const bendLower = buildIntervalMax((w) => -second(lnWreduced, Math.min(w, W_MAX - 0.01)), W_MAX, 0.05);
  return { groups: k, split, rho, lambda, bendUpper, bendLower };
}

const tables = new Map<number, RangeTable>();
const MAX_TABLES = 24;

/**
 * The table for k groups, built on first use (about 35 ms) and kept for the 24 most recently
 * built k. The table depends on k alone, so results do not depend on the cache's state.
 */
export function rangeTable(k: number): RangeTable {
  let t = tables.get(k);
  if (t === undefined) {
    t = buildTable(k);
    if (tables.size >= MAX_TABLES) {
      const oldest = tables.keys().next().value;
      if (oldest !== undefined) tables.delete(oldest);
    }
    tables.set(k, t);
  }
  return t;
}

/**
 * W(w), 1 - W(w) and W'(w) for the range of k standard normals, from the table.
 */
export function normalRange(w: number, table: RangeTable, out: NormalRangeOut): void {
  const k = table.groups;
  if (!(w > 0)) {
    out.cdf = 0;
    out.upper = 1;
    out.density = k === 2 && w === 0 ? 2 * INV_SQRT_2PI * Math.SQRT1_2 : 0;
    return;
  }
  if (w >= W_MAX) {
    out.cdf = 1;
    out.upper = 0;
    out.density = 0;
    return;
  }
  const quarter = 0.25 * w * w;
  const upper = pm.exp(evalChebyshev(table.rho, w) - quarter);
  out.upper = upper;
  if (w <= table.split) {
    // Below the median the density comes from the lower table: W' = W (lambda' + (k-1)/w);
    // from the upper one it would be a small difference of two larger numbers.
    const cdf = pm.exp(evalChebyshev(table.lambda, w) + (k - 1) * pm.log(w));
    out.cdf = cdf;
    out.density = cdf * (evalChebyshevDerivative(table.lambda, w) + (k - 1) / w);
  } else {
    out.cdf = 1 - upper;
    out.density = upper * (0.5 * w - evalChebyshevDerivative(table.rho, w));
  }
}

/**
 * Largest number of groups accepted. The tables are checked against direct evaluation up to
 * 200 groups; beyond that the inner integrand narrows faster than its panels and the
 * construction has not been validated, so such calls return NaN rather than a guess.
 */
export const MAX_GROUPS = 200;

function validGroups(k: number): boolean {
  return Number.isInteger(k) && k >= 2 && k <= MAX_GROUPS;
}

function validDf(df: number): boolean {
  return df > 0; // NaN fails too; Infinity allowed
}

/** ln of the integrand's g(s) part at s: ln P(range > q s) or ln P(range <= q s). */
function logG(s: number, q: number, table: RangeTable, upper: boolean): number {
  normalRange(q * s, table, scratch);
  return pm.log(upper ? scratch.upper : scratch.cdf);
}

/**
 * Maximizer over s > 0 of ln f(s) + ln g(s) (the outer integrand), by a geometric scan and
 * golden-section refinement; it only places the first panel, so moderate precision suffices.
 */
function outerMode(q: number, table: RangeTable, df: number, upper: boolean): number {
  const logh = (s: number): number => (df - 1) * pm.log(s) - 0.5 * df * s * s + logG(s, q, table, upper);
  return scaleMode(logh, q);
}

const scratch: NormalRangeOut = { cdf: 0, upper: 0, density: 0 };
const twoSlots = new Float64Array(2);

/**
 * One tail (and optionally the density) of Q at q, integrated directly: `upper` selects
 * which tail. Writes [probability, density] into result.
 */
function rangeIntegral(
  q: number,
  k: number,
  df: number,
  upper: boolean,
  wantDensity: boolean,
  result: Float64Array,
): void {
  const table = rangeTable(k);
  if (df === Infinity) {
    normalRange(q, table, scratch);
    result[0] = upper ? scratch.upper : scratch.cdf;
    result[1] = scratch.density;
    return;
  }
  const g: ScaleIntegrand = (s, out) => {
    normalRange(q * s, table, scratch);
    out[0] = upper ? scratch.upper : scratch.cdf;
    out[1] = wantDensity ? s * scratch.density : 0;
  };
  const center = outerMode(q, table, df, upper);
  const q2 = q * q;
  const bendMax = upper
    ? (lo: number, hi: number): number => q2 * intervalMax(table.bendUpper, q * lo, q * hi)
    : (lo: number, hi: number): number =>
        q2 * intervalMax(table.bendLower, q * lo, q * hi) + (k - 1) / pm.sq(Math.max(lo, 1e-150));
  integrateScale(df, g, !upper, center, bendMax, 2, result);
}

/**
 * P(Q <= q) for the studentized range of `groups` means with `df` error degrees of freedom
 * (df may be Infinity). NaN for groups < 2, above {@link MAX_GROUPS} or not an integer,
 * df <= 0, or q NaN.
 */
export function rangeCdf(q: number, groups: number, df: number): number {
  if (Number.isNaN(q) || !validGroups(groups) || !validDf(df)) return NaN;
  if (q <= 0) return 0;
  if (q === Infinity) return 1;
  // Integrate whichever tail is the smaller (judged by the df = Infinity value): the other
  // is then 1 minus a small number, which loses nothing.
  normalRange(q, rangeTable(groups), scratch);
  if (scratch.upper < 0.5) {
    rangeIntegral(q, groups, df, true, false, twoSlots);
    return Math.max(0, 1 - (twoSlots[0] as number));
  }
  rangeIntegral(q, groups, df, false, false, twoSlots);
  return Math.min(1, twoSlots[0] as number);
}

/**
 * P(Q > q), integrated in its upper-tail form so that it keeps relative accuracy far out
 * (checked to 1e-12 and below). NaN for invalid parameters as in {@link rangeCdf}.
 */
export function rangeUpper(q: number, groups: number, df: number): number {
  if (Number.isNaN(q) || !validGroups(groups) || !validDf(df)) return NaN;
  if (q <= 0) return 1;
  if (q === Infinity) return 0;
  rangeIntegral(q, groups, df, true, false, twoSlots);
  return Math.min(1, twoSlots[0] as number);
}

/**
 * Solves P(Q > q) = alpha (tail = 'upper') or P(Q <= q) = p (tail = 'lower') by Newton's
 * method on ln(probability) against ln q, inside a bracket that is kept for safety:
 * below by the two-group value sqrt(2) t (exact for k = 2, and the range grows with k), above
 * by a Bonferroni bound over the k(k-1)/2 pairs.
 */
function solveRange(prob: number, k: number, df: number, tail: 'upper' | 'lower'): number {
  const alpha = tail === 'upper' ? prob : 1 - prob;
  // Lower bracket: the k = 2 quantile (from alpha itself: 1 - alpha may round).
  let lo = df === Infinity ? Math.SQRT2 * -normalQuantile(alpha / 2) : Math.SQRT2 * -tQuantile(alpha / 2, df);
  if (tail === 'lower' && prob < 0.5) {
    lo = Math.SQRT2 * (df === Infinity ? normalQuantile(0.5 + prob / 2) : tQuantile(0.5 + prob / 2, df));
    // Near the centre the quantile loses its digits (0.5 + 1e-11 keeps few), and may come
    // out as 0. The density of t is largest at 0, so its quantile at 0.5 + e is at least
    // e / f(0): a bound that keeps its digits for any small probability.
    const density0 = df === Infinity ? 1 / Math.sqrt(2 * Math.PI) : pm.exp(gammaln((df + 1) / 2) - gammaln(df / 2)) / Math.sqrt(df * Math.PI);
    lo = Math.max(lo, (Math.SQRT2 * (prob / 2)) / density0);
  }
  // Upper bracket: P(Q > q) <= (k(k-1)/2) P(|T| sqrt 2 > q), so the quantile at alpha / pairs
  // is at least as large as the true one.
  const pairs = (k * (k - 1)) / 2;
  let hi = df === Infinity
    ? Math.SQRT2 * -normalQuantile(alpha / (2 * pairs))
    : Math.SQRT2 * -tQuantile(alpha / (2 * pairs), df);
  // Margins for the rounding of the bounds themselves.
  lo *= 1 - 1e-6;
  hi *= 1 + 1e-6;
  if (!(hi > lo)) hi = lo * 2;
  // Start from the two-group value for k = 2, else inside the bracket, pulled toward the
  // lower end where the Bonferroni bound is loose (small df).
  let y = k === 2 ? pm.log(lo / (1 - 1e-6)) : pm.log(lo) + 0.35 * (pm.log(hi) - pm.log(lo));
  let ylo = pm.log(lo);
  let yhi = pm.log(hi);
  const target = pm.log(prob);
  const res = new Float64Array(2);
  for (let iter = 0; iter < 60; iter++) {
    const q = pm.exp(y);
    rangeIntegral(q, k, df, tail === 'upper', true, res);
    const p = res[0] as number;
    const dens = res[1] as number;
    const F = pm.log(p) - target;
    if (Math.abs(F) < 4e-16) break;
    // d ln P / d ln q: -q f(q) / P(Q > q) for the upper tail, +q f(q) / P(Q <= q) for the lower.
    const dF = ((tail === 'upper' ? -1 : 1) * q * dens) / p;
    // Keep the bracket: F decreases in y for the upper tail and increases for the lower.
    const rootRight = tail === 'upper' ? F > 0 : F < 0;
    if (rootRight) ylo = Math.max(ylo, y);
    else yhi = Math.min(yhi, y);
    let next = Number.isFinite(F) && Number.isFinite(dF) && dF !== 0 ? y - F / dF : NaN;
    if (!(next >= ylo && next <= yhi)) next = 0.5 * (ylo + yhi);
    const step = Math.abs(next - y);
    y = next;
    if (step < 1e-15 * Math.max(1, Math.abs(y)) && Math.abs(F) < 1e-9) break;
  }
  return pm.exp(y);
}

/**
 * The q with P(Q <= q) = p for the studentized range (p in (0, 1)); p at or above 1/2 is
 * solved on the upper tail 1 - p, which is exact in floating point for p >= 1/2.
 */
export function rangeQuantile(p: number, groups: number, df: number): number {
  if (Number.isNaN(p) || !validGroups(groups) || !validDf(df)) return NaN;
  if (p < 0 || p > 1) return NaN;
  if (p === 0) return 0;
  if (p === 1) return Infinity;
  return p >= 0.5 ? solveRange(1 - p, groups, df, 'upper') : solveRange(p, groups, df, 'lower');
}

/**
 * Critical value of the studentized range: the q with P(Q <= q) = level (for example 0.95),
 * as used by Tukey's honestly significant difference.
 */
export function rangeCritical(level: number, groups: number, df: number): number {
  return rangeQuantile(level, groups, df);
}

/**
 * The q with P(Q > q) = alpha, for upper-tail probabilities too small to be written as
 * 1 - level in floating point (alpha down to about 1e-300).
 */
export function rangeUpperQuantile(alpha: number, groups: number, df: number): number {
  if (Number.isNaN(alpha) || !validGroups(groups) || !validDf(df)) return NaN;
  if (alpha < 0 || alpha > 1) return NaN;
  if (alpha === 0) return Infinity;
  if (alpha === 1) return 0;
  return alpha <= 0.5 ? solveRange(alpha, groups, df, 'upper') : solveRange(1 - alpha, groups, df, 'lower');
}
