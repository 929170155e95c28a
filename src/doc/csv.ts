/**
 * CSV (RFC 4180) for table bodies, through papaparse, with the character range of every
 * row so that an error can point at the row in the cell's text.
 *
 * Rules of our own on top of RFC 4180 (documented in DEVELOPERS.md): the delimiter is always
 * a comma; lines that are entirely empty are skipped (they separate cells in a document), so
 * an empty field in a one-column table is written as "".
 */
import Papa from 'papaparse';
import { msg } from '../messages/language.ts';

/** A CSV text read into a header and rows of fields. */
export interface CsvGrid {
  readonly header: readonly string[];
  /** Rows of fields, header excluded; every row has header.length fields. */
  readonly rows: readonly (readonly string[])[];
  /** Character range [from, to) of each data row in the text. */
  readonly rowRanges: readonly (readonly [number, number])[];
}

/** A CSV text that cannot be read as a table, with the range at fault. */
export class CsvError extends Error {
  readonly from: number;
  readonly to: number;
  constructor(message: string, from: number, to: number) {
    super(message);
    this.name = 'CsvError';
    this.from = from;
    this.to = to;
  }
}

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

/** Writes a header and rows as CSV with "\n" line ends and a final newline. */
export function writeCsv(header: readonly string[], rows: readonly (readonly string[])[]): string {
  const oneColumn = header.length === 1;
  const data = [header, ...rows].map((r) => r.map((f) => f));
  let text = Papa.unparse(data as string[][], { newline: '\n', quotes: false, delimiter: ',' });
  if (oneColumn) {
    // an empty field alone on its line would read as a separator: quote it
    text = text
      .split('\n')
      .map((l) => (l === '' ? '""' : l))
      .join('\n');
  }
  return `${text}\n`;
}
