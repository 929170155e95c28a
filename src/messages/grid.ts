/**
 * Every message the table grid shows, in one place, so that wording changes once and the
 * tests can refer to these builders. Plain words: what is wrong and what to do about it.
 */
import { countText } from '../format/digits.ts';
import { plural, quote } from './words.ts';

/** What a field that is not a number most likely needs, or '' when nothing is clear. */
function numberHint(field: string): string {
  if (/^[-+]?\d+,\d+$/.test(field)) {
    // "1,250" reads as a thousands separator or as a decimal comma: say both
    return /^[-+]?\d{1,3},\d{3}$/.test(field) ? ' (use a point for decimals and no thousands separators)' : ' (use a point for decimals)';
  }
  if (/^[-+]?\d{1,3}([, ]\d{3})+(\.\d+)?$/.test(field)) return ' (write the digits without thousands separators)';
  if (/^(n\/?a|na|nan|null|none|missing|-+|\.|\?)$/i.test(field)) return ' (leave the field empty for a missing value)';
  if (/^[-+<>~]?\s*(\d+(?:\.\d*)?|\.\d+)\s*[^\d\s.,]+$/.test(field)) return ' (keep units and signs out of the field; the column name can say the unit)';
  if (/^[<>≤≥~]/.test(field)) return ' (a bound is not a value; note it elsewhere and leave the field empty or give the value)';
  return '';
}

/** The grid's messages. */
export const gridMsg = {
  notNumber: (field: string, column: string) =>
    `${quote(field)} is not a number; the column ${column} holds numbers${numberHint(field)}`,
  notNumbersCount: (n: number) => (n === 1 ? '1 not a number' : `${countText(n)} not numbers`),
  notNumbersTitle: (n: number, column: string) =>
    `${plural(n, 'field')} of ${column} ${n === 1 ? 'is' : 'are'} not numbers, so formulas read the whole column as text until ${n === 1 ? 'it is' : 'they are'} fixed.`,
  missingField: () => 'missing (an empty field)',
  columnReads: (reading: string) => `formulas read this column as ${reading}`,
  notPlainColumn: (table: string, column: string) => `formulas reach this column as ${table}[${JSON.stringify(column)}]`,

  columnNameEmpty: () => 'A column needs a name.',
  columnNameLineBreak: () => 'A column name cannot hold a line break.',
  columnNameTaken: (name: string, column: number) => `The column ${quote(name)} already exists (column ${column}); give each column its own name.`,
  tableNameEmpty: () => 'A table needs a name.',
  tableNameKeyword: (name: string) => `${quote(name)} is a word of the formula language and cannot name a table.`,
  tableNameTaken: (name: string) => `Another cell already defines ${quote(name)}; choose another name.`,
  lastColumn: () => 'A table keeps at least one column.',
  headerNotCleared: () => 'Column names are not cleared: edit a name to rename its column, or delete the column.',
  readOnly: (file: string) => `This table is read from ${file}; change that file to change the table.`,
  fileLine: (file: string) => `Read from ${file}, the CSV file beside the document. The grid shows it read-only.`,
  fileReading: (file: string) => `Reading ${file}…`,

  pasteEmpty: () => 'There is nothing to paste.',
  pasteQuote: (line: number) => `Line ${line} of the pasted text has a quoted field that is never closed; nothing was pasted.`,
  pasteProblem: (line: number, detail: string) => `Line ${line} of the pasted text cannot be read as CSV (${detail}); nothing was pasted.`,
  pasteHeader: (reason: string) => `The first pasted line would rename columns, but: ${reason} Nothing was pasted.`,
  pasted: (rows: number, cols: number, addedRows: number, addedCols: number) => {
    const grown: string[] = [];
    if (addedRows > 0) grown.push(plural(addedRows, 'row'));
    if (addedCols > 0) grown.push(plural(addedCols, 'column'));
    return `Pasted ${plural(rows, 'row')} × ${plural(cols, 'column')}${grown.length > 0 ? `; the table grew by ${grown.join(' and ')}` : ''}.`;
  },
  pastedAsCsv: () => 'Read as CSV: the text had line breaks and no tabs.',
  pastedWithNames: (rows: number, cols: number) =>
    `Pasted ${plural(rows, 'row')} × ${plural(cols, 'column')}: the first row became the column names, since it holds names over numbers.`,
  namesRowAsData: () => 'Keep that row as data',
  namesRowAsDataTitle: () => 'Put the first pasted row back as a data row, under the names the table had',
  pasteOverNames: () => 'One value is not pasted over several column names: select one name to rename its column.',
  copied: (rows: number, cols: number) => `Copied ${plural(rows, 'row')} × ${plural(cols, 'column')} as tab-separated text.`,

  importTooBig: (file: string, mb: number) => `${file} was not imported: it is larger than ${mb} MB. Nothing changed.`,
  importFailed: (file: string, reason: string) => `${file} was not imported: ${reason} Nothing changed.`,
  importUnreadable: (file: string) => `${file} was not imported: the browser could not read it. Nothing changed.`,
  importNotUtf8: (file: string) => `${file} was not imported: it is not UTF-8 text (save it as UTF-8 and import it again). Nothing changed.`,
  imported: (file: string, rows: number, cols: number) => `Imported ${file}: ${plural(rows, 'row')}, ${plural(cols, 'column')}.`,

  rawIntro: (message: string) => `The text does not read as a table: ${message}`,
  rawRow: () => 'Show the row',
  rawReadsAgain: (rows: number, cols: number) => `The text reads as a table again (${plural(rows, 'row')}, ${plural(cols, 'column')}).`,
  noRows: (shortcut: string) => `No rows yet: add one (Add row, or ${shortcut}) or paste rows from a spreadsheet.`,
  counts: (rows: number, cols: number) => `${plural(rows, 'row')} · ${plural(cols, 'column')}`,

  // the table cell's own bar: its name, saving, the tools that change its shape, the text
  tableNameLabel: () => 'Table name',
  saveCsv: () => 'Save CSV',
  saveCsvTitle: () => 'Save the table as it reads now as a CSV file',
  toolsLabel: () => 'Table tools',
  addRow: () => 'Add row',
  addRowTitle: (below: string, above: string) => `Add a row below the selection (${below}; ${above} adds one above)`,
  addColumn: () => 'Add column',
  addColumnTitle: (right: string, left: string) => `Add a column right of the selection (${right}; ${left} adds one left)`,
  deleteRows: () => 'Delete rows',
  deleteRowsTitle: (keys: string) => `Delete the rows the selection covers (${keys})`,
  deleteColumns: () => 'Delete columns',
  deleteColumnsTitle: (keys: string) => `Delete the columns the selection covers (${keys})`,
  importCsv: () => 'Import CSV…',
  importCsvTitle: () => 'Replace the table with the rows of a CSV file (header row first)',
  showText: () => 'CSV text',
  showTextTitle: () => 'Show and edit the table as CSV text',
  showGrid: () => 'Grid',
  showGridTitle: () => 'Show the table as a grid',
  textLabel: (table: string) => `CSV text of table ${table}`,
  fieldsLabel: (table: string) => `Fields of ${table}`,
  wholeTableTitle: () => 'Select the whole table',
  printLimit: (shown: number, all: number) => `The first ${countText(shown)} of ${countText(all)} rows are printed.`,
};
