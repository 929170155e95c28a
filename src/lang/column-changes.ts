/**
 * Which rows a column changed from the column it was made from, when whoever made it knows
 * (a table read again after an edit of a few rows). The evaluation worker uses it to send
 * the page those rows rather than compare the two columns element by element. Kept beside
 * the columns, not in them: a column stays a plain value.
 */
import type { Column } from './values.ts';

/** A column made from `base` by changing the elements at `rows` (and nothing else). */
export interface ColumnChange {
  readonly base: Column;
  readonly rows: Int32Array;
}

const changes = new WeakMap<Column, ColumnChange>();

/** Notes that `next` is `base` with the elements at `rows` changed. */
export function noteColumnChange(next: Column, base: Column, rows: Int32Array): void {
  changes.set(next, { base, rows });
}

/** How `next` was made from another column, if that was noted. */
export function columnChangeOf(next: Column): ColumnChange | undefined {
  return changes.get(next);
}
