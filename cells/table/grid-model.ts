/**
 * The grid of a table cell's CSV body, and every change the grid makes to it, as values: each
 * change gives a new grid whose `text` is the new body. Pure; no DOM.
 *
 * A change of some rows splices only those rows' text into the body (parseCsv gives the
 * range of every row), so one field edit in 100,000 rows does not write the table again and
 * the rest of the body keeps its bytes (quoting, line ends). A change of the columns writes
 * the whole table with `csvLine`, which writeCsv writes with (src/doc/csv-write.ts).
 */
import { parseCsv } from '../../src/doc/csv.ts';
import { csvLine } from '../../src/doc/csv-write.ts';
import { decimalAt, type Column, type Table } from '../../src/lang/values.ts';
import { columnNameProblem, copyCounts, countField, countRows, emptyCounts, freshColumnName, type ColumnCounts } from './grid-checks.ts';
import { HEADER_ROW, type Rect } from './grid-keys.ts';
import { gridMsg } from '../../src/messages/grid.ts';

/** A table body read as a grid, with where each row lies in the body text. */
export interface BodyGrid {
  /** The body text this grid was read from or written to (trailing blank lines kept). */
  readonly text: string;
  /** The line end the body uses, kept for the rows the grid writes. */
  readonly eol: '\n' | '\r\n';
  readonly header: readonly string[];
  readonly rows: readonly (readonly string[])[];
  /** Character range [starts[i], ends[i]) of data row i in `text`, line end excluded. */
  readonly starts: Int32Array;
  readonly ends: Int32Array;
  /** Character range of the header row. */
  readonly headerFrom: number;
  readonly headerTo: number;
  readonly counts: ColumnCounts;
  /**
   * How this grid's text was made from another grid's (`of`): characters [from, to) of its
   * text replaced by `text`. Set by a change of rows, so that the view can send the change
   * rather than the whole body. Functions that spread a grid may carry it along; it holds
   * only for `of`, which the view checks by identity.
   */
  readonly change?: {
    readonly of: BodyGrid;
    readonly from: number;
    readonly to: number;
    readonly text: string;
    /** Data rows [from, to) of `of` replaced by `count` rows: this grid's [from, from + count). */
    readonly rows: { readonly from: number; readonly to: number; readonly count: number };
  };
}

/** A change the grid could not make, with the reason to show. */
export interface Refusal {
  readonly refused: string;
}

/** True for a refusal. */
export function isRefusal(x: unknown): x is Refusal {
  return typeof x === 'object' && x !== null && 'refused' in x;
}

function lineEndOf(text: string): '\n' | '\r\n' {
  const i = text.indexOf('\n');
  return i > 0 && text[i - 1] === '\r' ? '\r\n' : '\n';
}

/**
 * A text (an imported file) as a cell body: without its trailing blank lines, then one
 * blank line in the text's own line end. (freshBody ends with "\n\n" whatever the text
 * uses, and after "\r\n" lines a CSV reader takes that "\n\n" into the last field.)
 */
export function bodyOfText(text: string): string {
  const trimmed = text.replace(/(\r\n|\r|\n)+$/, '');
  if (trimmed === '') return '\n';
  const eol = lineEndOf(trimmed);
  return trimmed + eol + eol;
}

/** Reads a body. Throws CsvError (src/doc/csv.ts) when it does not read as a table. */
export function readBodyGrid(text: string): BodyGrid {
  const g = parseCsv(text);
  const n = g.rows.length;
  const starts = new Int32Array(n);
  const ends = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    const r = g.rowRanges[i]!;
    starts[i] = r[0];
    ends[i] = r[1];
  }
  let headerFrom = 0;
  while (headerFrom < text.length && (text[headerFrom] === '\n' || text[headerFrom] === '\r')) headerFrom++;
  let headerTo = n > 0 ? starts[0]! : text.length;
  while (headerTo > headerFrom && (text[headerTo - 1] === '\n' || text[headerTo - 1] === '\r')) headerTo--;
  return {
    text,
    eol: lineEndOf(text),
    header: g.header,
    rows: g.rows,
    starts,
    ends,
    headerFrom,
    headerTo,
    counts: countRows(g.rows, g.header.length),
  };
}

