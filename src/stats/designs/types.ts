/**
 * The plain fit object that every design analysis returns (docs/language.md section 8). Field
 * names are the record's field names, so the built-ins layer can hand the object over field
 * by field. Tables are columnar (one array per column, in column order), as the language's
 * tables are. A number that does not exist (the F of the error row, a standard error with no
 * error term) is NaN; the wiring shows it as missing.
 */
import type { FactorColumn } from '../linear/layout.ts';

/** A factor as the designs receive it: integer codes and level names in first-seen order. */
export type Factor = FactorColumn;

/** Options shared by every design function. */
export interface DesignOptions {
  /**
   * The exact offset the response was shifted by (src/stats/decimal); sums of squares are
   * formed on y as given, and the offset is added back to means, fitted values and the grand
   * mean. Default 0.
   */
  offset?: number;
  /** Confidence level of the intervals in the means table; default 0.95. */
  level?: number;
  /** Rows the caller left out for missing values; echoed into the notes. Default 0. */
  dropped?: number;
}

/** Which analysis made a fit. */
export type DesignKind = 'one_way' | 'blocked' | 'latin_square' | 'factorial' | 'split_plot' | 'across_sites';

/** The analysis-of-variance table: one row per term, then "error", then "total". */
export interface AnovaTable {
  source: string[];
  df: number[];
  ss: number[];
  ms: number[];
  f: number[];
  p: number[];
}

/** Means of one factor's levels with standard errors and confidence intervals. */
export interface MeansTable {
  level: string[];
  /** Observations at the level. */
  n: number[];
  /** Least-squares mean (the plain mean when the design is balanced), offset added back. */
  mean: number[];
  se: number[];
  low: number[];
  high: number[];
}

/** Everything the comparisons need about one factor's means. */
export interface FactorMeans {
  /** The factor's name. */
  factor: string;
  /** Level names, in the factor's order. */
  levels: string[];
  /** Means (offset added back), for display. */
  mean: Float64Array;
  /**
   * The same means on the scale of the shifted response (offset not added). Differences and
   * contrasts are formed from these: with a large offset added back, the doubles would lose
   * the very digits the decimal shift kept.
   */
  shifted_mean: Float64Array;
  /** The offset: mean = shifted_mean + offset. */
  offset: number;
  /**
   * Covariance of the means in units of the error variance: k x k row-major when
   * `covariance_form` is "full"; only the k variances when it is "diagonal" (independent
   * means, as in balanced designs, where a k x k matrix of 20,000 blocks would be 3 GB).
   */
  covariance: Float64Array;
  covariance_form: 'full' | 'diagonal';
  /** The same as a table at the fit's level. */
  table: MeansTable;
  /**
   * The error these means are judged against when it is not the fit's `mse` (a split plot's
   * whole-plot error, the treatment-by-site mean square of a series of trials). Comparisons
   * of these means use it and say so.
   */
  error?: ErrorTerm;
}

/** An error mean square other than the fit's residual one, with what it is in words. */
export interface ErrorTerm {
  /** Mean square. */
  mse: number;
  /** Its degrees of freedom (Satterthwaite's, not whole, when two errors combine). */
  df: number;
  /** Where it comes from, for the notes of a comparison. */
  note: string;
}

/** Tukey's one-degree-of-freedom test for nonadditivity. */
export interface Nonadditivity {
  ss: number;
  f: number;
  p: number;
  /** Degrees of freedom of the test: 1 and df_error - 1. */
  df1: number;
  df2: number;
}

/** Effects of a two-level factorial: for each term, mean at "+" minus mean at "-". */
export interface EffectsTable {
  term: string[];
  estimate: number[];
}

/**
 * Lenth's (1989) margins for an unreplicated two-level factorial, where no error term exists.
 * An effect whose absolute value exceeds `me` stands out individually; `sme` allows for
 * looking at all of them at once.
 */
export interface LenthMargins {
  /** Pseudo standard error. */
  pse: number;
  /** Margin of error and simultaneous margin of error at `level`. */
  me: number;
  sme: number;
  /** Degrees of freedom of the t quantiles: number of effects / 3. */
  df: number;
  level: number;
  /** For each effect (order of `effects`), whether |estimate| > me, and > sme. */
  beyond_me: boolean[];
  beyond_sme: boolean[];
}

