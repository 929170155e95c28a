/**
 * Design built-ins (one_way, blocked, latin_square, factorial) and what comes after a fit
 * (difference, pairwise, contrast, residual_checks), wired from src/stats.
 *
 * A fit record shows the fields of docs/language.md section 8; its `internal` part keeps the
 * numeric fit and the data it came from, for the comparisons, the checks and the charts.
 */
import { UsageError } from '../lang/errors.ts';
import { pPhrase } from '../format/digits.ts';
import { formatNumber } from '../lang/format.ts';
import { msg } from '../messages/language.ts';
import { MISSING, isColumn, numberColumn, record, textColumn, type Column, type NumberColumn, type RecordValue, type Table, type Value } from '../lang/values.ts';
import { contrast, difference, pairwise } from '../stats/compare/index.ts';
import { blocked, factorial, latinSquare, oneWay, splitPlotSuspicion, withCovariate, type Covariate, type DesignFit } from '../stats/designs/index.ts';
import { brownForsythe, shapiroWilk, studentizedFlags } from '../stats/diagnostics/index.ts';
import { MAX_GROUPS } from '../stats/distributions/index.ts';
import { isExactFit } from './exact.ts';
import { LEVEL, columnsTable, finish, fitInternal, nonadditivityRecord, prepare, spread, type FitInternal, type Prepared } from './fits.ts';
import { factorOf, numberLevel, resolveLevel, responseOf } from './columns.ts';
import { guarded, toRecord } from './records.ts';
import type { Builtin } from '../lang/builtins.ts';
import { IGNORED_BLOCKS_DOC, warnIgnoredBlocks } from './ignored-blocks.ts';
import { fnMsg } from '../messages/functions.ts';
import { planningMsg } from '../messages/planning.ts';

export { fitInternal, type FitInternal } from './fits.ts';

const Y = { name: 'y', type: 'numbers' as const, doc: 'The measurements (the response).' };
const COVARIATE = { name: 'covariate', type: 'numbers' as const, default: MISSING, doc: 'A measurement taken before treatment (start weight, stand count) to adjust for; left out, no adjustment.' };
const FACTOR = { name: 'factor', type: 'text' as const, default: MISSING, doc: 'Which factor’s levels to compare (a split plot’s subplot factor, say); left out, the treatment (for a split plot, the whole-plot factor).' };
const AT = { name: 'at', type: 'level_name' as const, default: MISSING, doc: 'Split plots: compare the levels at this one level of the other factor (its own standard error, stated in the notes).' };

/** The optional text of a named argument left out as missing. */
function optionalText(v: Value | undefined): string | undefined {
  if (v === undefined || (typeof v === 'object' && v.kind === 'missing')) return undefined;
  return levelText(v);
}

/** A comparison's record, with its notes only when it has something to say. */
function comparisonRecord(r: object & { notes: string[] }): RecordValue {
  const { notes, ...rest } = r;
  return toRecord(notes.length > 0 ? { ...rest, notes } : rest, 'comparison');
}

/**
 * The covariate at the rows the response and factors kept, shifted exactly like a response.
 * A covariate missing where the response was measured is an error, never a silent drop.
 */
function covariateOf(c: NumberColumn, p: Prepared): Covariate {
  if (c.values.length !== p.length) throw new UsageError(fnMsg.covariateLength(c.values.length, p.length));
  if (c.missing !== null) {
    let k = 0;
    const rows = p.rows;
    const n = rows === null ? p.length : rows.length;
    for (let j = 0; j < n; j++) if (c.missing[rows === null ? j : rows[j]!] === 1) k++;
    if (k > 0) throw new UsageError(fnMsg.covariateMissing(c.name, k));
  }
  const r = responseOf(c, p.rows);
  return { name: c.name ?? 'covariate', values: r.y, offset: r.offset };
}

