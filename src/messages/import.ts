/**
 * The words of adding a CSV file or a workbook's sheet to the document as a table, and of
 * reading a Parquet file that a table names.
 */
import { countText } from '../format/digits.ts';
import { plural } from './words.ts';

const megabytes = (bytes: number): string => `${Math.round(bytes / (1024 * 1024))} MB`;

export const importMsg = {
  offerTitle: (file: string) => `Add ${file} to this document as a table`,
  sheetLabel: () => 'Sheet',
  nameLabel: () => 'Table name',
  sheetSize: (rows: number, columns: number) => `${plural(rows, 'row')} × ${plural(columns, 'column')}`,
  preview: (header: readonly string[]) => `Columns: ${header.join(', ')}`,
  add: () => 'Add as table',
  cancel: () => 'Not now',
  added: (name: string, file: string) => `Added ${file} as the table ${name}.`,
  badName: (name: string) => `"${name}" cannot name a table: use letters, digits and underscores, starting with a letter.`,
  nameTaken: (name: string) => `The document already has a cell named ${name}.`,
  workbookTooLarge: (file: string, limit: number) => `${file} is larger than ${megabytes(limit)}, the most a workbook may be to open here; save the sheet as CSV and name it from a table cell instead.`,
  workbookUnreadable: (file: string, detail: string) => `${file} could not be read as a workbook (.xlsx): ${detail}`,
  workbookEmpty: (file: string) => `${file} has no sheet with any data.`,
  parquetUnreadable: (detail: string) => `the file could not be read as Parquet: ${detail}`,
  parquetTooManyRows: (rows: number, limit: number) => `the Parquet file has ${plural(rows, 'row')}; a table holds at most ${countText(limit)}`,
  parquetColumnRefused: (column: string, what: string) => `the Parquet column ${column} holds ${what}, which a table cannot hold`,
  parquetNoColumns: () => 'the Parquet file has no columns',
  parquetNotDecoded: (file: string) => `the Parquet file ${file} was not decoded before the document was loaded`,
  notImportable: (file: string) => `${file} is neither a CSV file nor a workbook (.xlsx).`,
};
