/**
 * Preparing columns for the statistics: dropping missing values (and saying how many were
 * dropped), the exact decimal shift of docs/language.md section 5, and integer level codes for factors.
 * The statistics code (src/stats) sees only complete typed arrays.
 */
import { UsageError } from '../lang/errors.ts';
import { msg } from '../messages/language.ts';
import { plural } from '../messages/words.ts';
import { pickDecimals, type Column, type NumberColumn, type Value } from '../lang/values.ts';
import { readDecimals, readDecimalsAgainInPlace, shiftDecimals, shiftReading, shiftReadingBorrowed, type DecimalReading } from '../stats/decimal/index.ts';
import { columnChangeOf } from '../lang/column-changes.ts';
import type { CallContext } from '../lang/builtins.ts';
import { fnMsg } from '../messages/functions.ts';

/** A factor as the statistics see it. */
export interface Factor {
  readonly name: string;
  readonly codes: Int32Array;
  readonly levels: string[];
}

/** A response ready for sums of squares: shifted values and the exact offset. */
export interface Response {
  readonly y: Float64Array;
  readonly offset: number;
}

/**
 * How levels are ordered, everywhere (means tables, comparisons, `levels`, `group_stats`,
 * charts): the order set with `level_order`, if any; otherwise, when every level starts with
 * a number (8500, 8700; 60C, 70C; blocks 1 to 10), in the order of those numbers, so that a
 * randomized field order does not scramble a means table; otherwise in the order the levels
 * first appear. The first level is the reference of a two-group difference (first minus
 * second). Built-in docs quote this sentence.
 */
export const LEVEL_ORDER_RULE =
  'Levels are taken in one order everywhere: the order set with level_order, if any; otherwise in increasing numeric order when every level starts with a number (1, 2, 10; 60C, 80C); otherwise in the order they first appear.';

/**
 * The level name of element i of a column. A number is named by its value (the shortest text
 * that reads back as it, -0 as 0), so that 1, 1.0 and 01 typed in one column are one level.
 */
export function levelName(c: Column, i: number): string {
  switch (c.type) {
    case 'text':
      return c.values[i]!;
    case 'boolean':
      return c.values[i] === 1 ? 'true' : 'false';
    case 'number':
      return numberLevel(c.values[i]!);
  }
}

/** The level name of a number: its shortest round-trip text, with -0 read as 0. */
export function numberLevel(x: number): string {
  return Object.is(x, -0) ? '0' : String(x);
}

/**
 * The level a user named, among a factor's levels: a number by its value; a text as written,
 * or, when no level is written so and the text reads as a number, by that number's value (so
 * "1.0" finds the level 1 of a numeric column).
 */
export function resolveLevel(v: Value, levels: readonly string[]): string {
  if (typeof v === 'number') return numberLevel(v);
  const text = String(v);
  if (levels.includes(text)) return text;
  if (/^\s*[-+]?(\d+(?:\.\d*)?|\.\d+)([eE][-+]?\d+)?\s*$/.test(text)) {
    const asNumber = numberLevel(Number(text));
    if (levels.includes(asNumber)) return asNumber;
  }
  return text;
}

/** The number a level name starts with (8500, 60C, 2.5mm), or NaN. */
function leadingNumber(name: string): number {
  const m = /^\s*[-+]?(\d+(?:\.\d*)?|\.\d+)([eE][-+]?\d+)?/.exec(name);
  return m === null ? NaN : Number(m[0]);
}

/** Integer codes of a column's levels for the rows kept, the levels ordered by {@link LEVEL_ORDER_RULE}. */
export function factorOf(c: Column, rows: Int32Array | null, fallbackName: string): Factor {
  const n = rows === null ? c.values.length : rows.length;
  const codes = new Int32Array(n);
  const index = new Map<string, number>();
  const levels: string[] = [];
  if (c.type === 'number') {
    // by value, with no string per element: a Map compares numbers as numberLevel names
    // them (one key per double, -0 with 0, NaN with NaN)
    const byValue = new Map<number, number>();
    const values = c.values;
    for (let k = 0; k < n; k++) {
      const x = values[rows === null ? k : rows[k]!]!;
      let code = byValue.get(x);
      if (code === undefined) {
        code = levels.length;
        byValue.set(x, code);
        const name = numberLevel(x);
        index.set(name, code);
        levels.push(name);
      }
      codes[k] = code;
    }
  } else {
    for (let k = 0; k < n; k++) {
      const i = rows === null ? k : rows[k]!;
      const name = levelName(c, i);
      let code = index.get(name);
      if (code === undefined) {
        code = levels.length;
        index.set(name, code);
        levels.push(name);
      }
      codes[k] = code;
    }
  }
  const name = c.name ?? fallbackName;
  let order: number[] | null = null;
  if (c.order !== undefined) {
    const unlisted = levels.filter((l) => !c.order!.includes(l));
    if (unlisted.length > 0) throw new UsageError(msg.levelNotInOrder(name, unlisted));
    // the set order, keeping the levels present in these rows
    order = c.order.filter((l) => index.has(l)).map((l) => index.get(l)!);
  } else {
    const numbers = levels.map(leadingNumber);
    if (levels.length > 1 && numbers.every((x) => !Number.isNaN(x))) {
      order = levels.map((_, j) => j).sort((a, b) => numbers[a]! - numbers[b]! || (levels[a]! < levels[b]! ? -1 : levels[a]! > levels[b]! ? 1 : 0));
    }
  }
  if (order === null) return { name, codes, levels };
  const recode = new Int32Array(levels.length);
  order.forEach((old, j) => {
    recode[old] = j;
  });
  for (let k = 0; k < n; k++) codes[k] = recode[codes[k]!]!;
  return { name, codes, levels: order.map((j) => levels[j]!) };
}

