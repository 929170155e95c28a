/**
 * The fingerprint of a document: one SHA-256 over the document's text without its sealed
 * section and over every data file its tables name, each framed by its length so that no
 * two different inputs give the same bytes:
 *
 *   "furrow fingerprint 1\n"
 *   "cells " BYTES "\n" <the document's UTF-8 bytes, sealed sections left out> "\n"
 *   "file " JSON-NAME " " BYTES "\n" <the file's bytes> "\n"      (per file, by name)
 *
 * The parts' own digests are sealed too, so that a verification can say which part changed.
 */
import { markerKind, type Document } from '../doc/document.ts';
import { CELL_KINDS } from '../../cells/kinds.ts';
import { writeDocument } from '../doc/format.ts';
import { jsonText } from '../lang/json.ts';
import { hex, sha256Bytes, utf8 } from './digest.ts';
import { sha256 } from '@noble/hashes/sha2.js';

/** The marker word of a sealed section. */
export const SEALED_KIND = 'sealed';

/** True for a sealed section. */
export function isSealedCell(marker: string): boolean {
  return markerKind(marker) === SEALED_KIND;
}

/** The document without its sealed sections. */
export function withoutSeal(doc: Document): Document {
  return { ...doc, cells: doc.cells.filter((c) => !isSealedCell(c.marker)) };
}

/** The names of the data files a document's tables read, sorted, each once. */
export function dataFileNames(doc: Document): string[] {
  const names = new Set<string>();
  for (const c of doc.cells) {
    for (const f of CELL_KINDS.filesRead(c)) names.add(f);
  }
  return [...names].sort();
}

/** What the fingerprint rests on, with the digest of each part. */
export interface Fingerprint {
  /** SHA-256 over everything, framed as above. */
  readonly whole: string;
  /** SHA-256 of the document's text without its sealed sections. */
  readonly cells: string;
  /** SHA-256 of each data file, by name; null for a file that could not be read. */
  readonly files: ReadonlyMap<string, string | null>;
}

/**
 * The fingerprint of a document and its data files.
 *
 * @param files the bytes of each file the document names (absent: the file is missing,
 *   which the fingerprint records as a part of its own, so it cannot match a seal)
 */
export function fingerprint(doc: Document, files: ReadonlyMap<string, Uint8Array>): Fingerprint {
  const text = utf8(writeDocument(withoutSeal(doc)));
  const h = sha256.create();
  h.update(utf8(`furrow fingerprint 1\ncells ${text.length}\n`));
  h.update(text);
  h.update(utf8('\n'));
  const digests = new Map<string, string | null>();
  for (const name of dataFileNames(doc)) {
    const bytes = files.get(name);
    if (bytes === undefined) {
      h.update(utf8(`missing ${jsonText(name)}\n`));
      digests.set(name, null);
      continue;
    }
    h.update(utf8(`file ${jsonText(name)} ${bytes.length}\n`));
    h.update(bytes);
    h.update(utf8('\n'));
    digests.set(name, sha256Bytes(bytes));
  }
  return { whole: hex(h.digest()), cells: sha256Bytes(text), files: digests };
}
