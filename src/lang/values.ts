/**
 * The value model of the cell language (docs/language.md section 3).
 *
 * Numbers, texts and booleans are plain JavaScript primitives; everything else is a tagged
 * object with a `kind`. Columns keep their data in typed arrays with a separate missing mask,
 * so that a missing value is never confused with NaN (the result of 0 / 0 is NaN, a blank
 * field is missing, and the two print differently).
 *
 * Values are immutable once built: the graph compares them to stop a wave of re-evaluation,
 * and the same object may be shared by many cells.
 */
import type { TextRanges } from '../stats/decimal/scan.ts';
import { isWrittenOver } from './column-changes.ts';

export type { TextRanges };

/** The one missing value. */
export interface Missing {
  readonly kind: 'missing';
}

/** The singleton missing value. */
export const MISSING: Missing = Object.freeze({ kind: 'missing' as const });

/** Element types a column can hold. */
export const COLUMN_TYPES = ['number', 'text', 'boolean'] as const;
/** Element type of a column. */
export type ColumnType = (typeof COLUMN_TYPES)[number];

interface ColumnBase {
  readonly kind: 'column';
  /** 1 where the element is missing; null when nothing is missing. */
  readonly missing: Uint8Array | null;
  /** The column's header when it came from a table (for analysis rows and chart axes). */
  readonly name: string | null;
  /**
   * The order of the column's levels when the user set it (`level_order`); fits, summaries
   * and comparisons then take the levels in this order, the first as the reference.
   */
  readonly order?: readonly string[];
}

/**
 * The decimal texts of a number column as typed: strings, or (for a column read from CSV)
 * ranges of the text it was read from, so that a million numbers need no million strings.
 * Read them with {@link decimalAt}; a missing element's text is ''.
 */
export type DecimalTexts = readonly string[] | TextRanges;

/** A column of numbers. */
export interface NumberColumn extends ColumnBase {
  readonly type: 'number';
  /** Values; entries that are missing hold NaN and are marked in `missing`. */
  readonly values: Float64Array;
  /**
   * The decimal text of each element as it was typed, when the column came straight from a
   * table (docs/language.md section 5); null for computed columns. Entries of missing elements
   * are empty strings.
   */
  readonly decimals: DecimalTexts | null;
}

/** A column of texts. */
export interface TextColumn extends ColumnBase {
  readonly type: 'text';
  /** Values; entries that are missing hold ''. */
  readonly values: readonly string[];
}

/** A column of booleans. */
export interface BooleanColumn extends ColumnBase {
  readonly type: 'boolean';
  /** 1 for true, 0 for false; missing entries hold 0 and are marked in `missing`. */
  readonly values: Uint8Array;
}

/** Any column. */
export type Column = NumberColumn | TextColumn | BooleanColumn;

/** A table: ordered named columns of equal length. */
export interface Table {
  readonly kind: 'table';
  readonly names: readonly string[];
  readonly columns: readonly Column[];
  readonly rows: number;
  /**
   * For a layout drawn by random_layout or latin_layout: how it was drawn (design, seed,
   * generator, algorithm), read with layout_details. Not part of the table's JSON, which
   * stays an object of column name to array; lost when the table is filtered.
   */
  readonly drawn?: RecordValue;
}

/** A record: ordered named fields. What analyses return. */
export interface RecordValue {
  readonly kind: 'record';
  readonly fields: ReadonlyMap<string, Value>;
  /**
   * What sort of record this is, for views and for functions that accept only some records
   * (for example 'fit' for the result of a design function, 'pairs' for `pairwise`).
   */
  readonly tag: string | null;
  /** Data that functions need later (for example a fit's design) but that is not shown. */
  readonly internal?: unknown;
  /**
   * What values made from the record read that its fields do not show (a fit's response
   * and factor names, which its charts print): two records differing only here are not
   * the same value, so renaming a response column re-titles the charts of its fit.
   */
  readonly identity?: string;
}

/** A chart: a vega-lite specification with its data inlined. */
export interface Chart {
  readonly kind: 'chart';
  readonly spec: unknown;
  /** One line stating the numbers the chart rests on. */
  readonly caption: string;
}

