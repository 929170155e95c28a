/**
 * CSV text split into field ranges, with no string made per field: every field is a pair of
 * offsets into the text (the content of a quoted field, without its quotes), so that a
 * million-row table costs a few typed arrays instead of millions of small strings. Columns
 * are then built straight from the ranges (csv-columns.ts).
 *
 * It reads exactly as `parseCsv` (csv.ts, through papaparse) does, field for field and error
 * for error; test/doc/csv-fields.fuzz.test.ts compares the two on thousands of generated texts.
 * The rules, which are papaparse's and ours on top of RFC 4180:
 *
 * - a byte-order mark at the start is not part of the text;
 * - the line break is one of "\n", "\r\n", "\r", chosen from the first megabyte with what is
 *   inside quotes left out (see {@link chooseLineBreak}); another kind of break inside an
 *   unquoted field is part of the field;
 * - the delimiter is always a comma; a field is quoted only when its first character is a
 *   quote; a doubled quote inside stands for one; spaces between a closing quote and the next
 *   comma or line break are dropped; a quote closed and followed by anything else makes the
 *   row unreadable; an unclosed quote makes it unreadable too;
 * - a line holding nothing at all is skipped (it separates cells); `""` alone is an empty
 *   field, not a skipped line;
 * - the first row read is the header; every other row must have one field per header name.
 */
import { msg } from '../messages/language.ts';
import { CsvError } from './csv-error.ts';

/** What papaparse calls a malformed closing quote; our message quotes its words. */
const MALFORMED_QUOTE = 'Trailing quote on quoted field is malformed';

/** A CSV text read as field ranges. */
export interface FieldGrid {
  /** The text the ranges point into (the whole text, byte-order mark included). */
  readonly source: string;
  /** Header names, trimmed. */
  readonly header: readonly string[];
  /** Number of data rows (header excluded). */
  readonly rows: number;
  /** Start and end of field (row r, column j) at index r * width + j; data rows only. */
  readonly from: Int32Array;
  readonly to: Int32Array;
  /**
   * 1 at the fields whose range holds doubled quotes to be read as one (quoted fields with a
   * quote inside); null when there are none.
   */
  readonly escaped: Uint8Array | null;
  /** Range [from, to) of each data row in the text, line break excluded: row r at 2r, 2r + 1. */
  readonly rowRanges: Int32Array;
}

/** The text of field (row r, column j). */
export function fieldText(g: FieldGrid, r: number, j: number): string {
  const k = r * g.header.length + j;
  const s = g.source.slice(g.from[k]!, g.to[k]!);
  return g.escaped !== null && g.escaped[k] === 1 ? s.replaceAll('""', '"') : s;
}

/** The character range [from, to) of data row r. */
export function rowRange(g: FieldGrid, r: number): [number, number] {
  return [g.rowRanges[2 * r]!, g.rowRanges[2 * r + 1]!];
}

const QUOTE = 34;
const COMMA = 44;
const CR = 13;
const LF = 10;
const BOM = 0xfeff;

/** True for the characters String.prototype.trim removes. */
export function isTrimmed(c: number): boolean {
  if (c <= 32) return c === 32 || (c >= 9 && c <= 13);
  if (c < 0xa0) return false;
  return (
    c === 0xa0 ||
    c === 0x1680 ||
    (c >= 0x2000 && c <= 0x200a) ||
    c === 0x2028 ||
    c === 0x2029 ||
    c === 0x202f ||
    c === 0x205f ||
    c === 0x3000 ||
    c === 0xfeff
  );
}

/**
 * The line break of a text: papaparse's rule, computed in one pass. Within the first megabyte
 * (after `start`), with every pair of quotes and what lies between them left out: "\n" when
 * there is no carriage return or a line feed comes before the first carriage return;
 * otherwise "\r\n" when at least half of the pieces between carriage returns start with a line
 * feed, else "\r".
 */
