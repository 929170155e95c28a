/**
 * Distribution built-ins: critical values and p-values for the tests of the trade.
 */
import { UsageError } from '../lang/errors.ts';
import { mapNumbers } from '../lang/elementwise.ts';
import * as dist from '../stats/distributions/index.ts';
import type { Builtin } from '../lang/builtins.ts';
import { fnMsg } from '../messages/functions.ts';

function positive(fn: string, name: string, v: number): number {
  if (!(v > 0)) throw new UsageError(fnMsg.notPositive(name, v));
  return v;
}

function groupsCount(v: number): number {
  if (!Number.isInteger(v) || v < 2) throw new UsageError(fnMsg.groupsNotWhole(v));
  if (v > dist.MAX_GROUPS) throw new UsageError(fnMsg.tooManyGroups(dist.MAX_GROUPS, v));
  return v;
}

const df = (name = 'df') => ({ name, type: 'number' as const, doc: 'Degrees of freedom (more than 0).' });

export const DISTRIBUTIONS: readonly Builtin[] = [
  {
    name: 't_critical',
    category: 'distributions',
    params: [{ name: 'level', type: 'level', doc: 'Confidence level, such as 0.95.' }, df()],
    returns: 'a number',
    doc: "Two-sided critical value of Student's t: the t with probability `level` between -t and t. With level 0.95 and 18 df it is 2.1009.",
    example: 't_critical(0.95, fit.df_error)',
    run: (a) => dist.tCritical(a.get('level') as number, positive('t_critical', 'df', a.get('df') as number)),
  },
  {
    name: 't_pvalue',
    category: 'distributions',
    params: [{ name: 't', type: 'numeric', doc: 'The t statistic, or a column of them.' }, df()],
    returns: 'a number, or a column',
    doc: "Two-sided p-value of Student's t: the probability of a |T| at least as large as |t|. Tails are computed directly, so small p-values keep their digits.",
    example: 't_pvalue(-4.06, 9)',
    run: (a) => {
      const d = positive('t_pvalue', 'df', a.get('df') as number);
      return mapNumbers(a.get('t')!, (t) => dist.tTwoSided(t, d));
    },
  },
  {
    name: 'f_critical',
    category: 'distributions',
    params: [{ name: 'level', type: 'level', doc: 'Confidence level, such as 0.95.' }, df('df1'), df('df2')],
    returns: 'a number',
    doc: 'Critical value of the F distribution: the f with probability 1 - level above it. With level 0.95 on 3 and 15 df it is 3.2874.',
    example: 'f_critical(0.95, 3, 15)',
    run: (a) =>
      dist.fCritical(
        a.get('level') as number,
        positive('f_critical', 'df1', a.get('df1') as number),
        positive('f_critical', 'df2', a.get('df2') as number),
      ),
  },
  {
    name: 'f_pvalue',
    category: 'distributions',
    params: [{ name: 'f', type: 'numeric', doc: 'The F statistic, or a column of them.' }, df('df1'), df('df2')],
    returns: 'a number, or a column',
    doc: 'Upper-tail p-value of the F distribution: the probability of an F at least as large as f, computed directly from the incomplete beta function.',
    example: 'f_pvalue(8.11, 3, 15)',
    run: (a) => {
      const d1 = positive('f_pvalue', 'df1', a.get('df1') as number);
      const d2 = positive('f_pvalue', 'df2', a.get('df2') as number);
      return mapNumbers(a.get('f')!, (f) => dist.fUpper(f, d1, d2));
    },
  },
  {
    name: 'normal_quantile',
    category: 'distributions',
    params: [{ name: 'p', type: 'numeric', doc: 'A probability between 0 and 1, or a column of them.' }],
    returns: 'a number, or a column',
    doc: 'Quantile of the standard normal distribution: the z with probability p below it. normal_quantile(0.975) is 1.96.',
    example: 'normal_quantile(0.975)',
    run: (a) => mapNumbers(a.get('p')!, (p) => (p >= 0 && p <= 1 ? dist.normalQuantile(p) : NaN)),
  },
  {
    name: 'chi2_pvalue',
    category: 'distributions',
    params: [{ name: 'x', type: 'numeric', doc: 'The chi-square statistic, or a column of them.' }, df()],
    returns: 'a number, or a column',
    doc: 'Upper-tail p-value of the chi-square distribution, computed directly from the upper incomplete gamma function.',
    example: 'chi2_pvalue(3.84, 1)',
    run: (a) => {
      const d = positive('chi2_pvalue', 'df', a.get('df') as number);
      return mapNumbers(a.get('x')!, (x) => dist.chi2Upper(x, d));
    },
  },
  {
    name: 'range_critical',
    category: 'distributions',
    params: [
      { name: 'level', type: 'level', doc: 'Confidence level, such as 0.95.' },
      { name: 'groups', type: 'number', doc: 'Number of means compared (at least 2).' },
      df(),
    ],
    returns: 'a number',
    doc: 'Critical value of the studentized range, as used by Tukey intervals: the q with probability `level` below it for the range of `groups` means with `df` error degrees of freedom.',
    example: 'range_critical(0.95, 4, 20)',
    run: (a) =>
      dist.rangeCritical(a.get('level') as number, groupsCount(a.get('groups') as number), positive('range_critical', 'df', a.get('df') as number)),
  },
];