/** A checked statement. */
export interface Claim {
  readonly kind: 'claim';
  readonly holds: boolean;
  readonly statement: string;
}

/** An error: message in plain words and the character range it refers to. */
export interface ErrorValue {
  readonly kind: 'error';
  readonly message: string;
  /** Character offsets in the cell's text (from inclusive, to exclusive). */
  readonly from: number;
  readonly to: number;
  /** When this cell failed only because a name it reads failed: that name. */
  readonly upstream: string | null;
}

/** Every value a cell or an expression can have. */
export type Value =
  | number
  | string
  | boolean
  | Missing
  | Column
  | Table
  | RecordValue
  | Chart
  | Claim
  | ErrorValue;

/** Names of value types, as shown to users and in the command line's JSON. */
export type TypeName =
  | 'number'
  | 'text'
  | 'boolean'
  | 'missing'
  | 'column'
  | 'table'
  | 'record'
  | 'chart'
  | 'claim'
  | 'error';

/** The type name of a value. */
export function typeOf(v: Value): TypeName {
  switch (typeof v) {
    case 'number':
      return 'number';
    case 'string':
      return 'text';
    case 'boolean':
      return 'boolean';
    default:
      return v.kind;
  }
}

/** A type name with its article, for messages ("a number", "an error"). */
export function describeType(v: Value): string {
  if (isColumn(v)) return `a column of ${v.type === 'number' ? 'numbers' : v.type === 'text' ? 'texts' : 'booleans'}`;
  const t = typeOf(v);
  if (t === 'missing') return 'a missing value';
  return /^[aeiou]/.test(t) ? `an ${t}` : `a ${t}`;
}

/** True for a column value. */
export function isColumn(v: Value): v is Column {
  return typeof v === 'object' && v.kind === 'column';
}

/** True for a number column. */
export function isNumberColumn(v: Value): v is NumberColumn {
  return isColumn(v) && v.type === 'number';
}

/** True for the missing value. */
export function isMissing(v: Value): v is Missing {
  return typeof v === 'object' && v.kind === 'missing';
}

/** True for an error value. */
export function isError(v: Value): v is ErrorValue {
  return typeof v === 'object' && v.kind === 'error';
}

/** True for a record. */
export function isRecord(v: Value): v is RecordValue {
  return typeof v === 'object' && v.kind === 'record';
}

/** True for a table. */
export function isTable(v: Value): v is Table {
  return typeof v === 'object' && v.kind === 'table';
}

/** The number of elements of a column. */
export function columnLength(c: Column): number {
  return c.values.length;
}

/** True when element i of a column is missing. */
export function isMissingAt(c: Column, i: number): boolean {
  return c.missing !== null && c.missing[i] === 1;
}

/** How many elements of a column are missing. */
export function missingCount(c: Column): number {
  if (c.missing === null) return 0;
  let n = 0;
  for (let i = 0; i < c.missing.length; i++) n += c.missing[i]!;
  return n;
}

/** Element i of a column as a scalar value. */
export function elementAt(c: Column, i: number): Value {
  if (isMissingAt(c, i)) return MISSING;
  switch (c.type) {
    case 'number':
      return c.values[i]!;
    case 'text':
      return c.values[i]!;
    case 'boolean':
      return c.values[i] === 1;
  }
}

/** A missing mask that is null when nothing is marked. */
export function compactMask(mask: Uint8Array | null): Uint8Array | null {
  if (mask === null) return null;
  for (let i = 0; i < mask.length; i++) if (mask[i] === 1) return mask;
  return null;
}

/** Builds a number column. */
export function numberColumn(
  values: Float64Array,
  missing: Uint8Array | null = null,
  name: string | null = null,
  decimals: DecimalTexts | null = null,
): NumberColumn {
  return { kind: 'column', type: 'number', values, missing: compactMask(missing), name, decimals };
}

/** Builds a text column. */
export function textColumn(values: readonly string[], missing: Uint8Array | null = null, name: string | null = null): TextColumn {
  return { kind: 'column', type: 'text', values, missing: compactMask(missing), name };
}

