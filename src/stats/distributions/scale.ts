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
import { KRONROD15 } from './quadrature.ts';
import * as pm from '../math/portable.ts';

const LN_SQRT_2PI = 0.5 * pm.log(2 * Math.PI);

/** Stirling's series remainder: lnGamma(x) - ((x - 1/2) ln x - x + ln sqrt(2 pi)). */
export function stirlingRemainder(x: number): number {
  if (x >= 10) {
    const r = 1 / x;
    const r2 = r * r;
    // Abramowitz and Stegun 6.1.41.
    return r * (1 / 12 - r2 * (1 / 360 - r2 * (1 / 1260 - r2 * (1 / 1680 - r2 / 1188))));
  }
  return gammaln(x) - ((x - 0.5) * pm.log(x) - x + LN_SQRT_2PI);
}

/**
 * The constant part of ln f(s), written so that no large terms cancel when df is large:
 * ln f(s) = c + df (ln s + (1 - s^2) / 2) - ln s, with c = ln sqrt(df / pi) - remainder(df/2).
 */
export function logScaleConstant(df: number): number {
  return 0.5 * pm.log(df / Math.PI) - stirlingRemainder(df / 2);
}

/** ln f(s) for the scale s = sqrt(X / df) (see the module comment). */
export function logScaleDensity(s: number, df: number, c: number): number {
  if (s <= 0) return df < 1 ? Infinity : df === 1 ? c : -Infinity;
  const e = s - 1;
  if (Math.abs(e) < 0.5) {
    // ln s + (1 - s^2)/2 = log1p(e) - e - e^2/2, accurate near s = 1 where large df lives.
    return c + df * (pm.log1p(e) - e - 0.5 * e * e) - pm.log(s);
  }
  // Far from 1 the terms do not cancel, and s - 1 would lose the digits of a small s.
  return c + (df - 1) * pm.log(s) + 0.5 * df * (1 - s) * (1 + s);
}

/**
 * A function evaluated under the integral: it writes one or more values into `out`
 * (out[0] drives the stopping rule; the others are integrated alongside on the same nodes).
 */
export type ScaleIntegrand = (s: number, out: Float64Array) => void;

/**
 * Computes integral of f(s) g_i(s) ds for each component i of the integrand, for the scale of
 * a standard deviation on df degrees of freedom (df finite, df > 0).
 *
 * g_0 must lie in [0, 1] and be monotone in s (`increasing` says which way); that makes the
 * stopping rule rigorous: the march stops on each side once the chi-square mass left
 * outside, times the largest value g_0 can take there, is below 1e-17 of the running total.
 *
 * `center` should be near the mode of f(s) g_0(s). Each panel is at most two local standard
 * deviations of the integrand wide, 2 / sqrt(-(ln f g_0)''), taking the largest bending over
 * the panel: |(ln f)''| <= df + |df - 1| / s^2 is largest at the panel's left end, and
 * `bendMax(lo, hi)` must bound -(ln g_0)'' on [lo, hi]. Toward 0 the panels therefore shrink
 * geometrically where s^(df-1) dominates, except that for a small integer df, where
 * s^(df-1) is a polynomial the 15-point rule integrates exactly, the last panel may reach 0.
 * Each panel is then checked by its Kronrod-Gauss difference and halved where needed.
 * `width` components are integrated; results go into `result`.
 */
