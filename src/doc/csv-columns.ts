/**
 * Table columns built straight from CSV field ranges (csv-fields.ts), by the typing rule of
 * table cells: a column is numbers when every non-empty field (spaces trimmed) is a decimal
 * number, booleans when every one is `true` or `false`, text otherwise; an empty field is
 * missing.
 *
 * No string is made per field: numbers are read from the source text in place (the double
 * and, for the exact decimal shift, the range of each field's text); texts are read into a
 * list of distinct values and a code per row, so a column of 50 varieties over a million rows
 * makes 50 strings.
 */
import { EXACT_POWERS, newDecimalScan, scanDecimalIn, type DecimalScan, type TextRanges } from '../stats/decimal/scan.ts';
import { booleanColumn, numberColumn, table, textColumn, type Column, type NumberColumn, type Table } from '../lang/values.ts';
import { isTrimmed, type FieldGrid } from './csv-fields.ts';

const MINUS = 45;

/**
 * Distinct texts of one column, each kept once: a hash table over the characters of a range,
 * so that a text already seen is found without making a string for it.
 */
class TextLevels {
  readonly texts: string[] = [];
  private slots: Int32Array = new Int32Array(64).fill(-1);
  private hashes: number[] = [];

  /** The code of the text source[a, b), adding it when new. */
  codeOf(source: string, a: number, b: number): number {
    let h = 0x811c9dc5;
    for (let i = a; i < b; i++) h = Math.imul(h ^ source.charCodeAt(i), 0x01000193);
    return this.find(h >>> 0, source, a, b, null);
  }

  /** The code of a text given as a string. */
  codeOfText(text: string): number {
    return this.codeOf(text, 0, text.length);
  }

  private find(h: number, source: string, a: number, b: number, made: string | null): number {
    const mask = this.slots.length - 1;
    let s = h & mask;
    const len = b - a;
    for (;;) {
      const code = this.slots[s]!;
      if (code === -1) break;
      if (this.hashes[code] === h) {
        const t = this.texts[code]!;
        if (t.length === len) {
          let same = true;
          for (let i = 0; i < len; i++) {
            if (t.charCodeAt(i) !== source.charCodeAt(a + i)) {
              same = false;
              break;
            }
          }
          if (same) return code;
        }
      }
      s = (s + 1) & mask;
    }
    const code = this.texts.length;
    this.texts.push(made ?? source.slice(a, b));
    this.hashes.push(h);
    this.slots[s] = code;
    if (this.texts.length * 2 > this.slots.length) this.grow();
    return code;
  }

  private grow(): void {
    const slots = new Int32Array(this.slots.length * 2).fill(-1);
    const mask = slots.length - 1;
    for (let code = 0; code < this.texts.length; code++) {
      let s = this.hashes[code]! & mask;
      while (slots[s] !== -1) s = (s + 1) & mask;
      slots[s] = code;
    }
    this.slots = slots;
  }
}

/** True when source[a, b) is exactly `word`. */
function isWord(source: string, a: number, b: number, word: string): boolean {
  if (b - a !== word.length) return false;
  for (let i = 0; i < word.length; i++) if (source.charCodeAt(a + i) !== word.charCodeAt(i)) return false;
  return true;
}

/** True when the first non-blank field of column j is neither a number nor a boolean. */
function firstFieldIsText(g: FieldGrid, j: number): boolean {
  const src = g.source;
  const width = g.header.length;
  const scan = newDecimalScan();
  for (let r = 0; r < g.rows; r++) {
    const k = r * width + j;
    let a = g.from[k]!;
    let b = g.to[k]!;
    while (a < b && isTrimmed(src.charCodeAt(a))) a++;
    while (b > a && isTrimmed(src.charCodeAt(b - 1))) b--;
    if (a === b) continue;
    if (g.escaped !== null && g.escaped[k] === 1) return true;
    return !scanDecimalIn(src, a, b, scan) && !isWord(src, a, b, 'true') && !isWord(src, a, b, 'false');
  }
  return false;
}

/** Writes the range of field k, spaces trimmed, into from[r] and to[r]. */
function trimmedInto(g: FieldGrid, k: number, from: Int32Array, to: Int32Array, r: number): void {
  trimFieldInto(g.source, g.from[k]!, g.to[k]!, from, to, r);
}

