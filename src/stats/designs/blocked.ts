/**
 * Randomized complete blocks.
 *
 * Balanced (every treatment the same number of times in every block): closed-form sums from
 * treatment and block means, residuals y - m_t - m_b + m formed directly, O(n) time and no
 * design matrix. With missing plots or unequal counts: least squares with the blocks absorbed
 * (src/stats/linear), the treatment sum of squares adjusted for blocks and the block sum of
 * squares adjusted for treatments, error degrees of freedom reduced by the missing plots.
 */
import { fUpper } from '../distributions/index.ts';
import { leastSquaresMeans } from '../linear/fit.ts';
import { centredSumOfSquares, groupMeans } from '../linear/sums.ts';
import { addOffset, anovaTable, diagonalCovariance, factorMeans, fullCovariance, missingCellNotes, errorFields } from './assemble.ts';
import { commonCount, compactFactor, requireAllLevels, resolveOptions, type ResolvedOptions } from './check.ts';
import { DesignError } from './errors.ts';
import { fitOrExplain } from './least.ts';
import { designMsg } from '../../messages/designs.ts';
import { accumulateTwoWay, correctTwoWay, type TwoWaySums } from './twoway.ts';
import type { DesignFit, DesignOptions, Factor, Nonadditivity } from './types.ts';

const DESIGN = 'randomized complete block';

/**
 * Relative efficiency of the blocked design against a completely randomized one of the same
 * size: the randomized design's error variance, estimated from this experiment as
 * (df_b MS_b + (df_t + df_e) MS_e) / (N - 1), over MS_e; then Fisher's degrees-of-freedom
 * correction ((df_e + 1)(df_r + 3)) / ((df_e + 3)(df_r + 1)), where df_e is the blocked
 * error df and df_r = N - t that of the randomized design.
 * source: Montgomery, Design and Analysis of Experiments (the vascular-graft example), and
 * docs/references.md section 4, for the formula and the correction.
 */
export function relativeEfficiency(
  msBlocks: number,
  dfBlocks: number,
  dfTreatments: number,
  mse: number,
  dfError: number,
  n: number,
  treatments: number,
): { corrected: number; uncorrected: number } {
  const crd = (dfBlocks * msBlocks + (dfTreatments + dfError) * mse) / (n - 1);
  const uncorrected = crd / mse;
  const dfr = n - treatments;
  const correction = ((dfError + 1) * (dfr + 3)) / ((dfError + 3) * (dfr + 1));
  return { corrected: uncorrected * correction, uncorrected };
}

/**
 * Tukey's one-degree-of-freedom test for nonadditivity, from `num` = sum of r_ij a_i b_j
 * over the residuals of the additive fit and the treatment and block effects (one
 * observation per cell):
 * SS_N = (sum r_ij a_i b_j)^2 / (sum a_i^2 sum b_j^2), F on 1 and df_e - 1 df.
 * Using residuals in place of y gives the same numerator exactly (the other parts of y are
 * orthogonal to a_i b_j) and avoids large intermediate sums.
 */
function nonadditivity(
  num: number,
  trtEffect: Float64Array,
  blkEffect: Float64Array,
  sse: number,
  dfError: number,
): Nonadditivity {
  let sa = 0;
  for (const a of trtEffect) sa += a * a;
  let sb = 0;
  for (const b of blkEffect) sb += b * b;
  const ss = (num * num) / (sa * sb);
  const df2 = dfError - 1;
  const f = df2 > 0 ? ss / ((sse - ss) / df2) : NaN;
  return { ss, f, p: f === f ? fUpper(f, 1, df2) : NaN, df1: 1, df2 };
}

/** Union-find over treatments and blocks: are all treatments linked through blocks? */
function checkConnected(trt: Int32Array, t: number, blk: Int32Array, b: number, levels: readonly string[]): void {
  const parent = new Int32Array(t + b);
  for (let k = 0; k < parent.length; k++) parent[k] = k;
  const find = (x: number): number => {
    let r = x;
    while (parent[r] !== r) r = parent[r]!;
    let c = x;
    while (parent[c] !== r) {
      const next = parent[c]!;
      parent[c] = r;
      c = next;
    }
    return r;
  };
  for (let i = 0; i < trt.length; i++) {
    const a = find(trt[i]!);
    const c = find(t + blk[i]!);
    if (a !== c) parent[a] = c;
  }
  const root = find(0);
  for (let k = 1; k < t; k++) {
    if (find(k) !== root) throw new DesignError(designMsg.disconnected(levels[0] ?? '1', levels[k] ?? String(k + 1)));
  }
}

