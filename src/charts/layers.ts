/**
 * Pieces that several charts share: the zero line, the marking of residuals beyond the
 * cut-off (shape and colour, never colour alone), row labels, tooltips, and the final
 * assembly with the look of look.ts.
 *
 * Every datum a chart carries uses field names of our own (`x`, `residual`, `row`, `f0`):
 * a user's column name can contain dots or brackets, which vega-lite would read as a path
 * into nested data, and it never becomes a key of the spec. Column names appear only as
 * titles.
 */
import { chartFormat, MEASURED_CHART_FORMAT, quantityOf } from '../format/digits.ts';
import { CONFIG, HEIGHT, MARKED, MARKED_SHAPE, POINT, POINT_SHAPE, WIDTH } from './look.ts';
import type { ChartSpec } from './types.ts';

/** A JSON object of a spec under construction (checked against vega-lite's schema in the tests). */
export type Json = { [key: string]: unknown };

/** The cut-off for marking studentized residuals (common practice, no source: |r| > 3). */
export const CUT = 3;
/** Legend entries of ordinary and marked residuals. */
export const WITHIN = `within ${CUT} studentized units`;
export const BEYOND = `beyond ${CUT} studentized units`;

/** A horizontal (axis 'y') or vertical (axis 'x') rule at zero, with a one-row data set of its own. */
export function zeroRule(axis: 'x' | 'y', title: string): Json {
  return {
    data: { values: [{ zero: 0 }] },
    mark: { type: 'rule', strokeDash: [4, 3] },
    encoding: { [axis]: { field: 'zero', type: 'quantitative', title } },
  };
}

/**
 * Colour and shape of points by their `flag` field ({@link WITHIN} or {@link BEYOND}); when
 * nothing is marked, a plain colour and no legend.
 */
export function flagEncoding(anyMarked: boolean): Json {
  if (!anyMarked) return { color: { value: POINT }, shape: { value: POINT_SHAPE } };
  const scale = (range: readonly string[]) => ({ domain: [WITHIN, BEYOND], range });
  return {
    color: { field: 'flag', type: 'nominal', scale: scale([POINT, MARKED]), legend: { title: null } },
    shape: { field: 'flag', type: 'nominal', scale: scale([POINT_SHAPE, MARKED_SHAPE]), legend: { title: null } },
    // a marked point a little larger, so that it stands out in print as well
    size: { condition: { test: { field: 'flag', equal: BEYOND }, value: 72 }, value: 38 },
  };
}

/**
 * A legend that lists every one of `k` levels (vega drops entries past 30 unless told, and
 * warns), in rows of at most 8.
 */
export function fullLegend(k: number): Json {
  return { symbolLimit: k, columns: Math.min(k, 8) };
}

/** The mark of points beyond the cut-off drawn over a binned view. */
export function markedPointMark(): Json {
  return { type: 'point', filled: true, color: MARKED, shape: MARKED_SHAPE, size: 60, opacity: 1 };
}

/** A layer of row labels (`row 17`) beside the given points. */
export function labelLayer(values: readonly Json[], encoding: Json): Json {
  return {
    data: { values },
    mark: { type: 'text', align: 'left', baseline: 'middle', dx: 7, dy: -6 },
    encoding: { ...encoding, text: { field: 'label', type: 'nominal' } },
  };
}

/**
 * One tooltip entry: a number, written by the digits policy for the quantity its field name
 * says (an estimate when the name says nothing), or a text. p-values go in as texts.
 */
export function tip(field: string, title: string, numeric = true): Json {
  if (!numeric) return { field, type: 'nominal', title };
  const q = quantityOf(field);
  return { field, type: 'quantitative', title, format: chartFormat(q === 'plain' || q === 'p' ? 'estimate' : q) };
}

/** A tooltip entry for a measured value, as many digits as data carry (see {@link MEASURED_CHART_FORMAT}). */
export function measuredTip(field: string, title: string): Json {
  return { field, type: 'quantitative', title, format: MEASURED_CHART_FORMAT };
}

/** A number for a datum: NaN and infinities become null (JSON has no NaN). */
export function num(x: number): number | null {
  return Number.isFinite(x) ? x : null;
}

/**
 * The whole spec: title and subtitle, the look, a fixed size unless the chart sets its own,
 * and the body (layers or a single view). No `$schema` (a URL) and no `usermeta`.
 */
export function assemble(title: string, subtitle: string | null, body: Json, size: Json = { width: WIDTH, height: HEIGHT }): ChartSpec {
  const spec: Json = {
    title: subtitle === null ? { text: title } : { text: title, subtitle },
    ...size,
    config: CONFIG,
    ...body,
  };
  // The shapes above are checked against vega-lite's JSON schema in test/charts.
  return expressionSafe(spec) as unknown as ChartSpec;
}

/** Characters that vega-lite does not escape when it writes a text into an expression. */
const UNSAFE_IN_EXPRESSIONS = /[\\\n\r\u2028\u2029]/;

/**
 * vega-lite writes titles, tooltip labels and sort orders into the expressions it generates,
 * escaping only the double quote: a backslash or a line separator from a column name or a
 * level broke every chart, and a crafted name could end the string. Every text of the spec
 * (the user's words can only be texts: field names are our own) is therefore written with a
 * backslash shown as its look-alike U+29F5 and line breaks as spaces. Texts in the data are
 * changed the same way, so that sort orders still match their values.
 */
export function expressionSafe(v: unknown): unknown {
  if (typeof v === 'string') return UNSAFE_IN_EXPRESSIONS.test(v) ? v.replace(/\\/g, '\u29F5').replace(/[\n\r\u2028\u2029]/g, ' ') : v;
  if (Array.isArray(v)) return v.map(expressionSafe);
  if (v !== null && typeof v === 'object') {
    const out: Json = {};
    for (const [k, x] of Object.entries(v as Json)) out[k] = expressionSafe(x);
    return out;
  }
  return v;
}