export const DESIGNS: readonly Builtin[] = [
  {
    name: 'one_way',
    category: 'designs',
    params: [Y, { name: 'treatment', type: 'factor', doc: 'The treatment of each measurement.' }, COVARIATE],
    returns: 'a fit record (with slope and slope_se when a covariate is given)',
    doc: 'One-way analysis of variance for a completely randomized design: the treatment and error sums of squares from centred two-pass sums on the exactly shifted data, F and its p-value, and the treatment means with intervals from the error mean square. Unequal group sizes are fine. With `covariate: x`, an analysis of covariance with one common slope: the table gains a row named after the covariate, each sum of squares adjusted for the other terms, the record gains `slope` and `slope_se`, `means` become means adjusted to the covariate’s overall mean, comparisons use them, and residual_checks tests that the slopes are parallel.' + IGNORED_BLOCKS_DOC,
    example: 'one_way(plants.weight, plants.group)',
    run: (a, ctx) => {
      const cov = a.get('covariate')!;
      const p = prepare(a.get('y') as NumberColumn, [{ col: a.get('treatment') as Column, role: 'treatment' }], ctx);
      let fit: RecordValue;
      if (isColumn(cov)) {
        const x = covariateOf(cov as NumberColumn, p);
        fit = finish(p, guarded(() => withCovariate(p.y, x, p.factors[0]!, null, { offset: p.offset, dropped: p.dropped })));
      } else {
        fit = finish(p, guarded(() => oneWay(p.y, p.factors[0]!, { offset: p.offset, dropped: p.dropped })));
      }
      warnIgnoredBlocks(ctx, 'y', 'treatment', a.get('y') as Column, a.get('treatment') as Column, (y, t, b) => `blocked(${y}, ${t}, ${b}${isColumn(cov) ? ', covariate: …' : ''})`);
      return fit;
    },
  },
  {
    name: 'blocked',
    category: 'designs',
    params: [
      Y,
      { name: 'treatment', type: 'factor', doc: 'The treatment of each measurement.' },
      { name: 'block', type: 'factor', doc: 'The block (batch, field, day, subject) of each measurement.' },
      COVARIATE,
    ],
    returns: 'a fit record with relative_efficiency and nonadditivity (slope and slope_se instead with a covariate)',
    doc: 'Analysis of variance for randomized complete blocks. Balanced data use closed-form sums; when a block lacks a treatment or cells have unequal counts, the model is fitted by least squares and each factor’s sum of squares is adjusted for the other, with the error degrees of freedom reduced and the missing cells named in `notes`. Adds the relative efficiency against a completely randomized design (with Fisher’s degrees-of-freedom correction) and, with one plot per cell, Tukey’s one-degree-of-freedom test for nonadditivity. With `covariate: x`, an analysis of covariance with one common slope: the treatment sum of squares is adjusted for the covariate and blocks, the blocks for treatments and the covariate, the covariate (its own row) for treatments and blocks; `slope`, `slope_se`, and means adjusted to the covariate’s overall mean, averaged over blocks.',
    example: 'blocked(plots.yield, plots.variety, plots.block)',
    run: (a, ctx) => {
      const p = prepare(
        a.get('y') as NumberColumn,
        [
          { col: a.get('treatment') as Column, role: 'treatment' },
          { col: a.get('block') as Column, role: 'block' },
        ],
        ctx,
      );
      const cov = a.get('covariate')!;
      if (isColumn(cov)) {
        const x = covariateOf(cov as NumberColumn, p);
        return finish(p, guarded(() => withCovariate(p.y, x, p.factors[0]!, p.factors[1]!, { offset: p.offset, dropped: p.dropped })));
      }
      return finish(p, guarded(() => blocked(p.y, p.factors[0]!, p.factors[1]!, { offset: p.offset, dropped: p.dropped })));
    },
  },
  {
    name: 'latin_square',
    category: 'designs',
    params: [
      Y,
      { name: 'treatment', type: 'factor', doc: 'The treatment of each measurement.' },
      { name: 'row', type: 'factor', doc: 'The row of the square.' },
      { name: 'column', type: 'factor', doc: 'The column of the square.' },
    ],
    returns: 'a fit record',
    doc: 'Analysis of variance for a Latin square: treatments, rows and columns, each with as many levels as the others and each treatment once in every row and column. Missing plots are fitted by least squares with adjusted sums of squares.',
    example: 'latin_square(runs.wear, runs.material, runs.day, runs.machine)',
    run: (a, ctx) => {
      const p = prepare(
        a.get('y') as NumberColumn,
        [
          { col: a.get('treatment') as Column, role: 'treatment' },
          { col: a.get('row') as Column, role: 'row' },
          { col: a.get('column') as Column, role: 'column' },
        ],
        ctx,
      );
      return finish(p, guarded(() => latinSquare(p.y, p.factors[0]!, p.factors[1]!, p.factors[2]!, { offset: p.offset, dropped: p.dropped })));
    },
  },
  {
    name: 'factorial',
    category: 'designs',
    params: [Y, { name: 'factors', type: 'factors', doc: 'The factors as a list of columns, such as [runs.speed, runs.feed].' }],
    returns: 'a fit record (with effects for two-level factors)',
    doc: 'Analysis of variance for a factorial experiment with two or more factors and all their interactions. With unequal cell counts, each term’s sum of squares is adjusted (`ss_method` says how). An unreplicated two-level factorial has no error term: its record gives the effects and Lenth’s pseudo standard error with its margins instead of F tests.',
    example: 'factorial(runs.finish, [runs.speed, runs.feed])',
    run: (a, ctx) => {
      const f = a.get('factors')!;
      const cols: { col: Column; role: string }[] = isColumn(f)
        ? [{ col: f, role: f.name ?? 'factor_1' }]
        : (f as Table).columns.map((c, i) => ({ col: c, role: (f as Table).names[i]! }));
      const p = prepare(a.get('y') as NumberColumn, cols, ctx);
      // factor names come from the list's column names
      p.factors = p.factors.map((fc, i) => ({ ...fc, name: cols[i]!.role }));
      const suspicion = splitPlotWarning(ctx.sourceTable?.('y')?.table ?? null, a.get('y') as NumberColumn, cols.map((c) => c.col), p);
      if (suspicion !== null) ctx.warn(suspicion);
      return finish(p, guarded(() => factorial(p.y, p.factors, { offset: p.offset, dropped: p.dropped })));
    },
  },
  {
    name: 'difference',
    category: 'after a fit',
    params: [
      { name: 'fit', type: 'fit', doc: 'A fit.' },
      { name: 'a', type: 'level_name', doc: 'The first treatment level.' },
      { name: 'b', type: 'level_name', doc: 'The second treatment level.' },
      LEVEL,
      FACTOR,
      AT,
    ],
    returns: 'a record: a b estimate se df t p low high level',
    doc: 'The difference of two treatment means (a minus b) with its standard error from the fit’s error mean square (least-squares means when data are missing, adjusted means with a covariate), a t test on the error degrees of freedom and a two-sided interval at `level`. Not adjusted for looking at several pairs: use pairwise for that. `factor:` compares the levels of another factor of the fit (a split plot’s subplot factor); `at:` compares them at one level of the other factor of a split plot. Where a fit has more than one error (split plots, series across sites), the right one is used and named in the result’s notes, with Satterthwaite’s degrees of freedom where two errors combine.',
    example: 'difference(fit, "open", "spindle")',
    run: (a) => {
      const i = comparable(fitInternal(a.get('fit') as RecordValue));
      const factor = optionalText(a.get('factor'));
      const levels = i.fit.factor_means.find((m) => m.factor === (factor ?? i.fit.treatment))?.levels ?? i.fit.means.level;
      const r = guarded(() => difference(i.fit, resolveLevel(a.get('a')!, levels), resolveLevel(a.get('b')!, levels), a.get('level') as number, factor, optionalAt(a.get('at'), i.fit, factor)));
      return comparisonRecord(r);
    },
  },
  {
    name: 'pairwise',
    category: 'after a fit',
    params: [
      { name: 'fit', type: 'fit', doc: 'A fit.' },
      { name: 'method', type: 'text', default: 'tukey', choices: ['tukey', 'bonferroni', 'lsd'], doc: 'How intervals allow for the number of pairs.' },
      LEVEL,
      FACTOR,
      AT,
    ],
    returns: 'a pairs record: method level factor df critical, and a table of every pair (a b estimate se low high p significant)',
    doc: 'Every pairwise difference of treatment means with intervals: "tukey" (Tukey’s honestly significant difference, Tukey-Kramer for unequal counts, from the studentized range), "bonferroni" (t intervals at level 1 - (1 - level)/pairs), or "lsd" (unadjusted t intervals, each at `level`). `factor:` and `at:` choose the means as in difference, with the error that kind of comparison needs (named in the notes).',
    example: 'pairwise(fit, method: "tukey")',
    run: (a) => {
      const i = comparable(fitInternal(a.get('fit') as RecordValue));
      const method = a.get('method') as string;
      const factorName = optionalText(a.get('factor')) ?? i.fit.treatment;
      const k = i.fit.factor_means.find((m) => m.factor === factorName)?.levels.length ?? i.fit.means.level.length;
      if (method === 'tukey' && k > MAX_GROUPS) {
        throw new UsageError(fnMsg.tukeyTooManyMeans(MAX_GROUPS, k));
      }
      const r = guarded(() => pairwise(i.fit, method, a.get('level') as number, optionalText(a.get('factor')), optionalAt(a.get('at'), i.fit, optionalText(a.get('factor')))));
      return record(
        [
          ['method', r.method],
          ['level', r.level],
          ['factor', r.factor],
          ['df', r.df],
          ['critical', r.critical],
          ['table', columnsTable(r.table as unknown as Record<string, ArrayLike<unknown>>, ['a', 'b', 'estimate', 'se', 'low', 'high', 'p', 'significant'])],
          ...(r.notes.length > 0 ? [['notes', textColumn(r.notes, null, 'notes')] as [string, Value]] : []),
        ],
        'pairs',
      );
    },
  },
  {
    name: 'contrast',
    category: 'after a fit',
    params: [
      { name: 'fit', type: 'fit', doc: 'A fit.' },
      { name: 'weights', type: 'numbers', doc: 'One weight per treatment level, in the order of fit.means; they must sum to zero.' },
      LEVEL,
      FACTOR,
      AT,
    ],
    returns: 'a record: estimate se df t p low high level weights levels',
    doc: 'A linear contrast of the treatment means, sum of weight times mean, with its standard error from the error mean square, a t test and an interval. The weights must add up to zero and there must be one for each level, in the order of the means table. `factor:` and `at:` choose the means as in difference.',
    example: 'contrast(fit, [1, 1, -1, -1])',
    run: (a) => {
      const i = comparable(fitInternal(a.get('fit') as RecordValue));
      const w = a.get('weights') as NumberColumn;
      if (w.missing !== null) throw new UsageError(fnMsg.weightMissing());
      const r = guarded(() => contrast(i.fit, Array.from(w.values), a.get('level') as number, optionalText(a.get('factor')), optionalAt(a.get('at'), i.fit, optionalText(a.get('factor')))));
      return comparisonRecord(r);
    },
  },
  {
    name: 'residual_checks',
    category: 'after a fit',
    params: [{ name: 'fit', type: 'fit', doc: 'A fit.' }],
    returns: 'a record: shapiro_wilk, brown_forsythe, studentized, flagged, nonadditivity and parallel_slopes (where they apply), notes',
    doc: 'What to look at before believing an F test (a fit that leaves no error, one that fits every observation exactly, says so instead): the Shapiro-Wilk test of the residuals (Royston’s algorithm), the Brown-Forsythe test of equal spread across treatments (across the cells of a factorial; on the residuals, centred at group medians), the internally studentized residuals with the rows beyond 3 in absolute value flagged (a rule of thumb), Tukey’s nonadditivity test for blocked fits with one plot per cell, and, for fits with a covariate, the test that the slopes are parallel (the treatment-by-covariate interaction against the common slope).',
    example: 'residual_checks(fit)',
    run: (a) => {
      const i = fitInternal(a.get('fit') as RecordValue);
      const fit = i.fit;
      const notes: string[] = [];
      const fields: [string, Value][] = [];
      const r = fit.residuals;
      if (isExactFit(fit)) {
        // residuals that are zero to rounding are noise: testing them would mislead
        return record(
          [
            ['shapiro_wilk', MISSING],
            ['brown_forsythe', MISSING],
            ['studentized', spread(fit.studentized_residuals, i.rows, i.length, 'studentized')],
            ['flagged', numberColumn(new Float64Array(0), null, 'row')],
            ['notes', textColumn([msg.exactFitResiduals()], null, 'notes')],
          ],
          'checks',
        );
      }
      if (r.length >= 3 && r.length <= 5000) {
        const sw = guarded(() => shapiroWilk(r));
        fields.push(['shapiro_wilk', record([['w', sw.w], ['p', sw.p], ['n', sw.n]], 'test')]);
      } else {
        fields.push(['shapiro_wilk', MISSING]);
        notes.push(fnMsg.shapiroWilkSize(r.length));
      }
      try {
        const bf = brownForsythe(r, spreadGroups(i));
        fields.push(['brown_forsythe', record([['f', bf.f], ['df1', bf.df1], ['df2', bf.df2], ['p', bf.p]], 'test')]);
      } catch (err) {
        fields.push(['brown_forsythe', MISSING]);
        notes.push(fnMsg.noBrownForsythe(err instanceof Error ? err.message : String(err)));
      }
      const st = fit.studentized_residuals;
      fields.push(['studentized', spread(st, i.rows, i.length, 'studentized')]);
      const flags = studentizedFlags(st, 3); // common practice, no source: |r| > 3 stands out
      const flaggedRows = Float64Array.from(flags.indices, (k) => (i.rows === null ? k : i.rows[k]!) + 1);
      fields.push(['flagged', numberColumn(flaggedRows, null, 'row')]);
      if (flaggedRows.length > 0) {
        notes.push(fnMsg.rowsFlagged([...flaggedRows].map((x) => formatNumber(x))));
      }
      if (fit.nonadditivity !== undefined) fields.push(['nonadditivity', nonadditivityRecord(fit.nonadditivity)]);
      if (fit.covariate !== undefined) {
        const ps = fit.covariate.parallel;
        fields.push(['parallel_slopes', record([['ss', ps.ss], ['f', ps.f], ['df1', ps.df1], ['df2', ps.df2], ['p', ps.p]], 'test')]);
        if (ps.p < 0.05) {
          notes.push(fnMsg.slopesDiffer(fit.covariate.name, pPhrase(ps.p)));
        }
      }
      if (fit.split !== undefined) {
        notes.push(fnMsg.withinWholePlots(fit.df_error, formatNumber(fit.split.dfWhole)));
      }
      fields.push(['notes', textColumn(notes, null, 'notes')]);
      return record(fields, 'checks');
    },
  },
];

