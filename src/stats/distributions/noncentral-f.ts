/**
 * The noncentral F distribution: F = (X1 / df1) / (X2 / df2) with X1 noncentral chi-square
 * (df1 degrees of freedom, noncentrality lambda) and X2 central chi-square on df2.
 *
 * Method: the Poisson mixture of incomplete beta functions (Johnson, Kotz and Balakrishnan,
 * Continuous Univariate Distributions 2, ch. 30, eq. 30.9), with x = df1 f / (df1 f + df2):
 *   P(F <= f) = sum_j p_j I_x(df1/2 + j, df2/2),   p_j = e^(-lambda/2) (lambda/2)^j / j!,
 *   P(F > f)  = sum_j p_j I_(1-x)(df2/2, df1/2 + j),
 * the scheme of AS 226 (Lenth 1987, with Frick's 1990 remark AS R84), summed outward from the
 * Poisson mode as in AS 310 (Chattamvelli and Shanmugam 1997), so that a large lambda neither
 * underflows e^(-lambda/2) nor needs thousands of terms. Only one incomplete
 * beta function is evaluated; the others follow from
 *   I_x(a + 1, b) = I_x(a, b) - T(a),   T(a) = Gamma(a + b) / (Gamma(a + 1) Gamma(b)) x^a (1-x)^b,
 * run only in the direction in which it adds positive terms (downward for the lower tail,
 * upward for the upper tail), so no cancellation creeps in, and the upper tail is its own
 * sum of positive terms, never 1 - cdf. Truncation is bounded by the Poisson tail mass
 * beyond the last term, relative to the sum, below 1e-17.
 *
 * df2 = Infinity is the limit P(X1 / df1 <= f), a noncentral chi-square probability, summed
 * the same way over regularized incomplete gamma functions (JKB ch. 29, eq. 29.2).
 */
import betainc from '@stdlib/math-base-special-betainc';
import gammainc from '@stdlib/math-base-special-gammainc';
import gammaln from '@stdlib/math-base-special-gammaln';
import { stirlingRemainder } from './scale.ts';
import * as pm from '../math/portable.ts';

const LN_2PI = pm.log(2 * Math.PI);
const TINY = 1e-17;

/**
 * ln of the Poisson probability of m at mean mu, in Loader's saddle-point form
 * (C. Loader, "Fast and accurate computation of binomial probabilities", 2000) so that large mu loses
 * nothing to cancellation: -stirling(m) - (m ln(m/mu) + mu - m) - ln(2 pi m)/2.
 */
function logPoisson(m: number, mu: number): number {
  if (mu === 0) return m === 0 ? 0 : -Infinity;
  if (m === 0) return -mu;
  const t = (m - mu) / mu;
  // m ln(m/mu) + mu - m = mu ((1 + t) ln(1 + t) - t), computed without cancellation.
  const bd0 = Math.abs(t) < 0.1 ? mu * bd0Series(t) : m * pm.log(m / mu) + mu - m;
  return -stirlingRemainder(m) - bd0 - 0.5 * (LN_2PI + pm.log(m));
}

/** (1 + t) ln(1 + t) - t = sum_{n >= 2} (-1)^n t^n / (n (n - 1)), for |t| < 0.1. */
function bd0Series(t: number): number {
  let term = t * t;
  let sum = 0;
  for (let n = 2; n < 60; n++) {
    const add = term / (n * (n - 1));
    sum += n % 2 === 0 ? add : -add;
    if (Math.abs(add) < 1e-17 * Math.abs(sum)) break;
    term *= t;
  }
  return sum;
}

/**
 * One family of terms I_j of the mixture, with I_{j+1} = I_j - T_j and
 * T_{j+1} = T_j r(j); `direct(j)` evaluates I_j (lower) or 1 - I_j (upper) once,
 * `logT(j)` gives ln T_j once, `logRatio(j)` gives ln r(j).
 */
interface Family {
  direct(j: number, upper: boolean): number;
  logT(j: number): number;
  logRatio(j: number): number;
}

