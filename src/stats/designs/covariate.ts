/**
 * Analysis of covariance: a one-way or blocked analysis with one covariate measured before
 * treatment (start weight, stand count, initial thickness), one common slope.
 *
 * Every piece comes from residuals on the factor model (Frisch-Waugh): residualize y and x on
 * treatments (and blocks), then the slope is sum(e_x e_y) / sum(e_x^2) and the error sum of
 * squares sum(e_y^2) - slope * sum(e_x e_y). Each term's sum of squares is the rise in that
 * error when the term is dropped, so each is adjusted for every other term: treatments for the
 * covariate and blocks, blocks for treatments and the covariate, the covariate for treatments
 * and blocks. The same path serves complete blocks and blocks with missing plots (the factor
 * model is then fitted by least squares, src/stats/linear).
 *
 * Adjusted means: the least-squares means of y minus slope times (least-squares mean of x
 * minus the overall mean of x), that is, the fitted value at the covariate's mean averaged
 * over blocks. Their covariance in units of sigma^2 is V + d d' / sum(e_x^2), where V is that
 * of the factor model's means and d the covariate's distance from its mean.
 */
import { fUpper } from '../distributions/index.ts';
import { choleskyFactor, choleskySolve } from '../linear/cholesky.ts';
import { leastSquaresMeans } from '../linear/fit.ts';
import { centredSumOfSquares, groupMeans, mean } from '../linear/sums.ts';
import { anovaTable, factorMeans, fullCovariance, errorFields } from './assemble.ts';
import { blocked } from './blocked.ts';
import { DesignError } from './errors.ts';
import { fitOrExplain } from './least.ts';
import { designMsg } from '../../messages/designs.ts';
import { oneWay } from './oneway.ts';
import type { CovariateParts, DesignFit, DesignOptions, Factor } from './types.ts';

/** A covariate as the designs receive it: values (shifted like the response may be) and a name. */
export interface Covariate {
  name: string;
  /** Values at the observations used; a constant shift does not change anything here. */
  values: Float64Array;
  /** The exact offset the values were shifted by (added back to the covariate's mean). */
  offset?: number;
}

/** Residuals of v on a factor model, with the model's leverages. */
type Residualizer = (v: Float64Array) => { residuals: Float64Array; leverage: Float64Array };

/** Residuals on group means (one factor): exact, O(n). */
function onGroups(f: Factor): Residualizer {
  const k = f.levels.length;
  return (v) => {
    const { count, mean: m } = groupMeans(v, f.codes, k);
    const residuals = new Float64Array(v.length);
    const leverage = new Float64Array(v.length);
    for (let i = 0; i < v.length; i++) {
      const g = f.codes[i]!;
      residuals[i] = v[i]! - m[g]!;
      leverage[i] = 1 / count[g]!;
    }
    return { residuals, leverage };
  };
}

/** Residuals on treatments and blocks (blocks absorbed; least squares, any pattern of plots). */
function onTreatmentsAndBlocks(treatment: Factor, block: Factor): Residualizer {
  return (v) => {
    const lin = fitOrExplain({ y: v, factors: [treatment, block], terms: [[0]], absorb: 1 });
    return { residuals: lin.residuals, leverage: lin.leverage };
  };
}

/** Residuals about the grand mean. */
const onMean: Residualizer = (v) => {
  const m = mean(v);
  return { residuals: Float64Array.from(v, (x) => x - m), leverage: new Float64Array(v.length).fill(1 / v.length) };
};

function dot(a: Float64Array, b: Float64Array): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += a[i]! * b[i]!;
  return s;
}

/** Error sum of squares after regressing residuals ey on residuals ex (common slope). */
function sseWithSlope(ey: Float64Array, ex: Float64Array): number {
  const exx = dot(ex, ex);
  const exy = dot(ex, ey);
  return Math.max(0, centredSumOfSquares(ey, 0) - (exx > 0 ? (exy * exy) / exx : 0));
}

/**
 * Test that the slope is the same in every treatment: separate slopes (the treatment by
 * covariate interaction) against the common one, both within the same factor model.
 */