export function integrateScale(
  df: number,
  g: ScaleIntegrand,
  increasing: boolean,
  center: number,
  bendMax: (lo: number, hi: number) => number,
  width: number,
  result: Float64Array,
): void {
  const c = logScaleConstant(df);
  // |df - 1| / s^2 is the size of the bending of ln s^(df-1), concave for df > 1, convex below.
  const dfm1 = Math.abs(df - 1);
  const polynomialAtZero = Number.isInteger(df) && df <= 13;
  const halfDf = 0.5 * df;
  // Largest panel width allowed on [lo, hi] (within a factor 2 of the best).
  const allowedOn = (lo: number, hi: number, withPower: boolean): number => {
    const power = withPower && dfm1 > 0 ? dfm1 / (lo * lo) : 0;
    return 2 / Math.sqrt(df + power + Math.max(0, bendMax(lo, hi)));
  };
  const widthRight = (from: number): number => {
    let wd = allowedOn(from, from, true);
    for (let r = 0; r < 40; r++) {
      const allowed = allowedOn(from, from + wd, true);
      if (allowed >= wd) break;
      wd = Math.max(allowed, 0.5 * wd);
    }
    return wd;
  };
  const widthLeft = (from: number): number => {
    let wd = allowedOn(from, from, true);
    for (let r = 0; r < 40; r++) {
      const lo = from - wd;
      if (lo <= 0) {
        // The rest down to 0 in one panel, if s^(df-1) is a low polynomial and the other
        // factors are smooth there.
        if (polynomialAtZero && allowedOn(0, from, false) >= from) return from;
        wd = 0.5 * from;
        continue;
      }
      const allowed = allowedOn(lo, from, true);
      if (allowed >= wd) break;
      wd = Math.max(allowed, 0.5 * wd);
    }
    return Math.min(wd, from);
  };
  const out = new Float64Array(width);
  const panel = new Float64Array(width);
  for (let i = 0; i < width; i++) result[i] = 0;
  const gAt = (s: number): number => {
    g(s, out);
    return out[0] as number;
  };

  // One panel by the 15-point Kronrod rule; where it differs from the embedded 7-point Gauss
  // rule by more than 1e-9 of the panel (or of the total so far), the panel is halved. The
  // Kronrod value is then far more accurate than that difference (QUADPACK's own error
  // estimate scales the difference down the same way).
  const kn = KRONROD15.nodes;
  const kw = KRONROD15.kronrodWeights;
  const gw = KRONROD15.gaussWeights;
  const nodeValue = (s: number, into: Float64Array): void => {
    const dens = pm.exp(logScaleDensity(s, df, c));
    if (dens === 0) {
      for (let i = 0; i < width; i++) into[i] = 0;
      return;
    }
    g(s, out);
    for (let i = 0; i < width; i++) into[i] = dens * (out[i] as number);
  };
  const v1 = new Float64Array(width);
  const v2 = new Float64Array(width);
  const addPanel = (lo: number, hi: number, depth = 0): void => {
    const half = 0.5 * (hi - lo);
    const mid = 0.5 * (hi + lo);
    for (let i = 0; i < width; i++) panel[i] = 0;
    let gauss = 0;
    nodeValue(mid, v1);
    for (let i = 0; i < width; i++) panel[i] = (kw[7] as number) * (v1[i] as number);
    gauss = (gw[3] as number) * (v1[0] as number);
    for (let j = 0; j < 7; j++) {
      const x = half * (kn[j] as number);
      nodeValue(mid - x, v1);
      nodeValue(mid + x, v2);
      const wk = kw[j] as number;
      for (let i = 0; i < width; i++) panel[i] = (panel[i] as number) + wk * ((v1[i] as number) + (v2[i] as number));
      if (j % 2 === 1) gauss += (gw[(j - 1) / 2] as number) * ((v1[0] as number) + (v2[0] as number));
    }
    const kron = (panel[0] as number) * half;
    gauss *= half;
    const scale = Math.max(Math.abs(kron), 1e-3 * (result[0] as number));
    if (Math.abs(kron - gauss) > 1e-9 * scale && depth < 12) {
      addPanel(lo, mid, depth + 1);
      addPanel(mid, hi, depth + 1);
      return;
    }
    for (let i = 0; i < width; i++) result[i] = (result[i] as number) + (panel[i] as number) * half;
  };

  const tiny = 1e-17;
  const maxPanels = 4000;
  let count = 0;
  const start = center > 0 ? center : 1e-300;
  // Rightward from the center: what is left beyond a is at most P(s > a) sup g.
  let a = start;
  for (;;) {
    const b = a + widthRight(a);
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
    const lo = b - widthLeft(b);
    addPanel(lo, b);
    b = lo;
    if (b <= 0 || ++count > maxPanels) break;
    const mass = gammainc(halfDf * b * b, halfDf, true, false);
    const bound = mass * (increasing ? gAt(b) : 1);
    if (bound <= tiny * (result[0] as number)) break;
  }
  // A march that ran out of panels did not reach its stopping rule: say so rather than
  // return a truncated sum.
  if (count > maxPanels) for (let i = 0; i < width; i++) result[i] = NaN;
}
