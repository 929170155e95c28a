/**
 * Treatment means with their confidence intervals, one row per level, ordered by mean
 * (highest at the top), from a fit's means table.
 */
import { assemble, num, tip, type Json } from './layers.ts';
import { POINT, POINT_SHAPE, ROW_STEP, WIDTH } from './look.ts';
import { axisTitle, derivedTitle, readName } from './titles.ts';
import type { ChartResult } from './types.ts';
import { capital, count, counted, fig, percent } from '../messages/charts.ts';

/** A fit's means table and what the caption states about it. */
export interface MeansInput {
  /** The factor's and the response's column names. */
  readonly factor: string;
  readonly response: string;
  readonly levels: readonly string[];
  readonly n: ArrayLike<number>;
  readonly mean: ArrayLike<number>;
  readonly se: ArrayLike<number>;
  /** Interval ends (NaN when the fit has no error term). */
  readonly low: ArrayLike<number>;
  readonly high: ArrayLike<number>;
  /** Confidence level of the intervals, and the error degrees of freedom they use. */
  readonly level: number;
  readonly dfError: number;
  /** True when the means are least-squares means (unbalanced or missing data). */
  readonly leastSquares: boolean;
  /** The covariate the means are adjusted for (its column name), when there is one. */
  readonly adjustedFor?: string;
  /** The error the intervals come from, in words, when it is not the fit's error mean square. */
  readonly errorName?: string;
}

/** More levels than this make a tall chart; the caller is told. */
export const TALL_ROWS = 200;
/**
 * The most levels a means chart draws. Past a few thousand rows vega-lite's compiler runs
 * out of stack (10,000 levels did), and no reader reads such a chart: the means table does.
 */
export const MAX_MEANS_LEVELS = 1000;

/** Order of levels by mean, highest first (ties in level order); NaN means last. */
export function byMean(mean: ArrayLike<number>): number[] {
  const idx = Array.from({ length: mean.length }, (_, i) => i);
  const key = (i: number) => (Number.isNaN(mean[i]!) ? -Infinity : mean[i]!);
  return idx.sort((a, b) => key(b) - key(a) || a - b);
}

/** The means chart; see the module note. */
export function meansChart(m: MeansInput): ChartResult {
  const k = m.levels.length;
  const warnings: string[] = [];
  const order = byMean(m.mean);
  let withInterval = 0;
  let total = 0;
  const values: Json[] = order.map((i) => {
    const low = num(m.low[i]!);
    const high = num(m.high[i]!);
    if (low !== null && high !== null) withInterval++;
    total += m.n[i]!;
    return { level: m.levels[i]!, n: m.n[i]!, mean: num(m.mean[i]!), se: num(m.se[i]!), low, high };
  });
  if (k > TALL_ROWS) warnings.push(`${count(k)} levels make a tall chart; the means table lists them too.`);

  const factor = readName(m.factor).label;
  const response = readName(m.response).label;
  const what = m.adjustedFor !== undefined ? 'adjusted mean' : m.leastSquares ? 'least-squares mean' : 'mean';
  const xTitle = derivedTitle(what, m.response);
  const y = { field: 'level', type: 'nominal', sort: values.map((v) => v.level), title: axisTitle(m.factor) };
  const tooltip = [tip('level', axisTitle(m.factor), false), tip('n', 'observations'), tip('mean', what), tip('se', 'standard error'), tip('low', 'low'), tip('high', 'high')];
  const layers: Json[] = [];
  if (withInterval > 0) {
    layers.push({
      mark: { type: 'rule', color: POINT, strokeWidth: 2, opacity: 0.55 },
      encoding: { y, x: { field: 'low', type: 'quantitative', title: xTitle, scale: { zero: false } }, x2: { field: 'high' }, tooltip },
    });
  }
  layers.push({
    mark: { type: 'point', color: POINT, shape: POINT_SHAPE, size: 64, opacity: 1 },
    encoding: { y, x: { field: 'mean', type: 'quantitative', title: xTitle, scale: { zero: false } }, tooltip },
  });

  const pct = percent(m.level);
  const title = withInterval > 0 ? `${capital(what)} ${response} by ${factor}, with ${pct} intervals` : `${capital(what)} ${response} by ${factor}`;
  const parts = [`${counted(k, `${factor} ${what}`)} of ${response} from ${counted(total, 'observation')}`];
  if (m.adjustedFor !== undefined) parts.push(`adjusted to the mean ${readName(m.adjustedFor).label}`);
  if (withInterval > 0) parts.push(`${pct} intervals from the ${m.errorName ?? 'error mean square'} on ${count(m.dfError)} df`);
  else parts.push('no intervals: the fit has no error term');
  const top = order[0];
  const bottom = order[order.length - 1];
  if (top !== undefined && bottom !== undefined && k > 1) {
    parts.push(`highest ${m.levels[top]} (${fig(m.mean[top]!)}), lowest ${m.levels[bottom]} (${fig(m.mean[bottom]!)})`);
  }
  return {
    spec: assemble(title, null, { data: { values }, layer: layers }, { width: WIDTH, height: { step: ROW_STEP } }),
    caption: `${parts.join('; ')}.`,
    warnings,
  };
}
