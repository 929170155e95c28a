/**
 * A layout as a run sheet: its columns (block, plot, treatment; row, column, treatment; or
 * plot, treatment), then empty columns for the measurements, one row per plot in field order.
 * The technician fills it in; the filled sheet reads back as a table (`--- table NAME from
 * sheet.csv`) that layout_check compares with the layout.
 *
 * Spreadsheet programs run a field that starts with `=`, `+`, `-` or `@` as a formula, so a
 * text field that starts so (a hostile or unlucky treatment name) is written with a leading
 * apostrophe, the usual guard; numbers are written as they are.
 */
import { isMissingAt, type Table } from '../lang/values.ts';
import { writeCsv } from './csv.ts';

/** The measurement columns a run sheet has when none are named. */
export const DEFAULT_MEASUREMENTS: readonly string[] = ['measurement', 'notes'];

/** A run sheet that cannot be written (a measurement column named like a layout column). */
export class RunSheetError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'RunSheetError';
  }
}

const FORMULA_START = /^[=+\-@\t\r]/;

/** The CSV text of a run sheet for `layout` with empty `measurements` columns. */
export function runSheet(layout: Table, measurements: readonly string[] = DEFAULT_MEASUREMENTS): string {
  const seen = new Set(layout.names);
  for (const m of measurements) {
    if (m.trim() === '') throw new RunSheetError('a measurement column needs a name.');
    if (seen.has(m)) throw new RunSheetError(`the layout already has a column "${m}"; name the measurement column differently.`);
    seen.add(m);
  }
  const rows: string[][] = [];
  for (let i = 0; i < layout.rows; i++) {
    const row = layout.columns.map((c) => {
      if (isMissingAt(c, i)) return '';
      if (c.type === 'text') {
        const s = c.values[i]!;
        return FORMULA_START.test(s) ? `'${s}` : s;
      }
      if (c.type === 'boolean') return c.values[i] === 1 ? 'true' : 'false';
      return String(c.values[i]);
    });
    for (let j = 0; j < measurements.length; j++) row.push('');
    rows.push(row);
  }
  return writeCsv([...layout.names, ...measurements], rows);
}
