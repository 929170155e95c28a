/**
 * Paired comparison: a one-sample t interval and test on the differences a - b, one pair per
 * unit (each unit is its own block).
 * source: Student (1908), "The probable error of a mean", Biometrika 6, 1-25.
 */
import { tInterval } from '../distributions/index.ts';
import { StatsInputError, checkSameLength } from '../summary/groups.ts';
import { mean, sumSquaredDeviations } from '../summary/moments.ts';
import { checkLevel } from './two-sample.ts';
import { statsMsg } from '../../messages/stats.ts';

/** The result of {@link paired}. */
export interface PairedResult {
  /** Mean of the differences a - b. */
  readonly estimate: number;
  /** Standard error of that mean, sd / sqrt(n). */
  readonly se: number;
  /** Degrees of freedom, n - 1. */
  readonly df: number;
  /** estimate / se. */
  readonly t: number;
  /** Two-sided p-value. */
  readonly p: number;
  /** Lower end of the two-sided confidence interval at `level`. */
  readonly low: number;
  /** Upper end of that interval. */
  readonly high: number;
  /** Confidence level. */
  readonly level: number;
  /** Number of pairs. */
  readonly n: number;
  /** Standard deviation of the differences. */
  readonly sd: number;
}

/**
 * Paired t comparison of a and b (position i of each belongs to the same unit).
 *
 * @param level - confidence level, strictly between 0 and 1
 * @throws StatsInputError when the lengths differ or there are fewer than two pairs
 */
export function paired(a: Float64Array, b: Float64Array, level = 0.95): PairedResult {
  checkLevel(level);
  checkSameLength(a, b);
  const n = a.length;
  if (n < 2) throw new StatsInputError(statsMsg.pairedTooFew(n));
  const d = new Float64Array(n);
  for (let i = 0; i < n; i++) d[i] = a[i]! - b[i]!;
  const estimate = mean(d);
  const sdd = Math.sqrt(sumSquaredDeviations(d, estimate) / (n - 1));
  const se = sdd / Math.sqrt(n);
  const df = n - 1;
  return {
    ...tInterval(estimate, se, df, level),
    n,
    sd: sdd,
  };
}
