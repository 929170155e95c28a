/**
 * Turning sums of squares, means and residuals into the parts of a fit record: the
 * analysis-of-variance table, the means tables, studentized residuals.
 */
import { fUpper, tCritical } from '../distributions/index.ts';
import type { AnovaTable, FactorMeans, MeansTable } from './types.ts';

/** One model term's line before F and p are known. */
export interface TermLine {
  source: string;
  df: number;
  ss: number;
}

/**
 * The analysis-of-variance table: the terms, then "error", then "total". F and p are NaN
 * when there is no error term.
 */
export function anovaTable(terms: readonly TermLine[], sse: number, dfError: number, sst: number, dfTotal: number): AnovaTable {
  const mse = dfError > 0 ? sse / dfError : NaN;
  const table: AnovaTable = { source: [], df: [], ss: [], ms: [], f: [], p: [] };
  for (const t of terms) {
    const ms = t.df > 0 ? t.ss / t.df : NaN;
    const f = dfError > 0 && t.df > 0 ? ms / mse : NaN;
    table.source.push(t.source);
    table.df.push(t.df);
    table.ss.push(t.ss);
    table.ms.push(ms);
    table.f.push(f);
    table.p.push(f === f ? fUpper(f, t.df, dfError) : NaN);
  }
  table.source.push('error', 'total');
  table.df.push(dfError, dfTotal);
  table.ss.push(dfError > 0 ? sse : 0, sst);
  table.ms.push(mse, NaN);
  table.f.push(NaN, NaN);
  table.p.push(NaN, NaN);
  return table;
}

/**
 * Means with standard errors and intervals from their covariance (units of sigma^2): a
 * k x k matrix, or k variances from {@link diagonalCovariance} for independent means.
 * `shiftedMean` is on the scale of the shifted response; `offset` is added for display.
 */
export function factorMeans(
  factor: string,
  levels: readonly string[],
  counts: ArrayLike<number>,
  shiftedMean: Float64Array,
  offset: number,
  cov: MeansCovariance,
  mse: number,
  dfError: number,
  level: number,
): FactorMeans {
  const form = cov.form;
  const covariance = cov.values;
  const k = levels.length;
  const mean = addOffset(shiftedMean, offset);
  const t = dfError > 0 ? tCritical(level, dfError) : NaN;
  const table: MeansTable = { level: [], n: [], mean: [], se: [], low: [], high: [] };
  for (let i = 0; i < k; i++) {
    const se = Math.sqrt(mse * covariance[form === 'diagonal' ? i : i * k + i]!);
    const m = mean[i]!;
    table.level.push(levels[i] ?? String(i));
    table.n.push(counts[i] ?? 0);
    table.mean.push(m);
    table.se.push(se);
    table.low.push(m - t * se);
    table.high.push(m + t * se);
  }
  return { factor, levels: [...levels], mean, shifted_mean: shiftedMean, offset, covariance, covariance_form: form, table };
}

/**
 * Variances 1/n_i of independent means (the "diagonal" covariance form; balanced designs).
 */
export function diagonalCovariance(counts: ArrayLike<number>): MeansCovariance {
  const k = counts.length;
  const out = new Float64Array(k);
  for (let i = 0; i < k; i++) out[i] = 1 / (counts[i] ?? NaN);
  return { form: 'diagonal', values: out };
}

/** A full k x k covariance (least-squares means). */
export function fullCovariance(values: Float64Array): MeansCovariance {
  return { form: 'full', values };
}

/** Covariance of means in units of sigma^2, with its storage form. */
export interface MeansCovariance {
  form: 'full' | 'diagonal';
  values: Float64Array;
}

/** The fields of a fit that follow from its error term, shared by every design. */
export interface ErrorFields {
  mse: number;
  df_error: number;
  sd: number;
  grand_mean: number;
  r2: number;
  residuals: Float64Array;
  leverage: Float64Array;
  studentized_residuals: Float64Array;
  offset: number;
}

/**
 * Error mean square, its root, R-squared, the grand mean with the offset added back, and
 * the studentized residuals (computed here unless the design already has them).
 */
export function errorFields(e: {
  mse: number;
  dfError: number;
  sse: number;
  sst: number;
  /** Grand mean on the shifted scale. */
  grand: number;
  offset: number;
  residuals: Float64Array;
  leverage: Float64Array;
  studentized?: Float64Array;
}): ErrorFields {
  return {
    mse: e.mse,
    df_error: e.dfError,
    sd: Math.sqrt(e.mse),
    grand_mean: e.grand + e.offset,
    r2: e.sst > 0 ? 1 - e.sse / e.sst : NaN,
    residuals: e.residuals,
    leverage: e.leverage,
    studentized_residuals: e.studentized ?? studentize(e.residuals, e.leverage, e.mse),
    offset: e.offset,
  };
}

/** e_i / sqrt(mse (1 - h_i)); NaN where the leverage is 1 or there is no error term. */
export function studentize(residuals: Float64Array, leverage: Float64Array, mse: number): Float64Array {
  const n = residuals.length;
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const room = 1 - leverage[i]!;
    out[i] = room > 1e-10 && mse > 0 ? residuals[i]! / Math.sqrt(mse * room) : NaN;
  }
  return out;
}

/** Add the decimal offset back to every element (a new array, also when offset is 0). */
export function addOffset(x: Float64Array, offset: number): Float64Array {
  const out = new Float64Array(x.length);
  for (let i = 0; i < x.length; i++) out[i] = x[i]! + offset;
  return out;
}

/** Plain-words list of missing (row-level, column-level) cells, capped at `limit` entries. */
export function missingCellNotes(
  counts: Int32Array,
  rowLevels: readonly string[],
  colLevels: readonly string[],
  describe: (row: string, col: string) => string,
  more: (k: number) => string,
  limit = 10,
): string[] {
  const notes: string[] = [];
  let missing = 0;
  const R = rowLevels.length;
  for (let c = 0; c < colLevels.length; c++) {
    for (let r = 0; r < R; r++) {
      if (counts[r + R * c] === 0) {
        missing++;
        if (missing <= limit) notes.push(describe(rowLevels[r] ?? String(r), colLevels[c] ?? String(c)));
      }
    }
  }
  if (missing > limit) notes.push(more(missing - limit));
  return notes;
}
