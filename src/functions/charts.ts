/**
 * Chart built-ins (docs/language.md section 7): residuals, normal probability, means, pairwise
 * differences, cell-mean profiles and a plain scatter, wired from src/charts. Each returns a
 * chart value whose spec carries its data inline; what the chart had to leave out or
 * approximate goes to the cell as a warning.
 */
import { MISSING, isMissing, type Chart, type Column, type NumberColumn, type RecordValue, type Table, type TextColumn, type Value } from '../lang/values.ts';
import { UsageError } from '../lang/errors.ts';
import { msg } from '../messages/language.ts';
import {
  MAX_MEANS_LEVELS,
  MAX_PAIRS,
  meansChart,
  normalChart,
  pairwiseChart,
  profileChart,
  residualsChart,
  scatterChart,
  type ChartResult,
  type ProfileInput,
  type ResidualAxis,
  type ResidualInput,
} from '../charts/index.ts';
import { completeRows, factorOf } from './columns.ts';
import { fitInternal, type FitInternal } from './designs.ts';
import type { Builtin, CallContext } from '../lang/builtins.ts';
import { fnMsg } from '../messages/functions.ts';

const FIT = { name: 'fit', type: 'fit' as const, doc: 'The fit to draw.' };

/** A chart value from a builder's result, its warnings passed to the cell. */
function chartValue(r: ChartResult, ctx: CallContext): Chart {
  for (const w of r.warnings) ctx.warn(w);
  return { kind: 'chart', spec: r.spec, caption: r.caption };
}

/** The residuals of a fit as the chart builders take them. */
function residualInput(record: RecordValue): { input: ResidualInput; internal: FitInternal } {
  const internal = fitInternal(record);
  const fit = internal.fit;
  if (!(fit.df_error > 0)) {
    throw new UsageError(fnMsg.noResidualsToPlot(fit.design, fit.effects !== undefined));
  }
  return {
    internal,
    input: {
      residuals: fit.residuals,
      fitted: fit.fitted,
      studentized: fit.studentized_residuals,
      y: internal.y,
      rows: internal.rows,
      response: internal.response,
      factors: internal.factors,
    },
  };
}

/** The x axis of residuals_chart for an `against` text (checked against the fit's design). */
function residualAxis(against: string, internal: FitInternal): ResidualAxis {
  switch (against) {
    case 'fitted':
    case 'order':
      return against;
    case 'treatment':
      return { factor: 0 };
    case 'block':
      if (internal.fit.kind === 'split_plot') return { factor: 2 };
      if (internal.fit.kind === 'across_sites') return { factor: 1 };
      if (internal.fit.kind !== 'blocked') {
        throw new UsageError(fnMsg.noBlocksToPlot(internal.fit.design));
      }
      return { factor: 1 };
    default:
      throw new UsageError(fnMsg.unknownAxis(against));
  }
}

/** Which factors a profile chart draws for each design, and the test it reports. */
function profileOf(internal: FitInternal): ProfileInput {
  const fit = internal.fit;
  const [first, second] = internal.factors;
  if (first === undefined || second === undefined) {
    throw new UsageError(fnMsg.interactionNeedsTwo(fit.design));
  }
  const base = { y: internal.y, response: internal.response };
  switch (fit.kind) {
    case 'factorial': {
      // one line per level of the second factor, across the levels of the first
      const term = `${first.name}:${second.name}`;
      const i = fit.table.source.indexOf(term);
      const f = i < 0 ? NaN : fit.table.f[i]!;
      const test = Number.isFinite(f)
        ? { label: `${term} interaction`, f, df1: fit.table.df[i]!, df2: fit.df_error, p: fit.table.p[i]! }
        : null;
      return { ...base, across: first, lines: second, test, averagedOver: internal.factors.slice(2).map((x) => x.name) };
    }
    case 'split_plot': {
      // one line per whole-plot level across the subplot levels, averaged over blocks
      const term = `${first.name}:${second.name}`;
      const i = fit.table.source.indexOf(term);
      const f = i < 0 ? NaN : fit.table.f[i]!;
      const test = Number.isFinite(f) ? { label: `${term} interaction`, f, df1: fit.table.df[i]!, df2: fit.df_error, p: fit.table.p[i]! } : null;
      return { ...base, across: second, lines: first, test, averagedOver: internal.factors.slice(2).map((x) => x.name) };
    }
    case 'across_sites': {
      // one line per treatment across the sites: where a treatment wins and where it does not
      const site = internal.factors[2]!;
      const term = `${first.name}:${site.name}`;
      const i = fit.table.source.indexOf(term);
      const f = i < 0 ? NaN : fit.table.f[i]!;
      const test = Number.isFinite(f) ? { label: `${term} interaction`, f, df1: fit.table.df[i]!, df2: fit.df_error, p: fit.table.p[i]! } : null;
      return { ...base, across: site, lines: first, test, averagedOver: [second.name] };
    }
    default: {
      // blocked and Latin square: one line per treatment, across the blocks (or rows)
      const na = fit.nonadditivity;
      const test = na === undefined ? null : { label: "Tukey's test for nonadditivity", f: na.f, df1: na.df1, df2: na.df2, p: na.p };
      return { ...base, across: second, lines: first, test, averagedOver: [] };
    }
  }
}

