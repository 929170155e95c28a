/**
 * The noncentral t distribution: T = (Z + delta) / s with Z standard normal and df s^2
 * chi-square on df degrees of freedom, independent.
 *
 * Method: the mixture representation over the scale s (Owen 1968, "A survey of properties and
 * applications of the noncentral t-distribution", Technometrics 10, 445-478, eq. 3.2;
 * also Johnson, Kotz and Balakrishnan, Continuous Univariate Distributions 2, ch. 31):
 *   P(T <= t) = integral over s of f(s) Phi(t s - delta) ds,
 *   P(T > t)  = integral over s of f(s) Phi(-(t s - delta)) ds,
 * each integrated directly by Gauss-Kronrod panels (./scale.ts). Both integrands are
 * positive, so each tail keeps its relative accuracy however small it is; Lenth's series
 * (AS 243), by contrast, gives the upper tail as 1 minus a sum and loses it below about
 * 1e-12. The tests compare this with that series in the body.
 */
import erfc from '@stdlib/math-base-special-erfc';
import { integrateScale, logScaleConstant, logScaleDensity, type ScaleIntegrand } from './scale.ts';
import { scaleMode } from './mode.ts';
import * as pm from '../math/portable.ts';

/** P(Z <= x) for a standard normal Z, from the side that does not cancel. */
function normalLower(x: number): number {
  return x < 0 ? 0.5 * erfc(-x * Math.SQRT1_2) : 1 - 0.5 * erfc(x * Math.SQRT1_2);
}

function valid(t: number, df: number, delta: number): boolean {
  return !Number.isNaN(t) && df > 0 && Number.isFinite(delta);
}

const slots = new Float64Array(1);

/**
 * ln of the integrand f(s) Phi(sign (t s - delta)); its maximizer places the first panel.
 * A scan over a geometric grid then a golden-section refinement.
 */
function mode(t: number, df: number, delta: number, sign: number): number {
  const c = logScaleConstant(df);
  const logh = (s: number): number => logScaleDensity(s, df, c) + pm.log(normalLower(sign * (t * s - delta)));
  return scaleMode(logh, Math.abs(t));
}

/**
 * -(ln Phi)''(x) = m (m + x) with m = phi(x) / Phi(x): it falls steadily from 1 (x -> -inf)
 * to 0 (x -> +inf), so its largest value on an interval is at the interval's left end.
 */
function normalLogBend(x: number): number {
  if (x < -8) return 1;
  if (x > 38) return 0;
  const m = pm.exp(-0.5 * x * x - 0.5 * pm.log(2 * Math.PI) - pm.log(normalLower(x)));
  return Math.min(1, Math.max(0, m * (m + x)));
}

/** integral of f(s) Phi(sign (t s - delta)) ds, for t != 0 and finite df. */
function mixture(t: number, df: number, delta: number, sign: number): number {
  const g: ScaleIntegrand = (s, out) => {
    out[0] = normalLower(sign * (t * s - delta));
  };
  const increasing = sign * t > 0;
  // The argument sign (t s - delta) is smallest at the left end of a panel when g increases
  // in s and at the right end otherwise; there the bending of ln g is largest.
  const t2 = t * t;
  const bendMax = (lo: number, hi: number): number =>
    t2 * normalLogBend(sign * (t * (increasing ? lo : hi) - delta));
  integrateScale(df, g, increasing, mode(t, df, delta, sign), bendMax, 1, slots);
  return Math.min(1, slots[0] as number);
}

/**
 * P(T <= t) for the noncentral t with df degrees of freedom (df > 0, Infinity allowed) and
 * noncentrality delta. NaN for invalid parameters.
 */
export function noncentralTCdf(t: number, df: number, delta: number): number {
  if (!valid(t, df, delta)) return NaN;
  if (t === Infinity) return 1;
  if (t === -Infinity) return 0;
  if (df === Infinity) return normalLower(t - delta);
  if (t === 0) return normalLower(-delta);
  return mixture(t, df, delta, 1);
}

/**
 * P(T > t) for the noncentral t, integrated directly so that it keeps its relative accuracy
 * in the far tail (it does not collapse to 0 where 1 - cdf would).
 */
export function noncentralTUpper(t: number, df: number, delta: number): number {
  if (!valid(t, df, delta)) return NaN;
  if (t === Infinity) return 0;
  if (t === -Infinity) return 1;
  if (df === Infinity) return normalLower(delta - t);
  if (t === 0) return normalLower(delta);
  return mixture(t, df, delta, -1);
}
