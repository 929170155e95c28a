/**
 * Brown-Forsythe test of equal spread across groups: Levene's one-way analysis of variance
 * applied to the absolute deviations from each group's median (the median makes it robust
 * to skewed data).
 * source: M. B. Brown, A. B. Forsythe (1974), "Robust tests for the equality of variances",
 * Journal of the American Statistical Association 69, 364-367; H. Levene (1960), in
 * Contributions to Probability and Statistics, Stanford University Press, 278-292.
 */
import { fUpper } from '../distributions/index.ts';
import { type GroupCodes, StatsInputError } from '../summary/groups.ts';
import { splitByLevel } from '../summary/group-stats.ts';
import { mean, sumSquaredDeviations } from '../summary/moments.ts';
import { quantileSorted } from '../summary/quantile.ts';
import { sq } from '../math/portable.ts';
import { statsMsg } from '../../messages/stats.ts';

/** The result of {@link brownForsythe}. */
export interface BrownForsytheResult {
  /** The F statistic of the analysis of variance of |y - group median|. */
  readonly f: number;
  /** Numerator degrees of freedom: groups with data, minus 1. */
  readonly df1: number;
  /** Denominator degrees of freedom: observations minus groups with data. */
  readonly df2: number;
  /** Upper-tail F p-value. */
  readonly p: number;
  /** Median of each level in `groups` order (NaN for a level without data). */
  readonly median: Float64Array;
}

/**
 * Brown-Forsythe test of y across the levels of `groups`. Levels without data are left out.
 *
 * @throws StatsInputError when fewer than two levels have data, there are no more
 *   observations than groups, or the deviations do not vary within any group
 */
export function brownForsythe(y: Float64Array, groups: GroupCodes): BrownForsytheResult {
  const { values, start, counts } = splitByLevel(y, groups);
  const k = counts.length;
  const n = y.length;
  const medians = new Float64Array(k).fill(NaN);
  const z = new Float64Array(n);
  let used = 0;
  for (let j = 0; j < k; j++) {
    const part = values.subarray(start[j]!, start[j + 1]!);
    if (part.length === 0) continue;
    used++;
    part.sort();
    const med = quantileSorted(part, 0.5);
    medians[j] = med;
    for (let i = start[j]!; i < start[j + 1]!; i++) z[i] = Math.abs(values[i]! - med);
  }
  if (used < 2) {
    throw new StatsInputError(statsMsg.spreadGroups(used));
  }
  const df1 = used - 1;
  const df2 = n - used;
  if (df2 < 1) {
    throw new StatsInputError(statsMsg.spreadTooFew());
  }
  const grand = mean(z);
  let between = 0;
  let within = 0;
  for (let j = 0; j < k; j++) {
    const part = z.subarray(start[j]!, start[j + 1]!);
    if (part.length === 0) continue;
    const mj = mean(part);
    between += part.length * sq(mj - grand);
    within += sumSquaredDeviations(part, mj);
  }
  if (!(within > 0)) {
    throw new StatsInputError(statsMsg.spreadConstant());
  }
  const f = between / df1 / (within / df2);
  return { f, df1, df2, p: fUpper(f, df1, df2), median: medians };
}