export function chooseLineBreak(text: string, start: number): '\n' | '\r\n' | '\r' {
  const end = Math.min(text.length, start + 1024 * 1024);
  // quotes pair from the left; a last unpaired quote and what follows it are kept
  let quotes = 0;
  for (let i = start; i < end; i++) if (text.charCodeAt(i) === QUOTE) quotes++;
  const pairedEnd = quotes % 2 === 0 ? end : text.lastIndexOf('"', end - 1);
  let inside = false;
  let crs = 0;
  let firstCr = -1;
  let firstLf = -1;
  let crThenLf = 0;
  let kept = 0; // characters kept so far (positions in the text with quoted parts removed)
  let previousWasCr = false;
  for (let i = start; i < end; i++) {
    const c = text.charCodeAt(i);
    if (c === QUOTE && i < pairedEnd) {
      inside = !inside;
      continue;
    }
    if (inside) continue;
    if (c === CR) {
      if (firstCr < 0) firstCr = kept;
      crs++;
    } else if (c === LF) {
      if (firstLf < 0) firstLf = kept;
      if (previousWasCr) crThenLf++;
    }
    previousWasCr = c === CR;
    kept++;
  }
  const lfFirst = firstLf >= 0 && firstLf < (firstCr < 0 ? kept : firstCr);
  if (crs === 0 || lfFirst) return '\n';
  return crThenLf >= (crs + 1) / 2 ? '\r\n' : '\r';
}

/** Growable Int32 storage. */
class Ints {
  data: Int32Array;
  length = 0;
  constructor(capacity: number) {
    this.data = new Int32Array(Math.max(16, capacity));
  }
  push(x: number): void {
    if (this.length === this.data.length) {
      const next = new Int32Array(this.data.length * 2);
      next.set(this.data);
      this.data = next;
    }
    this.data[this.length++] = x;
  }
  done(): Int32Array {
    // a view, not a copy: the spare room is at most as large as what is used
    return this.data.subarray(0, this.length);
  }
}

/**
 * Reads CSV text into field ranges. Throws CsvError, with the range of the row at fault, for
 * an unclosed or malformed quote, an empty or repeated header name, or a row whose field
 * count differs from the header's; a text with no row at all has no header.
 */
