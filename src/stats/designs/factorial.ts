/**
 * Factorial experiments: two or more crossed factors with every interaction.
 *
 * Equal numbers of observations in every cell: closed form. Each term's effects are the cell
 * means centred at the grand mean, averaged over the factors outside the term and centred
 * along each factor inside it; its sum of squares is (observations per level combination of
 * the term) times the sum of the squared effects. O(n + cells * terms) time.
 *
 * Unequal numbers (no cell empty): least squares with sum-to-zero coding, each term's sum of
 * squares adjusted for every other term, interactions included. We chose this adjustment
 * because, with that coding, the test of a main effect is the test that its least-squares
 * means (the equally weighted averages over the other factors' levels, which the means table
 * reports) are equal, whatever the cell counts; sequential sums would depend on the order of
 * the factors, and sums that ignore higher interactions test weighted hypotheses that change
 * with the counts. An empty cell leaves the highest interaction undetermined and is an error.
 */
import { leastSquaresMeans } from '../linear/fit.ts';
import { centredSumOfSquares, groupMeans, mean } from '../linear/sums.ts';
import { addOffset, anovaTable, diagonalCovariance, factorMeans, fullCovariance, errorFields } from './assemble.ts';
import { checkFactor, checkResponse, commonCount, requireAllLevels, resolveOptions } from './check.ts';
import { DesignError } from './errors.ts';
import { fitOrExplain } from './least.ts';
import { lenthMargins } from './lenth.ts';
import { designMsg } from '../../messages/designs.ts';
import type { DesignFit, DesignOptions, EffectsTable, Factor, FactorMeans, LenthMargins } from './types.ts';

/** All non-empty subsets of 0..k-1, by size, then in lexicographic order. */
export function allTerms(k: number): number[][] {
  const out: number[][] = [];
  const extend = (prefix: number[], start: number, size: number): void => {
    if (prefix.length === size) {
      out.push([...prefix]);
      return;
    }
    for (let f = start; f < k; f++) {
      prefix.push(f);
      extend(prefix, f + 1, size);
      prefix.pop();
    }
  };
  for (let size = 1; size <= k; size++) extend([], 0, size);
  return out;
}

/** Cell index of every observation (mixed radix, first factor fastest). */
function cellCodes(factors: readonly Factor[], n: number): { codes: Int32Array; cells: number } {
  let cells = 1;
  for (const f of factors) cells *= f.levels.length;
  if (cells > 268_435_456) throw new DesignError(designMsg.tooManyCells(cells));
  const codes = new Int32Array(n);
  let stride = 1;
  for (const f of factors) {
    for (let i = 0; i < n; i++) codes[i] = codes[i]! + f.codes[i]! * stride;
    stride *= f.levels.length;
  }
  return { codes, cells };
}

/** Describe a cell index as "a = x, b = y". */
function describeCell(factors: readonly Factor[], cell: number): string {
  const parts: string[] = [];
  let rest = cell;
  for (const f of factors) {
    const L = f.levels.length;
    parts.push(`${f.name} = ${f.levels[rest % L] ?? ''}`);
    rest = Math.floor(rest / L);
  }
  return parts.join(', ');
}

/**
 * Effects of `term` from centred cell means `d` (all cells equally weighted): average over
 * the factors outside the term, then centre along each factor inside it. Returned in the
 * term's own mixed radix (its first factor fastest).
 */
function termEffects(d: Float64Array, shape: readonly number[], term: readonly number[]): Float64Array {
  const dims = term.map((f) => shape[f]!);
  const size = dims.reduce((a, b) => a * b, 1);
  const out = new Float64Array(size);
  const strides: number[] = [];
  let s = 1;
  for (const L of shape) {
    strides.push(s);
    s *= L;
  }
  const cells = d.length;
  for (let c = 0; c < cells; c++) {
    let index = 0;
    let mult = 1;
    for (let a = 0; a < term.length; a++) {
      const f = term[a]!;
      index += (Math.floor(c / strides[f]!) % shape[f]!) * mult;
      mult *= dims[a]!;
    }
    out[index] = out[index]! + d[c]!;
  }
  const per = cells / size;
  for (let i = 0; i < size; i++) out[i] = out[i]! / per;
  // Centre along each axis of the term.
  let inner = 1;
  for (let a = 0; a < dims.length; a++) {
    const L = dims[a]!;
    const outer = size / (inner * L);
    for (let o = 0; o < outer; o++) {
      for (let k = 0; k < inner; k++) {
        let m = 0;
        for (let j = 0; j < L; j++) m += out[(o * L + j) * inner + k]!;
        m /= L;
        for (let j = 0; j < L; j++) out[(o * L + j) * inner + k] = out[(o * L + j) * inner + k]! - m;
      }
    }
    inner *= L;
  }
  return out;
}

/**
 * Analysis of a factorial experiment with all interactions.
 *
 * @param y - response, already shifted by `options.offset` (complete cases only).
 * @param factors - two or more factors; every combination of their levels must have data.
 * @param options - offset, confidence level (default 0.95), rows dropped upstream.
 * @returns a fit record. Table rows: main effects in the order given, then interactions by
 *   order ("a:b", "a:c", "b:c", "a:b:c"), error, total. `means` describes the first factor;
 *   `factor_means` every factor. When every factor has two levels, `effects` holds each
 *   term's effect (mean at the "+" side minus mean at the "-" side, "+" being each factor's
 *   second level); when in addition every cell has one observation, no error term exists
 *   and `lenth` gives Lenth's margins instead of F tests.
 * @throws DesignError for fewer than two factors, a factor level or a cell without data.
 */
