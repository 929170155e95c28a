/**
 * Reading a table body again after an edit without reading all of it: the text before and
 * after the change is the same, so only the lines the change lies in are split into fields,
 * and only the columns whose fields changed are built again. A change that touches the
 * header, a quoted field, or gives a row the wrong number of fields is read in full
 * instead (so its error, if any, is the full reader's).
 */
import { columnOfGrid, patchNumberColumn, trimFieldInto } from '../../src/doc/csv-columns.ts';
import { noteColumnChange, noteWrittenOver } from '../../src/lang/column-changes.ts';
import type { FieldGrid } from '../../src/doc/csv-fields.ts';
import { table, type Column, type Table } from '../../src/lang/values.ts';

/**
 * What a table keeps of its last reading of a body. It is read again at most once: reading
 * again may bring its grid's arrays up to date in place, for the reading that replaces it.
 */
export class KeptTable {
  readonly body: string;
  readonly grid: FieldGrid;
  readonly value: Table;
  /** Whether the body holds a carriage return (then it is read in full). */
  readonly hasReturn: boolean;
  constructor(body: string, grid: FieldGrid, value: Table, hasReturn: boolean = body.includes('\r')) {
    this.body = body;
    this.grid = grid;
    this.value = value;
    this.hasReturn = hasReturn;
  }
}

/** Counts of the work done, for tests that check an edit reads only what it changed. */
export const tableWork = { rowsRead: 0, columnsBuilt: 0 };

/** Below this length two texts are compared character by character. */
const BLOCK = 64;

/**
 * How many characters a and b share from the start (`head`) and from the end (`tail`, not
 * overlapping the head). Long equal stretches are compared as blocks (string equality, which
 * the engine does as a memory comparison), halving the stretch until it differs: about twice
 * the length compared in all, at memory speed rather than a character at a time.
 */
function sameEnds(a: string, b: string): { head: number; tail: number } {
  const n = Math.min(a.length, b.length);
  let head = 0;
  let hi = n;
  while (hi - head > BLOCK) {
    const mid = head + ((hi - head) >> 1);
    if (a.slice(head, mid) === b.slice(head, mid)) head = mid;
    else hi = mid;
  }
  while (head < hi && a.charCodeAt(head) === b.charCodeAt(head)) head++;
  const m = n - head;
  let tail = 0;
  hi = m;
  while (hi - tail > BLOCK) {
    const mid = tail + ((hi - tail) >> 1);
    if (a.slice(a.length - mid, a.length - tail) === b.slice(b.length - mid, b.length - tail)) tail = mid;
    else hi = mid;
  }
  while (tail < hi && a.charCodeAt(a.length - 1 - tail) === b.charCodeAt(b.length - 1 - tail)) tail++;
  return { head, tail };
}

