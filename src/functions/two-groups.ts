/**
 * Two-group comparisons and rank-based tests, wired from src/stats.
 */
import { formatNumber } from '../lang/format.ts';
import { msg } from '../messages/language.ts';
import { MISSING, joinDecimals, numberColumn, pickDecimals, type Column, type NumberColumn } from '../lang/values.ts';
import { friedman, kruskalWallis, rankSum, signedRank } from '../stats/ranks/index.ts';
import { paired, twoSample } from '../stats/two-groups/index.ts';
import { shiftDecimals } from '../stats/decimal/index.ts';
import { completeRows, factorOf, responseOf } from './columns.ts';
import { EXACT_FIT_RELATIVE } from './exact.ts';
import { guarded, toRecord } from './records.ts';
import type { Builtin, CallContext } from '../lang/builtins.ts';
import { IGNORED_BLOCKS_DOC, warnIgnoredBlocks } from './ignored-blocks.ts';

const LEVEL = { name: 'level', type: 'level' as const, default: 0.95, doc: 'Confidence level of the interval.' };

/** Paired columns at the complete pairs, on one common exact shift when both keep their text. */
function pairedValues(a: NumberColumn, b: NumberColumn, ctx: CallContext): { a: Float64Array; b: Float64Array } {
  const rows = completeRows([a, b], ctx, ['a', 'b']);
  const pick = (c: NumberColumn): NumberColumn => {
    if (rows === null) return c;
    const v = Float64Array.from(rows, (i) => c.values[i]!);
    return numberColumn(v, null, c.name, c.decimals === null ? null : pickDecimals(c.decimals, rows));
  };
  const pa = pick(a);
  const pb = pick(b);
  if (pa.decimals !== null && pb.decimals !== null) {
    try {
      const s = shiftDecimals(joinDecimals(pa.decimals, pb.decimals));
      const n = pa.values.length;
      return { a: s.shifted.subarray(0, n), b: s.shifted.subarray(n) };
    } catch {
      // fall back to the binary values
    }
  }
  return { a: pa.values, b: pb.values };
}

/** A response and a factor at their complete rows. */
function responseAndFactor(y: NumberColumn, g: Column, ctx: CallContext, names: [string, string]) {
  const rows = completeRows([y, g], ctx, names);
  const r = responseOf(y, rows);
  const f = factorOf(g, rows, names[1]);
  return { r, groups: { codes: f.codes, levels: f.levels } };
}

