/**
 * What both CSV readers of table bodies give: the grid read (csv.ts, through papaparse, for
 * the page's grid and pasted text) and the error that points at the rows at fault (also
 * thrown by the columnar reader, csv-fields.ts). A module of its own so that the command
 * line, which reads with the columnar reader only, does not load papaparse.
 */

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