/** Writes a whole table as a body (with the blank line that ends a cell), with row ranges. */
export function writeBodyGrid(header: readonly string[], rows: readonly (readonly string[])[], eol: '\n' | '\r\n' = '\n'): BodyGrid {
  const n = rows.length;
  const starts = new Int32Array(n);
  const ends = new Int32Array(n);
  const parts: string[] = new Array<string>(n + 1);
  const head = csvLine(header);
  parts[0] = head;
  let pos = head.length + eol.length;
  for (let i = 0; i < n; i++) {
    const line = csvLine(rows[i]!);
    parts[i + 1] = line;
    starts[i] = pos;
    ends[i] = pos + line.length;
    pos += line.length + eol.length;
  }
  const text = parts.join(eol) + eol + eol;
  return { text, eol, header, rows, starts, ends, headerFrom: 0, headerTo: head.length, counts: countRows(rows, header.length) };
}

/**
 * Replaces data rows [ra, rb) by `fresh` (any number of rows, each of the header's width),
 * splicing their text into the body. Everything else in the body keeps its bytes.
 */
export function replaceRows(g: BodyGrid, ra: number, rb: number, fresh: readonly (readonly string[])[], usedUp = false): BodyGrid {
  const n = g.rows.length;
  const k = fresh.length;
  if (ra < 0 || rb < ra || rb > n) throw new RangeError(`rows ${ra} to ${rb} are outside a grid of ${n} rows`);
  if (ra === rb && k === 0) return g;
  const lines = fresh.map(csvLine);
  const eol = g.eol;
  let from: number;
  let to: number;
  let insert: string;
  // where the first fresh row starts, relative to `from`
  let lead = 0;
  if (ra < rb) {
    if (k > 0) {
      from = g.starts[ra]!;
      to = g.ends[rb - 1]!;
      insert = lines.join(eol);
    } else if (rb < n) {
      from = g.starts[ra]!;
      to = g.starts[rb]!;
      insert = '';
    } else {
      from = ra > 0 ? g.ends[ra - 1]! : g.headerTo;
      to = g.ends[rb - 1]!;
      insert = '';
    }
  } else if (ra < n) {
    from = to = g.starts[ra]!;
    insert = lines.join(eol) + eol;
  } else {
    from = to = n > 0 ? g.ends[n - 1]! : g.headerTo;
    insert = eol + lines.join(eol);
    lead = eol.length;
  }
  const delta = insert.length - (to - from);
  const m = n - (rb - ra) + k;
  // Rows typed over in place, their text as long as before (a field retyped with as many
  // characters): every row keeps its range, and the arrays are shared. Otherwise new ones;
  // in a table of 100,000 rows each is 400 kB of fresh memory at every edit.
  const sameRanges = delta === 0 && k === rb - ra && lines.every((l, i) => l.length === g.ends[ra + i]! - g.starts[ra + i]!);
  const starts = sameRanges ? g.starts : new Int32Array(m);
  const ends = sameRanges ? g.ends : new Int32Array(m);
  if (!sameRanges) {
    starts.set(g.starts.subarray(0, ra));
    ends.set(g.ends.subarray(0, ra));
    let pos = from + lead;
    for (let i = 0; i < k; i++) {
      starts[ra + i] = pos;
      ends[ra + i] = pos + lines[i]!.length;
      pos += lines[i]!.length + eol.length;
    }
    for (let i = rb; i < n; i++) {
      starts[i - rb + ra + k] = g.starts[i]! + delta;
      ends[i - rb + ra + k] = g.ends[i]! + delta;
    }
  }
  // counts first: the rows replaced are read here, and a grid used up loses them below
  const counts = copyCounts(g.counts);
  const cols = g.header.length;
  for (let i = ra; i < rb; i++) for (let c = 0; c < cols; c++) countField(counts, c, g.rows[i]![c]!, -1);
  for (const row of fresh) for (let c = 0; c < cols; c++) countField(counts, c, row[c]!, 1);
  const rows = spliceRows(g.rows, ra, rb, fresh, usedUp);
  const text = g.text.slice(0, from) + insert + g.text.slice(to);
  return { ...g, text, rows, starts, ends, counts, change: { of: g, from, to, text: insert, rows: { from: ra, to: rb, count: k } } };
}

