/**
 * The difference between two levels' means after a fit, with its t interval.
 */
import { tInterval } from '../distributions/index.ts';
import { DesignError } from '../designs/errors.ts';
import { designMsg } from '../../messages/designs.ts';
import type { DesignFit } from '../designs/types.ts';
import { checkLevel, comparisonBasis, differenceVariance, levelIndex } from './basis.ts';

/** One difference of means, first level minus second. */
export interface DifferenceResult {
  a: string;
  b: string;
  estimate: number;
  se: number;
  df: number;
  t: number;
  /** Two-sided p-value (not adjusted for multiplicity). */
  p: number;
  low: number;
  high: number;
  level: number;
  /** Which error the standard error comes from, when the fit has more than one. */
  notes: string[];
}

/**
 * Mean of level `a` minus mean of level `b`, with standard error
 * sqrt(mse (v_aa + v_bb - 2 v_ab)) from the fit's covariance of the means (the least-squares
 * means in unbalanced designs), t on the error degrees of freedom, and a `level` interval.
 *
 * @param factor - which factor's levels (default: the fit's treatment factor).
 * @throws DesignError for an unknown level, a = b, a bad level or a fit without error df.
 */
export function difference(fit: DesignFit, a: string, b: string, level = 0.95, factor?: string, at?: string): DifferenceResult {
  checkLevel(level);
  const { means, mse, df, note } = comparisonBasis(fit, factor, at);
  if (a === b) throw new DesignError(designMsg.sameLevel(a));
  const i = levelIndex(means, a);
  const j = levelIndex(means, b);
  const estimate = means.shifted_mean[i]! - means.shifted_mean[j]!;
  const se = Math.sqrt(mse * differenceVariance(means, i, j));
  return { a, b, ...tInterval(estimate, se, df, level), notes: note === null ? [] : [note] };
}
