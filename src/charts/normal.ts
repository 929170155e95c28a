/**
 * Normal probability plot of residuals: the sorted residuals against the normal quantiles
 * of Blom's plotting positions, with a reference line through the quartiles and the
 * Shapiro-Wilk test in the subtitle. Points on the line agree with normal errors; a bow
 * says skew, an S says tails heavier or lighter than normal.
 *
 * Past {@link MAX_POINTS} residuals it draws an even sample of the ranks, every rank in
 * the two tails and every marked residual, and says so.
 */
import { normalQuantile } from '../stats/distributions/index.ts';
import { SHAPIRO_WILK_MAX_N, SHAPIRO_WILK_MIN_N, shapiroWilk } from '../stats/diagnostics/index.ts';
import { quantileSorted } from '../stats/summary/index.ts';
import { MAX_LABELS, MAX_POINTS, evenSample } from './large.ts';
import { CUT, assemble, flagEncoding, labelLayer, num, tip, type Json } from './layers.ts';
import { MUTED } from './look.ts';
import { chanceWords, dataRow, marked, residualDatum, residualTips, toLabel } from './residuals.ts';
import { derivedTitle, readName } from './titles.ts';
import type { ChartResult, ResidualInput } from './types.ts';
import { count, counted, fig, flaggedWords, ordinal, pText } from '../messages/charts.ts';

/** Ranks kept at each end of a sampled plot: the tails are where departures show. */
export const TAIL_RANKS = 50;

/**
 * Blom's plotting positions (i - 3/8) / (n + 1/4), i = 1..n.
 * source: G. Blom (1958), Statistical Estimates and Transformed Beta-Variables, Wiley.
 */
export function blomPositions(n: number): Float64Array {
  const p = new Float64Array(n);
  for (let i = 0; i < n; i++) p[i] = (i + 1 - 0.375) / (n + 0.25);
  return p;
}

/** The reference line through the quartiles: residual = intercept + slope * quantile. */
export interface QuartileLine {
  readonly slope: number;
  readonly intercept: number;
}

/**
 * The line through (z(0.25), Q1) and (z(0.75), Q3), with Q1 and Q3 the sample quartiles
 * (Hyndman and Fan's definition 7, as everywhere in src/stats) and z the standard normal
 * quantile: it follows the middle half of the data, so a few wild points do not tilt it.
 */
export function quartileLine(sorted: Float64Array): QuartileLine {
  const z1 = normalQuantile(0.25);
  const z3 = normalQuantile(0.75);
  const q1 = quantileSorted(sorted, 0.25);
  const q3 = quantileSorted(sorted, 0.75);
  const slope = (q3 - q1) / (z3 - z1);
  return { slope, intercept: q1 - slope * z1 };
}

/** The Shapiro-Wilk words of the subtitle (and whether a test was made). */
function shapiroWords(r: Float64Array): string {
  const n = r.length;
  if (n < SHAPIRO_WILK_MIN_N || n > SHAPIRO_WILK_MAX_N) {
    return `Shapiro-Wilk test not made: it covers ${SHAPIRO_WILK_MIN_N} to ${count(SHAPIRO_WILK_MAX_N)} residuals, this fit has ${count(n)}`;
  }
  try {
    const sw = shapiroWilk(r);
    return `Shapiro-Wilk W = ${fig(sw.w, 'statistic')}, ${pText(sw.p)}`;
  } catch (err) {
    return `Shapiro-Wilk test not made: ${err instanceof Error ? err.message : String(err)}`;
  }
}

/** The normal probability plot; see the module note. */
export function normalChart(input: ResidualInput): ChartResult {
  const r = input.residuals;
  const n = r.length;
  const warnings: string[] = [];
  // ranks: ties keep data order, so the plot is the same on every run
  const order = Int32Array.from({ length: n }, (_, k) => k).sort((a, b) => r[a]! - r[b]! || a - b);
  const sorted = Float64Array.from(order, (k) => r[k]!);
  const positions = blomPositions(n);
  const { at, rows } = marked(input);
  const isMarked = new Uint8Array(n);
  for (const k of at) isMarked[k] = 1;

  // which ranks to draw
  let ranks: Int32Array;
  let sampleWords = '';
  if (n <= MAX_POINTS) ranks = Int32Array.from({ length: n }, (_, i) => i);
  else {
    const extra: number[] = [];
    for (let i = 0; i < Math.min(TAIL_RANKS, n); i++) extra.push(i, n - 1 - i);
    for (let i = 0; i < n; i++) if (isMarked[order[i]!] === 1) extra.push(i);
    const s = evenSample(n, MAX_POINTS - extra.length, extra);
    ranks = s.at;
    sampleWords = `${count(ranks.length)} of ${count(n)} points drawn (every ${ordinal(s.stride)} rank, all ${TAIL_RANKS} at each end and every marked residual)`;
  }

  const labelAt = new Set(toLabel(input, at));
  const values: Json[] = [];
  const labelled: Json[] = [];
  for (const i of ranks) {
    const k = order[i]!;
    const d = residualDatum(input, k, isMarked[k] === 1);
    d.q = num(normalQuantile(positions[i]!));
    values.push(d);
    if (labelAt.has(k)) labelled.push({ ...d, label: `row ${dataRow(input, k)}` });
  }
  if (at.length > MAX_LABELS) warnings.push(`${count(at.length)} residuals lie beyond ${CUT} studentized units; the ${MAX_LABELS} largest are labelled with their rows.`);

  const yTitle = derivedTitle('residual of', input.response);
  const xTitle = 'normal quantile (Blom plotting positions)';
  const x = { field: 'q', type: 'quantitative', title: xTitle };
  const y = { field: 'residual', type: 'quantitative', title: yTitle };
  const layers: Json[] = [];
  const line = quartileLine(sorted);
  if (Number.isFinite(line.slope) && n >= 2) {
    const lo = normalQuantile(positions[0]!);
    const hi = normalQuantile(positions[n - 1]!);
    layers.push({
      data: { values: [lo, hi].map((q) => ({ q, line: line.intercept + line.slope * q })) },
      mark: { type: 'line', color: MUTED, strokeDash: [4, 3], strokeWidth: 1 },
      encoding: { x, y: { field: 'line', type: 'quantitative', title: yTitle } },
    });
  }
  layers.push({
    data: { values },
    mark: { type: 'point' },
    encoding: { x, y, ...flagEncoding(at.length > 0), tooltip: [...residualTips(input), tip('q', 'normal quantile')] },
  });
  if (labelled.length > 0) layers.push(labelLayer(labelled, { x, y }));

  const sw = shapiroWords(r);
  const chance = chanceWords(n);
  const parts = [`${counted(n, 'residual')} of ${readName(input.response).label}`, flaggedWords(rows, CUT) + (chance === null ? '' : `, ${chance}`), sw];
  parts.push(`reference line through the quartiles (slope ${fig(line.slope)})`);
  if (sampleWords !== '') parts.push(sampleWords);
  return {
    spec: assemble('Normal probability plot of the residuals', sw, { layer: layers }),
    caption: `${parts.join('; ')}.`,
    warnings,
  };
}
