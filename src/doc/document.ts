/**
 * The document model: what a `.furrow` file holds, kept so that writing gives back the
 * bytes that were read (docs/language.md section 1).
 *
 * A document is a value. Edits (src/doc/edits.ts) make a new document and never change an
 * old one, which gives undo, autosave and the worker bridge a single shape to pass around.
 */

/** One cell as the file holds it. */
export interface Cell {
  /** Identity within a session (not written to the file): "c1", "c2", ... */
  readonly id: string;
  /** The marker line after "--- ": "note", "table trees", "table plots from plots.csv", "formula". */
  readonly marker: string;
  /** The marker line's terminator: "\n", "\r\n", or "" when the file ends on it. */
  readonly eol: string;
  /** The body text, unescaped, with its line terminators (and the blank lines that follow it). */
  readonly body: string;
}

/** A whole document. */
export interface Document {
  /** The file began with a UTF-8 byte order mark. */
  readonly bom: boolean;
  /** Line 1 without its terminator: "furrow 1". */
  readonly firstLine: string;
  readonly firstEol: string;
  /** The header lines (key: value, blank lines) with their terminators, as read. */
  readonly header: string;
  readonly cells: readonly Cell[];
}

/** What the marker line of a cell says. */
export interface Marker {
  /** The first word: "note", "table", "formula", or an unknown kind. */
  readonly kind: string;
  /** The name, for kinds that name their cell on the marker line (tables). */
  readonly name: string | null;
  /** The file beside the document that the cell reads, for kinds that name one. */
  readonly file: string | null;
  /** Words the kind does not use. */
  readonly extra: readonly string[];
}

/** The first word of a marker line: the cell's kind. */
export function markerKind(marker: string): string {
  return /^[ \t]*(\S*)/.exec(marker)![1]!;
}

/**
 * How marker lines read, for the kinds a reader knows. The cell kinds supply it
 * (src/graph/kinds.ts); this folder knows no kind by name.
 */
export interface MarkerGrammar {
  /** The marker's parts, or null for a kind not known. */
  readMarker(marker: string): Marker | null;
}

/** True for a data file that a table reads as Parquet (decoded into table text first). */
export const isParquetName = (name: string): boolean => /\.parquet$/i.test(name);

/**
 * True when a file name a document gives stays in the document's own folder: no path, no
 * drive, no hidden or parent entry (a document from someone else reads nothing else).
 */
export function isSafeFileName(file: string): boolean {
  return !/[\\/:\0]/.test(file) && file !== '.' && file !== '..' && !file.startsWith('.') && file.length <= 255;
}

/** The header's `key: value` pairs, first occurrence of each key. */
export function headerFields(doc: Document): Map<string, string> {
  const out = new Map<string, string>();
  for (const line of doc.header.split('\n')) {
    const m = /^([A-Za-z_][A-Za-z0-9_-]*):[ \t]?(.*?)\r?$/.exec(line);
    if (m && !out.has(m[1]!)) out.set(m[1]!, m[2]!);
  }
  return out;
}

/** The document's title, or "Untitled trial". */
export function documentTitle(doc: Document): string {
  return headerFields(doc).get('title')?.trim() || 'Untitled trial';
}

/** A new empty document. */
export function emptyDocument(title = 'Untitled trial'): Document {
  return { bom: false, firstLine: 'furrow 1', firstEol: '\n', header: `title: ${title}\n\n`, cells: [] };
}

/**
 * The document's text for a cell body written fresh: text, one line end, one blank line.
 * Text with CRLF line ends keeps them (a CSV body read by papaparse must not end a field
 * with a stray line feed).
 */
export function freshBody(text: string): string {
  const eol = text.includes('\r\n') ? '\r\n' : '\n';
  const trimmed = text.replace(/\s+$/, '');
  return trimmed === '' ? eol : `${trimmed}${eol}${eol}`;
}

/** The body as a user sees it: without the trailing blank lines that separate cells. */
export function visibleBody(cell: Cell): string {
  return cell.body.replace(/(\r?\n)+$/, '');
}