/** Sums p_j I_j (upper = false) or p_j (1 - I_j) (upper = true) over j. */
function poissonMixture(mu: number, fam: Family, upper: boolean): number {
  const m = Math.floor(mu);
  const lpm = logPoisson(m, mu);
  const logMu = pm.log(mu);
  // Poisson bounds: P(J > j) <= p_{j+1} / (1 - mu / (j + 2)) for j + 2 > mu, and
  // P(J < j) <= p_{j-1} / (1 - (j - 1) / mu) for j - 1 < mu.
  if (!upper) {
    // Top index: where the Poisson mass above is below TINY.
    let j = m;
    let lp = lpm;
    for (;;) {
      const lpNext = lp + logMu - pm.log(j + 1);
      const ratio = mu / (j + 2);
      if (ratio < 1 && pm.exp(lpNext) / (1 - ratio) < TINY) break;
      lp = lpNext;
      j++;
    }
    // Downward: I_j = I_{j+1} + T_j, adding positive terms.
    let I = fam.direct(j, false);
    let lT = fam.logT(j);
    let sum = pm.exp(lp) * I;
    while (j > 0) {
      lT -= fam.logRatio(j - 1);
      lp -= logMu - pm.log(j);
      j--;
      I += pm.exp(lT);
      sum += pm.exp(lp) * I;
      // What is left is at most P(J < j) <= p_{j-1} / (1 - (j - 1) / mu).
      if (j - 1 < mu && j > 0) {
        const lpPrev = lp - logMu + pm.log(j);
        if (pm.exp(lpPrev) / (1 - (j - 1) / mu) < TINY * sum) break;
      }
    }
    return Math.min(1, sum);
  }
  // Bottom index: where the Poisson mass below is below TINY.
  let j = m;
  let lp = lpm;
  while (j > 0) {
    const lpPrev = lp - logMu + pm.log(j);
    const ratio = (j - 1) / mu;
    if (ratio < 1 && pm.exp(lpPrev) / (1 - ratio) < TINY) break;
    lp = lpPrev;
    j--;
  }
  // Upward: U_{j+1} = U_j + T_j, adding positive terms.
  let U = fam.direct(j, true);
  let lT = fam.logT(j);
  let sum = pm.exp(lp) * U;
  for (let iter = 0; iter < 1_000_000; iter++) {
    U += pm.exp(lT);
    lT += fam.logRatio(j);
    lp += logMu - pm.log(j + 1);
    j++;
    sum += pm.exp(lp) * U;
    // What is left is at most P(J > j) <= p_{j+1} / (1 - mu / (j + 2)), since U <= 1.
    const ratio = mu / (j + 2);
    if (ratio < 1) {
      const lpNext = lp + logMu - pm.log(j + 1);
      if (pm.exp(lpNext) / (1 - ratio) <= TINY * sum) break;
    }
  }
  return Math.min(1, sum);
}

function betaFamily(x: number, y: number, a: number, b: number): Family {
  const lnx = pm.log(x);
  const lny = pm.log(y);
  const lgb = gammaln(b);
  return {
    direct: (j, upper) => (upper ? betainc(y, b, a + j, true, false) : betainc(x, a + j, b, true, false)),
    logT: (j) => gammaln(a + j + b) - gammaln(a + j + 1) - lgb + (a + j) * lnx + b * lny,
    logRatio: (j) => lnx + pm.log((a + j + b) / (a + j + 1)),
  };
}

function gammaFamily(h: number, a: number): Family {
  // I_j = P(Gamma(a + j) <= h); I_j - I_{j+1} = h^(a+j) e^(-h) / Gamma(a + j + 1).
  const lnh = pm.log(h);
  return {
    direct: (j, upper) => gammainc(h, a + j, true, upper),
    logT: (j) => (a + j) * lnh - h - gammaln(a + j + 1),
    logRatio: (j) => lnh - pm.log(a + j + 1),
  };
}

function valid(f: number, df1: number, df2: number, lambda: number): boolean {
  return !Number.isNaN(f) && df1 > 0 && df1 < Infinity && df2 > 0 && lambda >= 0 && lambda < Infinity;
}

function tail(f: number, df1: number, df2: number, lambda: number, upper: boolean): number {
  const mu = 0.5 * lambda;
  // Beyond 1e15 denominator degrees of freedom the incomplete beta's parameters lose their
  // digits; the chi-square limit is then exact to about 1 / df2.
  if (df2 >= 1e15) {
    const fam = gammaFamily(0.5 * df1 * f, 0.5 * df1);
    if (mu === 0) return fam.direct(0, upper);
    return poissonMixture(mu, fam, upper);
  }
  // x and 1 - x, each computed directly.
  const denom = df1 * f + df2;
  const x = (df1 * f) / denom;
  const y = df2 / denom;
  const fam = betaFamily(x, y, 0.5 * df1, 0.5 * df2);
  if (mu === 0) return fam.direct(0, upper);
  return poissonMixture(mu, fam, upper);
}

/**
 * P(F <= f) for the noncentral F with df1 and df2 degrees of freedom (df2 may be Infinity)
 * and noncentrality lambda >= 0. NaN for invalid parameters.
 */
export function noncentralFCdf(f: number, df1: number, df2: number, lambda: number): number {
  if (!valid(f, df1, df2, lambda)) return NaN;
  if (f <= 0) return 0;
  if (f === Infinity) return 1;
  return tail(f, df1, df2, lambda, false);
}

/**
 * P(F > f) for the noncentral F, summed in its own positive-term form so that the far upper
 * tail keeps its relative accuracy. This is the power of an F test at critical value f.
 */
export function noncentralFUpper(f: number, df1: number, df2: number, lambda: number): number {
  if (!valid(f, df1, df2, lambda)) return NaN;
  if (f <= 0) return 1;
  if (f === Infinity) return 0;
  return tail(f, df1, df2, lambda, true);
}
