/**
 * Which rows a column changed from the column it was made from, when whoever made it knows
 * (a table read again after an edit of a few rows). The evaluation worker uses it to send
 * the page those rows rather than compare the two columns element by element. Kept beside
 * the columns, not in them: a column stays a plain value.
 */
import type { Column, TextRanges } from './values.ts';

/** A column made from `base` by changing the elements at `rows` (and nothing else). */
export interface ColumnChange {
  readonly base: Column;
  readonly rows: Int32Array;
  /**
   * The new decimal texts at `rows`, in that order, when the maker read them from a short
   * text of its own: reading them there spares reading the column's source, a long text
   * that may not yet be one piece of memory (cells/table/model-rows.ts).
   */
  readonly texts?: TextRanges;
}

const changes = new WeakMap<Column, ColumnChange>();

/** Notes that `next` is `base` with the elements at `rows` changed. */
export function noteColumnChange(next: Column, base: Column, rows: Int32Array, texts?: TextRanges): void {
  changes.set(next, texts === undefined ? { base, rows } : { base, rows, texts });
}

/** How `next` was made from another column, if that was noted. */
export function columnChangeOf(next: Column): ColumnChange | undefined {
  return changes.get(next);
}

/**
 * Columns whose arrays an edit wrote in place for the column that replaced it
 * (cells/table/model-rows.ts): what they held is gone, and they share their arrays with
 * their successor. Only these are marked: other columns share arrays legitimately (a column
 * with its levels put in order is the same values under another order).
 */
const writtenOver = new WeakSet<Column>();

/** Notes that `base`'s arrays were written in place for the column made from it. */
export function noteWrittenOver(base: Column): void {
  writtenOver.add(base);
}

/** Whether `c`'s arrays were written in place for another column (noteWrittenOver). */
export function isWrittenOver(c: Column): boolean {
  return writtenOver.has(c);
}
