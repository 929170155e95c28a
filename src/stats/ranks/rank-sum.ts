/**
 * Wilcoxon-Mann-Whitney rank sum test for two independent groups.
 * source: F. Wilcoxon (1945), Biometrics Bulletin 1, 80-83; H. B. Mann, D. R. Whitney (1947),
 * Annals of Mathematical Statistics 18, 50-60.
 */
import { normalUpper } from '../distributions/index.ts';
import { type GroupCodes, StatsInputError, levelCounts } from '../summary/groups.ts';
import { averageRanks } from './rank.ts';
import { rankSumExactP } from './exact.ts';
import type { RankPMethod } from './signed-rank.ts';
import { statsMsg } from '../../messages/stats.ts';

/** Largest size of either group for which the exact distribution is used. */
export const RANK_SUM_EXACT_MAX = 50;

/** The result of {@link rankSum}. */
export interface RankSumResult {
  /** W: the sum of the ranks (in the pooled sample) of the first level's values. */
  readonly rank_sum: number;
  /**
   * U = W - n1 (n1 + 1) / 2: the number of (first, second) pairs in which the first level's
   * value is larger, ties counting 1/2. It ranges from 0 to n1 n2.
   */
  readonly u: number;
  /** Size of the first level. */
  readonly n1: number;
  /** Size of the second level. */
  readonly n2: number;
  /** Name of the first level (first-seen order). */
  readonly first_level: string;
  /** Name of the second level. */
  readonly second_level: string;
  /** Number of groups of tied values in the pooled sample. */
  readonly tie_groups: number;
  /**
   * Normal score of U with the tie correction of the variance and a continuity correction
   * of 1/2 towards the centre. Reported for both methods; the p-value follows `method`.
   */
  readonly z: number;
  /** Two-sided p-value. */
  readonly p: number;
  /**
   * 'exact' (the null distribution of U by the Mann-Whitney recurrence, used when there are
   * no ties and neither group is larger than {@link RANK_SUM_EXACT_MAX}) or 'normal'.
   */
  readonly method: RankPMethod;
}

/**
 * Rank sum test of the two levels of `groups`.
 *
 * @param y - responses (complete cases); equal values are ties (exact comparison)
 * @param groups - exactly two levels, each with at least one value
 * @throws StatsInputError for another number of levels, an empty level, or all values equal
 */
export function rankSum(y: Float64Array, groups: GroupCodes): RankSumResult {
  if (groups.levels.length !== 2) {
    throw new StatsInputError(statsMsg.rankSumTwoGroups(groups.levels.length));
  }
  const counts = levelCounts(y.length, groups);
  const n1 = counts[0]!;
  const n2 = counts[1]!;
  const first = groups.levels[0]!;
  const second = groups.levels[1]!;
  if (n1 < 1 || n2 < 1) {
    throw new StatsInputError(statsMsg.emptyGroup(first, n1, second, n2));
  }
  const { ranks, tieTerm, tieGroups } = averageRanks(y);
  const codes = groups.codes;
  let w = 0;
  for (let i = 0; i < y.length; i++) if (codes[i] === 0) w += ranks[i]!;
  const u = w - (n1 * (n1 + 1)) / 2;

  const total = n1 + n2;
  const centre = (n1 * n2) / 2;
  const variance = ((n1 * n2) / 12) * (total + 1 - tieTerm / (total * (total - 1)));
  if (!(variance > 0)) {
    throw new StatsInputError(statsMsg.allTied());
  }
  const dev = Math.max(0, Math.abs(u - centre) - 0.5);
  const z = (Math.sign(u - centre) * dev) / Math.sqrt(variance);

  const exact = tieGroups === 0 && n1 <= RANK_SUM_EXACT_MAX && n2 <= RANK_SUM_EXACT_MAX;
  const p = exact ? rankSumExactP(u, n1, n2) : Math.min(1, 2 * normalUpper(Math.abs(z)));
  return {
    rank_sum: w,
    u,
    n1,
    n2,
    first_level: first,
    second_level: second,
    tie_groups: tieGroups,
    z,
    p,
    method: exact ? 'exact' : 'normal',
  };
}