function balancedFit(
  y: Float64Array,
  treatment: Factor,
  block: Factor,
  sums: TwoWaySums,
  r: number,
  opts: ResolvedOptions,
  notes: string[],
): DesignFit {
  const n = y.length;
  const t = sums.countA.length;
  const b = sums.countB.length;
  const trtCodes = treatment.codes;
  const blkCodes = block.codes;
  const { meanA: tm, meanB: bm, grand, sst } = correctTwoWay(y, trtCodes, blkCodes, sums);
  const trtEffect = new Float64Array(t);
  const blkEffect = new Float64Array(b);
  let sst2 = 0;
  for (let k = 0; k < t; k++) {
    trtEffect[k] = tm[k]! - grand;
    sst2 += trtEffect[k]! * trtEffect[k]!;
  }
  let ssb2 = 0;
  for (let k = 0; k < b; k++) {
    blkEffect[k] = bm[k]! - grand;
    ssb2 += blkEffect[k]! * blkEffect[k]!;
  }
  const ssTrt = b * r * sst2;
  const ssBlk = t * r * ssb2;

  const residuals = new Float64Array(n);
  const fitted = new Float64Array(n);
  let s1 = 0;
  let s2 = 0;
  let tukeySum = 0; // sum of r_ij a_i b_j, for the nonadditivity test
  const fittedCentre = grand + opts.offset;
  for (let i = 0; i < n; i++) {
    const ti = trtEffect[trtCodes[i]!]!;
    const bi = blkEffect[blkCodes[i]!]!;
    const res = y[i]! - grand - ti - bi;
    residuals[i] = res;
    fitted[i] = fittedCentre + ti + bi;
    s1 += res;
    s2 += res * res;
    tukeySum += res * ti * bi;
  }
  const sse = s2 - (s1 * s1) / n;
  const dfError = n - t - b + 1;
  const mse = dfError > 0 ? sse / dfError : NaN;
  // Every plot has the same leverage in a balanced design: (1/(b r) + 1/(t r) - 1/n).
  const h = 1 / (b * r) + 1 / (t * r) - 1 / n;
  const leverage = new Float64Array(n).fill(h);
  const studentized = new Float64Array(n);
  const scale = 1 / Math.sqrt(mse * (1 - h));
  for (let i = 0; i < n; i++) studentized[i] = residuals[i]! * scale;

  const table = anovaTable(
    [
      { source: treatment.name, df: t - 1, ss: ssTrt },
      { source: block.name, df: b - 1, ss: ssBlk },
    ],
    sse,
    dfError,
    sst,
    n - 1,
  );
  const trtCounts = new Float64Array(t).fill(b * r);
  const blkCounts = new Float64Array(b).fill(t * r);
  const trtMeans = factorMeans(treatment.name, treatment.levels, trtCounts, tm, opts.offset, diagonalCovariance(trtCounts), mse, dfError, opts.level);
  const blkMeans = factorMeans(block.name, block.levels, blkCounts, bm, opts.offset, diagonalCovariance(blkCounts), mse, dfError, opts.level);
  const re = relativeEfficiency(ssBlk / (b - 1), b - 1, t - 1, mse, dfError, n, t);
  const fit: DesignFit = {
    design: DESIGN,
    kind: 'blocked',
    factors: [treatment.name, block.name],
    treatment: treatment.name,
    n,
    level: opts.level,
    table,
    ss_method: 'closed form from treatment and block means (balanced, so the sums are orthogonal)',
    means: trtMeans.table,
    factor_means: [trtMeans, blkMeans],
    ...errorFields({ mse, dfError, sse, sst, grand, offset: opts.offset, residuals, leverage, studentized }),
    fitted,
    balanced: true,
    notes,
    relative_efficiency: re.corrected,
    relative_efficiency_uncorrected: re.uncorrected,
  };
  if (r === 1 && dfError > 1) fit.nonadditivity = nonadditivity(tukeySum, trtEffect, blkEffect, sse, dfError);
  return fit;
}

