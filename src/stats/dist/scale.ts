/**
 * Integrals over the distribution of a sample standard deviation's scale factor.
 *
 * If X is chi-square with df degrees of freedom, s = sqrt(X / df) has density
 *   f(s) = 2 (df/2)^(df/2) / Gamma(df/2) * s^(df-1) * exp(-df s^2 / 2),   s > 0.
 * The studentized range and the noncentral t are both mixtures over s:
 *   P = integral of f(s) g(s) ds
 * with g a probability that is monotone in s. This module computes such integrals with
 * Gauss-Legendre panels laid outward from a starting point, each panel about two local
 * standard deviations of the integrand wide, until a panel adds less than 1e-17 of the
 * running total. Because every node value is a positive probability weighted by a positive
 * density, the sum keeps its relative accuracy when the result is tiny (far tails).
 */
import gammaln from '@stdlib/math-base-special-gammaln';
import gammainc from '@stdlib/math-base-special-gammainc';
import { gaussLegendre } from './quadrature.ts';

const OUTER = gaussLegendre(12);
const LN_SQRT_2PI = 0.5 * Math.log(2 * Math.PI);

/** Stirling's series remainder: lnGamma(x) - ((x - 1/2) ln x - x + ln sqrt(2 pi)). */
export function stirlingRemainder(x: number): number {
  if (x >= 10) {
    const r = 1 / x;
    const r2 = r * r;
    // Abramowitz and Stegun 6.1.41.
    return r * (1 / 12 - r2 * (1 / 360 - r2 * (1 / 1260 - r2 * (1 / 1680 - r2 / 1188))));
  }
  return gammaln(x) - ((x - 0.5) * Math.log(x) - x + LN_SQRT_2PI);
}

/**
 * The constant part of ln f(s), written so that no large terms cancel when df is large:
 * ln f(s) = c + df (ln s + (1 - s^2) / 2) - ln s, with c = ln sqrt(df / pi) - remainder(df/2).
 */
export function logScaleConstant(df: number): number {
  return 0.5 * Math.log(df / Math.PI) - stirlingRemainder(df / 2);
}

/** ln f(s) for the scale s = sqrt(X / df) (see the module comment). */
export function logScaleDensity(s: number, df: number, c: number): number {
  if (s <= 0) return df < 1 ? Infinity : df === 1 ? c : -Infinity;
  const e = s - 1;
  // ln s + (1 - s^2)/2 = log1p(e) - e - e^2/2, accurate near s = 1 where large df lives.
  return c + df * (Math.log1p(e) - e - 0.5 * e * e) - Math.log(s);
}

/**
 * A function evaluated under the integral: it writes one or more values into `out`
 * (out[0] drives the stopping rule; the others are integrated alongside on the same nodes).
 */
export type ScaleIntegrand = (s: number, out: Float64Array) => void;

/**
 * The bending -(d/ds)^2 ln g(s) of a positive function, by a central second difference of
 * its logarithm; 0 where the logarithm is not finite (g underflows, so the integrand is 0).
 */
export function bendOfLog(logg: (s: number) => number): (s: number) => number {
  return (s: number): number => {
    const h = 1e-3 * s;
    const v = -(logg(s + h) - 2 * logg(s) + logg(s - h)) / (h * h);
    return Number.isFinite(v) ? v : 0;
  };
}

/**
 * Computes integral of f(s) g_i(s) ds for each component i of the integrand, for the scale of
 * a standard deviation on df degrees of freedom (df finite, df > 0).
 *
 * g_0 must lie in [0, 1] and be monotone in s (`increasing` says which way); that makes the
 * stopping rule rigorous: the march stops on each side once the chi-square mass left
 * outside, times the largest value g_0 can take there, is below 1e-17 of the running total.
 *
 * `center` should be near the mode of f(s) g_0(s). Each panel is about two local standard
 * deviations of the integrand wide, 2 / sqrt(-(ln f g_0)''), where -(ln f)'' = df + (df - 1)
 * / s^2 and `bend(s)` gives -(ln g_0)''; the local scale is sampled across the tentative
 * panel, which shrinks until every sample allows it. Toward 0 the panels therefore shrink
 * geometrically where s^(df-1) dominates. `width` components are integrated; results go
 * into `result`.
 */
export function integrateScale(
  df: number,
  g: ScaleIntegrand,
  increasing: boolean,
  center: number,
  bend: (s: number) => number,
  width: number,
  result: Float64Array,
): void {
  const c = logScaleConstant(df);
  const dfm1 = Math.max(df - 1, 0);
  const integerDf = Number.isInteger(df);
  const halfDf = 0.5 * df;
  const sigma = (s: number): number => {
    const t = Math.max(s, 1e-150);
    const power = dfm1 === 0 ? 0 : dfm1 / (t * t);
    return 1 / Math.sqrt(df + power + Math.max(0, bend(t)));
  };
  const panelWidth = (from: number, dir: number): number => {
    let wd = 2 * sigma(from);
    for (let r = 0; r < 6; r++) {
      let next = wd;
      for (const f of [0.25, 0.5, 0.75, 1]) {
        const x = from + dir * f * wd;
        if (x > 0) next = Math.min(next, 2 * sigma(x));
      }
      if (next >= wd) break;
      wd = next;
    }
    return wd;
  };
  const out = new Float64Array(width);
  const panel = new Float64Array(width);
  for (let i = 0; i < width; i++) result[i] = 0;
  const gAt = (s: number): number => {
    g(s, out);
    return out[0] as number;
  };

  const addPanel = (lo: number, hi: number): void => {
    const half = 0.5 * (hi - lo);
    const mid = 0.5 * (hi + lo);
    for (let i = 0; i < width; i++) panel[i] = 0;
    const nodes = OUTER.nodes;
    const weights = OUTER.weights;
    for (let j = 0; j < nodes.length; j++) {
      const s = mid + half * (nodes[j] as number);
      const dens = Math.exp(logScaleDensity(s, df, c));
      if (dens === 0) continue;
      g(s, out);
      const wd = (weights[j] as number) * dens;
      for (let i = 0; i < width; i++) panel[i] = (panel[i] as number) + wd * (out[i] as number);
    }
    for (let i = 0; i < width; i++) result[i] = (result[i] as number) + (panel[i] as number) * half;
  };

  const tiny = 1e-17;
  const maxPanels = 4000;
  let count = 0;
  const start = Math.max(center, 0);
  // Rightward from the center: what is left beyond a is at most P(s > a) sup g.
  let a = start;
  for (;;) {
    const b = a + panelWidth(a, 1);
    addPanel(a, b);
    a = b;
    if (++count > maxPanels) break;
    const mass = gammainc(halfDf * a * a, halfDf, true, true);
    const bound = mass * (increasing ? 1 : gAt(a));
    if (bound <= tiny * (result[0] as number)) break;
  }
  // Leftward from the center toward 0: what is left below b is at most P(s < b) sup g.
  let b = start;
  while (b > 0) {
    let lo = b - panelWidth(b, -1);
    if (!integerDf) {
      // s^(df-1) is not smooth at 0: never let a panel reach it.
      lo = Math.max(lo, 0.25 * b);
    } else if (lo < 0) {
      lo = 0;
    }
    addPanel(lo, b);
    b = lo;
    if (b <= 0 || ++count > maxPanels) break;
    const mass = gammainc(halfDf * b * b, halfDf, true, false);
    const bound = mass * (increasing ? gAt(b) : 1);
    if (bound <= tiny * (result[0] as number)) break;
  }
}