/** Builds a boolean column. */
export function booleanColumn(values: Uint8Array, missing: Uint8Array | null = null, name: string | null = null): BooleanColumn {
  return { kind: 'column', type: 'boolean', values, missing: compactMask(missing), name };
}

/** The same column under another name. */
export function renameColumn<C extends Column>(c: C, name: string | null): C {
  return { ...c, name };
}

/** Builds a record from [name, value] pairs, in order. */
export function record(fields: Iterable<readonly [string, Value]>, tag: string | null = null, internal?: unknown, identity?: string): RecordValue {
  const m = new Map<string, Value>();
  for (const [k, v] of fields) m.set(k, v);
  const base: RecordValue = internal === undefined ? { kind: 'record', fields: m, tag } : { kind: 'record', fields: m, tag, internal };
  return identity === undefined ? base : { ...base, identity };
}

/** Builds a table; every column must have the same length (checked). */
export function table(names: readonly string[], columns: readonly Column[]): Table {
  if (names.length !== columns.length) throw new Error('table: names and columns differ in count');
  const rows = columns.length === 0 ? 0 : columnLength(columns[0]!);
  for (const c of columns) {
    if (columnLength(c) !== rows) throw new Error('table: columns differ in length');
  }
  return { kind: 'table', names, columns, rows };
}

/** Builds an error value. */
export function errorValue(message: string, from: number, to: number, upstream: string | null = null): ErrorValue {
  return { kind: 'error', message, from, to, upstream };
}

/** Looks a column up in a table by name. */
export function tableColumn(t: Table, name: string): Column | undefined {
  const i = t.names.indexOf(name);
  return i < 0 ? undefined : t.columns[i];
}

/** True when decimal texts are held as ranges of a source text. */
export function isTextRanges(d: DecimalTexts): d is TextRanges {
  return !Array.isArray(d);
}

/** How many decimal texts there are. */
export function decimalsLength(d: DecimalTexts): number {
  return isTextRanges(d) ? d.from.length : d.length;
}

/** Decimal text i ('' for a missing element, undefined past the end). */
export function decimalAt(d: DecimalTexts, i: number): string | undefined {
  if (!isTextRanges(d)) return d[i];
  if (i < 0 || i >= d.from.length) return undefined;
  return d.source.slice(d.from[i]!, d.to[i]!);
}

/** The decimal texts at the given positions, in that order (ranges stay ranges). */
export function pickDecimals(d: DecimalTexts, positions: ArrayLike<number>): DecimalTexts {
  const k = positions.length;
  if (!isTextRanges(d)) return Array.from({ length: k }, (_, j) => d[positions[j]!]!);
  const from = new Int32Array(k);
  const to = new Int32Array(k);
  for (let j = 0; j < k; j++) {
    const p = positions[j]!;
    from[j] = d.from[p]!;
    to[j] = d.to[p]!;
  }
  return { source: d.source, from, to };
}

/** The texts of a followed by those of b (ranges stay ranges when they share a source). */
export function joinDecimals(a: DecimalTexts, b: DecimalTexts): DecimalTexts {
  if (isTextRanges(a) && isTextRanges(b) && a.source === b.source) {
    const n = a.from.length;
    const from = new Int32Array(n + b.from.length);
    const to = new Int32Array(n + b.from.length);
    from.set(a.from);
    from.set(b.from, n);
    to.set(a.to);
    to.set(b.to, n);
    return { source: a.source, from, to };
  }
  const out: string[] = [];
  for (const d of [a, b]) for (let i = 0; i < decimalsLength(d); i++) out.push(decimalAt(d, i)!);
  return out;
}

/**
 * Structural equality of two values, bit for bit on numbers (so that NaN equals NaN and
 * 0 differs from -0): the graph uses it to stop re-evaluation when a result did not change.
 */
