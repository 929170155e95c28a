/**
 * What every comparison starts from: one factor's means and their covariance from a fit,
 * the error mean square and its degrees of freedom.
 */
import { DesignError } from '../designs/errors.ts';
import { designMsg } from '../../messages/designs.ts';
import { diagonalCovariance, factorMeans } from '../designs/assemble.ts';
import { satterthwaite } from '../designs/strata.ts';
import type { DesignFit, FactorMeans, SplitParts } from '../designs/types.ts';

/** The means a comparison works on. */
export interface ComparisonBasis {
  means: FactorMeans;
  mse: number;
  df: number;
  /** Which error the comparison uses, in words, when it is not the fit's only one. */
  note: string | null;
}

/**
 * The means of `factor` (default: the fit's treatment factor), checking that the fit has an
 * error term. Means that carry their own error (a split plot's whole-plot means, treatment
 * means across sites) are judged against it. `at` (split plots only) takes the means of one
 * factor at one level of the other, with the standard error that kind of comparison needs.
 */
export function comparisonBasis(fit: DesignFit, factor?: string, at?: string): ComparisonBasis {
  const name = factor ?? fit.treatment;
  if (at !== undefined) {
    if (fit.split === undefined) throw new DesignError(designMsg.splitAtNeedsSplit());
    return splitSlice(fit.split, name, at, fit.level);
  }
  const means = fit.factor_means.find((m) => m.factor === name);
  if (means === undefined) throw new DesignError(designMsg.unknownFactor(name, fit.factor_means.map((m) => m.factor)));
  const mse = means.error?.mse ?? fit.mse;
  const df = means.error?.df ?? fit.df_error;
  if (!(df > 0) || !(mse >= 0)) throw new DesignError(designMsg.noErrorForComparison());
  // means judged against an error of their own (whole_error, treatment by site) that the
  // data leave at zero, to rounding beside the total: no standard error to speak of
  if (means.error !== undefined && !(mse * df > OWN_ERROR_RELATIVE * totalSumOfSquares(fit))) {
    throw new DesignError(designMsg.ownErrorZero(means.error.note));
  }
  return { means, mse, df, note: means.error?.note ?? null };
}

/**
 * An error sum of squares, relative to the total, below which it is rounding (the rule of
 * src/functions/exact.ts for a fit's own error; common practice, no source).
 */
const OWN_ERROR_RELATIVE = 1e-12;

function totalSumOfSquares(fit: DesignFit): number {
  const i = fit.table.source.indexOf('total');
  return i < 0 ? 0 : fit.table.ss[i]!;
}

/**
 * Cell means of a split plot along one factor at one level of the other. Differences of
 * subplot levels within one whole plot level need only the subplot error: variance 2 Eb / r.
 * Differences of whole-plot levels at one subplot level cross whole plots and carry both
 * errors: variance 2 (Ea + (b - 1) Eb) / (r b), on Satterthwaite's degrees of freedom.
 */
function splitSlice(s: SplitParts, factor: string, at: string, level: number): ComparisonBasis {
  const a = s.wholeLevels.length;
  const b = s.subLevels.length;
  let levels: string[];
  let shifted: Float64Array;
  let mse: number;
  let df: number;
  let note: string;
  if (factor === s.sub) {
    const i = s.wholeLevels.indexOf(at);
    if (i < 0) throw new DesignError(designMsg.unknownLevel(s.whole, at, s.wholeLevels));
    levels = [...s.subLevels];
    shifted = s.cellShifted.slice(i * b, i * b + b);
    mse = s.mseSub;
    df = s.dfSub;
    note = designMsg.splitSubAtWholeNote(s.whole, at);
  } else if (factor === s.whole) {
    const j = s.subLevels.indexOf(at);
    if (j < 0) throw new DesignError(designMsg.unknownLevel(s.sub, at, s.subLevels));
    levels = [...s.wholeLevels];
    shifted = Float64Array.from({ length: a }, (_, i) => s.cellShifted[i * b + j]!);
    mse = (s.mseWhole + (b - 1) * s.mseSub) / b;
    df = satterthwaite([s.mseWhole / b, ((b - 1) * s.mseSub) / b], [s.dfWhole, s.dfSub]);
    note = designMsg.splitWholeAtSubNote(s.sub, at);
  } else {
    throw new DesignError(designMsg.splitAtFactor(s.whole, s.sub));
  }
  if (!(df > 0) || !(mse >= 0)) throw new DesignError(designMsg.noErrorForComparison());
  const counts = new Float64Array(levels.length).fill(s.r);
  const means = factorMeans(factor, levels, counts, shifted, s.offset, diagonalCovariance(counts), mse, df, level);
  return { means, mse, df, note };
}

/** Position of `level` among the factor's levels. */
export function levelIndex(means: FactorMeans, level: string): number {
  const k = means.levels.indexOf(level);
  if (k < 0) throw new DesignError(designMsg.unknownLevel(means.factor, level, means.levels));
  return k;
}

/** Check a confidence level. */
export function checkLevel(level: number): void {
  if (!(level > 0 && level < 1)) throw new DesignError(designMsg.badLevel(level));
}

/** Covariance (units of sigma^2) of mean_i and mean_j, whatever the stored form. */
export function meansCovariance(means: FactorMeans, i: number, j: number): number {
  if (means.covariance_form === 'diagonal') return i === j ? means.covariance[i]! : 0;
  return means.covariance[i * means.levels.length + j]!;
}

/** Variance (units of sigma^2) of mean_i - mean_j. */
export function differenceVariance(means: FactorMeans, i: number, j: number): number {
  return meansCovariance(means, i, i) + meansCovariance(means, j, j) - 2 * meansCovariance(means, i, j);
}