function leastSquaresFit(
  y: Float64Array,
  treatment: Factor,
  block: Factor,
  t: number,
  b: number,
  trtCounts: Int32Array,
  blkCounts: Int32Array,
  opts: ResolvedOptions,
  notes: string[],
): DesignFit {
  const n = y.length;
  const lin = fitOrExplain({ y, factors: [treatment, block], terms: [[0]], absorb: 1 });
  const dfError = lin.dfError;
  if (dfError <= 0) throw new DesignError(designMsg.noErrorDf());
  const sse = lin.sse;
  const mse = sse / dfError;
  const ssTrt = lin.termSS[0]!;
  // Blocks adjusted for treatments: error of the treatments-only fit minus the full error.
  const tm = groupMeans(y, treatment.codes, t).mean;
  const oneWayResiduals = new Float64Array(n);
  for (let i = 0; i < n; i++) oneWayResiduals[i] = y[i]! - tm[treatment.codes[i]!]!;
  const sseOneWay = centredSumOfSquares(oneWayResiduals, 0);
  const ssBlk = Math.max(0, sseOneWay - sse);

  const table = anovaTable(
    [
      { source: treatment.name, df: t - 1, ss: ssTrt },
      { source: block.name, df: b - 1, ss: ssBlk },
    ],
    sse,
    dfError,
    lin.sst,
    n - 1,
  );
  const ls = leastSquaresMeans(lin, 0);
  const trtMeans = factorMeans(treatment.name, treatment.levels, trtCounts, ls.mean, opts.offset, fullCovariance(ls.covariance), mse, dfError, opts.level);
  // Block means: plain means (the least-squares means of blocks are rarely of interest and
  // would need the covariance of the absorbed effects).
  const bm = groupMeans(y, block.codes, b).mean;
  const blkMeans = factorMeans(block.name, block.levels, blkCounts, bm, opts.offset, diagonalCovariance(blkCounts), mse, dfError, opts.level);
  const re = relativeEfficiency(ssBlk / (b - 1), b - 1, t - 1, mse, dfError, n, t);
  notes.push(designMsg.efficiencyAdjusted(), designMsg.nonadditivitySkipped());
  return {
    design: DESIGN,
    kind: 'blocked',
    factors: [treatment.name, block.name],
    treatment: treatment.name,
    n,
    level: opts.level,
    table,
    ss_method: 'least squares: treatments adjusted for blocks, blocks adjusted for treatments',
    means: trtMeans.table,
    factor_means: [trtMeans, blkMeans],
    ...errorFields({ mse, dfError, sse, sst: lin.sst, grand: lin.mean, offset: opts.offset, residuals: lin.residuals, leverage: lin.leverage }),
    fitted: addOffset(lin.fitted, opts.offset),
    balanced: false,
    notes,
    relative_efficiency: re.corrected,
    relative_efficiency_uncorrected: re.uncorrected,
  };
}

/**
 * Analysis of a randomized complete block design.
 *
 * @param y - response, already shifted by `options.offset` (complete cases only).
 * @param treatment - treatment factor; every level must have data.
 * @param block - block factor; levels without data are dropped (with a note).
 * @param options - offset, confidence level (default 0.95), rows dropped upstream.
 * @returns a fit record with `relative_efficiency` and, with one plot per cell,
 *   `nonadditivity`. With missing plots the sums of squares are adjusted (see the module
 *   comment) and `notes` lists the missing plots.
 * @throws DesignError for a treatment without data, a block with one plot, treatments that
 *   never meet through blocks, or no degrees of freedom left for error.
 */
export function blocked(y: Float64Array, treatment: Factor, block: Factor, options?: DesignOptions): DesignFit {
  const opts = resolveOptions(options);
  const n = y.length;
  if (n === 0) throw new DesignError(designMsg.noData());
  if (treatment.codes.length !== n) throw new DesignError(designMsg.lengthMismatch(`treatment "${treatment.name}"`, treatment.codes.length, n));
  if (block.codes.length !== n) throw new DesignError(designMsg.lengthMismatch(`block "${block.name}"`, block.codes.length, n));
  let blk = block;
  let sums = accumulateTwoWay(y, treatment, blk, 'treatment', 'block');
  requireAllLevels(treatment, sums.countA, 'treatment');
  const compact = compactFactor(blk, sums.countB);
  if (compact.removed.length > 0) {
    blk = compact.factor;
    sums = accumulateTwoWay(y, treatment, blk, 'treatment', 'block');
  }
  const t = sums.countA.length;
  const b = sums.countB.length;
  if (b < 2) throw new DesignError(designMsg.tooFewLevels('block', blk.name, b));
  for (let k = 0; k < b; k++) {
    if (sums.countB[k] === 1) throw new DesignError(designMsg.blockWithOnePlot(blk.levels[k] ?? String(k + 1)));
  }
  const notes: string[] = [];
  if (opts.dropped > 0) notes.push(designMsg.dropped(opts.dropped));
  for (const name of compact.removed) notes.push(designMsg.emptyBlockDropped(name));

  const cells = sums.cells;
  const r = commonCount(cells);
  if (r >= 1) {
    if (n - t - b + 1 <= 0) throw new DesignError(designMsg.noErrorDf());
    return balancedFit(y, treatment, blk, sums, r, opts, notes);
  }
  checkConnected(treatment.codes, t, blk.codes, b, treatment.levels);
  const missing = missingCellNotes(
    cells,
    treatment.levels,
    blk.levels,
    (trt, bl) => designMsg.missingPlot('block', bl, trt),
    designMsg.moreMissing,
  );
  if (missing.length === 0 || cells.some((c) => c > 1)) notes.push(designMsg.unequalCells('treatment-block cells'));
  notes.push(...missing, designMsg.adjustedNote());
  return leastSquaresFit(y, treatment, blk, t, b, sums.countA, sums.countB, opts, notes);
}
