/**
 * Writing a header and rows as CSV (RFC 4180, with the rules of DEVELOPERS.md on top): the
 * text a table body, a run sheet or a converted Parquet file is stored as. It writes exactly
 * what papaparse's `unparse` wrote for these calls before (comma, "\n", quoting only where
 * needed), held to it field for field by test/doc/csv-write.test.ts; written here so that
 * the command line does not load papaparse to write a table.
 */

/** Characters that make a field quoted: papaparse's rule, kept so that stored bodies do not change. */
const NEEDS_QUOTES = /[",\r\n\uFEFF]|^ | $/;

/** One field as CSV: quoted, with its quotes doubled, when it holds a comma, a quote, a line break or a byte-order mark, or begins or ends with a space. */
export function csvField(field: string): string {
  return NEEDS_QUOTES.test(field) ? `"${field.replaceAll('"', '""')}"` : field;
}

/** One row of CSV (an empty field alone on its line is written "", as it would read as a separator between cells). */
export function csvLine(fields: readonly string[]): string {
  if (fields.length === 1 && fields[0] === '') return '""';
  let s = '';
  for (let i = 0; i < fields.length; i++) s += (i === 0 ? '' : ',') + csvField(fields[i]!);
  return s;
}

/** Writes a header and rows as CSV with "\n" line ends and a final newline. */
export function writeCsv(header: readonly string[], rows: readonly (readonly string[])[]): string {
  const lines = new Array<string>(rows.length + 1);
  lines[0] = csvLine(header);
  for (let i = 0; i < rows.length; i++) lines[i + 1] = csvLine(rows[i]!);
  return `${lines.join('\n')}\n`;
}
