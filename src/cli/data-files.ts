/**
 * The bytes of the data files a document names, read from the document's own folder, for
 * its fingerprint. A file that cannot be read is left out (the fingerprint then records it
 * as missing); the table that names it reports why.
 */
import type { Document } from '../doc/document.ts';
import { CSV_LIMIT_BYTES, besideDocument, readBytes } from './files.ts';
import { dataFileNames } from '../seal/fingerprint.ts';
import { isSafeFileName } from '../doc/document.ts';
import { cliMsg } from '../messages/cli.ts';

/** Every data file the document names, by name, as bytes. */
export function readDataFiles(documentPath: string, doc: Document): Map<string, Uint8Array> {
  const out = new Map<string, Uint8Array>();
  for (const name of dataFileNames(doc)) {
    if (!isSafeFileName(name)) continue;
    try {
      // the same checks as reading the table: a regular file, in the folder, within the limit
      out.set(name, readBytes(besideDocument(documentPath, name), cliMsg.theCsvFile(), CSV_LIMIT_BYTES));
    } catch {
      // missing or unreadable: recorded as missing in the fingerprint
    }
  }
  return out;
}