/**
 * rows with [ra, rb) replaced by `fresh`: rows typed over (as many as before) in one copy,
 * not three, or in `rows` itself when the grid that holds them is used up.
 */
function spliceRows<T>(rows: readonly T[], ra: number, rb: number, fresh: readonly T[], usedUp: boolean): T[] {
  if (fresh.length !== rb - ra) return rows.slice(0, ra).concat(fresh, rows.slice(rb));
  const out = usedUp ? (rows as T[]) : rows.slice();
  for (let i = 0; i < fresh.length; i++) out[ra + i] = fresh[i]!;
  return out;
}

/** Replaces the header row's text (same number of columns). */
function replaceHeader(g: BodyGrid, header: readonly string[]): BodyGrid {
  const line = csvLine(header);
  const delta = line.length - (g.headerTo - g.headerFrom);
  const starts = g.starts.slice();
  const ends = g.ends.slice();
  for (let i = 0; i < starts.length; i++) {
    starts[i]! += delta;
    ends[i]! += delta;
  }
  const text = g.text.slice(0, g.headerFrom) + line + g.text.slice(g.headerTo);
  return { ...g, text, header, starts, ends, headerTo: g.headerFrom + line.length };
}

/** Sets one field; the same grid back when the field already holds the text. */
export function setField(g: BodyGrid, r: number, c: number, value: string): BodyGrid {
  return setFieldOf(g, r, c, value, false);
}

/**
 * {@link setField} for a grid that is used up by it: `g` must never be read again once
 * this returns a new grid (the field editor's grid, which the new one replaces at once).
 * Its list of rows becomes the new grid's, with the one row replaced in it: copying a list
 * of 100,000 rows cost more than the rest of a keystroke in the grid.
 */
export function setFieldUsingUp(g: BodyGrid, r: number, c: number, value: string): BodyGrid {
  return setFieldOf(g, r, c, value, true);
}

function setFieldOf(g: BodyGrid, r: number, c: number, value: string, usedUp: boolean): BodyGrid {
  const row = g.rows[r];
  if (row === undefined || c < 0 || c >= g.header.length) throw new RangeError(`no field at row ${r}, column ${c}`);
  if (row[c] === value) return g;
  const next = row.slice();
  next[c] = value;
  return replaceRows(g, r, r + 1, [next], usedUp);
}

/** Renames column c, or says why it cannot. */
export function renameColumn(g: BodyGrid, c: number, raw: string): BodyGrid | Refusal {
  const problem = columnNameProblem(g.header, c, raw);
  if (problem !== null) return { refused: problem };
  const name = raw.trim();
  if (g.header[c] === name) return g;
  const header = g.header.slice();
  header[c] = name;
  return replaceHeader(g, header);
}

/** Empties the fields of a rectangle (column names are never emptied). */
export function clearRect(g: BodyGrid, rect: Rect): BodyGrid {
  const r0 = Math.max(0, rect.r0);
  const r1 = Math.min(g.rows.length - 1, rect.r1);
  if (r1 < r0) return g;
  const fresh: string[][] = [];
  let changed = false;
  for (let r = r0; r <= r1; r++) {
    const row = g.rows[r]!.slice();
    for (let c = rect.c0; c <= rect.c1; c++) {
      if (row[c] !== '') {
        row[c] = '';
        changed = true;
      }
    }
    fresh.push(row);
  }
  return changed ? replaceRows(g, r0, r1 + 1, fresh) : g;
}

