/**
 * The fit record and the data behind it: complete cases shifted exactly, level codes, the
 * record's fields in the contract's order (docs/language.md section 8) and the `internal` part
 * that comparisons, checks and charts read. Shared by every design built-in.
 */
import { withoutErrorTests } from './exact.ts';
import { UsageError } from '../lang/errors.ts';
import {
  MISSING,
  booleanColumn,
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
import type { DesignFit } from '../stats/designs/index.ts';
import { completeRows, factorOf, presentRows, responseOf, type Factor } from './columns.ts';
import type { CallContext } from '../lang/builtins.ts';
import { fnMsg } from '../messages/functions.ts';

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
  if (i === undefined || i.fit === undefined) throw new UsageError(fnMsg.notAFit());
  return i;
}

export const LEVEL = { name: 'level', type: 'level' as const, default: 0.95, doc: 'Confidence level of the intervals.' };

/** A number column with NaN shown as missing (an F that does not exist is not a number). */
export function nanAsMissing(values: ArrayLike<number>, name: string): NumberColumn {
  // a copy made by the typed array's own slice when it is one (Float64Array.from goes
  // element by element through the iterator, ten times slower on a million values)
  const v = values instanceof Float64Array ? values.slice() : Float64Array.from(values as ArrayLike<number>);
  const miss = new Uint8Array(v.length);
  for (let i = 0; i < v.length; i++) if (Number.isNaN(v[i]!)) miss[i] = 1;
  return numberColumn(v, miss, name);
}

/** A number that does not exist (an F or an efficiency of a fit with no error: 0 / 0) as missing, not NaN. */
export function numberOrMissing(x: number): number | typeof MISSING {
  return Number.isNaN(x) ? MISSING : x;
}

/**
 * A column of the data's full length: values at the rows used, missing elsewhere and where a
 * value does not exist (a studentized residual of a fit with no error).
 *
 * `values` is a fit's own array (fitted values, residuals), made fresh for the fit and never
 * written afterwards, like every column's values: when every row was used the column takes
 * it as it is. Copying a million of them cost 25 to 30 ms of fresh memory each.
 */
export function spread(values: Float64Array, rows: Int32Array | null, length: number, name: string): NumberColumn {
  if (rows === null) {
    let anyNaN = false;
    for (let i = 0; i < values.length && !anyNaN; i++) anyNaN = Number.isNaN(values[i]!);
    return anyNaN ? nanAsMissing(values, name) : numberColumn(values, null, name);
  }
  const out = new Float64Array(length).fill(NaN);
  const miss = new Uint8Array(length).fill(1);
  rows.forEach((r, k) => {
    const v = values[k]!;
    out[r] = v;
    miss[r] = Number.isNaN(v) ? 1 : 0;
  });
  return numberColumn(out, miss, name);
}

