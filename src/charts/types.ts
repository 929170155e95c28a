/**
 * What the chart builders take and give. Inputs are plain numbers in typed arrays and
 * factors as integer codes with level names, the way src/stats works; outputs are vega-lite
 * specifications with every datum inline.
 */
import type { TopLevelSpec } from 'vega-lite';

/** A vega-lite specification built by this folder: inline data, no URLs, no links. */
export type ChartSpec = TopLevelSpec;

/** What every builder returns. */
export interface ChartResult {
  readonly spec: ChartSpec;
  /** One line with the numbers the chart rests on. */
  readonly caption: string;
  /** What the reader should know about how the chart was drawn (sampling, dropped rows). */
  readonly warnings: readonly string[];
}

/** A factor at the rows a chart draws: level codes (0-based) and level names in order. */
export interface FactorInput {
  /** The factor's column name (axis and legend titles). */
  readonly name: string;
  readonly codes: Int32Array;
  readonly levels: readonly string[];
}

/**
 * The residuals of a fit, one entry per observation used, in data order.
 * `rows` maps each entry to its 0-based row of the data (null: entry i is row i), so that
 * labels name the row of the table even when rows with missing values were left out.
 */
export interface ResidualInput {
  readonly residuals: Float64Array;
  readonly fitted: Float64Array;
  /** Internally studentized residuals; NaN where they do not exist (leverage 1). */
  readonly studentized: Float64Array;
  /** The measured values (for tooltips). */
  readonly y: Float64Array;
  readonly rows: Int32Array | null;
  /** The response's column name. */
  readonly response: string;
  /** Factors of the fit, in model order (treatment first), for tooltips and strips. */
  readonly factors: readonly FactorInput[];
}
