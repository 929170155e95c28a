/**
 * A linear contrast of one factor's means: sum of w_i mean_i with weights adding to zero.
 */
import { tInterval } from '../distributions/index.ts';
import { DesignError } from '../designs/errors.ts';
import { designMsg } from '../../messages/designs.ts';
import type { DesignFit } from '../designs/types.ts';
import { checkLevel, comparisonBasis, meansCovariance } from './basis.ts';

/** Result of {@link contrast}. */
export interface ContrastResult {
  /** Sum of w_i mean_i. */
  estimate: number;
  se: number;
  df: number;
  t: number;
  /** Two-sided p-value. */
  p: number;
  low: number;
  high: number;
  level: number;
  /** The weights, in the factor's level order. */
  weights: number[];
  levels: string[];
  /** Which error the standard error comes from, when the fit has more than one. */
  notes: string[];
}

/** Weights may add up to zero only to rounding: this much of the sum of their sizes. */
const SUM_TOLERANCE = 1e-9;

/**
 * A contrast of the means: estimate sum w_i m_i, standard error sqrt(mse w' V w) from the
 * fit's covariance of the means, t on the error df, and a `level` interval.
 *
 * @param weights - one weight per level, in the factor's level order, adding up to zero.
 * @param factor - which factor's levels (default: the fit's treatment factor).
 * @throws DesignError when the count of weights is wrong, they do not add up to zero, they
 *   are all zero or not finite, or the fit has no error df.
 */
export function contrast(fit: DesignFit, weights: readonly number[], level = 0.95, factor?: string, at?: string): ContrastResult {
  checkLevel(level);
  const { means, mse, df, note } = comparisonBasis(fit, factor, at);
  const k = means.levels.length;
  if (weights.length !== k) throw new DesignError(designMsg.weightsCount(weights.length, k, means.factor));
  let sum = 0;
  let size = 0;
  for (const w of weights) {
    if (!Number.isFinite(w)) throw new DesignError(designMsg.weightsNotFinite());
    sum += w;
    size += Math.abs(w);
  }
  if (size === 0) throw new DesignError(designMsg.weightsZero());
  if (Math.abs(sum) > SUM_TOLERANCE * size) throw new DesignError(designMsg.weightsSum(sum));
  let estimate = 0;
  let variance = 0;
  for (let i = 0; i < k; i++) {
    const wi = weights[i]!;
    estimate += wi * means.shifted_mean[i]!;
    if (means.covariance_form === 'diagonal') variance += wi * wi * meansCovariance(means, i, i);
    else for (let j = 0; j < k; j++) variance += wi * weights[j]! * meansCovariance(means, i, j);
  }
  const se = Math.sqrt(mse * variance);
  return {
    ...tInterval(estimate, se, df, level),
    weights: [...weights],
    levels: [...means.levels],
    notes: note === null ? [] : [note],
  };
}