/** Refuses a comparison on a fit that leaves no error to compare against. */
function comparable(i: FitInternal): FitInternal {
  if (isExactFit(i.fit)) throw new UsageError(msg.exactFitNoComparison());
  return i;
}

/**
 * The groups whose spreads Brown-Forsythe compares: the treatments, or in a factorial the
 * cells (every combination of the factors), since the model fits each cell's mean.
 */
function spreadGroups(i: FitInternal): { codes: Int32Array; levels: string[] } {
  const t = i.factors[0]!;
  if (i.fit.kind !== 'factorial' || i.factors.length < 2) return { codes: t.codes, levels: t.levels };
  const index = new Map<string, number>();
  const levels: string[] = [];
  const codes = new Int32Array(t.codes.length);
  for (let k = 0; k < codes.length; k++) {
    const name = i.factors.map((f) => f.levels[f.codes[k]!]!).join(' × ');
    let c = index.get(name);
    if (c === undefined) {
      c = levels.length;
      index.set(name, c);
      levels.push(name);
    }
    codes[k] = c;
  }
  return { codes, levels };
}

/**
 * A warning when the table the data came from names whole plots: one factor is constant on
 * each of them while another varies inside, so the factorial's F for the first is formed
 * against the wrong error. Null when nothing suggests a split plot.
 */
