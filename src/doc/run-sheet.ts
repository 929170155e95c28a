/**
 * A layout as a run sheet: its columns (block, plot, treatment; row, column, treatment; or
 * plot, treatment), then empty columns for the measurements, one row per plot in field order.
 * The technician fills it in; the filled sheet reads back as a table (`--- table NAME from
 * sheet.csv`) that layout_check compares with the layout.
 * Fields are written as src/doc/table-csv.ts writes them (a text that a spreadsheet would
 * run as a formula gets a leading apostrophe).
 */
import type { Table } from '../lang/values.ts';
import { writeCsv } from './csv-write.ts';
import { csvRows } from './table-csv.ts';
import { planningMsg } from '../messages/planning.ts';

/** The measurement columns a run sheet has when none are named. */
export const DEFAULT_MEASUREMENTS: readonly string[] = ['measurement', 'notes'];

/** A run sheet that cannot be written (a measurement column named like a layout column). */
export class RunSheetError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'RunSheetError';
  }
}

/** The CSV text of a run sheet for `layout` with empty `measurements` columns. */
export function runSheet(layout: Table, measurements: readonly string[] = DEFAULT_MEASUREMENTS): string {
  const seen = new Set(layout.names);
  for (const m of measurements) {
    if (m.trim() === '') throw new RunSheetError(planningMsg.measurementUnnamed());
    if (seen.has(m)) throw new RunSheetError(planningMsg.measurementTaken(m));
    seen.add(m);
  }
  const rows = csvRows(layout, measurements.length);
  return writeCsv([...layout.names, ...measurements], rows);
}
