/**
 * The plain fit object that every design analysis returns (language.md, section 8). Field
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
export type DesignKind = 'one_way' | 'blocked' | 'latin_square' | 'factorial';

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
}
