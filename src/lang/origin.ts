/**
 * Which table a column was read from (`plots.yield`, `plots["yield (kg)"]`), so that a
 * built-in can look at the rest of the data the user analyses: the design of a trial lives in
 * its table (a whole-plot column beside a factorial's factors says the trial is a split
 * plot). Kept beside the values rather than in them, so values stay plain and comparable; a
 * WeakMap keyed by the column object, so nothing is kept alive by it.
 */
import type { Column, Table } from './values.ts';

const owners = new WeakMap<Column, Table>();

/** Record that `column` was read from `table` (called by the evaluator on member access). */
export function noteColumnOwner(column: Column, table: Table): void {
  owners.set(column, table);
}

/** The table a column was read from, or null for a computed column. */
export function columnOwner(column: Column): Table | null {
  return owners.get(column) ?? null;
}