export function factorial(y: Float64Array, factors: readonly Factor[], options?: DesignOptions): DesignFit {
  const opts = resolveOptions(options);
  checkResponse(y);
  const n = y.length;
  const k = factors.length;
  if (k < 2) throw new DesignError(designMsg.factorialNeedsTwo(k));
  const levelCounts = factors.map((f) => {
    const c = checkFactor(f, n, 'factor');
    requireAllLevels(f, c, 'factor', `factor "${f.name}": level`);
    return c;
  });
  const shape = factors.map((f) => f.levels.length);
  const terms = allTerms(k);
  const termNames = terms.map((t) => t.map((f) => factors[f]!.name).join(':'));
  const top = termNames[termNames.length - 1]!;
  const cellsTotal = shape.reduce((a, b) => a * b, 1);
  if (cellsTotal > n) throw new DesignError(designMsg.moreCellsThanData(cellsTotal, n, top));
  const { codes: cellOf, cells } = cellCodes(factors, n);
  const cellCount = new Int32Array(cells);
  for (let i = 0; i < n; i++) cellCount[cellOf[i]!]! += 1;
  for (let c = 0; c < cells; c++) {
    if (cellCount[c] === 0) throw new DesignError(designMsg.emptyCell(describeCell(factors, c), top));
  }
  const r = commonCount(cellCount);
  const twoLevel = shape.every((L) => L === 2);
  const notes: string[] = [];
  if (opts.dropped > 0) notes.push(designMsg.dropped(opts.dropped));

  let termSS: number[];
  let sse: number;
  let sst: number;
  let dfError: number;
  let residuals: Float64Array;
  let fitted: Float64Array;
  let leverage: Float64Array;
  let grand: number;
  let mse: number;
  let margins: FactorMeans[];
  let effectAtPlus: number[] = [];
  const termDf = terms.map((t) => t.reduce((a, f) => a * (shape[f]! - 1), 1));

  if (r >= 1) {
    grand = mean(y);
    const cm = groupMeans(y, cellOf, cells).mean;
    const d = new Float64Array(cells);
    for (let c = 0; c < cells; c++) d[c] = cm[c]! - grand;
    const effects = terms.map((t) => termEffects(d, shape, t));
    termSS = effects.map((e) => {
      let s = 0;
      for (const v of e) s += v * v;
      return (n / e.length) * s;
    });
    if (twoLevel) effectAtPlus = effects.map((e) => 2 * e[e.length - 1]!);
    residuals = new Float64Array(n);
    fitted = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const m = cm[cellOf[i]!]!;
      residuals[i] = y[i]! - m;
      fitted[i] = m + opts.offset;
    }
    sse = r > 1 ? centredSumOfSquares(residuals, 0) : 0;
    sst = centredSumOfSquares(y, grand);
    dfError = n - cells;
    mse = dfError > 0 ? sse / dfError : NaN;
    leverage = new Float64Array(n).fill(1 / r);
    margins = factors.map((f, j) => {
      const m = groupMeans(y, f.codes, shape[j]!).mean;
      const counts = levelCounts[j]!;
      return factorMeans(f.name, f.levels, counts, m, opts.offset, diagonalCovariance(counts), mse, dfError, opts.level);
    });
  } else {
    notes.push(designMsg.unequalCells('cells'), designMsg.adjustedNote());
    const lin = fitOrExplain({ y, factors, terms });
    dfError = lin.dfError;
    sse = lin.sse;
    sst = lin.sst;
    mse = dfError > 0 ? sse / dfError : NaN;
    termSS = Array.from(lin.termSS);
    residuals = lin.residuals;
    fitted = addOffset(lin.fitted, opts.offset);
    leverage = lin.leverage;
    grand = lin.mean;
    if (twoLevel) {
      effectAtPlus = lin.layout.terms.map((t) => 2 * lin.effects[t.indicatorStart + t.indicatorSize - 1]!);
    }
    margins = factors.map((f, j) => {
      const ls = leastSquaresMeans(lin, j);
      return factorMeans(f.name, f.levels, levelCounts[j]!, ls.mean, opts.offset, fullCovariance(ls.covariance), mse, dfError, opts.level);
    });
  }

  const table = anovaTable(
    terms.map((_, j) => ({ source: termNames[j]!, df: termDf[j]!, ss: termSS[j]! })),
    sse,
    dfError,
    sst,
    n - 1,
  );
  let effects: EffectsTable | undefined;
  let lenth: LenthMargins | undefined;
  if (twoLevel) {
    effects = { term: [...termNames], estimate: effectAtPlus };
    notes.push(designMsg.twoLevelSigns(factors.map((f) => `${f.name}: ${f.levels[0]} then ${f.levels[1]}`).join('; ')));
  }
  if (dfError === 0) {
    notes.push(designMsg.noErrorTerm());
    if (twoLevel && effects !== undefined) {
      lenth = lenthMargins(effects.estimate, opts.level);
      notes.push(designMsg.lenthOffered());
    }
  }
  const first = margins[0]!;
  const fit: DesignFit = {
    design: `${shape.join(' x ')} factorial`,
    kind: 'factorial',
    factors: factors.map((f) => f.name),
    treatment: factors[0]!.name,
    n,
    level: opts.level,
    table,
    ss_method:
      r >= 1
        ? 'closed form from cell means (equal numbers in every cell, so the sums are orthogonal)'
        : 'least squares with sum-to-zero coding: each term adjusted for every other term, interactions included',
    means: first.table,
    factor_means: margins,
    ...errorFields({ mse, dfError, sse, sst, grand, offset: opts.offset, residuals, leverage }),
    fitted,
    balanced: r >= 1,
    notes,
  };
  if (effects !== undefined) fit.effects = effects;
  if (lenth !== undefined) fit.lenth = lenth;
  return fit;
}
