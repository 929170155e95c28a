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

/** Writes a header and rows as CSV with "\n" line ends and a final newline. */
export function writeCsv(header: readonly string[], rows: readonly (readonly string[])[]): string {
  // an empty field alone on its line would read as a separator between cells: quote it
  const line =
    header.length === 1
      ? (r: readonly string[]): string => {
          const field = r[0] ?? '';
          return field === '' ? '""' : csvField(field);
        }
      : (r: readonly string[]): string => r.map(csvField).join(',');
  const lines = new Array<string>(rows.length + 1);
  lines[0] = line(header);
  for (let i = 0; i < rows.length; i++) lines[i + 1] = line(rows[i]!);
  return `${lines.join('\n')}\n`;
}
