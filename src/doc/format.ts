/**
 * Reading and writing the `.furrow` text format (docs/language.md section 1).
 *
 *   line 1         furrow 1
 *   header         key: value lines until the first cell
 *   cells          "--- KIND ..." opens a cell; its body runs to the next such line
 *
 * Reading then writing gives back the same bytes, for every input that reads as a document:
 * each line keeps its own terminator, and the only change made to body lines is the escape of
 * lines that would read as markers, which reading undoes exactly:
 *
 *   body line "--- x"    is written "\--- x"
 *   body line "\--- x"   is written "\\--- x"   (one more backslash, whatever the count)
 */
import { msg } from '../messages/language.ts';
import { markerKind, type Cell, type Document, type MarkerGrammar } from './document.ts';

/** A file that cannot be read as a document at all. */
export class DocumentError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'DocumentError';
  }
}

/** A remark about a document that was read anyway (unknown kinds or keys). */
export interface ReadWarning {
  /** 1-based line in the file. */
  readonly line: number;
  readonly message: string;
}

/** The most cells a document may hold (each is a node of the graph and an element of the page). */
export const MAX_CELLS = 50_000;

function countMarkers(lines: readonly string[]): number {
  let n = 0;
  for (const l of lines) if (isMarkerLine(l)) n++;
  return n;
}

/** The header keys Furrow knows; others are kept with a warning. */
export const KNOWN_HEADER_KEYS = ['title', 'author', 'date', 'summary', 'field', 'contact', 'caution'] as const;

const MARKER_PREFIX = '--- ';
const ESCAPED = /^\\*--- /;

/** Splits text into lines that keep their terminators; the last may have none. */
export function splitLines(text: string): string[] {
  const lines: string[] = [];
  let start = 0;
  for (;;) {
    const nl = text.indexOf('\n', start);
    if (nl < 0) {
      if (start < text.length) lines.push(text.slice(start));
      return lines;
    }
    lines.push(text.slice(start, nl + 1));
    start = nl + 1;
  }
}

/** A line without its terminator. */
function content(line: string): string {
  if (line.endsWith('\r\n')) return line.slice(0, -2);
  if (line.endsWith('\n')) return line.slice(0, -1);
  return line;
}

function terminator(line: string): string {
  if (line.endsWith('\r\n')) return '\r\n';
  if (line.endsWith('\n')) return '\n';
  return '';
}

/** True when a line of the file opens a cell. */
export function isMarkerLine(line: string): boolean {
  return line.startsWith(MARKER_PREFIX);
}

/** Escapes every body line that would read as a marker. */
export function escapeBody(body: string): string {
  if (!body.includes('--- ')) return body;
  return splitLines(body)
    .map((l) => (ESCAPED.test(l) ? `\\${l}` : l))
    .join('');
}

/** Undoes escapeBody on one line. */
function unescapeLine(line: string): string {
  return line.startsWith('\\') && ESCAPED.test(line) ? line.slice(1) : line;
}

/** The result of reading a document. */
export interface ReadResult {
  readonly document: Document;
  readonly warnings: readonly ReadWarning[];
}

/** How to read a document. */
export interface ReadOptions {
  /** Cell ids are this prefix and the cell's position: "c1", "c2", ... */
  readonly idPrefix?: string;
  /**
   * The kinds of cell the reader knows. With them, a cell of another kind, or a marker with
   * words its kind does not use, is warned about; without them, markers are not checked.
   */
  readonly kinds?: MarkerGrammar;
}

/**
 * Reads a document. Throws DocumentError when the text is not a Furrow document (its first
 * line is not "furrow 1"); anything else is kept, with warnings for what is unknown.
 */
export function readDocument(text: string, options: ReadOptions = {}): ReadResult {
  const idPrefix = options.idPrefix ?? 'c';
  const bom = text.charCodeAt(0) === 0xfeff;
  const body = bom ? text.slice(1) : text;
  const lines = splitLines(body);
  const first = lines[0] === undefined ? '' : content(lines[0]);
  if (first !== 'furrow 1') {
    const m = /^furrow\s+(\S+)\s*$/.exec(first);
    if (m && m[1] === '1') throw new DocumentError(msg.firstLineSpacing(first));
    if (m) throw new DocumentError(msg.wrongVersion(m[1]!));
    throw new DocumentError(msg.notADocument());
  }
  const warnings: ReadWarning[] = [];
  let i = 1;
  let header = '';
  for (; i < lines.length && !isMarkerLine(lines[i]!); i++) {
    const line = lines[i]!;
    header += line;
    const c = content(line);
    if (c.trim() === '') continue;
    const kv = /^([A-Za-z_][A-Za-z0-9_-]*):/.exec(c);
    if (!kv) warnings.push({ line: i + 1, message: msg.headerLine(i + 1) });
    else if (!(KNOWN_HEADER_KEYS as readonly string[]).includes(kv[1]!)) {
      warnings.push({ line: i + 1, message: msg.unknownHeaderKey(kv[1]!) });
    }
  }
  const cells: Cell[] = [];
  while (i < lines.length) {
    const markerLine = lines[i]!;
    const markerLineNo = i + 1;
    const marker = content(markerLine).slice(MARKER_PREFIX.length);
    i++;
    let cellBody = '';
    for (; i < lines.length && !isMarkerLine(lines[i]!); i++) cellBody += unescapeLine(lines[i]!);
    const m = options.kinds?.readMarker(marker);
    if (m === null) {
      warnings.push({ line: markerLineNo, message: msg.unknownCellKind(markerKind(marker)) });
    } else if (m !== undefined && m.extra.length > 0) {
      warnings.push({ line: markerLineNo, message: msg.badMarker(marker) });
    }
    cells.push({ id: `${idPrefix}${cells.length + 1}`, marker, eol: terminator(markerLine), body: cellBody });
    if (cells.length > MAX_CELLS) throw new DocumentError(msg.tooManyCells(countMarkers(lines), MAX_CELLS));
  }
  return {
    document: { bom, firstLine: first, firstEol: lines[0] === undefined ? '' : terminator(lines[0]), header, cells },
    warnings,
  };
}

/**
 * Writes a document. For a document that was read, the bytes are the ones read. For one
 * built by edits, a line break is added where a cell's text would otherwise run into the
 * next marker, so that the result always reads back as the same cells.
 */
export function writeDocument(doc: Document): string {
  const parts: string[] = [];
  if (doc.bom) parts.push('\uFEFF');
  parts.push(doc.firstLine, doc.firstEol);
  let open = doc.firstEol === '';
  if (doc.header !== '') {
    if (open) parts.push('\n');
    parts.push(doc.header);
    open = terminator(doc.header) === '';
  }
  for (const cell of doc.cells) {
    if (open) parts.push('\n');
    parts.push(MARKER_PREFIX, cell.marker, cell.eol);
    const body = escapeBody(cell.body);
    parts.push(body);
    open = body === '' ? cell.eol === '' : terminator(body) === '';
  }
  return parts.join('');
}
