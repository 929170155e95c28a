/**
 * Design built-ins (one_way, blocked, latin_square, factorial) and what comes after a fit
 * (difference, pairwise, contrast, residual_checks), wired from src/stats.
 *
 * A fit record shows the fields of language.md section 8; its `internal` part keeps the
 * numeric fit and the data it came from, for the comparisons, the checks and the charts.
 */
import { UsageError } from '../lang/errors.ts';
import { formatNumber } from '../lang/format.ts';
import {
  MISSING,
  booleanColumn,
  isColumn,
  numberColumn,
  record,
  table,
  textColumn,
  type Column,
  type NumberColumn,
  type RecordValue,
  type Table,
  type Value,
} from '../lang/values.ts';
import { contrast, difference, pairwise } from '../stats/compare/index.ts';
import { blocked, factorial, latinSquare, oneWay, type DesignFit } from '../stats/designs/index.ts';
import { brownForsythe, shapiroWilk, studentizedFlags } from '../stats/diagnostics/index.ts';
import { MAX_GROUPS } from '../stats/distributions/index.ts';
import { completeRows, factorOf, responseOf, type Factor } from './columns.ts';
import { guarded, toRecord } from './records.ts';
import type { Builtin, CallContext } from '../lang/builtins.ts';

/** What a fit record keeps for later functions. */
export interface FitInternal {
  readonly fit: DesignFit;
  /** Rows of the data used (0-based), or null when every row was used. */
  readonly rows: Int32Array | null;
  /** Length of the data as given. */
  readonly length: number;
  /** The factors at the rows used, in model order. */
  readonly factors: readonly Factor[];
  /** Response values at the rows used (offset added back). */
  readonly y: Float64Array;
  /** The response's column name, for chart axes. */
  readonly response: string;
}

/** The internal part of a fit record (the record was checked to be a fit). */
export function fitInternal(r: RecordValue): FitInternal {
  const i = r.internal as FitInternal | undefined;
  if (i === undefined || i.fit === undefined) throw new UsageError('this record is not a fit made in this document.');
  return i;
}

const LEVEL = { name: 'level', type: 'level' as const, default: 0.95, doc: 'Confidence level of the intervals.' };

/** A number column with NaN shown as missing (an F that does not exist is not a number). */
function nanAsMissing(values: ArrayLike<number>, name: string): NumberColumn {
  const v = Float64Array.from(values as ArrayLike<number>);
  const miss = new Uint8Array(v.length);
  for (let i = 0; i < v.length; i++) if (Number.isNaN(v[i]!)) miss[i] = 1;
  return numberColumn(v, miss, name);
}

/** A column of the data's full length: values at the rows used, missing elsewhere. */
function spread(values: Float64Array, rows: Int32Array | null, length: number, name: string): NumberColumn {
  if (rows === null) return numberColumn(Float64Array.from(values), null, name);
  const out = new Float64Array(length).fill(NaN);
  const miss = new Uint8Array(length).fill(1);
  rows.forEach((r, k) => {
    out[r] = values[k]!;
    miss[r] = 0;
  });
  return numberColumn(out, miss, name);
}

function columnsTable(obj: Record<string, ArrayLike<unknown>>, order: readonly string[]): Table {
  const cols: Column[] = order.map((name) => {
    const v = obj[name]!;
    const first = v.length > 0 ? v[0] : 0;
    if (typeof first === 'string') return textColumn(Array.from(v as ArrayLike<string>), null, name);
    if (typeof first === 'boolean') return booleanColumn(Uint8Array.from(v as ArrayLike<boolean>, (b) => (b ? 1 : 0)), null, name);
    return nanAsMissing(v as ArrayLike<number>, name);
  });
  return table(order, cols);
}