function parallelSlopes(
  ey: Float64Array,
  x: Float64Array,
  treatment: Factor,
  residualize: Residualizer,
  sseCommon: number,
  dfCommon: number,
): CovariateParts['parallel'] {
  const t = treatment.levels.length;
  const n = ey.length;
  const cols: Float64Array[] = [];
  for (let g = 0; g < t; g++) {
    const z = new Float64Array(n);
    for (let i = 0; i < n; i++) if (treatment.codes[i] === g) z[i] = x[i]!;
    cols.push(residualize(z).residuals);
  }
  const a = new Float64Array(t * t);
  const rhs = new Float64Array(t);
  for (let g = 0; g < t; g++) {
    rhs[g] = dot(cols[g]!, ey);
    for (let h = 0; h <= g; h++) {
      const v = dot(cols[g]!, cols[h]!);
      a[g * t + h] = v;
      a[h * t + g] = v;
    }
  }
  const chol = choleskyFactor(a, t);
  const gamma = choleskySolve(chol, rhs);
  const explained = dot(gamma, rhs);
  const sseSeparate = Math.max(0, centredSumOfSquares(ey, 0) - explained);
  const df1 = chol.rank - 1;
  const df2 = dfCommon - df1;
  const ss = Math.max(0, sseCommon - sseSeparate);
  const f = df1 > 0 && df2 > 0 && sseSeparate > 0 ? ss / df1 / (sseSeparate / df2) : NaN;
  return { ss, f, df1, df2, p: f === f ? fUpper(f, df1, df2) : NaN };
}

/**
 * One-way or blocked analysis with a covariate.
 *
 * @param y - response, already shifted by `options.offset` (complete cases only).
 * @param covariate - the covariate at the same observations, no missing values.
 * @param treatment - treatment factor; `block` - blocks, or null for a completely randomized
 *   design.
 * @returns a fit record: table rows treatment, (block,) covariate, error, total, each sum of
 *   squares adjusted for the others; `means` adjusted to the covariate's mean; `covariate`
 *   with the slope, its standard error and the test of parallel slopes.
 * @throws DesignError for a covariate that does not vary once the factors are allowed for, or
 *   anything the design without the covariate refuses.
 */
