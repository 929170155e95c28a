/**
 * The studentized range distribution: Q = (max - min of k independent N(0, 1)) / s, where
 * df s^2 is chi-square with df degrees of freedom, independent of the normals.
 *
 * Method: the double integral of Copenhaver and Holland (1988), "Computation of the
 * distribution of the maximum studentized range statistic with application to multiple
 * significance testing of simple effects", J. Statist. Comput. Simul. 30, 1-15:
 *   P(Q <= q) = integral over s of f(s) W(q s) ds,
 *   W(w) = P(range of k normals <= w) = k integral phi(z) [Phi(z + w) - Phi(z)]^(k-1) dz,
 * both integrals by Gauss-Legendre panels. Two choices of ours keep the upper tail's relative
 * accuracy down to 1e-12 and beyond:
 * - The inner integral is written about the centre of the window, z = u - w/2, and folded onto
 *   u >= 0 (the window probability D(u) = Phi(u + w/2) - Phi(u - w/2) is even in u). For w
 *   above the range's median the integrand of 1 - W(w) is integrated directly,
 *     1 - W(w) = k int_0^inf { phi(u - w/2) [A^(k-1) - D^(k-1)] + phi(u + w/2) [(1 - B)^(k-1) - D^(k-1)] } du
 *   with A = P(Z > u - w/2), B = P(Z > u + w/2), using the exactly known differences A - D = B
 *   and (1 - B) - D = 1 - A, so that x^n - y^n is formed as x^n (1 - (1 - (x - y)/x)^n)
 *   without cancellation. Below the median, W itself is integrated.
 * - The outer integral (./scale.ts) integrates the upper-tail form f(s) (1 - W(q s)) for
 *   P(Q > q), never 1 - P(Q <= q).
 */
import erfc from '@stdlib/math-base-special-erfc';
import { gaussLegendre } from './quadrature.ts';
import { integrateScale, type ScaleIntegrand } from './scale.ts';
import { normalQuantile, tCritical, tQuantile } from './central.ts';

const INNER = gaussLegendre(12);
const INV_SQRT_2PI = 1 / Math.sqrt(2 * Math.PI);
const INV_2PI = 1 / (2 * Math.PI);

/** P(Z > x) for a standard normal Z, accurate in relative terms for x > 0. */
function upperNormal(x: number): number {
  return 0.5 * erfc(x * Math.SQRT1_2);
}

/** x^n - y^n for 0 <= y <= x, given d = x - y computed without cancellation. */
function powDiff(x: number, d: number, n: number, xn: number): number {
  if (d >= 0.5 * x) return xn - Math.pow(x - d, n);
  return -xn * Math.expm1(n * Math.log1p(-d / x));
}

/**
 * A rough median of the range of k standard normals (twice Blom's approximation to the
 * expected largest normal score); only used to choose which of W and 1 - W to integrate, so
 * a few percent of error costs nothing.
 */
function rangeMedianGuess(k: number): number {
  return 2 * normalQuantile((k - 0.375) / (k + 0.25)) * 0.93;
}

/** Results of the inner integral: W(w), 1 - W(w) and the range density W'(w). */
interface InnerOut {
  cdf: number;
  upper: number;
  density: number;
}

/**
 * The distribution of the range of k standard normals at w: cdf, upper tail and density.
 * `wantDensity` adds the density (used by the quantile's Newton steps).
 */