export function readFieldGrid(text: string): FieldGrid {
  const len = text.length;
  const start = len > 0 && text.charCodeAt(0) === BOM ? 1 : 0;
  if (start === len) throw new CsvError(msg.emptyTable(), 0, 0);
  const nl = chooseLineBreak(text, start);
  const nl0 = nl.charCodeAt(0);
  const nlLen = nl.length;
  if (text.indexOf('"', start) === -1) return readPlain(text, start, nl);

  // the row being read: its fields' ranges and quoted-with-doubled-quotes flags
  const rowFrom = new Ints(64);
  const rowTo = new Ints(64);
  const rowEscaped = new Ints(64);
  let rowError: 'open' | 'malformed' | null = null;

  let header: string[] | null = null;
  let headerRange: [number, number] = [0, 0];
  let width = 0;
  const guess = Math.max(16, Math.floor(len / 8));
  const from = new Ints(guess);
  const to = new Ints(guess);
  const ranges = new Ints(Math.max(16, Math.floor(len / 16)));
  const escapedAt: number[] = [];
  let rowsRead = 0; // rows kept, header included (the row number messages use)
  let ragged: CsvError | null = null;

  let rowStart = start; // where the current row began (after the previous row's break)
  let cursor = start;

  const clearRow = (): void => {
    rowFrom.length = 0;
    rowTo.length = 0;
    rowEscaped.length = 0;
  };

  /** Ends the current row at `end` (its break included). */
  const endRow = (end: number): void => {
    const rFrom = rowStart;
    rowStart = end;
    if (rowError !== null) {
      throw rowError === 'open'
        ? new CsvError(msg.csvQuote(rowsRead), rFrom, end)
        : new CsvError(msg.csvProblem(rowsRead, MALFORMED_QUOTE), rFrom, end);
    }
    const count = rowFrom.length;
    const fs = rowFrom.data;
    const ts = rowTo.data;
    const es = rowEscaped.data;
    // an entirely empty line (not a quoted empty field) separates; it is not a row
    if (count === 1 && fs[0] === ts[0] && text.charCodeAt(rFrom) !== QUOTE) {
      clearRow();
      return;
    }
    let rTo = end;
    while (rTo > rFrom && (text.charCodeAt(rTo - 1) === LF || text.charCodeAt(rTo - 1) === CR)) rTo--;
    if (header === null) {
      const names: string[] = [];
      for (let j = 0; j < count; j++) {
        const s = text.slice(fs[j]!, ts[j]!);
        names.push((es[j] === 1 ? s.replaceAll('""', '"') : s).trim());
      }
      header = names;
      headerRange = [rFrom, rTo];
      width = header.length;
    } else if (count !== width) {
      ragged ??= new CsvError(msg.raggedRow(rowsRead, count, width), rFrom, rTo);
    } else if (ragged === null) {
      const base = from.length;
      for (let j = 0; j < count; j++) {
        from.push(fs[j]!);
        to.push(ts[j]!);
        if (es[j] === 1) escapedAt.push(base + j);
      }
      ranges.push(rFrom);
      ranges.push(rTo);
    }
    rowsRead++;
    clearRow();
  };

  const push = (a: number, b: number, escaped: boolean): void => {
    rowFrom.push(a);
    rowTo.push(b);
    rowEscaped.push(escaped ? 1 : 0);
  };

  // next comma and next line break at or after a position (-1: none left); they only move forward
  let nextComma = text.indexOf(',', cursor);
  let nextBreak = text.indexOf(nl, cursor);
  const commaFrom = (p: number): void => {
    if (nextComma !== -1 && nextComma < p) nextComma = text.indexOf(',', p);
  };
  const breakFrom = (p: number): void => {
    if (nextBreak !== -1 && nextBreak < p) nextBreak = text.indexOf(nl, p);
  };
  /** How many characters from `a` up to `b` are all trimmable (0 unless all are and b > a). */
  const spacesUpTo = (a: number, b: number): number => {
    if (b === -1 || b <= a) return 0;
    for (let i = a; i < b; i++) if (!isTrimmed(text.charCodeAt(i))) return 0;
    return b - a;
  };
  const isBreakAt = (p: number): boolean =>
    p < len && text.charCodeAt(p) === nl0 && (nlLen === 1 || (p + 1 < len && text.charCodeAt(p + 1) === LF));

  for (;;) {
    if (cursor < len && text.charCodeAt(cursor) === QUOTE) {
      // a quoted field: find its closing quote
      const content = cursor + 1;
      let q = cursor;
      let escaped = false;
      for (;;) {
        q = text.indexOf('"', q + 1);
        if (q === -1) {
          rowError ??= 'open';
          push(content, len, false);
          endRow(len);
          return finish();
        }
        if (q === len - 1) {
          push(content, q, escaped);
          endRow(len);
          return finish();
        }
        if (text.charCodeAt(q + 1) === QUOTE) {
          escaped = true;
          q++;
          continue;
        }
        commaFrom(q + 1);
        breakFrom(q + 1);
        const upTo = nextBreak === -1 ? nextComma : Math.min(nextComma, nextBreak);
        const spaces = spacesUpTo(q + 1, upTo);
        if (q + 1 + spaces < len && text.charCodeAt(q + 1 + spaces) === COMMA) {
          push(content, q, escaped);
          cursor = q + 1 + spaces + 1;
          break;
        }
        const spacesToBreak = spacesUpTo(q + 1, nextBreak);
        if (isBreakAt(q + 1 + spacesToBreak)) {
          push(content, q, escaped);
          cursor = q + 1 + spacesToBreak + nlLen;
          endRow(cursor);
          break;
        }
        // a closing quote followed by something else: the row cannot be read
        rowError ??= 'malformed';
        q++;
      }
      continue;
    }
    commaFrom(cursor);
    breakFrom(cursor);
    if (nextComma !== -1 && (nextComma < nextBreak || nextBreak === -1)) {
      push(cursor, nextComma, false);
      cursor = nextComma + 1;
      continue;
    }
    if (nextBreak !== -1) {
      push(cursor, nextBreak, false);
      cursor = nextBreak + nlLen;
      endRow(cursor);
      continue;
    }
    push(cursor, len, false);
    endRow(len);
    return finish();
  }

  function finish(): FieldGrid {
    if (header === null) throw new CsvError(msg.emptyTable(), 0, 0);
    const names: string[] = header;
    checkHeader(names, headerRange);
    if (ragged !== null) throw ragged;
    let escaped: Uint8Array | null = null;
    if (escapedAt.length > 0) {
      escaped = new Uint8Array(from.length);
      for (const k of escapedAt) escaped[k] = 1;
    }
    return {
      source: text,
      header: names,
      rows: ranges.length / 2,
      from: from.done(),
      to: to.done(),
      escaped,
      rowRanges: ranges.done(),
    };
  }
}