function splitPlotWarning(owner: Table | null, y: NumberColumn, factorCols: readonly Column[], p: Prepared): string | null {
  if (owner === null) return null;
  const used = new Set<Column>([y, ...factorCols]);
  const others = owner.columns
    .filter((c) => !used.has(c) && c.values.length === p.length)
    .map((c, i) => factorOf(c, p.rows, c.name ?? `column_${i + 1}`));
  const s = splitPlotSuspicion(p.factors, others);
  if (s === null) return null;
  return planningMsg.splitPlotSuspected(s.whole, s.sub, s.unit);
}

/** A level given as text or a number, as the fit names it. */
function levelText(v: Value): string {
  if (typeof v === 'string') return v;
  if (typeof v === 'number') return numberLevel(v);
  return String(v);
}

/**
 * The `at` level of a split-plot comparison, resolved against the levels of the other factor
 * (a number typed for a level named "200" finds it), or undefined when left out.
 */
function optionalAt(v: Value | undefined, fit: DesignFit, factor: string | undefined): string | undefined {
  if (v === undefined || (typeof v === 'object' && v.kind === 'missing')) return undefined;
  const sp = fit.split;
  if (sp === undefined) return levelText(v);
  const other = (factor ?? fit.treatment) === sp.sub ? sp.wholeLevels : sp.subLevels;
  return resolveLevel(v, other);
}
