/**
 * Wilcoxon's signed rank test on paired differences a - b.
 * source: F. Wilcoxon (1945), "Individual comparisons by ranking methods", Biometrics
 * Bulletin 1, 80-83.
 */
import { normalUpper } from '../distributions/index.ts';
import { StatsInputError, checkSameLength } from '../summary/groups.ts';
import { averageRanks } from './rank.ts';
import { signedRankExactP } from './exact.ts';
import { statsMsg } from '../../messages/stats.ts';

/** How a rank test's p-value was obtained. */
export type RankPMethod = 'exact' | 'normal';

/** Largest number of non-zero differences for which the exact distribution is used. */
export const SIGNED_RANK_EXACT_MAX = 50;

/** The result of {@link signedRank}. */
export interface SignedRankResult {
  /** V: the sum of the ranks of |a - b| over the pairs with a > b. */
  readonly statistic: number;
  /** Number of non-zero differences that were ranked. */
  readonly n: number;
  /** Number of pairs with a = b, dropped before ranking. */
  readonly zeros: number;
  /** Number of groups of tied |a - b| (each shares an average rank). */
  readonly tie_groups: number;
  /**
   * Normal score of V, with the tie correction of the variance and a continuity correction
   * of 1/2 towards the centre. Reported for both methods; the p-value follows `method`.
   */
  readonly z: number;
  /** Two-sided p-value. */
  readonly p: number;
  /**
   * 'exact' (the null distribution of V by counting, used when there are no ties and at most
   * {@link SIGNED_RANK_EXACT_MAX} non-zero differences) or 'normal' (the corrected normal
   * approximation, otherwise).
   */
  readonly method: RankPMethod;
}

/**
 * Wilcoxon signed rank test of a against b, pair by pair.
 *
 * Zero differences are dropped and counted (Wilcoxon's own rule), and the test is made on
 * the n that remain; the exact distribution is then the one for n, conditional on the number
 * of zeros. Differences are compared with a tolerance of 8 machine epsilons times the
 * largest |a| or |b|, so that differences equal in decimal but not in binary (0.7 - 1.9 and
 * 2.0 - 3.2) count as tied, and a difference within it of 0 counts as zero.
 *
 * @throws StatsInputError when the lengths differ or every difference is zero
 */
export function signedRank(a: Float64Array, b: Float64Array): SignedRankResult {
  checkSameLength(a, b);
  const len = a.length;
  let scale = 0;
  for (let i = 0; i < len; i++) {
    scale = Math.max(scale, Math.abs(a[i]!), Math.abs(b[i]!));
  }
  const tol = 8 * Number.EPSILON * scale;
  const abs = new Float64Array(len);
  const positive = new Uint8Array(len);
  let n = 0;
  for (let i = 0; i < len; i++) {
    const d = a[i]! - b[i]!;
    if (Math.abs(d) <= tol) continue;
    abs[n] = Math.abs(d);
    positive[n] = d > 0 ? 1 : 0;
    n++;
  }
  const zeros = len - n;
  if (n === 0) {
    throw new StatsInputError(statsMsg.allDifferencesZero(len));
  }
  const { ranks, tieTerm, tieGroups } = averageRanks(abs.subarray(0, n), tol);
  let v = 0;
  for (let i = 0; i < n; i++) if (positive[i] === 1) v += ranks[i]!;

  const centre = (n * (n + 1)) / 4;
  const variance = (n * (n + 1) * (2 * n + 1)) / 24 - tieTerm / 48;
  const dev = Math.max(0, Math.abs(v - centre) - 0.5);
  // Even with every |d| tied the variance is n (n + 1)^2 / 16 > 0, so z is always finite.
  const z = (Math.sign(v - centre) * dev) / Math.sqrt(variance);

  const exact = tieGroups === 0 && n <= SIGNED_RANK_EXACT_MAX;
  const p = exact ? signedRankExactP(v, n) : Math.min(1, 2 * normalUpper(Math.abs(z)));
  return {
    statistic: v,
    n,
    zeros,
    tie_groups: tieGroups,
    z,
    p,
    method: exact ? 'exact' : 'normal',
  };
}
