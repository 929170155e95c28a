/**
 * Summaries of one column: missing values are left out, and a warning on the cell says how
 * many. Sums of squares use the exact decimal shift of typed data.
 */
import { UsageError } from '../lang/errors.ts';
import { msg } from '../messages/language.ts';
import { numberColumn, table, textColumn, type Column, type NumberColumn } from '../lang/values.ts';
import * as S from '../stats/summary/index.ts';
import { LEVEL_ORDER_RULE, completeRows, completeValues, factorOf, levelName, plainValues, presentRows, responseOf } from './columns.ts';
import type { Builtin, CallContext } from '../lang/builtins.ts';
import { fnMsg } from '../messages/functions.ts';

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
    // borrowed: read here and let go (completeValues)
    const r = completeValues(x, ctx, true);
    return S.sum(r.y) + r.offset * r.y.length;
  }),
  summary('mean', 'The arithmetic mean of the values.', 'mean(plots.yield)', (x, ctx) => {
    const r = completeValues(x, ctx, true);
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
    (x, ctx) => S.variance(completeValues(x, ctx, true).y),
  ),
  summary('sd', 'The sample standard deviation: the square root of the sample variance (divisor n - 1).', 'sd(plots.yield)', (x, ctx) => S.sd(completeValues(x, ctx, true).y)),
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
    doc: `Summaries of y within each level of \`by\`: count, mean, standard deviation and standard error of the mean (sd / sqrt(n)). Rows with a missing value are left out. ${LEVEL_ORDER_RULE}`,
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
    doc: `The distinct values of a column (its levels); missing values are left out. A number is one level whatever way it was typed (1, 1.0 and 01 are one level; so are -0 and 0). ${LEVEL_ORDER_RULE}`,
    example: 'levels(plots.variety)',
    run: (a) => {
      const c = a.get('x') as Column;
      const f = factorOf(c, presentRows(c), 'x');
      if (f.levels.length === 0 && c.values.length > 0) throw new UsageError(fnMsg.allMissing());
      return textColumn(f.levels, null, c.name);
    },
  },
  {
    name: 'level_order',
    category: 'summaries',
    params: [
      { name: 'x', type: 'column', doc: 'A column of levels (treatments, blocks, groups).' },
      { name: 'levels', type: 'levels', doc: 'Every level of x, in the order wanted; the first is the reference.' },
    ],
    returns: 'the same column, with its levels in that order',
    doc: 'Sets the order of a column\'s levels for everything that reads it: means tables, comparisons (a two-group difference is the first level minus the second), levels, group_stats and charts. Every level that appears in the column must be listed, once. Without it, levels are in increasing numeric order when every level starts with a number, and otherwise in the order they first appear.',
    example: 'level_order(plots.dose, ["control", "low", "high"])',
    run: (a) => {
      const c = a.get('x') as Column;
      const list = a.get('levels') as Column;
      const order: string[] = [];
      const seen = new Set<string>();
      for (let i = 0; i < list.values.length; i++) {
        if (list.missing !== null && list.missing[i] === 1) continue;
        const name = levelName(list, i);
        if (seen.has(name)) throw new UsageError(msg.orderRepeats(name));
        seen.add(name);
        order.push(name);
      }
      const present = factorOf({ ...c, order: undefined } as Column, presentRows(c), 'x').levels;
      const unknown = order.filter((l) => !present.includes(l));
      if (unknown.length > 0) throw new UsageError(msg.orderUnknown(c.name ?? 'x', unknown));
      const unlisted = present.filter((l) => !seen.has(l));
      if (unlisted.length > 0) throw new UsageError(msg.levelNotInOrder(c.name ?? 'x', unlisted));
      return { ...c, order };
    },
  },
];
