/**
 * The document's own bytes inside its report, so that the page can open a report back as
 * the document, byte for byte: base64 in hidden elements (no script element, nothing that
 * runs), one for the document and one per data file it names.
 *
 *   <pre hidden id="furrow-source" data-name="trial.furrow">BASE64</pre>
 *   <pre hidden class="furrow-data" data-name="plots.csv">BASE64</pre>
 */
import { escapeHtml } from './sanitize.ts';

/** Base64 of bytes (portable: Node, page and worker). */
export function toBase64(bytes: Uint8Array): string {
  let s = '';
  const CHUNK = 0x8000;
  for (let i = 0; i < bytes.length; i += CHUNK) s += String.fromCharCode(...bytes.subarray(i, i + CHUNK));
  return btoa(s);
}

/** Bytes of base64 text. */
export function fromBase64(text: string): Uint8Array {
  const s = atob(text);
  const out = new Uint8Array(s.length);
  for (let i = 0; i < s.length; i++) out[i] = s.charCodeAt(i);
  return out;
}

/** The hidden elements that carry a document and its data files. */
export function sourceElements(name: string, document: Uint8Array, files: ReadonlyMap<string, Uint8Array>): string {
  const parts = [`<pre hidden id="furrow-source" data-name="${escapeHtml(name)}">${toBase64(document)}</pre>`];
  for (const [file, bytes] of files) parts.push(`<pre hidden class="furrow-data" data-name="${escapeHtml(file)}">${toBase64(bytes)}</pre>`);
  return parts.join('\n');
}

/** A document carried by a report. */
export interface CarriedDocument {
  readonly name: string;
  readonly bytes: Uint8Array;
  readonly files: ReadonlyMap<string, Uint8Array>;
}

function unescapeAttribute(s: string): string {
  return s.replace(/&(amp|lt|gt|quot|#39);/g, (_m, e: string) => ({ amp: '&', lt: '<', gt: '>', quot: '"', '#39': "'" })[e as 'amp'] ?? '');
}

/**
 * The document a report carries, or null when the text is not a Furrow report. Reads only
 * the elements written by {@link sourceElements}; nothing else in the file is looked at.
 */
export function carriedDocument(html: string): CarriedDocument | null {
  // the last one: the report writes it after everything that came from the document
  const doc = [...html.matchAll(/<pre hidden id="furrow-source" data-name="([^"]*)">([A-Za-z0-9+/=]*)<\/pre>/g)].pop();
  if (doc === undefined) return null;
  const files = new Map<string, Uint8Array>();
  for (const m of html.matchAll(/<pre hidden class="furrow-data" data-name="([^"]*)">([A-Za-z0-9+/=]*)<\/pre>/g)) {
    files.set(unescapeAttribute(m[1]!), fromBase64(m[2]!));
  }
  return { name: unescapeAttribute(doc[1]!), bytes: fromBase64(doc[2]!), files };
}