/** The record of a fit: the contract's fields first, then what the design adds. */
function fitRecord(fit: DesignFit, internal: FitInternal): RecordValue {
  const { rows, length } = internal;
  const fields: [string, Value][] = [
    ['design', fit.design],
    ['table', columnsTable(fit.table as unknown as Record<string, ArrayLike<unknown>>, ['source', 'df', 'ss', 'ms', 'f', 'p'])],
    ['means', columnsTable(fit.means as unknown as Record<string, ArrayLike<unknown>>, ['level', 'n', 'mean', 'se', 'low', 'high'])],
    ['mse', fit.mse],
    ['df_error', fit.df_error],
    ['sd', fit.sd],
    ['grand_mean', fit.grand_mean],
    ['r2', fit.r2],
    ['fitted', spread(fit.fitted, rows, length, 'fitted')],
    ['residuals', spread(fit.residuals, rows, length, 'residuals')],
    ['studentized', spread(fit.studentized_residuals, rows, length, 'studentized')],
    ['balanced', fit.balanced],
  ];
  if (fit.relative_efficiency !== undefined) fields.push(['relative_efficiency', fit.relative_efficiency]);
  if (fit.nonadditivity !== undefined) {
    const na = fit.nonadditivity;
    fields.push(['nonadditivity', record([['ss', na.ss], ['f', na.f], ['p', na.p], ['df1', na.df1], ['df2', na.df2]], 'test')]);
  }
  if (fit.effects !== undefined) fields.push(['effects', columnsTable(fit.effects as unknown as Record<string, ArrayLike<unknown>>, ['term', 'estimate'])]);
  if (fit.lenth !== undefined) {
    const l = fit.lenth;
    fields.push([
      'lenth',
      record(
        [
          ['pse', l.pse],
          ['me', l.me],
          ['sme', l.sme],
          ['df', l.df],
          ['level', l.level],
        ],
        'margins',
      ),
    ]);
  }
  fields.push(['treatment', fit.treatment], ['n', fit.n], ['level', fit.level], ['ss_method', fit.ss_method]);
  fields.push(['notes', textColumn(fit.notes.slice(), null, 'notes')]);
  // the names its charts print are part of what the fit is
  const identity = JSON.stringify([internal.response, internal.factors.map((f) => [f.name, f.levels])]);
  return record(fields, 'fit', internal, identity);
}

/** The rows of a column that are not missing, or null when none is missing. */
function presentRows(c: Column): Int32Array | null {
  if (c.missing === null) return null;
  const out: number[] = [];
  for (let i = 0; i < c.values.length; i++) if (c.missing[i] !== 1) out.push(i);
  return Int32Array.from(out);
}

interface Prepared {
  y: Float64Array;
  offset: number;
  factors: Factor[];
  rows: Int32Array | null;
  length: number;
  dropped: number;
  response: string;
}

/** Complete cases of a response and factors, shifted exactly, with level codes. */
function prepare(y: NumberColumn, factorCols: readonly { col: Column; role: string }[], ctx: CallContext): Prepared {
  const names = ['y', ...factorCols.map((f) => f.role)];
  const rows = completeRows([y, ...factorCols.map((f) => f.col)], ctx, names);
  const r = responseOf(y, rows);
  const factors = factorCols.map((f) => factorOf(f.col, rows, f.role));
  if (rows !== null) {
    // a level that appears in the table but lost every row to missing values: a treatment
    // with no data cannot be compared, and silently leaving it out would hide that
    factorCols.forEach((f, j) => {
      const all = factorOf(f.col, presentRows(f.col), f.role);
      const kept = new Set(factors[j]!.levels);
      const lost = all.levels.filter((l) => !kept.has(l));
      if (lost.length > 0) {
        const name = factors[j]!.name;
        throw new UsageError(
          `${name} ${lost.map((l) => `"${l}"`).join(', ')} ${lost.length === 1 ? 'has' : 'have'} no measurement left (every ${lost.length === 1 ? 'one of its rows has' : 'row of them has'} a missing value), so ${lost.length === 1 ? 'it' : 'they'} cannot be estimated. Measure ${lost.length === 1 ? 'it' : 'them'}, or remove ${lost.length === 1 ? 'its rows' : 'their rows'} from the table.`,
        );
      }
    });
  }
  const seen = new Set<string>();
  for (const f of factors) {
    if (seen.has(f.name)) throw new UsageError(`two factors are both called "${f.name}"; each factor needs its own column.`);
    seen.add(f.name);
  }
  const length = y.values.length;
  return { y: r.y, offset: r.offset, factors, rows, length, dropped: rows === null ? 0 : length - rows.length, response: y.name ?? 'y' };
}