/** Inserts `count` empty rows before data row `at` (at = rows.length appends). */
export function insertRows(g: BodyGrid, at: number, count = 1): BodyGrid {
  const empty = (): string[] => g.header.map(() => '');
  return replaceRows(g, at, at, Array.from({ length: count }, empty));
}

/** Deletes data rows r0 to r1 inclusive. */
export function deleteRows(g: BodyGrid, r0: number, r1: number): BodyGrid {
  const a = Math.max(0, r0);
  const b = Math.min(g.rows.length - 1, r1);
  return b < a ? g : replaceRows(g, a, b + 1, []);
}

/** Inserts `count` empty columns before column `at`, named column_N (N its place, unique). */
export function insertColumns(g: BodyGrid, at: number, count = 1): BodyGrid {
  const names = new Set(g.header);
  const added: string[] = [];
  for (let i = 0; i < count; i++) {
    const name = freshColumnName(names, at + i + 1);
    names.add(name);
    added.push(name);
  }
  const header = [...g.header.slice(0, at), ...added, ...g.header.slice(at)];
  const blanks = added.map(() => '');
  const rows = g.rows.map((r) => [...r.slice(0, at), ...blanks, ...r.slice(at)]);
  return writeBodyGrid(header, rows, g.eol);
}

/** Deletes columns c0 to c1 inclusive, or refuses to delete every column. */
export function deleteColumns(g: BodyGrid, c0: number, c1: number): BodyGrid | Refusal {
  const a = Math.max(0, c0);
  const b = Math.min(g.header.length - 1, c1);
  if (b < a) return g;
  if (a === 0 && b === g.header.length - 1) return { refused: gridMsg.lastColumn() };
  const cut = <T>(xs: readonly T[]): T[] => [...xs.slice(0, a), ...xs.slice(b + 1)];
  return writeBodyGrid(cut(g.header), g.rows.map(cut), g.eol);
}

/** What a paste did. */
export interface Pasted {
  readonly grid: BodyGrid;
  /** The rectangle the pasted block now covers (select it). */
  readonly rect: Rect;
  readonly addedRows: number;
  readonly addedColumns: number;
}

/**
 * Pastes a rectangular block with its top-left field at `target`, growing the table with
 * rows and columns (named column_N, unique) as needed. At the row of column names, the
 * block's first line renames the columns it covers and the rest fills rows from the first.
 * A single value pasted over a larger selection fills the selection.
 */