/**
 * Writes the range text[a, b), spaces trimmed, into from[r] and to[r], each plus `at` (for a
 * text that is a part of a longer one starting at `at`).
 */
export function trimFieldInto(text: string, a: number, b: number, from: Int32Array, to: Int32Array, r: number, at = 0): void {
  while (a < b && isTrimmed(text.charCodeAt(a))) a++;
  while (b > a && isTrimmed(text.charCodeAt(b - 1))) b--;
  from[r] = a + at;
  to[r] = b + at;
}

/** Builds column j of a field grid. */
export function columnOfGrid(g: FieldGrid, j: number, name: string): Column {
  const src = g.source;
  const width = g.header.length;
  const n = g.rows;
  const escaped = g.escaped;
  if (firstFieldIsText(g, j)) return textColumnOfGrid(g, j, name);
  // trimmed ranges of the fields (an escaped field holds a quote, so it is text)
  const from = new Int32Array(n);
  const to = new Int32Array(n);
  const missing = new Uint8Array(n);
  let numbers = true;
  let booleans = true;
  let values: Float64Array | null = new Float64Array(n);
  const scan = newDecimalScan();
  for (let r = 0; r < n; r++) {
    const k = r * width + j;
    trimmedInto(g, k, from, to, r);
    const a = from[r]!;
    const b = to[r]!;
    if (a === b) {
      missing[r] = 1;
      if (values !== null) values[r] = NaN;
      continue;
    }
    if (escaped !== null && escaped[k] === 1) {
      numbers = false;
      booleans = false;
      break;
    }
    if (numbers) {
      const v = numberIn(src, a, b, scan);
      if (v !== null) values![r] = v;
      else {
        numbers = false;
        values = null;
      }
    }
    if (booleans && !isWord(src, a, b, 'true') && !isWord(src, a, b, 'false')) booleans = false;
    if (!numbers && !booleans) break;
  }
  if (numbers) return numberColumn(values!, missing, name, { source: src, from, to });
  if (booleans) {
    const out = new Uint8Array(n);
    for (let r = 0; r < n; r++) if (missing[r] === 0) out[r] = src.charCodeAt(from[r]!) === 116 /* t */ ? 1 : 0;
    return booleanColumn(out, missing, name);
  }
  return textColumnOfGrid(g, j, name);
}

/** Text that holds rows [first, last) of a field grid's source: `text` is source[at, at + text.length). */
export interface SourcePart {
  readonly text: string;
  readonly at: number;
}

/** A column patched by {@link patchNumberColumn}, and the decimal texts of its changed rows, in row order. */
export interface PatchedNumberColumn {
  readonly column: NumberColumn;
  readonly texts: TextRanges;
}

/**
 * Number column j of `g` made from `base`, the same column of an earlier reading of a text
 * (`baseText`, which its ranges point into) that differs only in rows [first, last): those
 * rows are read again, the ranges of the rows after them move by `shift`, and the rest is
 * copied. Null when that would not give what {@link columnOfGrid} gives (base not a number
 * column read from ranges, a row count that changed, or a field read again that is neither
 * empty nor a number).
 *
 * `part`, when given, holds the changed rows' text and is read instead of `g.source`
 * (which is then never read). `inPlace` writes the base's values and missing marks rather
 * than copies of them, for a base that nothing will read again as it was; a null answer
 * leaves the base as it was.
 */