export function withCovariate(
  y: Float64Array,
  covariate: Covariate,
  treatment: Factor,
  block: Factor | null,
  options?: DesignOptions,
): DesignFit {
  const n = y.length;
  const x = covariate.values;
  if (x.length !== n) throw new DesignError(designMsg.covariateLength(x.length, n));
  for (let i = 0; i < n; i++) if (!Number.isFinite(x[i]!)) throw new DesignError(designMsg.covariateMissing(1, covariate.name));
  // The analysis without the covariate makes every check of the design (and gives block means).
  const base = block === null ? oneWay(y, treatment, options) : blocked(y, treatment, block, options);
  const offset = base.offset;
  const level = base.level;
  const full: Residualizer = block === null ? onGroups(treatment) : onTreatmentsAndBlocks(treatment, block);
  const noTreatment: Residualizer = block === null ? onMean : onGroups(block);
  const noBlock: Residualizer = onGroups(treatment);

  const fy = full(y);
  const fx = full(x);
  const ey = fy.residuals;
  const ex = fx.residuals;
  const exx = dot(ex, ex);
  const totalX = centredSumOfSquares(x);
  // a covariate that the factors explain entirely (or that never varies) adjusts nothing
  if (!(exx > 1e-10 * totalX) || !(totalX > 0)) throw new DesignError(designMsg.covariateConstant(covariate.name));
  const exy = dot(ex, ey);
  const slope = exy / exx;
  const residuals = new Float64Array(n);
  for (let i = 0; i < n; i++) residuals[i] = ey[i]! - slope * ex[i]!;
  const sse = centredSumOfSquares(residuals, 0);
  const dfError = base.df_error - 1;
  if (dfError <= 0) throw new DesignError(designMsg.noErrorDf());
  const mse = sse / dfError;
  const sst = centredSumOfSquares(y);

  const ssCovariate = (exy * exy) / exx;
  const ssTreatment = Math.max(0, sseWithSlope(noTreatment(y).residuals, noTreatment(x).residuals) - sse);
  const t = treatment.levels.length;
  const terms = [{ source: treatment.name, df: t - 1, ss: ssTreatment }];
  if (block !== null) {
    const ssBlock = Math.max(0, sseWithSlope(noBlock(y).residuals, noBlock(x).residuals) - sse);
    terms.push({ source: block.name, df: base.table.df[1]!, ss: ssBlock });
  }
  terms.push({ source: covariate.name, df: 1, ss: ssCovariate });
  const table = anovaTable(terms, sse, dfError, sst, n - 1);

  // adjusted means and their covariance
  let lsY: Float64Array;
  let lsX: Float64Array;
  let v: Float64Array;
  if (block === null) {
    lsY = groupMeans(y, treatment.codes, t).mean;
    const gx = groupMeans(x, treatment.codes, t);
    lsX = gx.mean;
    v = new Float64Array(t * t);
    for (let g = 0; g < t; g++) v[g * t + g] = 1 / gx.count[g]!;
  } else {
    const linY = fitOrExplain({ y, factors: [treatment, block], terms: [[0]], absorb: 1 });
    const linX = fitOrExplain({ y: x, factors: [treatment, block], terms: [[0]], absorb: 1 });
    const my = leastSquaresMeans(linY, 0);
    lsY = my.mean;
    lsX = leastSquaresMeans(linX, 0).mean;
    v = my.covariance;
  }
  const xbar = mean(x);
  const adjusted = new Float64Array(t);
  const d = new Float64Array(t);
  for (let g = 0; g < t; g++) {
    d[g] = lsX[g]! - xbar;
    adjusted[g] = lsY[g]! - slope * d[g]!;
  }
  const cov = new Float64Array(t * t);
  for (let g = 0; g < t; g++) for (let h = 0; h < t; h++) cov[g * t + h] = v[g * t + h]! + (d[g]! * d[h]!) / exx;
  const counts = groupMeans(y, treatment.codes, t).count;
  const trtMeans = factorMeans(treatment.name, treatment.levels, counts, adjusted, offset, fullCovariance(cov), mse, dfError, level);

  const leverage = new Float64Array(n);
  const fitted = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    leverage[i] = fy.leverage[i]! + (ex[i]! * ex[i]!) / exx;
    fitted[i] = y[i]! - residuals[i]! + offset;
  }
  const parallel = parallelSlopes(ey, x, treatment, full, sse, dfError);
  const covOffset = covariate.offset ?? 0;
  const parts: CovariateParts = {
    name: covariate.name,
    slope,
    slope_se: Math.sqrt(mse / exx),
    mean: xbar + covOffset,
    unadjusted: Array.from(groupMeans(y, treatment.codes, t).mean, (m) => m + offset),
    covariateMeans: Array.from(groupMeans(x, treatment.codes, t).mean, (m) => m + covOffset),
    parallel,
  };
  const notes = [...base.notes.filter((s) => s !== designMsg.nonadditivitySkipped() && s !== designMsg.efficiencyAdjusted()), designMsg.covariateNote(covariate.name)];
  const fit: DesignFit = {
    design: `${base.design} with a covariate`,
    kind: base.kind,
    factors: base.factors,
    treatment: treatment.name,
    n,
    level,
    table,
    ss_method: `least squares with one common slope: each sum of squares adjusted for every other term (${block === null ? 'treatment for the covariate; the covariate for treatments' : 'treatments for the covariate and blocks; blocks for treatments and the covariate; the covariate for treatments and blocks'})`,
    means: trtMeans.table,
    factor_means: [trtMeans, ...base.factor_means.slice(1)],
    ...errorFields({ mse, dfError, sse, sst, grand: mean(y), offset, residuals, leverage }),
    fitted,
    balanced: base.balanced,
    notes,
    covariate: parts,
  };
  return fit;
}
