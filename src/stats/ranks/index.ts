/** Rank-based tests: Friedman, Kruskal-Wallis, Wilcoxon signed rank and rank sum. */
export { friedman, type FriedmanResult } from './friedman.ts';
export { kruskalWallis, type KruskalWallisResult } from './kruskal-wallis.ts';
export {
  signedRank,
  type SignedRankResult,
  type RankPMethod,
  SIGNED_RANK_EXACT_MAX,
} from './signed-rank.ts';
export { rankSum, type RankSumResult, RANK_SUM_EXACT_MAX } from './rank-sum.ts';
export { averageRanks, sortOrder, type Ranking } from './rank.ts';
export {
  signedRankCounts,
  signedRankExactP,
  mannWhitneyProbabilities,
  rankSumExactP,
} from './exact.ts';