export function pasteBlock(g: BodyGrid, target: Rect, block: readonly (readonly string[])[]): Pasted | Refusal {
  const height = block.length;
  // a loop, not Math.max(...rows): spreading a pasted block of a few hundred thousand rows overflows the stack
  let width = 0;
  for (const r of block) if (r.length > width) width = r.length;
  if (height === 0 || width === 0) return { refused: gridMsg.pasteEmpty() };
  if (height === 1 && width === 1 && (target.r1 > target.r0 || target.c1 > target.c0)) {
    const value = block[0]![0]!;
    const r0 = Math.max(0, target.r0);
    if (target.r1 < r0) return { refused: gridMsg.pasteOverNames() };
    const fill: string[][] = [];
    for (let r = r0; r <= target.r1; r++) {
      const row = g.rows[r]!.slice();
      for (let c = target.c0; c <= target.c1; c++) row[c] = value;
      fill.push(row);
    }
    return { grid: replaceRows(g, r0, target.r1 + 1, fill), rect: { ...target, r0 }, addedRows: 0, addedColumns: 0 };
  }
  const c0 = target.c0;
  const onHeader = target.r0 === HEADER_ROW;
  const names = onHeader ? block[0]! : null;
  const data = onHeader ? block.slice(1) : block;
  const r0 = onHeader ? 0 : target.r0;
  const cols = g.header.length;
  const n = g.rows.length;
  const addedColumns = Math.max(0, c0 + width - cols);
  const addedRows = Math.max(0, r0 + data.length - n);
  const width2 = cols + addedColumns;

  let header: string[] = g.header.slice();
  if (addedColumns > 0) {
    const taken = new Set(header);
    for (const nm of names ?? []) taken.add(nm.trim());
    for (let j = cols; j < width2; j++) {
      const name = freshColumnName(taken, j + 1);
      taken.add(name);
      header.push(name);
    }
  }
  if (names !== null) {
    header = header.slice();
    for (let j = 0; j < width; j++) header[c0 + j] = (names[j] ?? '').trim();
    for (let j = 0; j < width; j++) {
      const problem = columnNameProblem(header, c0 + j, header[c0 + j]!);
      if (problem !== null) return { refused: gridMsg.pasteHeader(problem) };
    }
  }
  const place = (row: readonly string[] | undefined, i: number): string[] => {
    const out = row === undefined ? new Array<string>(width2).fill('') : row.slice();
    while (out.length < width2) out.push('');
    const src = data[i]!;
    for (let j = 0; j < width; j++) out[c0 + j] = src[j] ?? '';
    return out;
  };
  const rect: Rect = { r0: onHeader ? HEADER_ROW : r0, r1: r0 + data.length - 1, c0, c1: c0 + width - 1 };
  if (addedColumns > 0) {
    const rows: (readonly string[])[] = g.rows.map((r) => [...r, ...new Array<string>(addedColumns).fill('')]);
    for (let i = 0; i < data.length; i++) rows[r0 + i] = place(g.rows[r0 + i], i);
    return { grid: writeBodyGrid(header, rows, g.eol), rect, addedRows, addedColumns };
  }
  let grid = g;
  if (data.length > 0) {
    const fresh: string[][] = [];
    for (let i = 0; i < data.length; i++) fresh.push(place(g.rows[r0 + i], i));
    grid = replaceRows(g, r0, Math.min(n, r0 + data.length), fresh);
  }
  if (names !== null) grid = replaceHeader(grid, header);
  return { grid, rect, addedRows, addedColumns };
}

/** The fields of a rectangle (column names for the header row), for copying. */
export function fieldsIn(view: FieldSource, rect: Rect): string[][] {
  const out: string[][] = [];
  for (let r = rect.r0; r <= rect.r1; r++) {
    const line: string[] = [];
    for (let c = rect.c0; c <= rect.c1; c++) line.push(r === HEADER_ROW ? (view.header[c] ?? '') : view.field(r, c));
    out.push(line);
  }
  return out;
}

/** What the grid shows, whether it comes from a body or from a table value read from a file. */
export interface FieldSource {
  readonly header: readonly string[];
  readonly rowCount: number;
  /** The field's text as typed. */
  field(r: number, c: number): string;
  readonly counts: ColumnCounts;
}

/** A body grid as a field source. */
export function sourceOfBody(g: BodyGrid): FieldSource {
  return { header: g.header, rowCount: g.rows.length, field: (r, c) => g.rows[r]?.[c] ?? '', counts: g.counts };
}

/** The text of element i of a column as the grid shows it ('' when missing). */
function elementText(col: Column, i: number): string {
  if (col.missing !== null && col.missing[i] === 1) return '';
  switch (col.type) {
    case 'number':
      return (col.decimals === null ? undefined : decimalAt(col.decimals, i)) ?? String(col.values[i]);
    case 'boolean':
      return col.values[i] === 1 ? 'true' : 'false';
    case 'text':
      return col.values[i] ?? '';
  }
}

/** A table value (a table read from a CSV file) as a field source; counts are taken once. */
export function sourceOfTable(t: Table): FieldSource {
  const cols = t.columns.length;
  const counts = emptyCounts(cols);
  for (let c = 0; c < cols; c++) {
    const col = t.columns[c]!;
    for (let i = 0; i < t.rows; i++) countField(counts, c, elementText(col, i), 1);
  }
  return { header: t.names, rowCount: t.rows, field: (r, c) => (t.columns[c] ? elementText(t.columns[c], r) : ''), counts };
}
