/**
 * Least squares for factor models on typed arrays: exact cross products from level counts,
 * a small Cholesky solve with rank detection, residuals formed directly (see fit.ts).
 */
export { fitFactorModel, leastSquaresMeans, LinearModelError } from './fit.ts';
export type { FactorModelSpec, LinearFit, AliasedTerm, AbsorbedPart, LeastSquaresMeans } from './fit.ts';
export type { FactorColumn, ModelLayout, TermLayout } from './layout.ts';
export { buildLayout } from './layout.ts';
export { choleskyFactor, choleskySolve, choleskyInverse, ALIAS_TOLERANCE } from './cholesky.ts';
export type { CholeskyFactor } from './cholesky.ts';
export { mean, centredSumOfSquares, groupMeans } from './sums.ts';
export { denseDesign, householderLeastSquares } from './qr.ts';
export type { DenseDesign, HouseholderResult } from './qr.ts';
