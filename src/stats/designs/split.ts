/**
 * Split plots: a whole-plot factor applied to whole plots within blocks, a subplot factor
 * randomized to the subplots of each whole plot. Two error strata:
 *
 * - between whole plots: blocks, the whole-plot factor, and whole_error (blocks by whole
 *   plots), whose mean square Ea estimates sigma^2 + b sigma_w^2;
 * - within whole plots: the subplot factor, the interaction, and error, whose mean square Eb
 *   estimates sigma^2.
 *
 * This version needs complete whole plots: every whole plot (a block and a whole-plot level)
 * holds every subplot level exactly once. We chose that over a least-squares fit because with
 * a subplot missing the two strata are no longer orthogonal and the F tests and standard errors
 * below stop being exact; a missing subplot is a plain error that names it. Closed form from
 * cell means, O(n) time.
 */
import { fUpper, tCritical } from '../distributions/index.ts';
import { centredSumOfSquares, groupMeans, mean } from '../linear/sums.ts';
import { addOffset, diagonalCovariance, errorFields, factorMeans } from './assemble.ts';
import { checkFactor, checkResponse, resolveOptions } from './check.ts';
import { DesignError } from './errors.ts';
import { designMsg } from '../../messages/designs.ts';
import { satterthwaite } from './strata.ts';
import type { AnovaTable, DesignFit, DesignOptions, Factor, SplitParts } from './types.ts';
import { sq } from '../math/portable.ts';

const DESIGN = 'split plot in randomized complete blocks';

/** One row of the table, with the error it is tested against (or none). */
interface StratumRow {
  source: string;
  df: number;
  ss: number;
  against: 'whole' | 'sub' | null;
}

/**
 * Analysis of a split-plot experiment with whole plots in randomized complete blocks.
 *
 * @param y - response, already shifted by `options.offset` (complete cases only).
 * @param whole - the whole-plot factor (hard to change; one level per whole plot).
 * @param sub - the subplot factor, randomized within each whole plot.
 * @param block - the blocks (replicates); a whole plot is a block and a whole-plot level.
 * @returns a fit record. Table rows: block, whole, whole_error, sub, whole:sub, error, total.
 *   The whole-plot factor is tested against whole_error, the rest (blocks included) against error.
 *   `factor_means` holds the whole-plot means (judged against whole_error), the subplot means,
 *   and `split` the cell means and both error terms for the comparisons.
 * @throws DesignError when a whole plot lacks a subplot level or holds one twice, a factor has
 *   too few levels, or no degrees of freedom are left for an error.
 */
