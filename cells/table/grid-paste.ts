/**
 * Clipboard blocks: what a paste holds (tab-separated text from a spreadsheet, CSV text, or
 * one plain value) and the tab-separated text a copy gives.
 *
 * Spreadsheets put a field that holds a tab, a line break or a double quote in double quotes
 * (a quote inside doubled), and so does `blockToTsv`, so a copied block pastes back as the
 * same fields here and in a spreadsheet.
 */
import Papa from 'papaparse';
import { gridMsg } from '../../src/messages/grid.ts';

/** How pasted text is read. */
export type BlockFormat = 'tsv' | 'csv' | 'field';

/** A rectangular block of fields, or why the text could not be read as one. */
export type BlockRead =
  | { readonly ok: true; readonly format: BlockFormat; readonly rows: readonly (readonly string[])[]; readonly width: number }
  | { readonly ok: false; readonly message: string };

/** The text without the one line end a copied block usually ends with. */
function withoutFinalLineEnd(text: string): string {
  return text.replace(/\r?\n$|\r$/, '');
}

/**
 * How pasted text is read: with a tab it is tab-separated; else with a line break it is CSV;
 * a single line without a tab is one value, commas and all, so that pasting "12,5" or
 * "Smith, J." into a field never spreads it over several columns.
 */
export function detectBlockFormat(text: string): BlockFormat {
  const t = withoutFinalLineEnd(text);
  if (t.includes('\t')) return 'tsv';
  if (/[\r\n]/.test(t)) return 'csv';
  return 'field';
}

/** Pads rows to the widest one, so the block is a rectangle. */
function rectangle(rows: string[][]): { rows: string[][]; width: number } {
  let width = 0;
  for (const r of rows) width = Math.max(width, r.length);
  for (const r of rows) while (r.length < width) r.push('');
  return { rows, width };
}

/** Reads pasted text into a rectangular block of fields. */
export function readBlock(text: string): BlockRead {
  const t = withoutFinalLineEnd(text);
  if (t === '') return { ok: false, message: gridMsg.pasteEmpty() };
  const format = detectBlockFormat(text);
  if (format === 'field') {
    // one value as a CSV field would give it ("a ""b"""): take the value inside
    const quoted = /^"((?:[^"]|"")*)"$/.exec(t);
    return { ok: true, format, rows: [[quoted ? quoted[1]!.replace(/""/g, '"') : t]], width: 1 };
  }
  if (format === 'tsv') {
    const r = Papa.parse<string[]>(t, { delimiter: '\t', quoteChar: '"', escapeChar: '"' });
    // a stray quote in a spreadsheet's text: read it as plain lines and tabs, quotes kept
    const rows = r.errors.length === 0 ? r.data.map((row) => row.slice()) : t.split(/\r\n|\n|\r/).map((line) => line.split('\t'));
    const b = rectangle(rows);
    return { ok: true, format, rows: b.rows, width: b.width };
  }
  const r = Papa.parse<string[]>(t, { delimiter: ',', quoteChar: '"', escapeChar: '"' });
  const e = r.errors[0];
  if (e !== undefined) {
    const line = (e.row ?? 0) + 1;
    return { ok: false, message: e.code === 'MissingQuotes' ? gridMsg.pasteQuote(line) : gridMsg.pasteProblem(line, e.message) };
  }
  const b = rectangle(r.data.map((row) => row.slice()));
  return { ok: true, format, rows: b.rows, width: b.width };
}

const NEEDS_QUOTES = /[\t\r\n"]/;
// a block of one column and several rows has no tab, so it pastes back as CSV: commas too
const NEEDS_QUOTES_ONE_COLUMN = /[\t\r\n",]/;

/** A block as tab-separated text, rows joined by "\n", for the clipboard. */
export function blockToTsv(rows: readonly (readonly string[])[]): string {
  const oneColumn = rows.length > 1 && rows.every((r) => r.length === 1);
  const needs = oneColumn ? NEEDS_QUOTES_ONE_COLUMN : NEEDS_QUOTES;
  const field = (f: string): string => (needs.test(f) ? `"${f.replace(/"/g, '""')}"` : f);
  const lines = rows.map((r) => r.map(field).join('\t'));
  // an empty last line would read as the block's final line end
  if (oneColumn && lines[lines.length - 1] === '') lines[lines.length - 1] = '""';
  return lines.join('\n');
}
