/**
 * The one canonical JSON form of every value (docs/language.md sections 6 and 9): the command
 * line's --json output, the sealed values of a document and the digests of large ones all
 * rest on it, so a value has exactly one text and two equal values have the same text.
 *
 * The shapes are the contract's: number as a JSON number (non-finite as the texts "NaN",
 * "Infinity", "-Infinity"), missing as null, column as an array, table as an object of
 * column name to array in column order, record as an object in field order, chart as
 * {"vega_lite": SPEC}, claim as {"holds", "statement"}, error as {"message", "from", "to"}.
 *
 * How the text is fixed:
 * - numbers take ECMAScript's Number-to-String form, the shortest text that reads back as
 *   the same double (as RFC 8785 section 3.2.2.3 does), with one deliberate difference:
 *   negative zero is written `-0`, not `0`, so that sealed numbers compare bit for bit;
 * - texts are written as JSON.stringify writes them (RFC 8785 section 3.2.2.2: only `"`,
 *   `\`, control characters and lone surrogates are escaped);
 * - no whitespace anywhere;
 * - members keep the value's own order rather than RFC 8785's sorted keys, because the order
 *   of a table's columns and of a record's fields is part of the value.
 *
 * Only the fields the contract names are written. A value kind that gains an optional
 * descriptive part later (for example how a layout was drawn) therefore keeps the same text
 * and the same digest; such a part, when it should be sealed, is sealed as its own entry.
 *
 * Written by hand rather than through JSON.stringify of intermediate objects, so that names
 * chosen by a document (a column called "__proto__") are only ever keys of text.
 */
import { EXACT_POWERS } from '../stats/decimal/scan.ts';
import { elementAt, type Column, type TextRanges, type Value } from './values.ts';

/** A number in the canonical JSON: shortest round-trip form, non-finite as text. */
export function jsonNumber(x: number): string {
  if (Number.isNaN(x)) return '"NaN"';
  if (x === Infinity) return '"Infinity"';
  if (x === -Infinity) return '"-Infinity"';
  if (Object.is(x, -0)) return '-0';
  return String(x);
}

/** A text in the canonical JSON. */
export function jsonText(s: string): string {
  return JSON.stringify(s);
}

/**
 * Room for one number's canonical text and its comma, enough for every double: the longest
 * texts are 25 characters, a 17-digit negative number between 1e-6 and 1e-5
 * ("-0.0000012345678901234567"); exponent forms take at most 24 ("-2.2250738585072014e-308").
 * The writer checks the room anyway and grows its buffer before a text made from a double, so
 * a miscount can never cut one; a typed text it copies is at most 23 characters
 * ("-0.00000" and 15 digits, typedCanonical), so it and its comma always fit within the 26.
 */
const MOST_BYTES_PER_NUMBER = 26;

/**
 * The elements `from` to `to` of a number column's canonical JSON, comma-separated without
 * the brackets, as ASCII bytes: the same characters as `columnJson(c, from, to)` between its
 * brackets, each number's text from {@link jsonNumber}. For writing a million numbers, where
 * joining strings and encoding them afterwards costs as much as making the texts.
 *
 * `typed` is the column's decimal texts, when it was read from them: a typed text that is
 * already its number's canonical text (see {@link typedCanonical}) is copied, which costs a
 * tenth of making the text from the double.
 */
export function numbersJsonBytes(values: Float64Array, missing: Uint8Array | null, from = 0, to = values.length, typed: TextRanges | null = null): Uint8Array {
  let out = new Uint8Array(Math.max(0, to - from) * MOST_BYTES_PER_NUMBER);
  let o = 0;
  for (let i = from; i < to; i++) {
    if (i > from) out[o++] = 44; // ,
    if (missing === null || missing[i] !== 1) {
      if (typed !== null) {
        const a = typed.from[i]!;
        const b = typed.to[i]!;
        // room: a canonical typed text is at most 23 characters ("-0.00000" and 15 digits)
        if (typedCanonical(typed.source, a, b, values[i]!)) {
          for (let j = a; j < b; j++) out[o++] = typed.source.charCodeAt(j);
          continue;
        }
      }
    }
    const text = missing !== null && missing[i] === 1 ? 'null' : jsonNumber(values[i]!);
    if (o + text.length + 1 > out.length) {
      const bigger = new Uint8Array(out.length * 2 + text.length + 1);
      bigger.set(out.subarray(0, o));
      out = bigger;
    }
    for (let j = 0; j < text.length; j++) out[o++] = text.charCodeAt(j);
  }
  return out.subarray(0, o);
}

/**
 * True when source[a, b) is exactly the canonical JSON text of `x` (jsonNumber(x)), decided
 * from the text without making that text. That holds for a plain decimal: an optional minus,
 * an integer part of 0 or without leading zeros, an optional fraction whose last digit is
 * not 0, at most 15 significant digits, and (below 1) at most five zeros after the point;
 * and x must be the double the text reads as. At most 15 digits, no two such decimals read
 * as one double (2^53 > 10^15), so the shortest text that reads back as x has exactly these
 * digits; between 1e-6 and 1e21 ECMAScript writes it without an exponent, as typed. Anything
 * else (an exponent, a plus, "5.", ".5", "2.50", "007", 16 digits) is made from the double.
 */