export function splitPlot(y: Float64Array, whole: Factor, sub: Factor, block: Factor, options?: DesignOptions): DesignFit {
  const opts = resolveOptions(options);
  checkResponse(y);
  const n = y.length;
  const wc = checkFactor(whole, n, 'whole-plot factor');
  const sc = checkFactor(sub, n, 'subplot factor');
  const bc = checkFactor(block, n, 'block');
  const a = wc.length;
  const b = sc.length;
  const r = bc.length;
  if (a < 1 || wc.some((c) => c === 0)) throw new DesignError(designMsg.levelWithoutData('whole-plot level', firstEmpty(whole, wc)));
  if (sc.some((c) => c === 0)) throw new DesignError(designMsg.levelWithoutData('subplot level', firstEmpty(sub, sc)));
  if (bc.some((c) => c === 0)) throw new DesignError(designMsg.levelWithoutData('block', firstEmpty(block, bc)));
  if (b < 2) throw new DesignError(designMsg.tooFewLevels('subplot factor', sub.name, b));
  if (r < 2) throw new DesignError(designMsg.tooFewLevels('block', block.name, r));
  if (a * b * r > 268_435_456) throw new DesignError(designMsg.tooManyCells(a * b * r));

  // every whole plot (block k, whole level i) holds every subplot level exactly once
  const cellOf = new Int32Array(n); // (k, i, j) with j fastest
  const count = new Int32Array(a * b * r);
  for (let t = 0; t < n; t++) {
    const c = (block.codes[t]! * a + whole.codes[t]!) * b + sub.codes[t]!;
    cellOf[t] = c;
    count[c]!++;
  }
  for (let cell = 0; cell < count.length; cell++) {
    const c = count[cell]!;
    if (c === 1) continue;
    const j = cell % b;
    const i = Math.floor(cell / b) % a;
    const k = Math.floor(cell / (a * b));
    const where = [block.levels[k] ?? '', whole.levels[i] ?? '', sub.levels[j] ?? ''] as const;
    if (c === 0) throw new DesignError(designMsg.splitMissing(block.name, whole.name, sub.name, ...where));
    throw new DesignError(designMsg.splitTwice(block.name, whole.name, sub.name, ...where, c));
  }

  const grand = mean(y);
  const wholePlotOf = new Int32Array(n);
  const cellAB = new Int32Array(n);
  for (let t = 0; t < n; t++) {
    wholePlotOf[t] = block.codes[t]! * a + whole.codes[t]!;
    cellAB[t] = whole.codes[t]! * b + sub.codes[t]!;
  }
  const mA = groupMeans(y, whole.codes, a).mean;
  const mB = groupMeans(y, sub.codes, b).mean;
  const mR = groupMeans(y, block.codes, r).mean;
  const mRA = groupMeans(y, wholePlotOf, r * a).mean;
  const mAB = groupMeans(y, cellAB, a * b).mean;

  let ssR = 0;
  for (let k = 0; k < r; k++) ssR += sq(mR[k]! - grand);
  ssR *= a * b;
  let ssA = 0;
  for (let i = 0; i < a; i++) ssA += sq(mA[i]! - grand);
  ssA *= r * b;
  let ssB = 0;
  for (let j = 0; j < b; j++) ssB += sq(mB[j]! - grand);
  ssB *= r * a;
  let ssWholeError = 0;
  for (let k = 0; k < r; k++) {
    for (let i = 0; i < a; i++) ssWholeError += sq(mRA[k * a + i]! - mR[k]! - mA[i]! + grand);
  }
  ssWholeError *= b;
  let ssAB = 0;
  for (let i = 0; i < a; i++) {
    for (let j = 0; j < b; j++) ssAB += sq(mAB[i * b + j]! - mA[i]! - mB[j]! + grand);
  }
  ssAB *= r;

  // residual: y - (whole-plot mean) - (cell mean) + (whole-level mean)
  const residuals = new Float64Array(n);
  const fittedShifted = new Float64Array(n);
  for (let t = 0; t < n; t++) {
    const f = mRA[wholePlotOf[t]!]! + mAB[cellAB[t]!]! - mA[whole.codes[t]!]!;
    fittedShifted[t] = f;
    residuals[t] = y[t]! - f;
  }
  const sse = centredSumOfSquares(residuals, 0);
  const sst = centredSumOfSquares(y, grand);
  const dfR = r - 1;
  const dfA = a - 1;
  const dfWhole = (r - 1) * (a - 1);
  const dfB = b - 1;
  const dfAB = (a - 1) * (b - 1);
  const dfSub = a * (r - 1) * (b - 1);
  if (dfSub <= 0) throw new DesignError(designMsg.noErrorDf());
  const mseSub = sse / dfSub;
  const mseWhole = dfWhole > 0 ? ssWholeError / dfWhole : NaN;
  // whole_error zero to rounding beside the total (the rule of src/functions/exact.ts): the
  // whole-plot factor has nothing to be tested against
  const wholeExact = dfWhole > 0 && !(ssWholeError > 1e-12 * centredSumOfSquares(y, mean(y)));
  const interaction = `${whole.name}:${sub.name}`;

  const rows: StratumRow[] = [
    // as the issue that asked for this analysis fixes it: the whole-plot factor against
    // whole_error, every other row (blocks included) against the subplot error
    { source: block.name, df: dfR, ss: ssR, against: 'sub' },
    { source: whole.name, df: dfA, ss: ssA, against: 'whole' },
    { source: 'whole_error', df: dfWhole, ss: ssWholeError, against: 'sub' },
    { source: sub.name, df: dfB, ss: ssB, against: 'sub' },
    { source: interaction, df: dfAB, ss: ssAB, against: 'sub' },
    { source: 'error', df: dfSub, ss: sse, against: null },
  ];
  const table: AnovaTable = { source: [], df: [], ss: [], ms: [], f: [], p: [] };
  for (const row of rows) {
    const ms = row.df > 0 ? row.ss / row.df : NaN;
    const [em, edf] = row.against === 'whole' ? [wholeExact ? NaN : mseWhole, dfWhole] : row.against === 'sub' ? [mseSub, dfSub] : [NaN, 0];
    const f = row.df > 0 && edf > 0 && em > 0 ? ms / em : NaN;
    table.source.push(row.source);
    table.df.push(row.df);
    table.ss.push(row.ss);
    table.ms.push(ms);
    table.f.push(f);
    table.p.push(f === f ? fUpper(f, row.df, edf) : NaN);
  }
  table.source.push('total');
  table.df.push(n - 1);
  table.ss.push(sst);
  table.ms.push(NaN);
  table.f.push(NaN);
  table.p.push(NaN);

  const notes: string[] = [];
  if (opts.dropped > 0) notes.push(designMsg.dropped(opts.dropped));
  notes.push(designMsg.splitStrata(block.name, whole.name));
  if (a === 1) notes.push(designMsg.splitOneWholeLevel(whole.name));
  if (wholeExact) notes.push(designMsg.splitWholeExact(whole.name));

  // whole-plot means: variance Ea / (r b); subplot means and cell means combine both errors
  const wholeCounts = new Float64Array(a).fill(r * b);
  const wholeMeans = factorMeans(whole.name, whole.levels, wholeCounts, mA, opts.offset, diagonalCovariance(wholeCounts), wholeExact ? NaN : mseWhole, dfWhole, opts.level);
  wholeMeans.error = { mse: mseWhole, df: dfWhole, note: designMsg.splitWholeNote() };
  // The variance of one subplot mean is (sigma_w^2 + sigma^2) / (r a), estimated by
  // (Ea + (b - 1) Eb) / (r a b); differences of subplot means need only Eb.
  const combined = a > 1 ? (mseWhole + (b - 1) * mseSub) / b : mseSub;
  const combinedDf = a > 1 ? satterthwaite([mseWhole / b, ((b - 1) * mseSub) / b], [dfWhole, dfSub]) : dfSub;
  const subCounts = new Float64Array(b).fill(r * a);
  const subMeans = factorMeans(sub.name, sub.levels, subCounts, mB, opts.offset, diagonalCovariance(subCounts), combined, combinedDf, opts.level);
  subMeans.error = { mse: mseSub, df: dfSub, note: designMsg.splitSubNote() };

  const cellMeansOut: SplitParts['cells'] = { whole: [], sub: [], n: [], mean: [], se: [], low: [], high: [], df: [] };
  const tCell = tCritical(opts.level, combinedDf);
  const seCell = Math.sqrt(combined / r);
  for (let i = 0; i < a; i++) {
    for (let j = 0; j < b; j++) {
      const m = mAB[i * b + j]! + opts.offset;
      cellMeansOut.whole.push(whole.levels[i]!);
      cellMeansOut.sub.push(sub.levels[j]!);
      cellMeansOut.n.push(r);
      cellMeansOut.mean.push(m);
      cellMeansOut.se.push(seCell);
      cellMeansOut.low.push(m - tCell * seCell);
      cellMeansOut.high.push(m + tCell * seCell);
      cellMeansOut.df.push(combinedDf);
    }
  }
  const blockCounts = new Float64Array(r).fill(a * b);
  const blockMeans = factorMeans(block.name, block.levels, blockCounts, mR, opts.offset, diagonalCovariance(blockCounts), wholeExact ? NaN : mseWhole, dfWhole, opts.level);
  blockMeans.error = { mse: mseWhole, df: dfWhole, note: designMsg.splitWholeNote() };

  // Leverage of a subplot: the fitted value (whole-plot mean + cell mean - whole-level mean)
  // is a projection with trace a r + a b - a over n = a b r equal observations.
  const h = (a * r + a * b - a) / n;
  const leverage = new Float64Array(n).fill(h);
  const split: SplitParts = {
    whole: whole.name,
    sub: sub.name,
    block: block.name,
    wholeLevels: [...whole.levels],
    subLevels: [...sub.levels],
    r,
    mseWhole,
    dfWhole,
    mseSub,
    dfSub,
    cellShifted: mAB,
    offset: opts.offset,
    cells: cellMeansOut,
  };
  return {
    design: DESIGN,
    kind: 'split_plot',
    factors: [whole.name, sub.name, block.name],
    treatment: whole.name,
    n,
    level: opts.level,
    table,
    ss_method: 'closed form from block, whole-plot, subplot and cell means (complete whole plots, so the two strata are orthogonal)',
    means: wholeMeans.table,
    factor_means: [wholeMeans, subMeans, blockMeans],
    ...errorFields({ mse: mseSub, dfError: dfSub, sse, sst, grand, offset: opts.offset, residuals, leverage }),
    fitted: addOffset(fittedShifted, opts.offset),
    balanced: true,
    notes,
    split,
  };
}

function firstEmpty(f: Factor, counts: Int32Array): string {
  for (let k = 0; k < counts.length; k++) if (counts[k] === 0) return f.levels[k] ?? String(k + 1);
  return f.name;
}
