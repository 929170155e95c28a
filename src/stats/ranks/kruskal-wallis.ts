/**
 * Kruskal-Wallis one-way analysis of variance by ranks, with the correction for ties.
 * source: W. H. Kruskal, W. A. Wallis (1952), "Use of ranks in one-criterion variance
 * analysis", Journal of the American Statistical Association 47, 583-621.
 */
import { chi2Upper } from '../distributions/index.ts';
import { type GroupCodes, StatsInputError, levelCounts } from '../summary/groups.ts';
import { averageRanks } from './rank.ts';
import { sq } from '../math/portable.ts';
import { statsMsg } from '../../messages/stats.ts';

/** The result of {@link kruskalWallis}. */
export interface KruskalWallisResult {
  /** H, divided by the tie correction 1 - sum(t^3 - t) / (N^3 - N). */
  readonly statistic: number;
  /** Degrees of freedom: the number of levels with data, minus 1. */
  readonly df: number;
  /** Upper-tail chi-square p-value of the statistic on df (the large-sample approximation). */
  readonly p: number;
  /** Total number of observations. */
  readonly n: number;
  /** Tie correction factor (1 without ties). */
  readonly tie_correction: number;
  /** Level names in `groups` order. */
  readonly level: readonly string[];
  /** Observations per level. */
  readonly level_n: Int32Array;
  /** Mean rank per level (NaN for a level with no observations). */
  readonly mean_rank: Float64Array;
}

/**
 * Kruskal-Wallis test of y across the levels of `groups`. Levels without observations are
 * left out of the degrees of freedom.
 *
 * @throws StatsInputError when fewer than two levels have data, or all values are equal
 */
export function kruskalWallis(y: Float64Array, groups: GroupCodes): KruskalWallisResult {
  const counts = levelCounts(y.length, groups);
  const k = counts.length;
  let used = 0;
  for (let j = 0; j < k; j++) if (counts[j]! > 0) used++;
  if (used < 2) {
    throw new StatsInputError(statsMsg.kruskalGroups(used));
  }
  const n = y.length;
  const { ranks, tieTerm } = averageRanks(y);
  const rankTotal = new Float64Array(k);
  const codes = groups.codes;
  for (let i = 0; i < n; i++) rankTotal[codes[i]!]! += ranks[i]!;
  const meanRank = new Float64Array(k);
  const centre = (n + 1) / 2;
  // Centred form sum n_j (Rbar_j - (N+1)/2)^2: no cancellation between two large terms.
  let between = 0;
  for (let j = 0; j < k; j++) {
    const nj = counts[j]!;
    meanRank[j] = nj > 0 ? rankTotal[j]! / nj : NaN;
    if (nj > 0) between += nj * sq(meanRank[j]! - centre);
  }
  const correction = 1 - tieTerm / (n * n * n - n);
  if (!(correction > 0)) {
    throw new StatsInputError(statsMsg.allTied());
  }
  const statistic = ((12 / (n * (n + 1))) * between) / correction;
  const df = used - 1;
  return {
    statistic,
    df,
    p: chi2Upper(statistic, df),
    n,
    tie_correction: correction,
    level: groups.levels.slice(),
    level_n: counts,
    mean_rank: meanRank,
  };
}