/** The first row whose range ends at or after `at` (rows are in text order). */
function firstRowEndingFrom(ranges: Int32Array, rows: number, at: number): number {
  let lo = 0;
  let hi = rows;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (ranges[2 * mid + 1]! < at) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** True when a[af, at) and b[bf, bt) hold the same characters. */
function sameText(a: string, af: number, at: number, b: string, bf: number, bt: number): boolean {
  if (at - af !== bt - bf) return false;
  for (let i = 0; i < at - af; i++) if (a.charCodeAt(af + i) !== b.charCodeAt(bf + i)) return false;
  return true;
}

/**
 * A number column that an edit left alone, read from ranges of the kept body `old`: its
 * ranges move to the new body (the changed rows' from the grid, `lines` being the new text
 * from `lineStart`; the rows after them by `shift`) and its source becomes the new body, in
 * place. Its texts read the same, for its fields did not change, so the column is the same
 * value; and when a later edit changes it (typing along a row), it is read again in the
 * changed rows rather than built afresh from the whole body. A column still read from an
 * older body is left as it is.
 */
function followBody(c: Column, old: string, body: string, next: FieldGrid, j: number, first: number, last: number, shift: number, lines: string, lineStart: number): void {
  if (c.type !== 'number' || c.decimals === null || Array.isArray(c.decimals)) return;
  // written in place: whoever shares this object (a column with its levels put in order)
  // reads the same texts through it before and after
  const r = c.decimals as { source: string; readonly from: Int32Array; readonly to: Int32Array };
  if (r.source !== old || r.from.length !== next.rows) return;
  const width = next.header.length;
  for (let row = first; row < last; row++) {
    const k = row * width + j;
    trimFieldInto(lines, next.from[k]! - lineStart, next.to[k]! - lineStart, r.from, r.to, row, lineStart);
  }
  if (shift !== 0) {
    for (let i = last; i < r.from.length; i++) {
      r.from[i] = r.from[i]! + shift;
      r.to[i] = r.to[i]! + shift;
    }
  }
  r.source = body;
}

/**
 * Where a body differs from the kept one, when known: characters [from, to) of the kept
 * body were replaced, by `text` when it is given.
 */
export interface BodyChange {
  readonly from: number;
  readonly to: number;
  readonly text?: string;
}

/**
 * The table of `body`, read from what was kept of an earlier body; null when the change
 * must be read in full. `change` says where the bodies differ when the edit that made
 * `body` is known (a splice of the kept body, src/doc/edits.ts spliceOf); otherwise the two
 * texts are compared.
 */
export function rereadTable(kept: KeptTable, body: string, change?: BodyChange): { grid: FieldGrid; value: Table } | null {
  const old = kept.body;
  // the full reader guesses the line break from the text; with carriage returns about,
  // splitting at line feeds might not agree with it (the new body has one only if the
  // kept one had, or the changed lines bring one: checked below)
  if (kept.hasReturn) return null;
  // the same before `head` and after the last `tail` characters (not always the longest such stretches)
  const { head, tail } = change === undefined ? sameEnds(old, body) : { head: change.from, tail: old.length - change.to };
  // Whole lines around the change: from the line start before it (in the common head) to
  // the first line break after it (in the common tail), in the old text and the new.
  const lineStart = old.lastIndexOf('\n', head - 1) + 1;
  const oldEndAt = old.length - tail;
  const found = old.indexOf('\n', oldEndAt);
  const oldLineEnd = found < 0 ? old.length : found;
  const newLineEnd = oldLineEnd + (body.length - old.length);
  const oldLines = old.slice(lineStart, oldLineEnd);
  // The new lines are cut from the kept body and the splice's text when it is known, and
  // everything below reads them, never `body` (except to build a column afresh, when the
  // edit is not a field typed over). The new body is a join of three pieces, and
  // the first character read from such a string copies it whole into one (1.2 MB in a
  // table of 100,000 rows, several milliseconds of fresh memory at every keystroke); the
  // kept body was made whole while the thread was idle (settleText).
  const newLines = change?.text !== undefined ? old.slice(lineStart, head) + change.text + old.slice(change.to, oldLineEnd) : body.slice(lineStart, newLineEnd);
  const grid = kept.grid;
  const width = grid.header.length;
  const headerEnd = grid.rows > 0 ? grid.rowRanges[0]! : old.length;
  // the header line, quotes (which may join lines), or a byte-order mark: read in full
  const firstChar = head > 0 ? old.charCodeAt(0) : body.charCodeAt(0);
  if (lineStart < headerEnd || oldLines.includes('"') || newLines.includes('"') || newLines.includes('\r') || firstChar === 0xfeff) return null;
  // the rows the old lines held
  const first = firstRowEndingFrom(grid.rowRanges, grid.rows, lineStart);
  let last = first;
  while (last < grid.rows && grid.rowRanges[2 * last]! <= oldLineEnd) last++;
  // the new lines, split into fields; wholly empty lines separate, as in the full reader
  const fieldFrom: number[] = [];
  const fieldTo: number[] = [];
  const ranges: number[] = [];
  let at = lineStart;
  for (const line of newLines.split('\n')) {
    const from = at;
    at += line.length + 1;
    if (line === '') continue;
    let f = from;
    let count = 0;
    for (;;) {
      const found = newLines.indexOf(',', f - lineStart);
      const comma = found < 0 ? -1 : found + lineStart;
      const end = comma < 0 || comma > from + line.length ? from + line.length : comma;
      fieldFrom.push(f);
      fieldTo.push(end);
      count++;
      if (end === from + line.length) break;
      f = end + 1;
    }
    if (count !== width) return null;
    ranges.push(from, from + line.length);
  }
  const added = ranges.length / 2;
  tableWork.rowsRead += added;
  const shift = body.length - old.length;
  const rows = grid.rows - (last - first) + added;
  const sameCount = added === last - first;
  // the old ranges of the changed rows, to tell below which columns changed
  const oldFrom = grid.from.slice(first * width, last * width);
  const oldTo = grid.to.slice(first * width, last * width);
  const after = (first + added) * width;
  let from: Int32Array;
  let to: Int32Array;
  let rowRanges: Int32Array;
  let escaped: Uint8Array | null = null;
  if (sameCount) {
    // The same number of rows, as when a field is typed over: the kept grid's arrays are
    // brought up to date in place. The kept reading is being replaced and is never read
    // again (KeptTable); new arrays of a few hundred thousand entries at every keystroke
    // cost more than the reading itself, most of it in fresh pages of memory.
    from = grid.from;
    to = grid.to;
    rowRanges = grid.rowRanges;
    escaped = grid.escaped;
    if (escaped !== null) escaped.fill(0, first * width, after);
  } else {
    from = new Int32Array(rows * width);
    to = new Int32Array(rows * width);
    rowRanges = new Int32Array(rows * 2);
    // rows before the change keep their places; the new ones follow; the rest move by `shift`
    from.set(grid.from.subarray(0, first * width));
    to.set(grid.to.subarray(0, first * width));
    rowRanges.set(grid.rowRanges.subarray(0, first * 2));
    from.set(grid.from.subarray(last * width), after);
    to.set(grid.to.subarray(last * width), after);
    rowRanges.set(grid.rowRanges.subarray(last * 2), (first + added) * 2);
    if (grid.escaped !== null) {
      escaped = new Uint8Array(rows * width);
      escaped.set(grid.escaped.subarray(0, first * width));
      escaped.set(grid.escaped.subarray(last * width), after);
    }
  }
  from.set(fieldFrom, first * width);
  to.set(fieldTo, first * width);
  rowRanges.set(ranges, first * 2);
  if (shift !== 0) {
    for (let o = after; o < rows * width; o++) {
      from[o] = from[o]! + shift;
      to[o] = to[o]! + shift;
    }
    for (let o = (first + added) * 2; o < rows * 2; o++) rowRanges[o] = rowRanges[o]! + shift;
  }
  const next: FieldGrid = { source: body, header: grid.header, rows, from, to, escaped, rowRanges };
  // columns: when the row count stays, only columns with a changed field are built again
  const columns = grid.header.map((name, j) => {
    const oldColumn = kept.value.columns[j]!;
    if (sameCount) {
      let same = true;
      for (let r = first; r < last && same; r++) {
        const k = r * width + j;
        const o = (r - first) * width + j;
        same = sameText(old, oldFrom[o]!, oldTo[o]!, newLines, from[k]! - lineStart, to[k]! - lineStart);
      }
      if (same) {
        followBody(oldColumn, old, body, next, j, first, last, shift, newLines, lineStart);
        return oldColumn;
      }
    }
    tableWork.columnsBuilt++;
    // a number column whose changed fields are still numbers: only those rows are read
    if (sameCount) {
      // in place: the kept reading is never read again (KeptTable); the base is marked as
      // written over, so that nothing takes it and its successor, which share their arrays,
      // for the same (sameValue, changedRows)
      const patched = patchNumberColumn(next, j, name, oldColumn, old, first, last, shift, { text: newLines, at: lineStart }, true);
      if (patched !== null) {
        if (patched.column.values === oldColumn.values) noteWrittenOver(oldColumn);
        noteColumnChange(patched.column, oldColumn, Int32Array.from({ length: last - first }, (_, i) => first + i), patched.texts);
        return patched.column;
      }
    }
    return columnOfGrid(next, j, name);
  });
  return { grid: next, value: table(grid.header, columns) };
}
