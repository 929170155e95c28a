/**
 * Designed-experiment analyses: one-way, randomized complete blocks, Latin squares and
 * factorials. Each takes the (shifted) response as a Float64Array and factors as integer
 * codes with level names, and returns a {@link DesignFit} whose fields are the fit record's
 * fields (docs/language.md section 8). Errors in the design are thrown as {@link DesignError}.
 *
 * Wiring sketch for the built-ins registry:
 * ```ts
 * const { offset, shifted } = shiftDecimals(texts);        // src/stats/decimal
 * const fit = blocked(shifted, treatment, block, { offset, level, dropped });
 * ```
 */
export { oneWay } from './oneway.ts';
export { blocked, relativeEfficiency } from './blocked.ts';
export { latinSquare } from './latin.ts';
export { factorial, allTerms } from './factorial.ts';
export { lenthMargins } from './lenth.ts';
export { splitPlot } from './split.ts';
export { withCovariate, type Covariate } from './covariate.ts';
export { acrossSites } from './sites.ts';
export { satterthwaite, bartlett, type BartlettTest } from './strata.ts';
export { DesignError } from './errors.ts';
export type {
  AnovaTable,
  CovariateParts,
  ErrorTerm,
  SitesParts,
  SplitParts,
  DesignFit,
  DesignKind,
  DesignOptions,
  EffectsTable,
  Factor,
  FactorMeans,
  LenthMargins,
  MeansTable,
  Nonadditivity,
} from './types.ts';
export { notSplitPlotSuspicion, splitPlotSuspicion, type NotSplitSuspicion, type SplitSuspicion } from './suspect.ts';
