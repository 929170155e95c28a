/**
 * Reading a table body again after an edit without reading all of it: the text before and
 * after the change is the same, so only the lines the change lies in are split into fields,
 * and only the columns whose fields changed are built again. A change that touches the
 * header, a quoted field, or gives a row the wrong number of fields is read in full
 * instead (so its error, if any, is the full reader's).
 */
import type { CsvGrid } from '../../src/doc/csv.ts';
import { table, type Column, type Table } from '../../src/lang/values.ts';

/** What a table keeps of its last reading of a body. */
export class KeptTable {
  readonly body: string;
  readonly grid: CsvGrid;
  readonly value: Table;
  constructor(body: string, grid: CsvGrid, value: Table) {
    this.body = body;
    this.grid = grid;
    this.value = value;
  }
}

/** Counts of the work done, for tests that check an edit reads only what it changed. */
export const tableWork = { rowsRead: 0, columnsBuilt: 0 };

/** The last index where a and b agree from the start, and from the end (not overlapping). */
function sameEnds(a: string, b: string): { head: number; tail: number } {
  const n = Math.min(a.length, b.length);
  let head = 0;
  while (head < n && a.charCodeAt(head) === b.charCodeAt(head)) head++;
  let tail = 0;
  while (tail < n - head && a.charCodeAt(a.length - 1 - tail) === b.charCodeAt(b.length - 1 - tail)) tail++;
  return { head, tail };
}

/** The first row whose range ends at or after `at` (rows are in text order). */
function firstRowEndingFrom(ranges: CsvGrid['rowRanges'], at: number): number {
  let lo = 0;
  let hi = ranges.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (ranges[mid]![1] < at) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/**
 * The table of `body`, read from what was kept of an earlier body; null when the change
 * must be read in full. `columnFromFields` builds a column as the full reader does.
 */
export function rereadTable(
  kept: KeptTable,
  body: string,
  columnFromFields: (name: string, fields: readonly string[]) => Column,
): { grid: CsvGrid; value: Table } | null {
  const old = kept.body;
  // the full reader guesses the line break from the text; with carriage returns about,
  // splitting at line feeds might not agree with it
  if (old.includes('\r') || body.includes('\r')) return null;
  const { head, tail } = sameEnds(old, body);
  // Whole lines around the change: from the line start before it (in the common head) to
  // the first line break after it (in the common tail), in the old text and the new.
  const lineStart = old.lastIndexOf('\n', head - 1) + 1;
  const oldEndAt = old.length - tail;
  const found = old.indexOf('\n', oldEndAt);
  const oldLineEnd = found < 0 ? old.length : found;
  const newLineEnd = oldLineEnd + (body.length - old.length);
  const oldLines = old.slice(lineStart, oldLineEnd);
  const newLines = body.slice(lineStart, newLineEnd);
  const grid = kept.grid;
  const headerEnd = grid.rows.length > 0 ? grid.rowRanges[0]![0] : old.length;
  // the header line, or quotes (which may join lines): read in full
  if (lineStart < headerEnd || oldLines.includes('"') || newLines.includes('"')) return null;
  // the rows the old lines held
  const first = firstRowEndingFrom(grid.rowRanges, lineStart);
  let last = first;
  while (last < grid.rows.length && grid.rowRanges[last]![0] <= oldLineEnd) last++;
  // the new lines, split into fields; wholly empty lines separate, as in the full reader
  const width = grid.header.length;
  const rows: string[][] = [];
  const ranges: [number, number][] = [];
  let at = lineStart;
  for (const line of newLines.split('\n')) {
    const from = at;
    at += line.length + 1;
    if (line === '') continue;
    const fields = line.split(',');
    if (fields.length !== width) return null;
    rows.push(fields);
    ranges.push([from, from + line.length]);
  }
  tableWork.rowsRead += rows.length;
  const shift = body.length - old.length;
  const allRows = [...grid.rows.slice(0, first), ...rows, ...grid.rows.slice(last)];
  const allRanges = [
    ...grid.rowRanges.slice(0, first),
    ...ranges,
    ...grid.rowRanges.slice(last).map(([a, b]) => [a + shift, b + shift] as const),
  ];
  const next: CsvGrid = { header: grid.header, rows: allRows, rowRanges: allRanges };
  // columns: when the row count stays, only columns with a changed field are built again
  const sameCount = rows.length === last - first;
  const columns = grid.header.map((name, j) => {
    const oldColumn = kept.value.columns[j]!;
    if (sameCount && rows.every((r, k) => r[j] === grid.rows[first + k]![j])) return oldColumn;
    tableWork.columnsBuilt++;
    return columnFromFields(
      name,
      allRows.map((r) => r[j]!),
    );
  });
  return { grid: next, value: table(grid.header, columns) };
}