function tableColumn(t: Table, name: string): Column {
  const i = t.names.indexOf(name);
  const c = i < 0 ? undefined : t.columns[i];
  if (c === undefined) throw new UsageError(fnMsg.pairsLacksColumn(name));
  return c;
}

function numbersOf(t: Table, name: string): Float64Array {
  const c = tableColumn(t, name);
  if (c.type !== 'number') throw new UsageError(fnMsg.pairsColumnNotNumbers(name));
  const out = Float64Array.from(c.values);
  if (c.missing !== null) for (let i = 0; i < out.length; i++) if (c.missing[i] === 1) out[i] = NaN;
  return out;
}

function textsOf(t: Table, name: string): string[] {
  const c = tableColumn(t, name);
  if (c.type === 'text') return [...(c as TextColumn).values];
  return Array.from({ length: c.values.length }, (_, i) => String(c.values[i]));
}

function field(r: RecordValue, name: string): Value {
  const v = r.fields.get(name);
  if (v === undefined) throw new UsageError(fnMsg.pairsLacksField(name));
  return v;
}

export const CHARTS: readonly Builtin[] = [
  {
    name: 'residuals_chart',
    category: 'charts',
    params: [
      FIT,
      { name: 'against', type: 'text', default: 'fitted', choices: ['fitted', 'order', 'treatment', 'block'], doc: 'What the residuals are drawn against.' },
    ],
    returns: 'a chart',
    doc: 'The residuals of a fit against its fitted values, the order of the rows in the table, the treatments, or the blocks of a blocked fit, with a line at zero. A residual whose internally studentized value is beyond 3 in size (a rule of thumb) is drawn in another colour and shape and labelled with its row of the table. Funnels, curves or runs in this chart question the analysis more than any test does. Past 5,000 residuals the chart shows counts in bins, with the marked residuals drawn one by one.',
    example: 'residuals_chart(fit, against: "order")',
    run: (a, ctx) => {
      const { input, internal } = residualInput(a.get('fit') as RecordValue);
      const fit = internal.fit;
      return chartValue(residualsChart(input, residualAxis(a.get('against') as string, internal), { sd: fit.sd, df: fit.df_error }), ctx);
    },
  },
  {
    name: 'normal_chart',
    category: 'charts',
    params: [FIT],
    returns: 'a chart',
    doc: 'Normal probability plot of the residuals of a fit: each sorted residual against the normal quantile of Blom’s plotting position (i - 3/8)/(n + 1/4), with a reference line through the quartiles and the Shapiro-Wilk test (Royston’s algorithm) in the subtitle. Points near the line agree with normal errors; a bow says skew and an S says heavier or lighter tails. A large p-value does not prove the errors normal. Residuals beyond 3 studentized units are marked and labelled with their rows.',
    example: 'normal_chart(fit)',
    run: (a, ctx) => chartValue(normalChart(residualInput(a.get('fit') as RecordValue).input), ctx),
  },
  {
    name: 'means_chart',
    category: 'charts',
    params: [FIT],
    returns: 'a chart',
    doc: 'The treatment means of a fit with their confidence intervals (from the error mean square, at the fit’s level), one row per treatment, highest mean at the top. The intervals are each for one mean; to compare treatments, use pairwise and pairwise_chart. With missing plots, the means are least-squares means; with a covariate, means adjusted to the covariate’s mean; for a split plot, the whole-plot means with intervals from the whole-plot error; across sites, intervals from the treatment-by-site mean square.',
    example: 'means_chart(fit)',
    run: (a, ctx) => {
      const internal = fitInternal(a.get('fit') as RecordValue);
      const fit = internal.fit;
      const m = fit.means;
      if (m.level.length > MAX_MEANS_LEVELS) throw new UsageError(msg.tooManyLevelsToDraw(m.level.length, MAX_MEANS_LEVELS));
      return chartValue(
        meansChart({
          factor: fit.treatment,
          response: internal.response,
          levels: m.level,
          n: m.n,
          mean: m.mean,
          se: m.se,
          low: m.low,
          high: m.high,
          level: fit.level,
          dfError: fit.factor_means[0]?.error?.df ?? fit.df_error,
          leastSquares: !fit.balanced,
          ...(fit.covariate === undefined ? {} : { adjustedFor: fit.covariate.name }),
          ...(fit.split !== undefined ? { errorName: fnMsg.errorTermWholePlot() } : fit.sites !== undefined ? { errorName: fnMsg.errorTermSites() } : {}),
        }),
        ctx,
      );
    },
  },
  {
    name: 'pairwise_chart',
    category: 'charts',
    params: [{ name: 'pairs', type: 'pairs', doc: 'The differences to draw, as pairwise(fit) gives them.' }],
    returns: 'a chart',
    doc: 'Every pairwise difference of treatment means with its interval, as pairwise adjusted it (Tukey, Bonferroni or unadjusted), in the order of the pairs table, with a line at zero. Intervals that exclude zero are drawn in another colour and shape. An interval that includes zero does not show the two treatments equal: its ends say how large a difference the data still allow.',
    example: 'pairwise_chart(pairwise(fit, method: "tukey"))',
    run: (a, ctx) => {
      const r = a.get('pairs') as RecordValue;
      const t = field(r, 'table');
      if (typeof t !== 'object' || t.kind !== 'table') throw new UsageError(fnMsg.pairsLacksTable());
      if (t.rows === 0) throw new UsageError(fnMsg.noPairsToDraw());
      if (t.rows > MAX_PAIRS) throw new UsageError(msg.tooManyPairsToDraw(t.rows, MAX_PAIRS));
      const num = (name: string): number => {
        const v = field(r, name);
        return typeof v === 'number' ? v : NaN;
      };
      return chartValue(
        pairwiseChart({
          method: String(field(r, 'method')),
          level: num('level'),
          factor: String(field(r, 'factor')),
          df: num('df'),
          critical: num('critical'),
          a: textsOf(t, 'a'),
          b: textsOf(t, 'b'),
          estimate: numbersOf(t, 'estimate'),
          se: numbersOf(t, 'se'),
          low: numbersOf(t, 'low'),
          high: numbersOf(t, 'high'),
          p: numbersOf(t, 'p'),
        }),
        ctx,
      );
    },
  },
  {
    name: 'interaction_chart',
    category: 'charts',
    params: [FIT],
    returns: 'a chart',
    doc: 'Cell means drawn as profiles. For a factorial fit: the mean response of each level of the second factor (one line each) across the levels of the first, averaged over any further factors, with the test of their interaction. For a blocked fit (or a Latin square): each treatment’s value across the blocks (or rows), with Tukey’s test for nonadditivity where it applies. For a split plot: each whole-plot level across the subplot levels, with the test of their interaction. For a series across sites: each treatment across the sites, which shows where a treatment wins and where it does not. Lines that run parallel mean the effects add; lines that cross or fan out mean they do not.',
    example: 'interaction_chart(fit)',
    run: (a, ctx) => chartValue(profileChart(profileOf(fitInternal(a.get('fit') as RecordValue))), ctx),
  },
  {
    name: 'scatter',
    category: 'charts',
    params: [
      { name: 'x', type: 'numbers', doc: 'The values along the horizontal axis.' },
      { name: 'y', type: 'numbers', doc: 'The values along the vertical axis.' },
      { name: 'color', type: 'factor', default: MISSING, doc: 'Groups to colour (and shape) the points by; left out, one colour.' },
    ],
    returns: 'a chart',
    doc: 'A scatter of y against x, one point per row, coloured and shaped by the levels of `color` when it is given, with colours that colour-blind readers can tell apart. Rows with a missing value are left out and counted. Past 5,000 points the chart shows counts in bins (or, with groups, an even sample of the rows) and says so.',
    example: 'scatter(plots.height_cm, plots.yield_kg, color: plots.variety)',
    run: (a, ctx) => {
      const x = a.get('x') as NumberColumn;
      const y = a.get('y') as NumberColumn;
      const g = a.get('color')!;
      const group = isMissing(g) ? null : (g as Column);
      const cols: Column[] = group === null ? [x, y] : [x, y, group];
      const names = [x.name ?? 'x', y.name ?? 'y', group?.name ?? 'color'];
      const rows = completeRows(cols, ctx, names);
      const n = rows === null ? x.values.length : rows.length;
      if (n === 0) throw new UsageError(fnMsg.nothingToDraw());
      const at = (c: NumberColumn) => Float64Array.from({ length: n }, (_, k) => c.values[rows === null ? k : rows[k]!]!);
      return chartValue(
        scatterChart({
          x: at(x),
          y: at(y),
          rows,
          xName: x.name ?? 'x',
          yName: y.name ?? 'y',
          group: group === null ? null : factorOf(group, rows, 'color'),
          dropped: x.values.length - n,
        }),
        ctx,
      );
    },
  },
];
