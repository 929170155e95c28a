/**
 * Comparisons after a design fit: one difference, all pairs (Tukey, Bonferroni, least
 * significant difference), and linear contrasts, all from the fit's error mean square and
 * the covariance of its means.
 */
export { difference } from './difference.ts';
export type { DifferenceResult } from './difference.ts';
export { pairwise, PAIRWISE_METHODS } from './pairwise.ts';
export type { PairwiseMethod, PairwiseResult, PairwiseTable } from './pairwise.ts';
export { contrast } from './contrast.ts';
export type { ContrastResult } from './contrast.ts';
export { comparisonBasis } from './basis.ts';
export type { ComparisonBasis } from './basis.ts';
