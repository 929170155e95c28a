/**
 * All pairwise differences of one factor's means, with simultaneous (Tukey, Bonferroni) or
 * unadjusted (least significant difference) intervals and p-values.
 */
import { rangeCritical, rangeUpper, tCritical, tTwoSided } from '../distributions/index.ts';
import { DesignError } from '../designs/errors.ts';
import { designMsg } from '../../messages/designs.ts';
import type { DesignFit } from '../designs/types.ts';
import { checkLevel, comparisonBasis, differenceVariance } from './basis.ts';

/** Most pairs {@link pairwise} lists (1,000 levels give 499,500). */
export const MAX_PAIRS = 500_000;

/** The methods {@link pairwise} knows. */
export const PAIRWISE_METHODS = ['tukey', 'bonferroni', 'lsd'] as const;
/** One of {@link PAIRWISE_METHODS}. */
export type PairwiseMethod = (typeof PAIRWISE_METHODS)[number];

/** Every pair, first level minus second, in level order (1-2, 1-3, ..., 2-3, ...). */
export interface PairwiseTable {
  a: string[];
  b: string[];
  estimate: number[];
  se: number[];
  low: number[];
  high: number[];
  /** p-value adjusted for the method (unadjusted for "lsd"). */
  p: number[];
  /** Whether the adjusted p-value is below 1 - level (the interval excludes 0). */
  significant: boolean[];
}

/** Result of {@link pairwise}. */
export interface PairwiseResult {
  method: PairwiseMethod;
  level: number;
  factor: string;
  df: number;
  /** Multiplier of each pair's standard error that gives the interval's half-width. */
  critical: number;
  table: PairwiseTable;
  /** Which error the standard errors come from, when the fit has more than one. */
  notes: string[];
}

/**
 * All pairwise differences of means after a fit.
 *
 * - "tukey": Tukey's studentized range; with unequal counts or least-squares means each pair
 *   uses its own standard error from the covariance of the means (Tukey-Kramer). Intervals
 *   estimate +- q(level; k, df) / sqrt(2) * se; p = P(Q > sqrt(2) |t|).
 * - "bonferroni": t intervals at level 1 - (1 - level) / m for the m = k(k - 1) / 2 pairs;
 *   p = min(1, m p_t).
 * - "lsd": unadjusted t intervals and p-values.
 *
 * @param factor - which factor's levels (default: the fit's treatment factor).
 * @throws DesignError for an unknown method, a bad level, fewer than two levels or a fit
 *   without error df.
 */
export function pairwise(fit: DesignFit, method: string = 'tukey', level = 0.95, factor?: string, at?: string): PairwiseResult {
  if (!(PAIRWISE_METHODS as readonly string[]).includes(method)) throw new DesignError(designMsg.unknownMethod(method));
  const m = method as PairwiseMethod;
  checkLevel(level);
  const { means, mse, df, note } = comparisonBasis(fit, factor, at);
  const k = means.levels.length;
  if (k < 2) throw new DesignError(designMsg.tooFewForPairs());
  const pairs = (k * (k - 1)) / 2;
  if (pairs > MAX_PAIRS) throw new DesignError(designMsg.tooManyPairs(means.factor, k));
  let critical: number;
  if (m === 'tukey') critical = rangeCritical(level, k, df) / Math.SQRT2;
  else if (m === 'bonferroni') critical = tCritical(1 - (1 - level) / pairs, df);
  else critical = tCritical(level, df);

  const table: PairwiseTable = { a: [], b: [], estimate: [], se: [], low: [], high: [], p: [], significant: [] };
  for (let i = 0; i < k; i++) {
    for (let j = i + 1; j < k; j++) {
      const estimate = means.shifted_mean[i]! - means.shifted_mean[j]!;
      const se = Math.sqrt(mse * differenceVariance(means, i, j));
      const t = estimate / se;
      let p: number;
      if (m === 'tukey') p = rangeUpper(Math.SQRT2 * Math.abs(t), k, df);
      else if (m === 'bonferroni') p = Math.min(1, pairs * tTwoSided(t, df));
      else p = tTwoSided(t, df);
      table.a.push(means.levels[i]!);
      table.b.push(means.levels[j]!);
      table.estimate.push(estimate);
      table.se.push(se);
      table.low.push(estimate - critical * se);
      table.high.push(estimate + critical * se);
      table.p.push(p);
      table.significant.push(p < 1 - level);
    }
  }
  return { method: m, level, factor: means.factor, df, critical, table, notes: note === null ? [] : [note] };
}
