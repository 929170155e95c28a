/**
 * CSV (RFC 4180) for table bodies, through papaparse, with the character range of every
 * row so that an error can point at the row in the cell's text: the page's grid and pasted
 * text read through it. Documents and data files are read by the columnar reader
 * (csv-fields.ts, held to this one field for field); tables are written by csv-write.ts.
 *
 * Rules of our own on top of RFC 4180 (documented in DEVELOPERS.md): the delimiter is always
 * a comma; lines that are entirely empty are skipped (they separate cells in a document), so
 * an empty field in a one-column table is written as "".
 */
import Papa from 'papaparse';
import { msg } from '../messages/language.ts';
import { CsvError, type CsvGrid } from './csv-error.ts';

/** Reads CSV text into a grid. Throws CsvError for ragged rows, repeated or empty header names. */
export function parseCsv(text: string): CsvGrid {
  const rows: string[][] = [];
  const ranges: [number, number][] = [];
  let start = 0;
  let failure: CsvError | null = null;
  Papa.parse<string[]>(text, {
    delimiter: ',',
    quoteChar: '"',
    escapeChar: '"',
    step: (result, parser) => {
      const end = result.meta.cursor;
      const fields = result.data;
      const from = start;
      start = end;
      if (result.errors.length > 0 && failure === null) {
        const e = result.errors[0]!;
        failure =
          e.code === 'MissingQuotes'
            ? new CsvError(msg.csvQuote(rows.length), from, end)
            : new CsvError(msg.csvProblem(rows.length, e.message), from, end);
        parser.abort();
        return;
      }
      // an entirely empty line (not a quoted empty field) is a separator, not a row
      if (fields.length === 1 && fields[0] === '' && !/"/.test(text.slice(from, end))) return;
      rows.push(fields);
      ranges.push([from, trimEnd(text, from, end)]);
    },
  });
  if (failure !== null) throw failure;
  if (rows.length === 0) throw new CsvError(msg.emptyTable(), 0, 0);
  const header = rows[0]!.map((h) => h.trim());
  const headerRange = ranges[0]!;
  const seen = new Map<string, number>();
  header.forEach((h, j) => {
    if (h === '') throw new CsvError(msg.emptyHeader(j + 1), headerRange[0], headerRange[1]);
    const first = seen.get(h);
    if (first !== undefined) throw new CsvError(msg.duplicateHeader(h, first + 1, j + 1), headerRange[0], headerRange[1]);
    seen.set(h, j);
  });
  for (let r = 1; r < rows.length; r++) {
    const row = rows[r]!;
    if (row.length !== header.length) {
      const [from, to] = ranges[r]!;
      throw new CsvError(msg.raggedRow(r, row.length, header.length), from, to);
    }
  }
  return { header, rows: rows.slice(1), rowRanges: ranges.slice(1) };
}

/** The end of a row's range without its line terminator. */
function trimEnd(text: string, from: number, to: number): number {
  let e = to;
  while (e > from && (text[e - 1] === '\n' || text[e - 1] === '\r')) e--;
  return e;
}
