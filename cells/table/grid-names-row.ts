/**
 * A pasted block whose first row names its columns. Copied from a spreadsheet, a block often
 * starts with its row of names; pasted as data into a new table, those names would land as a
 * data row and mark the numeric columns "not a number". So, when a new table (one still as a
 * new table starts, or with nothing in it under untitled columns) receives at its first field
 * a block whose first row is all names over rows that are numbers in at least one column, the
 * first row becomes the column names. The view offers one click to put it back as data.
 * Pure; no DOM.
 */
import { tableKind } from './kind.ts';
import { DECIMAL } from './model.ts';
import { columnNameProblem, countRows, holdsNumbers } from './grid-checks.ts';
import type { Rect } from './grid-keys.ts';
import { readBodyGrid, writeBodyGrid, type BodyGrid } from './grid-model.ts';

/** The grid a new table starts with (the kind's own template). */
const STARTER: BodyGrid = readBodyGrid(tableKind.template?.(() => 'table').body ?? '\n');
const UNTITLED = /^column_\d+$/;

/** The row a new table starts with, perhaps widened by empty columns. */
function isStarterRow(row: readonly string[]): boolean {
  const start = STARTER.rows[0];
  if (start === undefined) return false;
  return row.every((f, i) => (i < start.length ? f === start[i] : f.trim() === ''));
}

/**
 * A table still new: its column names are the ones a new table or an added column gets, and
 * it holds no data except, in its first row, what a new table starts with.
 */
export function isNewTable(g: BodyGrid): boolean {
  const starterNames = new Set(STARTER.header);
  if (!g.header.every((h) => starterNames.has(h) || UNTITLED.test(h))) return false;
  for (let r = 0; r < g.rows.length; r++) {
    const row = g.rows[r]!;
    if (row.every((f) => f.trim() === '')) continue;
    if (r === 0 && isStarterRow(row)) continue;
    return false;
  }
  return true;
}

/** A field that reads as a column's name rather than a value: not empty, not a number, not true/false. */
function isName(field: string): boolean {
  const f = field.trim();
  return f !== '' && !DECIMAL.test(f) && f !== 'true' && f !== 'false';
}

/**
 * True when a block's first row names its columns: at least two rows, every field of the
 * first a usable column name (distinct, no line break) that is not a number, and at least
 * one column whose fields below read as numbers.
 */
export function firstRowNames(block: readonly (readonly string[])[]): boolean {
  const names = block[0];
  if (names === undefined || block.length < 2 || names.length === 0) return false;
  if (!names.every(isName)) return false;
  const header = names.map((n) => n.trim());
  if (header.some((_, c) => columnNameProblem(header, c, header[c]!) !== null)) return false;
  const counts = countRows(block.slice(1), header.length);
  return header.some((_, c) => holdsNumbers(counts.filled[c] ?? 0, counts.numbers[c] ?? 0));
}

/**
 * The table a paste gives when its first row is taken as the column names: the pasted block
 * itself, names over rows. Null when the paste is not such a case (not at the first field,
 * not a new table, or a first row that does not name columns).
 */
export function pasteWithNames(g: BodyGrid, target: Rect, block: readonly (readonly string[])[]): BodyGrid | null {
  if (target.r0 !== 0 || target.c0 !== 0) return null;
  if (!isNewTable(g) || !firstRowNames(block)) return null;
  const header = block[0]!.map((n) => n.trim());
  const rows = block.slice(1).map((r) => {
    const row = r.slice();
    while (row.length < header.length) row.push('');
    return row;
  });
  return writeBodyGrid(header, rows, g.eol);
}