export function normalRange(w: number, k: number, wantDensity: boolean, out: InnerOut): void {
  if (!(w > 0)) {
    out.cdf = 0;
    out.upper = 1;
    out.density = k === 2 && w === 0 ? 2 * INV_SQRT_2PI * Math.SQRT1_2 : 0;
    return;
  }
  if (w > 80) {
    // 1 - W(w) < k^2 exp(-w^2/4) underflows.
    out.cdf = 1;
    out.upper = 0;
    out.density = 0;
    return;
  }
  const n = k - 1;
  const c = 0.5 * w;
  const useUpper = w > rangeMedianGuess(k);
  const uMax = useUpper ? Math.min(c + 8.5, 10) : c + 8.5;
  // Panel width: the window probability raised to the power k - 1 narrows like 1/sqrt(k).
  const h = Math.min(1, 2.2 / Math.sqrt(k));
  const nodes = INNER.nodes;
  const weights = INNER.weights;
  const expc2 = Math.exp(-c * c);
  let total = 0;
  let dtotal = 0;
  for (let lo = 0; lo < uMax; lo += h) {
    const hi = Math.min(lo + h, uMax);
    const half = 0.5 * (hi - lo);
    const mid = 0.5 * (hi + lo);
    let sum = 0;
    let dsum = 0;
    for (let j = 0; j < nodes.length; j++) {
      const u = mid + half * (nodes[j] as number);
      const a = u - c;
      const b = u + c;
      // A = P(Z > a), Ac = P(Z <= a); B = P(Z > b), b > 0 so B <= 1/2.
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
      // D = P(a < Z <= b), taken from the side that does not cancel.
      const D = a >= 0 ? A - B : Bc - Ac;
      const pa = INV_SQRT_2PI * Math.exp(-0.5 * a * a);
      const pb = INV_SQRT_2PI * Math.exp(-0.5 * b * b);
      let v: number;
      const Dn1 = n === 1 ? 1 : Math.pow(D, n - 1);
      if (useUpper) {
        const An = Math.pow(A, n);
        const Bcn = Math.pow(Bc, n);
        v = pa * powDiff(A, B, n, An) + pb * powDiff(Bc, Ac, n, Bcn);
      } else {
        v = (pa + pb) * Dn1 * D;
      }
      const wj = weights[j] as number;
      sum += wj * v;
      if (wantDensity) dsum += wj * Math.exp(-u * u) * Dn1;
    }
    sum *= half;
    dsum *= half;
    total += sum;
    dtotal += dsum;
    if (sum <= 1e-17 * total && total > 0 && (!wantDensity || dsum <= 1e-17 * dtotal)) break;
  }
  const value = k * total;
  if (useUpper) {
    out.upper = Math.min(value, 1);
    out.cdf = 1 - out.upper;
  } else {
    out.cdf = Math.min(value, 1);
    out.upper = 1 - out.cdf;
  }
  out.density = wantDensity ? 2 * k * n * INV_2PI * expc2 * dtotal : 0;
}

function validGroups(k: number): boolean {
  return Number.isInteger(k) && k >= 2;
}

function validDf(df: number): boolean {
  return df > 0; // NaN fails too; Infinity allowed
}

/** Cheap stand-in for ln of the integrand over s, used only to place the first panel. */
function logProxy(s: number, q: number, k: number, df: number, upper: boolean): number {
  const w = q * s;
  let lg: number;
  if (upper) {
    lg = Math.min(0, Math.log(k * (k - 1)) + Math.log(upperNormal(w * Math.SQRT1_2)));
  } else {
    // W(w) ~ k w^(k-1) integral of phi^k for small w; 1 for large.
    lg = Math.min(
      0,
      Math.log(k) + (k - 1) * Math.log(w) - 0.5 * (k - 1) * Math.log(2 * Math.PI) - 0.5 * Math.log(k),
    );
  }
  return (df - 1) * Math.log(s) - 0.5 * df * s * s + lg;
}

/** Maximizer of logProxy over s > 0 by a geometric scan and golden-section refinement. */
function proxyMode(q: number, k: number, df: number, upper: boolean): number {
  let best = 1;
  let bestVal = -Infinity;
  const lo = -12;
  const hi = 3;
  const steps = 60;
  for (let i = 0; i <= steps; i++) {
    const s = Math.exp(lo + ((hi - lo) * i) / steps);
    const v = logProxy(s, q, k, df, upper);
    if (v > bestVal) {
      bestVal = v;
      best = s;
    }
  }
  const ratio = Math.exp((hi - lo) / steps);
  let a = Math.log(best / ratio);
  let b = Math.log(best * ratio);
  const gr = (Math.sqrt(5) - 1) / 2;
  let x1 = b - gr * (b - a);
  let x2 = a + gr * (b - a);
  let f1 = logProxy(Math.exp(x1), q, k, df, upper);
  let f2 = logProxy(Math.exp(x2), q, k, df, upper);
  for (let i = 0; i < 30; i++) {
    if (f1 > f2) {
      b = x2;
      x2 = x1;
      f2 = f1;
      x1 = b - gr * (b - a);
      f1 = logProxy(Math.exp(x1), q, k, df, upper);
    } else {
      a = x1;
      x1 = x2;
      f1 = f2;
      x2 = a + gr * (b - a);
      f2 = logProxy(Math.exp(x2), q, k, df, upper);
    }
  }
  return Math.exp(0.5 * (a + b));
}