/**
 * {@link readFieldGrid} for a text with no quote at all (the usual data file): one pass over
 * the characters, fields written straight into the range arrays. Same rows, same errors.
 */
function readPlain(text: string, start: number, nl: '\n' | '\r\n' | '\r'): FieldGrid {
  const len = text.length;
  let capacity = Math.max(64, Math.floor(len / 4));
  let from = new Int32Array(capacity);
  let to = new Int32Array(capacity);
  let ranges = new Int32Array(Math.max(64, Math.floor(len / 8)));
  let rowCount = 0;
  let header: string[] | null = null;
  let headerRange: [number, number] = [0, 0];
  let width = -1;
  let rowsRead = 0;
  let ragged: CsvError | null = null;
  let fp = 0; // fields written
  let rowFp = 0; // where the current row's fields start
  let rowStart = start;
  // Line by line, finding line breaks and commas with indexOf (which the engine runs at
  // memory speed) rather than looking at every character. `comma` is the next comma at or
  // after the current field, kept across lines so that a text with few commas is not
  // searched to its end once per line.
  const nlLen = nl.length;
  let comma = text.indexOf(',', start);
  let at = start;
  for (;;) {
    let lineEnd = text.indexOf(nl, at);
    const last = lineEnd < 0;
    if (last) lineEnd = len;
    let f = at;
    for (;;) {
      if (comma >= 0 && comma < f) comma = text.indexOf(',', f);
      const ends = comma >= 0 && comma < lineEnd ? comma : lineEnd;
      if (fp === capacity) {
        capacity *= 2;
        const grownFrom = new Int32Array(capacity);
        grownFrom.set(from);
        from = grownFrom;
        const grownTo = new Int32Array(capacity);
        grownTo.set(to);
        to = grownTo;
      }
      from[fp] = f;
      to[fp++] = ends;
      if (ends === lineEnd) break;
      f = ends + 1;
    }
    // the end of a row: its break (if any) ends at `end`
    const end = last ? len : lineEnd + nlLen;
    at = end;
    const count = fp - rowFp;
    const rFrom = rowStart;
    rowStart = end;
    if (count === 1 && from[rowFp] === to[rowFp]) {
      fp = rowFp; // an empty line separates; it is not a row
      if (last) break;
      continue;
    }
    let rTo = end;
    while (rTo > rFrom && (text.charCodeAt(rTo - 1) === LF || text.charCodeAt(rTo - 1) === CR)) rTo--;
    if (count === width && ragged === null) {
      if (2 * rowCount + 2 > ranges.length) {
        const r = new Int32Array(ranges.length * 2);
        r.set(ranges);
        ranges = r;
      }
      ranges[2 * rowCount] = rFrom;
      ranges[2 * rowCount + 1] = rTo;
      rowCount++;
    } else if (header === null) {
      const names: string[] = [];
      for (let k = rowFp; k < fp; k++) names.push(text.slice(from[k]!, to[k]!).trim());
      header = names;
      headerRange = [rFrom, rTo];
      width = count;
      fp = rowFp;
    } else {
      ragged ??= new CsvError(msg.raggedRow(rowsRead, count, width), rFrom, rTo);
      fp = rowFp;
    }
    rowFp = fp;
    rowsRead++;
    if (last) break;
  }
  if (header === null) throw new CsvError(msg.emptyTable(), 0, 0);
  const names: string[] = header;
  checkHeader(names, headerRange);
  if (ragged !== null) throw ragged;
  return {
    source: text,
    header: names,
    rows: rowCount,
    from: from.subarray(0, fp),
    to: to.subarray(0, fp),
    escaped: null,
    rowRanges: ranges.subarray(0, 2 * rowCount),
  };
}

/** Throws for an empty or repeated header name. */
function checkHeader(names: readonly string[], range: readonly [number, number]): void {
  const seen = new Map<string, number>();
  names.forEach((h, j) => {
    if (h === '') throw new CsvError(msg.emptyHeader(j + 1), range[0], range[1]);
    const first = seen.get(h);
    if (first !== undefined) throw new CsvError(msg.duplicateHeader(h, first + 1, j + 1), range[0], range[1]);
    seen.set(h, j);
  });
}
