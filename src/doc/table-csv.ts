/**
 * A table value as CSV text, for saving from the page (data, layouts, analysis tables, means,
 * pairs) and for run sheets. Numbers typed as decimals keep their text; computed numbers are
 * written in their shortest round-trip form, so the file reads back as the same doubles;
 * missing values are empty fields.
 *
 * Spreadsheet programs run a field that starts with `=`, `+`, `-` or `@` as a formula, so a
 * text field that starts so (a hostile or unlucky name) is written with a leading apostrophe,
 * the usual guard (common practice, no source); numbers are written as they are.
 */
import { decimalAt, isMissingAt, type Column, type Table } from '../lang/values.ts';
import { writeCsv } from './csv-write.ts';

const FORMULA_START = /^[=+\-@\t\r]/;

/** One field of a column as CSV text. */
export function csvField(c: Column, i: number): string {
  if (isMissingAt(c, i)) return '';
  switch (c.type) {
    case 'text': {
      const s = c.values[i]!;
      return FORMULA_START.test(s) ? `'${s}` : s;
    }
    case 'boolean':
      return c.values[i] === 1 ? 'true' : 'false';
    case 'number':
      return (c.decimals === null ? '' : decimalAt(c.decimals, i)) || String(c.values[i]);
  }
}

/** The rows of a table as CSV fields, with `extra` empty fields after each row. */
export function csvRows(t: Table, extra = 0): string[][] {
  const rows: string[][] = [];
  for (let i = 0; i < t.rows; i++) {
    const row = t.columns.map((c) => csvField(c, i));
    for (let j = 0; j < extra; j++) row.push('');
    rows.push(row);
  }
  return rows;
}

/** A table as CSV text: its header, then its rows. */
export function tableCsv(t: Table): string {
  return writeCsv(t.names, csvRows(t));
}
