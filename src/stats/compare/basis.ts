/**
 * What every comparison starts from: one factor's means and their covariance from a fit,
 * the error mean square and its degrees of freedom.
 */
import { DesignError } from '../designs/errors.ts';
import { messages } from '../designs/messages.ts';
import type { DesignFit, FactorMeans } from '../designs/types.ts';

/** The means a comparison works on. */
export interface ComparisonBasis {
  means: FactorMeans;
  mse: number;
  df: number;
}

/**
 * The means of `factor` (default: the fit's treatment factor), checking that the fit has an
 * error term.
 */
export function comparisonBasis(fit: DesignFit, factor?: string): ComparisonBasis {
  const name = factor ?? fit.treatment;
  const means = fit.factor_means.find((m) => m.factor === name);
  if (means === undefined) throw new DesignError(messages.unknownFactor(name, fit.factor_means.map((m) => m.factor)));
  if (!(fit.df_error > 0) || !(fit.mse >= 0)) throw new DesignError(messages.noErrorForComparison());
  return { means, mse: fit.mse, df: fit.df_error };
}

/** Position of `level` among the factor's levels. */
export function levelIndex(means: FactorMeans, level: string): number {
  const k = means.levels.indexOf(level);
  if (k < 0) throw new DesignError(messages.unknownLevel(means.factor, level, means.levels));
  return k;
}

/** Check a confidence level. */
export function checkLevel(level: number): void {
  if (!(level > 0 && level < 1)) throw new DesignError(messages.badLevel(level));
}

/** Covariance (units of sigma^2) of mean_i and mean_j, whatever the stored form. */
export function meansCovariance(means: FactorMeans, i: number, j: number): number {
  if (means.covariance_form === 'diagonal') return i === j ? means.covariance[i]! : 0;
  return means.covariance[i * means.levels.length + j]!;
}

/** Variance (units of sigma^2) of mean_i - mean_j. */
export function differenceVariance(means: FactorMeans, i: number, j: number): number {
  return meansCovariance(means, i, i) + meansCovariance(means, j, j) - 2 * meansCovariance(means, i, j);
}
