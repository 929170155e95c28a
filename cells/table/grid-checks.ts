/**
 * What the grid checks as the user types: whether a column is meant to hold numbers and
 * which of its fields are not numbers, what a column reads as, and whether a name can
 * name a column or the table. Pure functions over counts kept per column.
 */
import { isKeyword, isPlainName } from '../../src/lang/lexer.ts';
import { msg } from '../../src/messages/language.ts';
import { DECIMAL } from './model.ts';
import { gridMsg } from '../../src/messages/grid.ts';

/** Per column: fields that are not empty, that read as decimal numbers, that read as true/false. */
export interface ColumnCounts {
  readonly filled: Int32Array;
  readonly numbers: Int32Array;
  readonly booleans: Int32Array;
}

/** Counts for a number of columns, all zero. */
export function emptyCounts(cols: number): ColumnCounts {
  return { filled: new Int32Array(cols), numbers: new Int32Array(cols), booleans: new Int32Array(cols) };
}

/** A copy of counts, to change without touching the original. */
export function copyCounts(k: ColumnCounts): ColumnCounts {
  return { filled: k.filled.slice(), numbers: k.numbers.slice(), booleans: k.booleans.slice() };
}

/**
 * Adds (sign 1) or removes (sign -1) one field from column c's counts. Fields are trimmed as
 * the table model trims them (cells/table/model.ts), so the grid and the engine agree.
 */
export function countField(k: ColumnCounts, c: number, field: string, sign: 1 | -1): void {
  const f = field.trim();
  if (f === '') return;
  k.filled[c]! += sign;
  if (DECIMAL.test(f)) k.numbers[c]! += sign;
  else if (f === 'true' || f === 'false') k.booleans[c]! += sign;
}

/** Counts every field of rows of a given width. */
export function countRows(rows: readonly (readonly string[])[], cols: number): ColumnCounts {
  const k = emptyCounts(cols);
  for (const row of rows) for (let c = 0; c < cols; c++) countField(k, c, row[c] ?? '', 1);
  return k;
}

/**
 * A column is meant to hold numbers when at least half of its non-empty fields are decimal
 * numbers. // common practice, no source: a column that is mostly numbers with a few odd
 * entries is a column of measurements with typing slips (a decimal comma, a unit, "n/a"),
 * not a column of labels; below half, the numbers are more likely codes among labels.
 */
export function holdsNumbers(filled: number, numbers: number): boolean {
  return numbers > 0 && numbers * 2 >= filled;
}

/** Why a field cannot be what its column holds, or null when it can (or is empty). */
export function fieldProblem(field: string, column: string, columnHoldsNumbers: boolean): string | null {
  if (!columnHoldsNumbers) return null;
  const f = field.trim();
  if (f === '' || DECIMAL.test(f)) return null;
  return gridMsg.notNumber(f, column);
}

/** How many fields of column c are marked as not numbers. */
export function markedCount(k: ColumnCounts, c: number): number {
  const filled = k.filled[c] ?? 0;
  const numbers = k.numbers[c] ?? 0;
  return holdsNumbers(filled, numbers) ? filled - numbers : 0;
}

/** What formulas read a column as, by the table model's rule (every non-empty field). */
export type ColumnReading = 'numbers' | 'true/false' | 'text' | 'empty';

/** What column c reads as. */
export function columnReading(k: ColumnCounts, c: number): ColumnReading {
  const filled = k.filled[c] ?? 0;
  if (filled === 0) return 'empty';
  if (k.numbers[c] === filled) return 'numbers';
  if (k.booleans[c] === filled) return 'true/false';
  return 'text';
}

/** Why a text cannot rename column c of a header, or null when it can. */
export function columnNameProblem(header: readonly string[], c: number, raw: string): string | null {
  const name = raw.trim();
  if (name === '') return gridMsg.columnNameEmpty();
  if (/[\r\n]/.test(name)) return gridMsg.columnNameLineBreak();
  const j = header.findIndex((h, i) => i !== c && h === name);
  if (j >= 0) return gridMsg.columnNameTaken(name, j + 1);
  return null;
}

/**
 * Why a text cannot rename the table, or null when it can. `taken` holds the names other
 * cells define (a Set, since the names come from a document).
 */
export function tableNameProblem(raw: string, current: string | null, taken: ReadonlySet<string>): string | null {
  const name = raw.trim();
  if (name === '') return gridMsg.tableNameEmpty();
  if (isKeyword(name)) return gridMsg.tableNameKeyword(name);
  if (!isPlainName(name)) return msg.badTableName(name);
  if (name !== current && taken.has(name)) return gridMsg.tableNameTaken(name);
  return null;
}

/** A column name not in `names`: column_N for the column's place N, or the next free number. */
export function freshColumnName(names: ReadonlySet<string>, place: number): string {
  for (let k = place; ; k++) {
    const name = `column_${k}`;
    if (!names.has(name)) return name;
  }
}