export const TWO_GROUPS: readonly Builtin[] = [
  {
    name: 'two_sample',
    category: 'two groups',
    params: [
      { name: 'y', type: 'numbers', doc: 'The measurements.' },
      { name: 'group', type: 'factor', doc: 'The group of each measurement; exactly two levels.' },
      LEVEL,
      { name: 'equal_variance', type: 'boolean', default: true, doc: 'true for the pooled-variance t test, false for Welch’s.' },
    ],
    returns: 'a record: estimate se df t p low high level n pooled_variance, and each group’s n, mean, sd',
    doc: 'Compares the means of two independent groups with Student’s t: the pooled-variance form by default, or Welch’s form with Satterthwaite’s degrees of freedom when equal_variance is false. The estimate is the first level minus the second, levels taken in the order of the level rule (see level_order); the interval is two-sided at `level`.' + IGNORED_BLOCKS_DOC,
    example: 'two_sample(trial.hours, trial.drug, equal_variance: false)',
    run: (a, ctx) => {
      const { r, groups } = responseAndFactor(a.get('y') as NumberColumn, a.get('group') as Column, ctx, ['y', 'group']);
      const res = guarded(() => twoSample(r.y, groups, a.get('level') as number, a.get('equal_variance') as boolean));
      warnIgnoredBlocks(ctx, 'y', 'group', a.get('y') as Column, a.get('group') as Column, (y, g, b) => `blocked(${y}, ${g}, ${b}) (the paired comparison)`);
      return toRecord({ ...res, first_mean: res.first_mean + r.offset, second_mean: res.second_mean + r.offset }, 'comparison');
    },
  },
  {
    name: 'paired',
    category: 'two groups',
    params: [
      { name: 'a', type: 'numbers', doc: 'The first measurement of each unit.' },
      { name: 'b', type: 'numbers', doc: 'The second measurement of the same units, in the same order.' },
      LEVEL,
    ],
    returns: 'a record: estimate se df t p low high level n sd',
    doc: 'Paired t comparison: Student’s t on the differences a - b, unit by unit (each unit is a block of two). Pairs with a missing value are left out.',
    example: 'paired(sleep.drug_1, sleep.drug_2)',
    run: (a, ctx) => {
      const v = pairedValues(a.get('a') as NumberColumn, a.get('b') as NumberColumn, ctx);
      const res = guarded(() => paired(v.a, v.b, a.get('level') as number));
      // every difference the same (to rounding): t would divide by nothing
      if (!(res.sd > EXACT_FIT_RELATIVE * Math.abs(res.estimate)) && res.n >= 2) {
        ctx.warn(msg.pairedAllEqual(res.n, formatNumber(res.estimate)));
        return toRecord({ ...res, se: 0, t: MISSING, p: MISSING, low: MISSING, high: MISSING }, 'comparison');
      }
      return toRecord({ ...res }, 'comparison');
    },
  },
  {
    name: 'friedman',
    category: 'rank-based',
    params: [
      { name: 'y', type: 'numbers', doc: 'The measurements.' },
      { name: 'treatment', type: 'factor', doc: 'The treatment of each measurement.' },
      { name: 'block', type: 'factor', doc: 'The block of each measurement; one measurement per treatment in each block.' },
    ],
    returns: 'a record: statistic df p treatments blocks tie_correction level rank_sum',
    doc: 'Friedman’s rank test for treatments in complete blocks: ranks within each block (ties share their average rank), the chi-square form of the statistic with the tie correction, and its large-sample chi-square p-value.',
    example: 'friedman(plots.yield, plots.variety, plots.block)',
    run: (a, ctx) => {
      const y = a.get('y') as NumberColumn;
      const t = a.get('treatment') as Column;
      const b = a.get('block') as Column;
      const rows = completeRows([y, t, b], ctx, ['y', 'treatment', 'block']);
      const r = responseOf(y, rows);
      const ft = factorOf(t, rows, 'treatment');
      const fb = factorOf(b, rows, 'block');
      return toRecord({ ...guarded(() => friedman(r.y, ft, fb)) }, 'test');
    },
  },
  {
    name: 'kruskal_wallis',
    category: 'rank-based',
    params: [
      { name: 'y', type: 'numbers', doc: 'The measurements.' },
      { name: 'treatment', type: 'factor', doc: 'The group of each measurement.' },
    ],
    returns: 'a record: statistic df p n tie_correction level level_n mean_rank',
    doc: 'The Kruskal-Wallis rank test for differences among several independent groups, with the tie correction and the large-sample chi-square p-value.' + IGNORED_BLOCKS_DOC,
    example: 'kruskal_wallis(plants.weight, plants.group)',
    run: (a, ctx) => {
      const { r, groups } = responseAndFactor(a.get('y') as NumberColumn, a.get('treatment') as Column, ctx, ['y', 'treatment']);
      const res = toRecord({ ...guarded(() => kruskalWallis(r.y, groups)) }, 'test');
      warnIgnoredBlocks(ctx, 'y', 'treatment', a.get('y') as Column, a.get('treatment') as Column, (y, t, b) => `friedman(${y}, ${t}, ${b})`);
      return res;
    },
  },
  {
    name: 'signed_rank',
    category: 'rank-based',
    params: [
      { name: 'a', type: 'numbers', doc: 'The first measurement of each unit.' },
      { name: 'b', type: 'numbers', doc: 'The second measurement of the same units.' },
    ],
    returns: 'a record: statistic n zeros tie_groups z p method',
    doc: 'Wilcoxon’s signed rank test on the paired differences a - b. Zero differences are dropped and counted; the p-value is exact for up to 50 pairs without ties, and from the normal approximation with tie and continuity corrections otherwise (`method` says which).',
    example: 'signed_rank(sleep.drug_1, sleep.drug_2)',
    run: (a, ctx) => {
      const v = pairedValues(a.get('a') as NumberColumn, a.get('b') as NumberColumn, ctx);
      return toRecord({ ...guarded(() => signedRank(v.a, v.b)) }, 'test');
    },
  },
  {
    name: 'rank_sum',
    category: 'rank-based',
    params: [
      { name: 'y', type: 'numbers', doc: 'The measurements.' },
      { name: 'group', type: 'factor', doc: 'The group of each measurement; exactly two levels.' },
    ],
    returns: 'a record: rank_sum u n1 n2 first_level second_level tie_groups z p method',
    doc: 'Wilcoxon’s rank sum test (Mann and Whitney’s U) for two independent groups: exact p-value for groups of up to 50 without ties, normal approximation with tie and continuity corrections otherwise (`method` says which).' + IGNORED_BLOCKS_DOC,
    example: 'rank_sum(trial.hours, trial.drug)',
    run: (a, ctx) => {
      const { r, groups } = responseAndFactor(a.get('y') as NumberColumn, a.get('group') as Column, ctx, ['y', 'group']);
      const res = toRecord({ ...guarded(() => rankSum(r.y, groups)) }, 'test');
      warnIgnoredBlocks(ctx, 'y', 'group', a.get('y') as Column, a.get('group') as Column, (y, g, b) => `signed_rank on the pairs, or friedman(${y}, ${g}, ${b}),`);
      return res;
    },
  },
];

