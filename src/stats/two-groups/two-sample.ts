/**
 * Two independent groups: the difference of their means with a t interval and test, either
 * with one pooled variance (Student) or with separate variances and the
 * Welch-Satterthwaite degrees of freedom.
 * source: B. L. Welch (1947), "The generalization of 'Student's' problem when several
 * different population variances are involved", Biometrika 34, 28-35;
 * F. E. Satterthwaite (1946), Biometrics Bulletin 2, 110-114.
 */
import { tInterval } from '../distributions/index.ts';
import { type GroupCodes, StatsInputError } from '../summary/groups.ts';
import { splitByLevel } from '../summary/group-stats.ts';
import { mean, sumSquaredDeviations } from '../summary/moments.ts';
import { statsMsg } from '../../messages/stats.ts';

/** The result of {@link twoSample}. The difference is always first level minus second. */
export interface TwoSampleResult {
  /** Mean of the first level minus mean of the second. */
  readonly estimate: number;
  /** Standard error of the difference. */
  readonly se: number;
  /** Degrees of freedom: n1 + n2 - 2 pooled, Welch-Satterthwaite (not an integer) otherwise. */
  readonly df: number;
  /** estimate / se. */
  readonly t: number;
  /** Two-sided p-value of t on df degrees of freedom. */
  readonly p: number;
  /** Lower end of the two-sided confidence interval at `level`. */
  readonly low: number;
  /** Upper end of that interval. */
  readonly high: number;
  /** Confidence level of the interval. */
  readonly level: number;
  /** Total number of observations, n1 + n2. */
  readonly n: number;
  /** Pooled variance (weights each group's variance by its degrees of freedom); NaN for Welch. */
  readonly pooled_variance: number;
  /** True for the pooled form, false for Welch's. */
  readonly equal_variance: boolean;
  /** Name of the first level (first-seen order). */
  readonly first_level: string;
  /** Observations in the first level. */
  readonly first_n: number;
  /** Mean of the first level. */
  readonly first_mean: number;
  /** Standard deviation of the first level (NaN for a single value). */
  readonly first_sd: number;
  /** Name of the second level. */
  readonly second_level: string;
  /** Observations in the second level. */
  readonly second_n: number;
  /** Mean of the second level. */
  readonly second_mean: number;
  /** Standard deviation of the second level (NaN for a single value). */
  readonly second_sd: number;
}

/**
 * Compares the means of the two levels of `groups`.
 *
 * @param y - responses (complete cases)
 * @param groups - exactly two levels; the first (in first-seen order) is the minuend
 * @param level - confidence level of the interval, strictly between 0 and 1
 * @param equalVariance - true for the pooled-variance form, false for Welch's
 * @returns the comparison; when no group varies at all, se is 0 and t is infinite (p = 0),
 *   or NaN when the two means are also equal
 * @throws StatsInputError for a grouping that does not have two levels, or too few values
 *   (pooled: each level needs one value and the total at least three; Welch: each level
 *   needs two)
 */
export function twoSample(
  y: Float64Array,
  groups: GroupCodes,
  level = 0.95,
  equalVariance = true,
): TwoSampleResult {
  checkLevel(level);
  if (groups.levels.length !== 2) {
    throw new StatsInputError(statsMsg.twoGroupsOnly(groups.levels.length));
  }
  const { values, start } = splitByLevel(y, groups);
  const a = values.subarray(start[0]!, start[1]!);
  const b = values.subarray(start[1]!, start[2]!);
  const n1 = a.length;
  const n2 = b.length;
  const name1 = groups.levels[0]!;
  const name2 = groups.levels[1]!;
  if (n1 < 1 || n2 < 1) {
    throw new StatsInputError(statsMsg.emptyGroup(name1, n1, name2, n2));
  }
  if (equalVariance && n1 + n2 < 3) {
    throw new StatsInputError(statsMsg.pooledTooFew());
  }
  if (!equalVariance && (n1 < 2 || n2 < 2)) {
    throw new StatsInputError(statsMsg.separateTooFew(name1, n1, name2, n2));
  }
  const m1 = mean(a);
  const m2 = mean(b);
  const ss1 = sumSquaredDeviations(a, m1);
  const ss2 = sumSquaredDeviations(b, m2);
  const v1 = n1 > 1 ? ss1 / (n1 - 1) : NaN;
  const v2 = n2 > 1 ? ss2 / (n2 - 1) : NaN;
  const estimate = m1 - m2;

  let se: number;
  let df: number;
  let pooled = NaN;
  if (equalVariance) {
    df = n1 + n2 - 2;
    pooled = (ss1 + ss2) / df;
    se = Math.sqrt(pooled * (1 / n1 + 1 / n2));
  } else {
    const w1 = v1 / n1;
    const w2 = v2 / n2;
    se = Math.sqrt(w1 + w2);
    df = ((w1 + w2) * (w1 + w2)) / ((w1 * w1) / (n1 - 1) + (w2 * w2) / (n2 - 1));
  }
  return {
    ...tInterval(estimate, se, df, level),
    n: n1 + n2,
    pooled_variance: pooled,
    equal_variance: equalVariance,
    first_level: name1,
    first_n: n1,
    first_mean: m1,
    first_sd: Math.sqrt(v1),
    second_level: name2,
    second_n: n2,
    second_mean: m2,
    second_sd: Math.sqrt(v2),
  };
}

/** @throws StatsInputError unless 0 < level < 1 */
export function checkLevel(level: number): void {
  if (!(level > 0 && level < 1)) {
    throw new StatsInputError(statsMsg.badLevel(level));
  }
}
