/**
 * Friedman's test for a randomized complete block layout: treatments ranked within each
 * block, with the correction for ties within blocks.
 * source: M. Friedman (1937), "The use of ranks to avoid the assumption of normality
 * implicit in the analysis of variance", Journal of the American Statistical Association
 * 32, 675-701; the tie correction as given in W. J. Conover (1999), Practical Nonparametric
 * Statistics, 3rd ed.
 */
import { chi2Upper } from '../distributions/index.ts';
import { type GroupCodes, StatsInputError, levelCounts } from '../summary/groups.ts';
import { averageRanks } from './rank.ts';
import { sq } from '../math/portable.ts';
import { statsMsg } from '../../messages/stats.ts';

/** The result of {@link friedman}. */
export interface FriedmanResult {
  /**
   * The chi-square form of the statistic, 12 / (b k (k + 1)) sum_j (R_j - b (k + 1) / 2)^2,
   * divided by the tie correction 1 - sum(t^3 - t) / (b k (k^2 - 1)).
   */
  readonly statistic: number;
  /** Degrees of freedom, k - 1. */
  readonly df: number;
  /** Upper-tail chi-square p-value (the large-sample approximation). */
  readonly p: number;
  /** Number of treatments k (levels with data). */
  readonly treatments: number;
  /** Number of blocks b (levels with data). */
  readonly blocks: number;
  /** Tie correction factor (1 without ties). */
  readonly tie_correction: number;
  /** Treatment names with data, in `treatment` order. */
  readonly level: readonly string[];
  /** Rank sum R_j of each of those treatments over the blocks. */
  readonly rank_sum: Float64Array;
}

/**
 * Friedman's test of y for `treatment` within `block`. Every block must hold exactly one
 * value of every treatment (levels that have no data at all are left out).
 *
 * @throws StatsInputError when the layout is not complete with one value per cell, when
 *   there are fewer than two treatments or blocks, or when every block is all ties
 */
export function friedman(
  y: Float64Array,
  treatment: GroupCodes,
  block: GroupCodes,
): FriedmanResult {
  const n = y.length;
  const tCounts = levelCounts(n, treatment, 'treatment');
  const bCounts = levelCounts(n, block, 'block');
  const tIndex = compact(tCounts);
  const bIndex = compact(bCounts);
  const k = tIndex.used;
  const b = bIndex.used;
  if (k < 2) throw new StatsInputError(statsMsg.friedmanTreatments(k));
  if (b < 2) throw new StatsInputError(statsMsg.friedmanBlocks(b));

  const cell = new Int32Array(b * k).fill(-1);
  for (let i = 0; i < n; i++) {
    const t = tIndex.map[treatment.codes[i]!]!;
    const bl = bIndex.map[block.codes[i]!]!;
    const at = bl * k + t;
    if (cell[at] !== -1) {
      throw new StatsInputError(statsMsg.friedmanTwice(block.levels[block.codes[i]!]!, treatment.levels[treatment.codes[i]!]!));
    }
    cell[at] = i;
  }
  if (n !== b * k) {
    const at = cell.indexOf(-1);
    const bl = Math.floor(at / k);
    const t = at % k;
    throw new StatsInputError(
      statsMsg.friedmanMissing(block.levels[bIndex.levels[bl]!]!, treatment.levels[tIndex.levels[t]!]!),
    );
  }

  const rankSum = new Float64Array(k);
  const row = new Float64Array(k);
  let tieTerm = 0;
  for (let bl = 0; bl < b; bl++) {
    for (let t = 0; t < k; t++) row[t] = y[cell[bl * k + t]!]!;
    const r = averageRanks(row);
    tieTerm += r.tieTerm;
    for (let t = 0; t < k; t++) rankSum[t]! += r.ranks[t]!;
  }
  const centre = (b * (k + 1)) / 2;
  let spread = 0;
  for (let t = 0; t < k; t++) spread += sq(rankSum[t]! - centre);
  const correction = 1 - tieTerm / (b * k * (k * k - 1));
  if (!(correction > 0)) {
    throw new StatsInputError(statsMsg.blocksAllTied());
  }
  const statistic = ((12 / (b * k * (k + 1))) * spread) / correction;
  const df = k - 1;
  return {
    statistic,
    df,
    p: chi2Upper(statistic, df),
    treatments: k,
    blocks: b,
    tie_correction: correction,
    level: Array.from(tIndex.levels, (c) => treatment.levels[c]!),
    rank_sum: rankSum,
  };
}

/** Numbers the levels that have data 0 .. used - 1, keeping their order. */
function compact(counts: Int32Array): { map: Int32Array; levels: Int32Array; used: number } {
  const map = new Int32Array(counts.length).fill(-1);
  const levels: number[] = [];
  for (let j = 0; j < counts.length; j++) {
    if (counts[j]! > 0) {
      map[j] = levels.length;
      levels.push(j);
    }
  }
  return { map, levels: Int32Array.from(levels), used: levels.length };
}