export function typedCanonical(source: string, a: number, b: number, x: number): boolean {
  let i = a;
  const negative = i < b && source.charCodeAt(i) === 45; // -
  if (negative) i++;
  if (i >= b) return false;
  let significand = 0;
  let digits = 0;
  let fraction = 0;
  const first = source.charCodeAt(i);
  if (first === 48) {
    // 0 alone, or 0.xxx
    i++;
    if (i === b) return x === 0 && Object.is(x, negative ? -0 : 0);
    if (source.charCodeAt(i) !== 46) return false;
  } else {
    while (i < b) {
      const d = source.charCodeAt(i) - 48;
      if (d < 0 || d > 9) break;
      significand = significand * 10 + d;
      digits++;
      i++;
    }
    if (digits === 0 || digits > 15) return false;
    if (i === b) return Object.is(x, negative ? -significand : significand);
    if (source.charCodeAt(i) !== 46) return false;
  }
  // the fraction, after the point
  i++;
  let zeros = 0;
  let last = -1;
  while (i < b) {
    const d = source.charCodeAt(i) - 48;
    if (d < 0 || d > 9) return false;
    fraction++;
    if (digits === 0 && d === 0) zeros++;
    else {
      significand = significand * 10 + d;
      digits++;
    }
    last = d;
    i++;
  }
  if (fraction === 0 || last === 0 || digits > 15 || (first === 48 && zeros > 5)) return false;
  // one correctly rounded division by an exact power: the double the text reads as
  const v = significand / EXACT_POWERS[fraction]!;
  return Object.is(x, negative ? -v : v);
}

/** As {@link numbersJsonBytes}, for a boolean column's elements (1 true, 0 false). */
export function booleansJsonBytes(values: Uint8Array, missing: Uint8Array | null, from = 0, to = values.length): Uint8Array {
  const out = new Uint8Array(Math.max(0, to - from) * 6);
  let o = 0;
  for (let i = from; i < to; i++) {
    if (i > from) out[o++] = 44;
    const text = missing !== null && missing[i] === 1 ? 'null' : values[i] === 1 ? 'true' : 'false';
    for (let j = 0; j < text.length; j++) out[o++] = text.charCodeAt(j);
  }
  return out.subarray(0, o);
}

/** The canonical JSON of elements `from` (inclusive) to `to` (exclusive) of a column. */
export function columnJson(c: Column, from = 0, to = c.values.length): string {
  const parts: string[] = new Array<string>(Math.max(0, to - from));
  for (let i = from; i < to; i++) parts[i - from] = toJson(elementAt(c, i));
  return `[${parts.join(',')}]`;
}

/** The canonical JSON text of a value. */
export function toJson(v: Value): string {
  switch (typeof v) {
    case 'number':
      return jsonNumber(v);
    case 'string':
      return jsonText(v);
    case 'boolean':
      return v ? 'true' : 'false';
  }
  switch (v.kind) {
    case 'missing':
      return 'null';
    case 'column':
      return columnJson(v);
    case 'table':
      return `{${v.names.map((n, i) => `${jsonText(n)}:${toJson(v.columns[i]!)}`).join(',')}}`;
    case 'record':
      return `{${[...v.fields].map(([k, x]) => `${jsonText(k)}:${toJson(x)}`).join(',')}}`;
    case 'chart':
      return `{"vega_lite":${plainJson(v.spec)}}`;
    case 'claim':
      return `{"holds":${v.holds ? 'true' : 'false'},"statement":${jsonText(v.statement)}}`;
    case 'error':
      return `{"message":${jsonText(v.message)},"from":${v.from},"to":${v.to}}`;
  }
}

/** Deepest nesting a chart specification may have (specs are built by the project). */
const MAX_DEPTH = 200;

/**
 * The canonical JSON of plain data (a chart's specification): objects in their own key
 * order, numbers as {@link jsonNumber}, `undefined` members left out as JSON.stringify does.
 *
 * @throws Error on a value that is not plain data (a function, a cycle, a typed array)
 */
export function plainJson(x: unknown, depth = 0): string {
  if (depth > MAX_DEPTH) throw new Error('plainJson: nested too deeply (or a cycle)');
  if (x === null) return 'null';
  switch (typeof x) {
    case 'number':
      return jsonNumber(x);
    case 'string':
      return jsonText(x);
    case 'boolean':
      return x ? 'true' : 'false';
    case 'object':
      break;
    default:
      throw new Error(`plainJson: ${typeof x} is not plain data`);
  }
  if (Array.isArray(x)) return `[${x.map((e) => (e === undefined ? 'null' : plainJson(e, depth + 1))).join(',')}]`;
  const proto = Object.getPrototypeOf(x) as unknown;
  if (proto !== Object.prototype && proto !== null) throw new Error('plainJson: only plain objects and arrays');
  const parts: string[] = [];
  for (const [k, e] of Object.entries(x)) {
    if (e === undefined) continue;
    parts.push(`${jsonText(k)}:${plainJson(e, depth + 1)}`);
  }
  return `{${parts.join(',')}}`;
}