export function columnsTable(obj: Record<string, ArrayLike<unknown>>, order: readonly string[]): Table {
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
export function fitRecord(fit: DesignFit, internal: FitInternal): RecordValue {
  const { rows, length } = internal;
  const fields: [string, Value][] = [
    ['design', fit.design],
    ['table', columnsTable(fit.table as unknown as Record<string, ArrayLike<unknown>>, ['source', 'df', 'ss', 'ms', 'f', 'p'])],
    ['means', columnsTable(fit.means as unknown as Record<string, ArrayLike<unknown>>, MEANS_COLUMNS)],
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
  if (fit.relative_efficiency !== undefined) fields.push(['relative_efficiency', numberOrMissing(fit.relative_efficiency)]);
  if (fit.nonadditivity !== undefined) fields.push(['nonadditivity', nonadditivityRecord(fit.nonadditivity)]);
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
  fields.push(...stratumFields(fit));
  fields.push(['treatment', fit.treatment], ['n', fit.n], ['level', fit.level], ['ss_method', fit.ss_method]);
  fields.push(['notes', textColumn(fit.notes.slice(), null, 'notes')]);
  // the names its charts print are part of what the fit is
  const identity = JSON.stringify([internal.response, internal.factors.map((f) => [f.name, f.levels])]);
  return record(fields, 'fit', internal, identity);
}

/** Tukey's test for nonadditivity as a record; F and p missing where they do not exist. */
export function nonadditivityRecord(na: NonNullable<DesignFit['nonadditivity']>): RecordValue {
  return record([['ss', na.ss], ['f', numberOrMissing(na.f)], ['p', numberOrMissing(na.p)], ['df1', na.df1], ['df2', na.df2]], 'test');
}

const MEANS_COLUMNS = ['level', 'n', 'mean', 'se', 'low', 'high'] as const;

/** What split plots, covariates and site series add to the record. */
function stratumFields(fit: DesignFit): [string, Value][] {
  const out: [string, Value][] = [];
  const sp = fit.split;
  if (sp !== undefined) {
    out.push(['mse_whole', sp.mseWhole], ['df_whole_error', sp.dfWhole]);
    const sub = fit.factor_means.find((m) => m.factor === sp.sub);
    if (sub !== undefined) out.push(['sub_means', columnsTable(sub.table as unknown as Record<string, ArrayLike<unknown>>, MEANS_COLUMNS)]);
    // the combinations, one row per whole-plot and subplot level, columns named after them
    const reserved = new Set<string>(['n', 'mean', 'se', 'low', 'high', 'df']);
    const wholeCol = reserved.has(sp.whole) ? 'whole' : sp.whole;
    const subCol = reserved.has(sp.sub) || sp.sub === wholeCol ? 'sub' : sp.sub;
    const c = sp.cells;
    out.push([
      'cell_means',
      columnsTable({ [wholeCol]: c.whole, [subCol]: c.sub, n: c.n, mean: c.mean, se: c.se, low: c.low, high: c.high, df: c.df }, [wholeCol, subCol, 'n', 'mean', 'se', 'low', 'high', 'df']),
    ]);
  }
  const cv = fit.covariate;
  if (cv !== undefined) {
    out.push(['slope', cv.slope], ['slope_se', numberOrMissing(cv.slope_se)], ['covariate_mean', cv.mean]);
    out.push([
      'unadjusted_means',
      columnsTable({ level: fit.means.level, mean: cv.unadjusted, covariate: cv.covariateMeans }, ['level', 'mean', 'covariate']),
    ]);
  }
  const st = fit.sites;
  if (st !== undefined) {
    out.push(['f_against_error', st.f_against_error], ['p_against_error', st.p_against_error]);
    const b = st.bartlett;
    // not made (a site without error): shown as missing, not as a number
    const made = (x: number): Value => (Number.isNaN(x) ? MISSING : x);
    out.push(['bartlett', record([['statistic', made(b.statistic)], ['df', b.df], ['p', made(b.p)]], 'test')]);
    const ps = st.perSite;
    out.push(['per_site', columnsTable({ site: ps.site, blocks: ps.blocks, mean: ps.mean, mse: ps.mse, df_error: ps.df_error, f: ps.f, p: ps.p }, ['site', 'blocks', 'mean', 'mse', 'df_error', 'f', 'p'])]);
    const cm = st.cellMeans;
    out.push(['site_means', columnsTable({ treatment: cm.treatment, site: cm.site, mean: cm.mean }, ['treatment', 'site', 'mean'])]);
  }
  return out;
}

export interface Prepared {
  y: Float64Array;
  offset: number;
  factors: Factor[];
  rows: Int32Array | null;
  length: number;
  dropped: number;
  response: string;
}

/** Complete cases of a response and factors, shifted exactly, with level codes. */
export function prepare(y: NumberColumn, factorCols: readonly { col: Column; role: string }[], ctx: CallContext): Prepared {
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
        throw new UsageError(fnMsg.levelsLost(name, lost));
      }
    });
  }
  const seen = new Set<string>();
  for (const f of factors) {
    if (seen.has(f.name)) throw new UsageError(fnMsg.factorsShareName(f.name));
    seen.add(f.name);
  }
  const length = y.values.length;
  return { y: r.y, offset: r.offset, factors, rows, length, dropped: rows === null ? 0 : length - rows.length, response: y.name ?? 'y' };
}

export function finish(p: Prepared, computed: DesignFit): RecordValue {
  const y = new Float64Array(p.y.length);
  for (let i = 0; i < y.length; i++) y[i] = p.y[i]! + p.offset;
  // a fit with no error left shows no tests (see exact.ts)
  const fit = withoutErrorTests(computed);
  return fitRecord(fit, { fit, rows: p.rows, length: p.length, factors: p.factors, y, response: p.response });
}

