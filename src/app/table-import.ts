/**
 * A CSV file or a spreadsheet workbook opened (or dropped) on the page, read into sheets the
 * user can add as table cells. A CSV is one sheet; a workbook has one per worksheet.
 *
 * Workbook numbers keep their exact value: a writer often stores 4.2 as "4.2000000000000002",
 * and the sheet's text is read back as the shortest decimal text that names the same double
 * ("4.2"), so the exact decimal shift of an analysis works on what the user sees in the
 * spreadsheet. Dates become ISO dates (2026-04-03), with the time when it is not midnight.
 * The workbook reader is loaded only when a workbook is opened.
 */
import { CELL_KINDS } from '../../cells/kinds.ts';
import { parseCsv } from '../doc/csv.ts';
import { writeCsv } from '../doc/csv-write.ts';
import { freshBody, type Cell, type Document } from '../doc/document.ts';
import { freshCellId } from '../doc/edits.ts';
import { isoDateText, shortestNumberText } from '../doc/field-text.ts';
import { decodeUtf8 } from '../doc/utf8.ts';
import { isPlainName } from '../lang/lexer.ts';
import { importMsg } from '../messages/import.ts';

/** One sheet of an opened file: its column names and rows of field texts. */
export interface ImportSheet {
  /** The worksheet's name; a CSV file's name for a CSV. */
  readonly label: string;
  readonly header: readonly string[];
  readonly rows: readonly (readonly string[])[];
}

/** An opened file that can become tables. */
export interface ImportSource {
  readonly fileName: string;
  readonly sheets: readonly ImportSheet[];
}

/** A workbook larger than this is refused before it is unpacked (a packed sheet grows ~10x). */
export const MAX_WORKBOOK_BYTES = 50 * 1024 * 1024;

/** True for the names of files this module reads. */
export function isImportable(fileName: string): boolean {
  return /\.(csv|xlsx)$/i.test(fileName);
}

export const isWorkbook = (fileName: string): boolean => /\.xlsx$/i.test(fileName);

/** A cell of a sheet as field text. Numbers arrive already as their shortest text. */
function fieldText(v: unknown): string {
  if (v === null || v === undefined) return '';
  if (typeof v === 'string') return v;
  if (typeof v === 'boolean') return v ? 'true' : 'false';
  if (v instanceof Date) return Number.isNaN(v.getTime()) ? '' : isoDateText(v);
  return String(v);
}

/**
 * Rows of a sheet as a header and data rows: the first row that is not empty gives the
 * column names (an empty name becomes `column_N`); rows that are empty are dropped; short
 * rows are padded and columns beyond the header are named too.
 */
export function sheetOf(label: string, cells: readonly (readonly unknown[])[]): ImportSheet {
  const rows = cells.map((r) => r.map(fieldText)).filter((r) => r.some((f) => f.trim() !== ''));
  const width = rows.reduce((w, r) => {
    let last = r.length;
    while (last > 0 && r[last - 1]!.trim() === '') last--;
    return Math.max(w, last);
  }, 0);
  const [first = [], ...data] = rows;
  const header = Array.from({ length: width }, (_, j) => first[j]?.trim() || `column_${j + 1}`);
  return { label, header, rows: data.map((r) => Array.from({ length: width }, (_, j) => r[j] ?? '')) };
}

/** Reads a CSV file's bytes (UTF-8, refused otherwise) as one sheet. */
export function csvSource(fileName: string, bytes: Uint8Array): ImportSource {
  const grid = parseCsv(decodeUtf8(bytes));
  return { fileName, sheets: [{ label: fileName, header: grid.header, rows: grid.rows }] };
}

/** Reads a workbook's bytes: every worksheet, numbers as their shortest decimal text. */
export async function workbookSource(fileName: string, bytes: Uint8Array): Promise<ImportSource> {
  if (bytes.byteLength > MAX_WORKBOOK_BYTES) throw new Error(importMsg.workbookTooLarge(fileName, MAX_WORKBOOK_BYTES));
  const { default: readWorkbook } = await import('read-excel-file/browser');
  let sheets;
  try {
    const buffer = bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer;
    sheets = await readWorkbook<string>(buffer, { parseNumber: shortestNumberText, trim: false });
  } catch (e) {
    throw new Error(importMsg.workbookUnreadable(fileName, e instanceof Error ? e.message : String(e)));
  }
  const read = sheets.map((s) => sheetOf(s.sheet, s.data)).filter((s) => s.header.length > 0);
  if (read.length === 0) throw new Error(importMsg.workbookEmpty(fileName));
  return { fileName, sheets: read };
}

/** Reads an opened file of either kind. */
export function importSource(fileName: string, bytes: Uint8Array): Promise<ImportSource> {
  return isWorkbook(fileName) ? workbookSource(fileName, bytes) : Promise.resolve(csvSource(fileName, bytes));
}

/**
 * A table name from a file or sheet name: letters, digits and underscores, starting with a
 * letter ("Field notes 2026.xlsx" gives `field_notes_2026`), and not one the document uses.
 */
export function tableNameFor(label: string, taken: ReadonlySet<string>): string {
  let base = label
    .replace(/\.(csv|xlsx)$/i, '')
    .toLowerCase()
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .replace(/[^a-z0-9]+/g, '_')
    .replace(/^_+|_+$/g, '');
  if (base === '' || !/^[a-z]/.test(base)) base = `table_${base}`.replace(/_+$/, '');
  if (!isPlainName(base)) base = `${base}_table`;
  if (!taken.has(base)) return base;
  for (let k = 2; ; k++) if (!taken.has(`${base}_${k}`)) return `${base}_${k}`;
}

/** The names the document's cells take. */
export function namesTaken(doc: Document): Set<string> {
  return new Set(doc.cells.map((c) => CELL_KINDS.nameOf(c)).filter((n): n is string => n !== null));
}

/** A new table cell holding a sheet, named `name` (its marker as the table kind writes it). */
export function importedTableCell(doc: Document, name: string, sheet: ImportSheet): Cell {
  const table = CELL_KINDS.all().find((k) => k.kind === 'table');
  if (table?.template === undefined) throw new Error('no table kind is registered');
  const { marker } = table.template(() => name);
  return { id: freshCellId(doc), marker, eol: '\n', body: freshBody(writeCsv(sheet.header, sheet.rows)) };
}