const scratch: InnerOut = { cdf: 0, upper: 0, density: 0 };
const twoSlots = new Float64Array(2);

/**
 * Both tails (and optionally the density) of Q at q, integrated directly: `upper` selects
 * which tail drives the integration. Writes [probability, density] into result.
 */
function rangeIntegral(
  q: number,
  k: number,
  df: number,
  upper: boolean,
  wantDensity: boolean,
  result: Float64Array,
): void {
  if (df === Infinity) {
    normalRange(q, k, wantDensity, scratch);
    result[0] = upper ? scratch.upper : scratch.cdf;
    result[1] = scratch.density;
    return;
  }
  const g: ScaleIntegrand = (s, out) => {
    normalRange(q * s, k, wantDensity, scratch);
    out[0] = upper ? scratch.upper : scratch.cdf;
    out[1] = wantDensity ? s * scratch.density : 0;
  };
  const center = proxyMode(q, k, df, upper);
  const curvature = upper ? 0.5 * q * q : 0.25 * q * q;
  integrateScale(df, g, center, curvature, 2, result);
}

/**
 * P(Q <= q) for the studentized range of `groups` means with `df` error degrees of freedom
 * (df may be Infinity). NaN for groups < 2 (or not an integer), df <= 0, or q NaN.
 */
export function rangeCdf(q: number, groups: number, df: number): number {
  if (Number.isNaN(q) || !validGroups(groups) || !validDf(df)) return NaN;
  if (q <= 0) return 0;
  if (q === Infinity) return 1;
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
  // Lower bracket: the k = 2 quantile.
  let lo = df === Infinity
    ? Math.SQRT2 * -normalQuantile(alpha / 2)
    : Math.SQRT2 * tCritical(1 - alpha, df);
  if (tail === 'lower' && prob < 0.5) {
    lo = Math.SQRT2 * (df === Infinity ? normalQuantile(0.5 + prob / 2) : tQuantile(0.5 + prob / 2, df));
  }
  // Upper bracket: P(Q > q) <= (k(k-1)/2) P(|T| sqrt 2 > q), so the quantile at alpha / pairs
  // is at least as large as the true one.
  const pairs = (k * (k - 1)) / 2;
  let hi = df === Infinity
    ? Math.SQRT2 * -normalQuantile(alpha / (2 * pairs))
    : Math.SQRT2 * -tQuantile(alpha / (2 * pairs), df);
  if (!(hi > lo)) hi = lo * 2;
  if (k === 2) {
    hi = lo * (1 + 1e-9);
    lo = lo * (1 - 1e-9);
  }
  let y = Math.log(0.5 * (lo + hi));
  if (k > 2) {
    // Start from the geometric mean of the bracket, pulled toward the lower end for small df
    // where the Bonferroni bound is loose.
    y = Math.log(lo) + 0.35 * (Math.log(hi) - Math.log(lo));
  } else {
    y = Math.log(0.5 * (lo + hi));
  }
  let ylo = Math.log(lo);
  let yhi = Math.log(hi);
  const target = Math.log(prob);
  const res = new Float64Array(2);
  for (let iter = 0; iter < 60; iter++) {
    const q = Math.exp(y);
    rangeIntegral(q, k, df, tail === 'upper', true, res);
    const p = res[0] as number;
    const dens = res[1] as number;
    const F = Math.log(p) - target;
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
    if (step < 1e-15 * Math.max(1, Math.abs(y))) break;
  }
  return Math.exp(y);
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
