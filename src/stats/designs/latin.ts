/**
 * Latin squares: t treatments in t rows and t columns, each treatment once in every row and
 * every column. Complete squares use closed-form sums (treatment, row and column means,
 * residuals y - m_t - m_r - m_c + 2m); squares with missing plots are fitted by least squares
 * with each of the three factors adjusted for the other two.
 */
import { leastSquaresMeans } from '../linear/fit.ts';
import { centredSumOfSquares, groupMeans, mean } from '../linear/sums.ts';
import { addOffset, anovaTable, diagonalCovariance, factorMeans, fullCovariance, missingCellNotes, errorFields } from './assemble.ts';
import { checkFactor, checkResponse, crossCounts, requireAllLevels, resolveOptions } from './check.ts';
import { DesignError } from './errors.ts';
import { fitOrExplain } from './least.ts';
import { designMsg } from '../../messages/designs.ts';
import type { DesignFit, DesignOptions, Factor, FactorMeans } from './types.ts';

/** Check the Latin property: one plot per cell, each treatment at most once per line. */
function checkLatin(treatment: Factor, row: Factor, column: Factor, t: number): Int32Array {
  const cells = crossCounts(row.codes, t, column.codes, t);
  for (let c = 0; c < t; c++) {
    for (let r = 0; r < t; r++) {
      if (cells[r + t * c]! > 1) throw new DesignError(designMsg.twoPlotsInCell(row.levels[r] ?? '', column.levels[c] ?? ''));
    }
  }
  const inRow = crossCounts(treatment.codes, t, row.codes, t);
  const inCol = crossCounts(treatment.codes, t, column.codes, t);
  for (let line = 0; line < t; line++) {
    for (let k = 0; k < t; k++) {
      if (inRow[k + t * line]! > 1) throw new DesignError(designMsg.repeatedInLine(treatment.levels[k] ?? '', 'row', row.levels[line] ?? ''));
      if (inCol[k + t * line]! > 1) throw new DesignError(designMsg.repeatedInLine(treatment.levels[k] ?? '', 'column', column.levels[line] ?? ''));
    }
  }
  return cells;
}

/**
 * Analysis of a Latin square design.
 *
 * @param y - response, already shifted by `options.offset` (complete cases only).
 * @param treatment - treatment factor; `row` and `column` - the two blocking factors. All three
 *   must have the same number of levels, each with data.
 * @param options - offset, confidence level (default 0.95), rows dropped upstream.
 * @returns a fit record; table rows are the treatment, row and column factors (named after
 *   them), then error and total. A 2 x 2 square has no error term (F and p are NaN).
 * @throws DesignError when the square is not square, a cell holds two plots, a treatment
 *   repeats in a row or column, or a level has no data.
 */
export function latinSquare(y: Float64Array, treatment: Factor, row: Factor, column: Factor, options?: DesignOptions): DesignFit {
  const opts = resolveOptions(options);
  checkResponse(y);
  const n = y.length;
  const tc = checkFactor(treatment, n, 'treatment');
  const rc = checkFactor(row, n, 'row');
  const cc = checkFactor(column, n, 'column');
  const t = tc.length;
  if (rc.length !== t || cc.length !== t) throw new DesignError(designMsg.notSquare(t, rc.length, cc.length));
  requireAllLevels(treatment, tc, 'treatment');
  requireAllLevels(row, rc, 'row');
  requireAllLevels(column, cc, 'column');
  const cells = checkLatin(treatment, row, column, t);
  const notes: string[] = [];
  if (opts.dropped > 0) notes.push(designMsg.dropped(opts.dropped));
  const complete = n === t * t;
  const terms = [treatment, row, column];

  let ss: number[];
  let sse: number;
  let sst: number;
  let dfError: number;
  let residuals: Float64Array;
  let fitted: Float64Array;
  let leverage: Float64Array;
  let grand: number;
  let margins: FactorMeans[];
  let mse: number;
  if (complete) {
    grand = mean(y);
    const means = terms.map((f) => groupMeans(y, f.codes, t).mean);
    const effects = means.map((m) => m.map((v) => v - grand));
    ss = effects.map((e) => {
      let s = 0;
      for (const v of e) s += v * v;
      return t * s;
    });
    residuals = new Float64Array(n);
    fitted = new Float64Array(n);
    const [et, er, ec] = effects as [Float64Array, Float64Array, Float64Array];
    let s1 = 0;
    let s2 = 0;
    for (let i = 0; i < n; i++) {
      const e = et[treatment.codes[i]!]! + er[row.codes[i]!]! + ec[column.codes[i]!]!;
      const res = y[i]! - grand - e;
      residuals[i] = res;
      fitted[i] = grand + e + opts.offset;
      s1 += res;
      s2 += res * res;
    }
    sse = s2 - (s1 * s1) / n;
    sst = centredSumOfSquares(y, grand);
    dfError = (t - 1) * (t - 2);
    mse = dfError > 0 ? sse / dfError : NaN;
    leverage = new Float64Array(n).fill((3 * t - 2) / (t * t));
    const counts = new Float64Array(t).fill(t);
    margins = terms.map((f, k) =>
      factorMeans(f.name, f.levels, counts, means[k]!, opts.offset, diagonalCovariance(counts), mse, dfError, opts.level),
    );
    if (dfError === 0) notes.push(designMsg.smallLatin());
  } else {
    notes.push(
      ...missingCellNotes(cells, row.levels, column.levels, (r, c) => `row ${r}, column ${c} has no plot`, designMsg.moreMissing),
      designMsg.adjustedNote(),
    );
    const lin = fitOrExplain({ y, factors: terms, terms: [[0], [1], [2]] });
    dfError = lin.dfError;
    if (dfError <= 0) throw new DesignError(designMsg.noErrorDf());
    sse = lin.sse;
    sst = lin.sst;
    mse = sse / dfError;
    ss = Array.from(lin.termSS);
    residuals = lin.residuals;
    fitted = addOffset(lin.fitted, opts.offset);
    leverage = lin.leverage;
    grand = lin.mean;
    const countsOf = [tc, rc, cc];
    margins = terms.map((f, k) => {
      const ls = leastSquaresMeans(lin, k);
      return factorMeans(f.name, f.levels, countsOf[k]!, ls.mean, opts.offset, fullCovariance(ls.covariance), mse, dfError, opts.level);
    });
  }
  const table = anovaTable(
    terms.map((f, k) => ({ source: f.name, df: t - 1, ss: ss[k]! })),
    sse,
    dfError,
    sst,
    n - 1,
  );
  const first = margins[0]!;
  return {
    design: 'Latin square',
    kind: 'latin_square',
    factors: terms.map((f) => f.name),
    treatment: treatment.name,
    n,
    level: opts.level,
    table,
    ss_method: complete
      ? 'closed form from treatment, row and column means (complete square, so the sums are orthogonal)'
      : 'least squares: each factor adjusted for the other two',
    means: first.table,
    factor_means: margins,
    ...errorFields({ mse, dfError, sse, sst, grand, offset: opts.offset, residuals, leverage }),
    fitted,
    balanced: complete,
    notes,
  };
}