export function sameValue(a: Value, b: Value): boolean {
  if (a === b) return true;
  if (typeof a === 'number' || typeof b === 'number') return typeof a === 'number' && typeof b === 'number' && Object.is(a, b);
  if (typeof a !== 'object' || typeof b !== 'object') return false;
  if (a.kind !== b.kind) return false;
  switch (a.kind) {
    case 'missing':
      return true;
    case 'column': {
      const c = b as Column;
      if (a.type !== c.type || a.name !== c.name || a.values.length !== c.values.length) return false;
      if (!sameMask(a.missing, c.missing)) return false;
      if (!sameTexts(a.order ?? null, c.order ?? null)) return false;
      if (a.type === 'number') {
        const x = a.values;
        const y = (c as NumberColumn).values;
        // A column whose array an edit wrote in place for the column made from it
        // (cells/table/model-rows.ts) shares that array with its successor, and what it held
        // is gone: the two are not the same. (Their decimal texts, never written in place,
        // differ too; this says so without reading them.)
        if (x === y && (isWrittenOver(a) || isWrittenOver(c))) return false;
        for (let i = 0; i < x.length; i++) if (!Object.is(x[i], y[i])) return false;
        return sameDecimals(a.decimals, (c as NumberColumn).decimals);
      }
      for (let i = 0; i < a.values.length; i++) if (a.values[i] !== c.values[i]) return false;
      return true;
    }
    case 'table': {
      const t = b as Table;
      if (a.rows !== t.rows || a.names.length !== t.names.length) return false;
      if ((a.drawn === undefined) !== (t.drawn === undefined)) return false;
      if (a.drawn !== undefined && !sameValue(a.drawn, t.drawn!)) return false;
      for (let i = 0; i < a.names.length; i++) {
        if (a.names[i] !== t.names[i] || !sameValue(a.columns[i]!, t.columns[i]!)) return false;
      }
      return true;
    }
    case 'record': {
      const r = b as RecordValue;
      if (a.tag !== r.tag || a.fields.size !== r.fields.size || a.identity !== r.identity) return false;
      // Records with internal data (fits) are compared by their visible fields plus the
      // identity of the internal data: two fits of the same numbers share nothing, so
      // compare visible fields and accept equal ones only when internals are both absent
      // or the visible fields (which include fitted values and residuals) match.
      const ka = [...a.fields.keys()];
      const kb = [...r.fields.keys()];
      for (let i = 0; i < ka.length; i++) {
        if (ka[i] !== kb[i]) return false;
        if (!sameValue(a.fields.get(ka[i]!)!, r.fields.get(kb[i]!)!)) return false;
      }
      return (a.internal === undefined) === (r.internal === undefined);
    }
    case 'chart':
      return JSON.stringify(a.spec) === JSON.stringify((b as Chart).spec) && a.caption === (b as Chart).caption;
    case 'claim':
      return a.holds === (b as Claim).holds && a.statement === (b as Claim).statement;
    case 'error': {
      const e = b as ErrorValue;
      return a.message === e.message && a.from === e.from && a.to === e.to && a.upstream === e.upstream;
    }
  }
}

function sameMask(a: Uint8Array | null, b: Uint8Array | null): boolean {
  if (a === null || b === null) return a === b;
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false;
  return true;
}

/** True when two lists of texts hold the same texts in the same order (null only matches null). */
export function sameTexts(a: readonly string[] | null, b: readonly string[] | null): boolean {
  if (a === b) return true;
  if (a === null || b === null) return false;
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false;
  return true;
}

function sameDecimals(a: DecimalTexts | null, b: DecimalTexts | null): boolean {
  if (a === null || b === null) return a === b;
  if (a === b) return true;
  const n = decimalsLength(a);
  if (n !== decimalsLength(b)) return false;
  if (isTextRanges(a) && isTextRanges(b)) {
    // compare in place, no strings made; two long sources are compared once, not per text
    const oneSource = a.source === b.source;
    for (let i = 0; i < n; i++) {
      const fa = a.from[i]!;
      const fb = b.from[i]!;
      const len = a.to[i]! - fa;
      if (len !== b.to[i]! - fb) return false;
      if (oneSource && fa === fb) continue;
      for (let k = 0; k < len; k++) if (a.source.charCodeAt(fa + k) !== b.source.charCodeAt(fb + k)) return false;
    }
    return true;
  }
  for (let i = 0; i < n; i++) if (decimalAt(a, i) !== decimalAt(b, i)) return false;
  return true;
}