/** The fit record. */
export interface DesignFit {
  /** The design in words, e.g. "randomized complete block". */
  design: string;
  kind: DesignKind;
  /** Factor names in model order; the first is the one `means` describes. */
  factors: string[];
  /** Name of the factor that `means` describes. */
  treatment: string;
  /** Observations used. */
  n: number;
  /** Confidence level of the intervals. */
  level: number;
  /** The analysis-of-variance table. */
  table: AnovaTable;
  /** How the sums of squares in `table` were formed, in words. */
  ss_method: string;
  /** Means of the treatment factor. */
  means: MeansTable;
  /** Means of every factor (first: the treatment factor), with their covariances. */
  factor_means: FactorMeans[];
  mse: number;
  df_error: number;
  sd: number;
  grand_mean: number;
  r2: number;
  /** In data order. */
  fitted: Float64Array;
  residuals: Float64Array;
  /** Leverages (diagonal of the hat matrix) and internally studentized residuals. */
  leverage: Float64Array;
  studentized_residuals: Float64Array;
  /** True when every cell has the same number of observations (closed-form sums). */
  balanced: boolean;
  /** What was assumed, dropped or missing, in plain words. */
  notes: string[];
  /** The offset that was added back. */
  offset: number;
  /** Blocked designs: efficiency against a completely randomized design (corrected). */
  relative_efficiency?: number;
  /** The same before the degrees-of-freedom correction. */
  relative_efficiency_uncorrected?: number;
  /** Blocked designs with one observation per cell. */
  nonadditivity?: Nonadditivity;
  /** Two-level factorials. */
  effects?: EffectsTable;
  /** Unreplicated two-level factorials. */
  lenth?: LenthMargins;
  /** Split plots: the whole-plot stratum and the cell means (see split.ts). */
  split?: SplitParts;
  /** Fits with a covariate (see covariate.ts). */
  covariate?: CovariateParts;
  /** A series of trials across sites (see sites.ts). */
  sites?: SitesParts;
}

/** What comparisons and charts need from a split-plot fit. */
export interface SplitParts {
  whole: string;
  sub: string;
  block: string;
  wholeLevels: string[];
  subLevels: string[];
  /** Blocks (replicates of every whole plot). */
  r: number;
  /** Whole-plot error mean square and df; subplot error mean square and df. */
  mseWhole: number;
  dfWhole: number;
  mseSub: number;
  dfSub: number;
  /** Cell means on the shifted scale, whole level major: cell (i, j) at i * subLevels + j. */
  cellShifted: Float64Array;
  offset: number;
  /** The combinations table (whole, sub, n, mean, se, low, high, df). */
  cells: {
    whole: string[];
    sub: string[];
    n: number[];
    mean: number[];
    se: number[];
    low: number[];
    high: number[];
    df: number[];
  };
}

/** The covariate's part of a fit. */
export interface CovariateParts {
  name: string;
  slope: number;
  slope_se: number;
  /** Mean of the covariate over the observations used (the means are adjusted to it). */
  mean: number;
  /** Unadjusted treatment means (offset added back), in level order. */
  unadjusted: number[];
  /** Covariate means by treatment, in level order. */
  covariateMeans: number[];
  /** Test that the slopes are the same in every treatment (treatment-by-covariate term). */
  parallel: { ss: number; f: number; df1: number; df2: number; p: number };
}

/** A series of trials: pooled and per-site results. */
export interface SitesParts {
  site: string;
  block: string;
  siteLevels: string[];
  /** The treatment F against the pooled error, beside the one in the table. */
  f_against_error: number;
  p_against_error: number;
  /** Bartlett's test of equal error variances across sites. */
  bartlett: { statistic: number; df: number; p: number };
  /** Per site, in site order. */
  perSite: { site: string[]; blocks: number[]; mean: number[]; mse: number[]; df_error: number[]; f: number[]; p: number[] };
  /** Treatment means at each site (treatment major), offset added back. */
  cellMeans: { treatment: string[]; site: string[]; mean: number[] };
}
