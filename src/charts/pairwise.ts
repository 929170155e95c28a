/**
 * Pairwise differences of means with their intervals (adjusted as the method says), one row
 * per pair in the order of the pairs table, and a line at zero. An interval that excludes
 * zero is drawn in another colour and shape; the legend says which is which.
 */
import { pValueText } from '../format/digits.ts';
import { assemble, num, tip, zeroRule, type Json } from './layers.ts';
import { MARKED, MARKED_SHAPE, POINT, POINT_SHAPE, ROW_STEP, WIDTH } from './look.ts';
import { axisTitle, readName } from './titles.ts';
import type { ChartResult } from './types.ts';
import { count, counted, fig, percent } from '../messages/charts.ts';

/** The fields of a pairs record (the `pairwise` built-in). */
export interface PairsInput {
  /** "tukey", "bonferroni" or "lsd". */
  readonly method: string;
  readonly level: number;
  /** The factor's column name. */
  readonly factor: string;
  readonly df: number;
  readonly critical: number;
  readonly a: readonly string[];
  readonly b: readonly string[];
  readonly estimate: ArrayLike<number>;
  readonly se: ArrayLike<number>;
  readonly low: ArrayLike<number>;
  readonly high: ArrayLike<number>;
  readonly p: ArrayLike<number>;
}

/** Legend entries. */
export const EXCLUDES = 'interval excludes 0';
export const INCLUDES = 'interval includes 0';

/** More pairs than this make a tall chart; the caller is told. */
export const TALL_PAIRS = 300;
/**
 * The most pairs a pairwise chart draws (about 63 levels). 150 levels (11,175 pairs) ran
 * vega-lite's compiler out of stack, and 500 levels made a 61 MB spec; the pairs table lists
 * every pair.
 */
export const MAX_PAIRS = 2000;

/** How each method is named in the title and explained in the caption. */
const METHODS: ReadonlyMap<string, { title: string; words: string }> = new Map([
  ['tukey', { title: 'Tukey', words: "simultaneous intervals by Tukey's honestly significant difference (Tukey-Kramer for unequal counts)" }],
  ['bonferroni', { title: 'Bonferroni', words: 'Bonferroni-adjusted intervals' }],
  ['lsd', { title: 'unadjusted (least significant difference)', words: 'each interval at its level alone, not adjusted for the number of pairs' }],
]);

/** The pairwise chart; see the module note. */
export function pairwiseChart(p: PairsInput): ChartResult {
  const m = p.a.length;
  const warnings: string[] = [];
  const method = METHODS.get(p.method) ?? { title: p.method, words: `${p.method} intervals` };
  let excluding = 0;
  const values: Json[] = [];
  for (let i = 0; i < m; i++) {
    const low = p.low[i]!;
    const high = p.high[i]!;
    const excludes = low > 0 || high < 0;
    if (excludes) excluding++;
    values.push({
      pair: `${p.a[i]} − ${p.b[i]}`,
      a: p.a[i]!,
      b: p.b[i]!,
      estimate: num(p.estimate[i]!),
      se: num(p.se[i]!),
      low: num(low),
      high: num(high),
      p: num(p.p[i]!),
      p_text: Number.isNaN(p.p[i]!) ? '' : pValueText(p.p[i]!),
      side: excludes ? EXCLUDES : INCLUDES,
    });
  }
  if (m > TALL_PAIRS) warnings.push(`${count(m)} pairs make a tall chart; the pairs table lists them too.`);

  const factor = readName(p.factor).label;
  const xTitle = 'difference of means (first minus second)';
  const x = { field: 'estimate', type: 'quantitative', title: xTitle };
  const y = { field: 'pair', type: 'nominal', sort: values.map((v) => v.pair), title: `pair of ${axisTitle(p.factor)} levels` };
  const scale = (range: readonly string[]) => ({ domain: [INCLUDES, EXCLUDES], range });
  const color = { field: 'side', type: 'nominal', scale: scale([POINT, MARKED]), legend: { title: null } };
  const shape = { field: 'side', type: 'nominal', scale: scale([POINT_SHAPE, MARKED_SHAPE]), legend: { title: null } };
  const tooltip = [tip('a', 'first', false), tip('b', 'second', false), tip('estimate', 'difference'), tip('se', 'standard error'), tip('low', 'low'), tip('high', 'high'), tip('p_text', p.method === 'lsd' ? 'p' : 'adjusted p', false)];
  const layers: Json[] = [
    zeroRule('x', xTitle),
    {
      data: { values },
      mark: { type: 'rule', strokeWidth: 2, opacity: 0.6 },
      encoding: { y, x: { field: 'low', type: 'quantitative', title: xTitle }, x2: { field: 'high' }, color, tooltip },
    },
    { data: { values }, mark: { type: 'point', size: 64, opacity: 1 }, encoding: { y, x, color, shape, tooltip } },
  ];
  const pct = percent(p.level);
  const title = `Differences of ${factor} means, ${method.title} ${pct} intervals`;
  const caption = [
    `${counted(m, 'pair')} of ${factor} means`,
    `${pct} ${method.words} on ${count(p.df)} df (estimate ± ${fig(p.critical)} standard errors)`,
    `${count(excluding)} of ${count(m)} interval${m === 1 ? '' : 's'} exclude${m === 1 ? 's' : ''} zero`,
  ].join('; ');
  return {
    spec: assemble(title, null, { layer: layers }, { width: WIDTH, height: { step: ROW_STEP } }),
    caption: `${caption}.`,
    warnings,
  };
}
