/**
 * Small pieces shared by analyses with more than one error term: Satterthwaite's degrees of
 * freedom for a sum of mean squares, and Bartlett's test that several error variances are
 * equal before they are pooled.
 */
import { chi2Upper } from '../distributions/index.ts';
import * as pm from '../math/portable.ts';

/**
 * Satterthwaite's (1946) approximate degrees of freedom of a sum of independent mean-square
 * terms c_1 + c_2 + ...: (sum c_i)^2 / sum (c_i^2 / df_i). A term with no degrees of freedom
 * gives NaN.
 */
export function satterthwaite(terms: readonly number[], dfs: readonly number[]): number {
  let sum = 0;
  let denom = 0;
  for (let i = 0; i < terms.length; i++) {
    const c = terms[i]!;
    const df = dfs[i]!;
    if (!(df > 0)) return NaN;
    sum += c;
    denom += (c * c) / df;
  }
  return denom > 0 ? (sum * sum) / denom : NaN;
}

/** Bartlett's test of equal variances. */
export interface BartlettTest {
  statistic: number;
  df: number;
  p: number;
}

/**
 * Bartlett's (1937) test that k variances, each estimated on its own degrees of freedom, are
 * equal: M = nu ln s_p^2 - sum nu_i ln s_i^2 with nu = sum nu_i and s_p^2 the pooled variance,
 * divided by C = 1 + (sum 1/nu_i - 1/nu) / (3 (k - 1)); chi-square on k - 1 df. Sensitive to
 * long tails, as every textbook warns; a small p says the variances differ or the errors are
 * not normal.
 */
export function bartlett(variances: readonly number[], dfs: readonly number[]): BartlettTest {
  const k = variances.length;
  let nu = 0;
  let pooled = 0;
  let logSum = 0;
  let inv = 0;
  for (let i = 0; i < k; i++) {
    const v = variances[i]!;
    const d = dfs[i]!;
    nu += d;
    pooled += d * v;
    logSum += d * pm.log(v);
    inv += 1 / d;
  }
  pooled /= nu;
  const m = nu * pm.log(pooled) - logSum;
  const c = 1 + (inv - 1 / nu) / (3 * (k - 1));
  const statistic = m / c;
  return { statistic, df: k - 1, p: chi2Upper(statistic, k - 1) };
}
