/**
 * The bytes of the data files a document names, read from the document's own folder, for
 * its fingerprint. A file that cannot be read is left out (the fingerprint then records it
 * as missing); the table that names it reports why.
 */
import { readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import type { Document } from '../doc/document.ts';
import { dataFileNames } from '../seal/fingerprint.ts';
import { isSafeFileName } from '../../cells/table/model.ts';

/** Every data file the document names, by name, as bytes. */
export function readDataFiles(documentPath: string, doc: Document): Map<string, Uint8Array> {
  const out = new Map<string, Uint8Array>();
  for (const name of dataFileNames(doc)) {
    if (!isSafeFileName(name)) continue;
    try {
      out.set(name, readFileSync(join(dirname(documentPath), name)));
    } catch {
      // missing or unreadable: recorded as missing in the fingerprint
    }
  }
  return out;
}