export function patchNumberColumn(
  g: FieldGrid,
  j: number,
  name: string,
  base: Column,
  baseText: string,
  first: number,
  last: number,
  shift: number,
  part: SourcePart = { text: g.source, at: 0 },
  inPlace = false,
): PatchedNumberColumn | null {
  if (base.type !== 'number' || base.decimals === null || Array.isArray(base.decimals) || base.values.length !== g.rows) return null;
  const old = base.decimals as TextRanges;
  // the base's ranges must be ranges of the earlier text (a column kept unchanged through
  // several readings points into an older one)
  if (old.source !== baseText) return null;
  const src = part.text;
  const at = part.at;
  const width = g.header.length;
  // the trimmed ranges of the rows read again, in the part
  const count = last - first;
  const changedFrom = new Int32Array(count);
  const changedTo = new Int32Array(count);
  const changedValues = new Float64Array(count);
  const scan = newDecimalScan();
  for (let r = first; r < last; r++) {
    const k = r * width + j;
    trimFieldInto(src, g.from[k]! - at, g.to[k]! - at, changedFrom, changedTo, r - first);
    const a = changedFrom[r - first]!;
    const b = changedTo[r - first]!;
    if (a === b) {
      changedValues[r - first] = NaN;
      continue;
    }
    if (g.escaped !== null && g.escaped[k] === 1) return null;
    const v = numberIn(src, a, b, scan);
    if (v === null) return null;
    changedValues[r - first] = v;
  }
  // Fields retyped with as many characters leave every range where it was: the base's
  // ranges serve as they are (ranges are written only together with their source, so that
  // they read the same texts: cells/table/model-rows.ts followBody). In a table of 100,000
  // rows that spares 800 kB of fresh memory at each such edit.
  let sameRanges = shift === 0;
  for (let i = 0; i < count && sameRanges; i++) sameRanges = changedFrom[i]! + at === old.from[first + i] && changedTo[i]! + at === old.to[first + i];
  // Ranges that move are copied even in place: a column with its levels put in order
  // shares the base's texts object, and its texts, read with the old body, are what tells
  // it from its successor once the values it shares were written over.
  const from = sameRanges ? old.from : old.from.slice();
  const to = sameRanges ? old.to : old.to.slice();
  if (!sameRanges) {
    if (shift !== 0) {
      for (let r = last; r < g.rows; r++) {
        from[r] = from[r]! + shift;
        to[r] = to[r]! + shift;
      }
    }
    for (let i = 0; i < count; i++) {
      from[first + i] = changedFrom[i]! + at;
      to[first + i] = changedTo[i]! + at;
    }
  }
  const values = inPlace ? base.values : base.values.slice();
  // no mask until a row is missing
  let missing = base.missing === null ? null : inPlace ? base.missing : base.missing.slice();
  for (let i = 0; i < count; i++) {
    const r = first + i;
    if (changedFrom[i] === changedTo[i]) {
      missing ??= new Uint8Array(g.rows);
      missing[r] = 1;
    } else if (missing !== null) missing[r] = 0;
    values[r] = changedValues[i]!;
  }
  return { column: numberColumn(values, missing, name, { source: g.source, from, to }), texts: { source: src, from: changedFrom, to: changedTo } };
}

/** The double of the decimal text source[a, b), or null when it is not one. */
function numberIn(src: string, a: number, b: number, scan: DecimalScan): number | null {
  if (!scanDecimalIn(src, a, b, scan)) return null;
  const s = scan.scale;
  if (scan.significand === 0 && scan.fits) return src.charCodeAt(a) === MINUS ? -0 : 0;
  if (scan.fits && s >= -22 && s <= 22) return s >= 0 ? scan.significand * EXACT_POWERS[s]! : scan.significand / EXACT_POWERS[-s]!;
  return Number(src.slice(a, b));
}

/** Column j as texts: each distinct text made once, as typed (untrimmed); blank fields missing. */
function textColumnOfGrid(g: FieldGrid, j: number, name: string): Column {
  const src = g.source;
  const width = g.header.length;
  const n = g.rows;
  const levels = new TextLevels();
  const codes = new Int32Array(n);
  const missing = new Uint8Array(n);
  for (let r = 0; r < n; r++) {
    const k = r * width + j;
    const a = g.from[k]!;
    const b = g.to[k]!;
    let blank = true;
    for (let i = a; i < b; i++) {
      if (!isTrimmed(src.charCodeAt(i))) {
        blank = false;
        break;
      }
    }
    if (blank) {
      missing[r] = 1;
      codes[r] = -1;
    } else if (g.escaped !== null && g.escaped[k] === 1) {
      codes[r] = levels.codeOfText(src.slice(a, b).replaceAll('""', '"'));
    } else {
      codes[r] = levels.codeOf(src, a, b);
    }
  }
  const texts = levels.texts;
  const values: string[] = new Array<string>(n);
  for (let r = 0; r < n; r++) {
    const c = codes[r]!;
    values[r] = c < 0 ? '' : texts[c]!;
  }
  return textColumn(values, missing, name);
}

/** The table of a field grid. */
export function tableOfGrid(g: FieldGrid): Table {
  return table(
    g.header,
    g.header.map((name, j) => columnOfGrid(g, j, name)),
  );
}
