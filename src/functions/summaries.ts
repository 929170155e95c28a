/**
 * Summaries of one column: missing values are left out, and a warning on the cell says how
 * many. Sums of squares use the exact decimal shift of typed data.
 */
import { UsageError } from '../lang/errors.ts';
import { numberColumn, table, textColumn, type Column, type NumberColumn } from '../lang/values.ts';
import * as S from '../stats/summary/index.ts';
import { completeRows, completeValues, factorOf, levelName, plainValues, responseOf } from './columns.ts';
import type { Builtin, CallContext } from '../lang/builtins.ts';

const X = { name: 'x', type: 'numbers' as const, doc: 'A column of numbers; missing values are left out.' };

function summary(name: string, doc: string, example: string, f: (x: NumberColumn, ctx: CallContext) => number): Builtin {
  return { name, category: 'summaries', params: [X], returns: 'a number', doc, example, run: (a, ctx) => f(a.get('x') as NumberColumn, ctx) };
}

export const SUMMARIES: readonly Builtin[] = [
  {
    name: 'count',
    category: 'summaries',
    params: [{ name: 'x', type: 'column', doc: 'Any column.' }],
    returns: 'a number',
    doc: 'The number of values in a column that are not missing.',
    example: 'count(plots.yield)',
    run: (a) => {
      const c = a.get('x') as Column;
      let n = 0;
      for (let i = 0; i < c.values.length; i++) if (c.missing === null || c.missing[i] === 0) n++;
      return n;
    },
  },
  summary('sum', 'The sum of the values (compensated summation, so long columns keep their digits).', 'sum(plots.yield)', (x, ctx) => {
    const r = completeValues(x, ctx);
    return S.sum(r.y) + r.offset * r.y.length;
  }),
  summary('mean', 'The arithmetic mean of the values.', 'mean(plots.yield)', (x, ctx) => {
    const r = completeValues(x, ctx);
    return r.offset + S.mean(r.y);
  }),
  summary('median', 'The median: the middle value, or the mean of the two middle values.', 'median(plots.yield)', (x, ctx) => {
    const r = completeValues(x, ctx);
    return r.offset + S.median(r.y);
  }),
  summary(
    'variance',
    'The sample variance, with divisor n - 1, from deviations about the mean (two passes), so data with many constant leading digits keep their precision. NaN for fewer than two values.',
    'variance(plots.yield)',
    (x, ctx) => S.variance(completeValues(x, ctx).y),
  ),
  summary('sd', 'The sample standard deviation: the square root of the sample variance (divisor n - 1).', 'sd(plots.yield)', (x, ctx) => S.sd(completeValues(x, ctx).y)),
  summary('min', 'The smallest value that is not missing.', 'min(plots.yield)', (x, ctx) => {
    const r = completeValues(x, ctx);
    return r.y.length === 0 ? NaN : S.min(plainValues(r));
  }),
  summary('max', 'The largest value that is not missing.', 'max(plots.yield)', (x, ctx) => {
    const r = completeValues(x, ctx);
    return r.y.length === 0 ? NaN : S.max(plainValues(r));
  }),
  {
    name: 'quantile',
    category: 'summaries',
    params: [X, { name: 'p', type: 'probability', doc: 'The proportion below the quantile, from 0 to 1.' }],
    returns: 'a number',
    doc: 'The sample quantile at proportion p, by linear interpolation between order statistics (definition 7 of Hyndman and Fan, 1996): quantile(x, 0.5) is the median.',
    example: 'quantile(plots.yield, 0.9)',
    run: (a, ctx) => {
      const r = completeValues(a.get('x') as NumberColumn, ctx);
      return r.offset + S.quantile(r.y, a.get('p') as number);
    },
  },
  {
    name: 'group_stats',
    category: 'summaries',
    params: [
      { name: 'y', type: 'numbers', doc: 'The measurements.' },
      { name: 'by', type: 'factor', doc: 'The group of each measurement.' },
    ],
    returns: 'a table with columns level, n, mean, sd, se',
    doc: 'Summaries of y within each level of `by`, in the order the levels first appear: count, mean, standard deviation and standard error of the mean (sd / sqrt(n)). Rows with a missing value are left out.',
    example: 'group_stats(plots.yield, plots.variety)',
    run: (a, ctx) => {
      const y = a.get('y') as NumberColumn;
      const by = a.get('by') as Column;
      const rows = completeRows([y, by], ctx, ['y', 'by']);
      const r = responseOf(y, rows);
      const f = factorOf(by, rows, 'by');
      const g = S.groupStats(r.y, { codes: f.codes, levels: f.levels });
      const mean = g.mean.map((m) => m + r.offset);
      return table(
        ['level', 'n', 'mean', 'sd', 'se'],
        [textColumn(g.level, null, 'level'), numberColumn(Float64Array.from(g.n), null, 'n'), numberColumn(mean, null, 'mean'), numberColumn(g.sd, null, 'sd'), numberColumn(g.se, null, 'se')],
      );
    },
  },
  {
    name: 'levels',
    category: 'summaries',
    params: [{ name: 'x', type: 'column', doc: 'Any column.' }],
    returns: 'a column of texts',
    doc: 'The distinct values of a column, in the order they first appear; missing values are left out.',
    example: 'levels(plots.variety)',
    run: (a) => {
      const c = a.get('x') as Column;
      const seen = new Set<string>();
      const out: string[] = [];
      for (let i = 0; i < c.values.length; i++) {
        if (c.missing !== null && c.missing[i] === 1) continue;
        const name = levelName(c, i);
        if (!seen.has(name)) {
          seen.add(name);
          out.push(name);
        }
      }
      if (out.length === 0 && c.values.length > 0) throw new UsageError('every value of the column is missing.');
      return textColumn(out, null, c.name);
    },
  },
];