function finish(p: Prepared, fit: DesignFit): RecordValue {
  const y = new Float64Array(p.y.length);
  for (let i = 0; i < y.length; i++) y[i] = p.y[i]! + p.offset;
  return fitRecord(fit, { fit, rows: p.rows, length: p.length, factors: p.factors, y, response: p.response });
}

const Y = { name: 'y', type: 'numbers' as const, doc: 'The measurements (the response).' };

export const DESIGNS: readonly Builtin[] = [
  {
    name: 'one_way',
    category: 'designs',
    params: [Y, { name: 'treatment', type: 'factor', doc: 'The treatment of each measurement.' }],
    returns: 'a fit record',
    doc: 'One-way analysis of variance for a completely randomized design: the treatment and error sums of squares from centred two-pass sums on the exactly shifted data, F and its p-value, and the treatment means with intervals from the error mean square. Unequal group sizes are fine.',
    example: 'one_way(plants.weight, plants.group)',
    run: (a, ctx) => {
      const p = prepare(a.get('y') as NumberColumn, [{ col: a.get('treatment') as Column, role: 'treatment' }], ctx);
      return finish(p, guarded(() => oneWay(p.y, p.factors[0]!, { offset: p.offset, dropped: p.dropped })));
    },
  },
  {
    name: 'blocked',
    category: 'designs',
    params: [
      Y,
      { name: 'treatment', type: 'factor', doc: 'The treatment of each measurement.' },
      { name: 'block', type: 'factor', doc: 'The block (batch, field, day, subject) of each measurement.' },
    ],
    returns: 'a fit record with relative_efficiency and nonadditivity',
    doc: 'Analysis of variance for randomized complete blocks. Balanced data use closed-form sums; when a block lacks a treatment or cells have unequal counts, the model is fitted by least squares and each factor’s sum of squares is adjusted for the other, with the error degrees of freedom reduced and the missing cells named in `notes`. Adds the relative efficiency against a completely randomized design (with Fisher’s degrees-of-freedom correction) and, with one plot per cell, Tukey’s one-degree-of-freedom test for nonadditivity.',
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
    ],
    returns: 'a record: a b estimate se df t p low high level',
    doc: 'The difference of two treatment means (a minus b) with its standard error from the fit’s error mean square (least-squares means when data are missing), a t test on the error degrees of freedom and a two-sided interval at `level`. Not adjusted for looking at several pairs: use pairwise for that.',
    example: 'difference(fit, "open", "spindle")',
    run: (a) => {
      const i = fitInternal(a.get('fit') as RecordValue);
      const r = guarded(() => difference(i.fit, levelText(a.get('a')!), levelText(a.get('b')!), a.get('level') as number));
      return toRecord({ ...r }, 'comparison');
    },
  },
  {
    name: 'pairwise',
    category: 'after a fit',
    params: [
      { name: 'fit', type: 'fit', doc: 'A fit.' },
      { name: 'method', type: 'text', default: 'tukey', choices: ['tukey', 'bonferroni', 'lsd'], doc: 'How intervals allow for the number of pairs.' },
      LEVEL,
    ],
    returns: 'a pairs record: method level factor df critical, and a table of every pair (a b estimate se low high p significant)',
    doc: 'Every pairwise difference of treatment means with intervals: "tukey" (Tukey’s honestly significant difference, Tukey-Kramer for unequal counts, from the studentized range), "bonferroni" (t intervals at level 1 - (1 - level)/pairs), or "lsd" (unadjusted t intervals, each at `level`).',
    example: 'pairwise(fit, method: "tukey")',
    run: (a) => {
      const i = fitInternal(a.get('fit') as RecordValue);
      const method = a.get('method') as string;
      const k = i.fit.means.level.length;
      if (method === 'tukey' && k > MAX_GROUPS) {
        throw new UsageError(`Tukey intervals use the studentized range, computed here for up to ${MAX_GROUPS} means; this fit has ${k}. Use method: "bonferroni".`);
      }
      const r = guarded(() => pairwise(i.fit, method, a.get('level') as number));
      return record(
        [
          ['method', r.method],
          ['level', r.level],
          ['factor', r.factor],
          ['df', r.df],
          ['critical', r.critical],
          ['table', columnsTable(r.table as unknown as Record<string, ArrayLike<unknown>>, ['a', 'b', 'estimate', 'se', 'low', 'high', 'p', 'significant'])],
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
    ],
    returns: 'a record: estimate se df t p low high level weights levels',
    doc: 'A linear contrast of the treatment means, sum of weight times mean, with its standard error from the error mean square, a t test and an interval. The weights must add up to zero and there must be one for each level, in the order of the means table.',
    example: 'contrast(fit, [1, 1, -1, -1])',
    run: (a) => {
      const i = fitInternal(a.get('fit') as RecordValue);
      const w = a.get('weights') as NumberColumn;
      if (w.missing !== null) throw new UsageError('a weight is missing.');
      const r = guarded(() => contrast(i.fit, Array.from(w.values), a.get('level') as number));
      return toRecord({ ...r }, 'comparison');
    },
  },
  {
    name: 'residual_checks',
    category: 'after a fit',
    params: [{ name: 'fit', type: 'fit', doc: 'A fit.' }],
    returns: 'a record: shapiro_wilk, brown_forsythe, studentized, flagged, nonadditivity (where it applies), notes',
    doc: 'What to look at before believing an F test: the Shapiro-Wilk test of the residuals (Royston’s algorithm), the Brown-Forsythe test of equal spread across treatments (on the residuals, centred at group medians), the internally studentized residuals with the rows beyond 3 in absolute value flagged (a rule of thumb), and Tukey’s nonadditivity test for blocked fits with one plot per cell.',
    example: 'residual_checks(fit)',
    run: (a) => {
      const i = fitInternal(a.get('fit') as RecordValue);
      const fit = i.fit;
      const notes: string[] = [];
      const fields: [string, Value][] = [];
      const r = fit.residuals;
      if (r.length >= 3 && r.length <= 5000) {
        const sw = guarded(() => shapiroWilk(r));
        fields.push(['shapiro_wilk', record([['w', sw.w], ['p', sw.p], ['n', sw.n]], 'test')]);
      } else {
        fields.push(['shapiro_wilk', MISSING]);
        notes.push(`The Shapiro-Wilk test needs 3 to 5000 residuals; this fit has ${r.length}. Look at the normal probability plot instead.`);
      }
      const t = i.factors[0]!;
      try {
        const bf = brownForsythe(r, { codes: t.codes, levels: t.levels });
        fields.push(['brown_forsythe', record([['f', bf.f], ['df1', bf.df1], ['df2', bf.df2], ['p', bf.p]], 'test')]);
      } catch (err) {
        fields.push(['brown_forsythe', MISSING]);
        notes.push(`No Brown-Forsythe test: ${err instanceof Error ? err.message : String(err)}.`);
      }
      const st = fit.studentized_residuals;
      fields.push(['studentized', spread(st, i.rows, i.length, 'studentized')]);
      const flags = studentizedFlags(st, 3); // common practice, no source: |r| > 3 stands out
      const flaggedRows = Float64Array.from(flags.indices, (k) => (i.rows === null ? k : i.rows[k]!) + 1);
      fields.push(['flagged', numberColumn(flaggedRows, null, 'row')]);
      if (flaggedRows.length > 0) {
        notes.push(`Row${flaggedRows.length === 1 ? '' : 's'} ${[...flaggedRows].map((x) => formatNumber(x)).join(', ')} ha${flaggedRows.length === 1 ? 's a' : 've'} studentized residual${flaggedRows.length === 1 ? '' : 's'} beyond 3 in size (a rule of thumb): check ${flaggedRows.length === 1 ? 'that plot' : 'those plots'} in the table.`);
      }
      if (fit.nonadditivity !== undefined) {
        const na = fit.nonadditivity;
        fields.push(['nonadditivity', record([['ss', na.ss], ['f', na.f], ['p', na.p], ['df1', na.df1], ['df2', na.df2]], 'test')]);
      }
      fields.push(['notes', textColumn(notes, null, 'notes')]);
      return record(fields, 'checks');
    },
  },
];

/** A level given as text or a number, as the fit names it. */
function levelText(v: Value): string {
  if (typeof v === 'string') return v;
  if (typeof v === 'number') return formatNumber(v, 15);
  return String(v);
}