/**
 * The decimal texts of whole columns, read once: analyses of one column (or a column an
 * edit changed in a few rows, read again in those rows only) do not read its texts again.
 * Null when a text is not plain decimal.
 *
 * The readings are this cache's alone (responseOf copies what it shifts, or lends it to a
 * caller that lets go of it before asking again), so a column made
 * from another by an edit takes over the other's reading and writes its changed rows into
 * it; the other's entry is dropped first, and should that column be analysed again its
 * texts, which never change, are read afresh.
 */
const readings = new WeakMap<NumberColumn, DecimalReading | null>();

function readingOf(c: NumberColumn): DecimalReading | null {
  const kept = readings.get(c);
  if (kept !== undefined) return kept;
  let r: DecimalReading | null = null;
  try {
    const change = columnChangeOf(c);
    const baseColumn = change?.base as NumberColumn | undefined;
    const base = baseColumn === undefined ? undefined : readings.get(baseColumn);
    if (base) {
      readings.delete(baseColumn!);
      r = readDecimalsAgainInPlace(base, c.decimals!, change!.rows, change!.texts);
    } else r = readDecimals(c.decimals!);
  } catch {
    r = null;
  }
  readings.set(c, r);
  return r;
}

/**
 * Where a borrowed shift of a reading is written when its offset is not 0, by the reading's
 * values array (which a reading read again in place keeps).
 */
const scratches = new WeakMap<Float64Array, Float64Array>();

function scratchFor(r: DecimalReading): Float64Array {
  let s = scratches.get(r.values);
  if (s === undefined) {
    s = new Float64Array(r.values.length);
    scratches.set(r.values, s);
  }
  return s;
}

/**
 * The values of a number column at the rows kept, shifted exactly when their text is kept.
 * `borrow`: the caller only reads `y`, and only until it next asks for a response, so `y`
 * may be an array this cache keeps and writes again (a sum or a variance of a long column
 * at every keystroke then copies nothing).
 */
export function responseOf(c: NumberColumn, rows: Int32Array | null, borrow = false): Response {
  const n = rows === null ? c.values.length : rows.length;
  if (c.decimals !== null) {
    if (rows === null) {
      const r = readingOf(c);
      if (r !== null) {
        const s = borrow ? shiftReadingBorrowed(r, scratchFor(r)) : shiftReading(r);
        return { y: s.shifted, offset: s.offset };
      }
    } else {
      try {
        const s = shiftDecimals(pickDecimals(c.decimals, rows));
        return { y: s.shifted, offset: s.offset };
      } catch {
        // fall through to the binary values (a text that is not plain decimal)
      }
    }
  }
  const y = new Float64Array(n);
  for (let k = 0; k < n; k++) y[k] = c.values[rows === null ? k : rows[k]!]!;
  return { y, offset: 0 };
}

/**
 * The complete values of a number column (missing ones left out and counted in a warning).
 * `borrow` as for {@link responseOf}.
 */
export function completeValues(c: NumberColumn, ctx: CallContext, borrow = false): Response & { kept: Int32Array | null } {
  const rows = completeRows([c], ctx);
  return { ...responseOf(c, rows, borrow), kept: rows };
}

/** A response shifted back to plain values. */
export function plainValues(r: Response): Float64Array {
  if (r.offset === 0) return r.y;
  const out = new Float64Array(r.y.length);
  for (let i = 0; i < out.length; i++) out[i] = r.y[i]! + r.offset;
  return out;
}

/**
 * The rows where none of the columns is missing, or null when all are complete. Columns must
 * have one length (checked, with the names in the message). Warns with the count dropped.
 */
export function completeRows(cols: readonly Column[], ctx: CallContext, names?: readonly string[]): Int32Array | null {
  const n = cols[0]!.values.length;
  cols.forEach((c, j) => {
    if (c.values.length !== n) {
      const a = names?.[0] ?? cols[0]!.name ?? 'the first column';
      const b = names?.[j] ?? c.name ?? `column ${j + 1}`;
      throw new UsageError(fnMsg.lengthsDiffer(a, n, b, c.values.length));
    }
  });
  if (cols.every((c) => c.missing === null)) return null;
  const keep: number[] = [];
  for (let i = 0; i < n; i++) {
    let ok = true;
    for (const c of cols) if (c.missing !== null && c.missing[i] === 1) ok = false;
    if (ok) keep.push(i);
  }
  const dropped = n - keep.length;
  if (dropped > 0) ctx.warn(fnMsg.rowsLeftOut(dropped));
  return Int32Array.from(keep);
}

/** The rows of a column that are not missing, or null when none is missing. */
export function presentRows(c: Column): Int32Array | null {
  if (c.missing === null) return null;
  const out: number[] = [];
  for (let i = 0; i < c.values.length; i++) if (c.missing[i] !== 1) out.push(i);
  return Int32Array.from(out);
}
