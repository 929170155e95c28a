/**
 * The text a table reads from a data file beside its document. A CSV file is read as it is;
 * a Parquet file is decoded into table text first. Decoding is asynchronous, and the engine
 * reads files synchronously, so the command line decodes the Parquet files a document names
 * before it loads the document (`preloadParquet`), and `dataFileText` hands out the text.
 */
import { MAX_TABLE_ROWS } from '../../cells/table/model.ts';
import { readDocument } from '../doc/format.ts';
import { isParquetName, isSafeFileName } from '../doc/document.ts';
import type { CellKinds } from '../graph/kinds.ts';
import { importMsg } from '../messages/import.ts';
import { CSV_LIMIT_BYTES, DOCUMENT_LIMIT_BYTES, FileProblem, besideDocument, readBytes, readText } from './files.ts';

/** Decoded Parquet files by real path: the text, or the problem met decoding it. */
const decoded = new Map<string, { text: string } | { problem: string }>();

/** The Parquet files a document names, safe names only (the table reports the others). */
function parquetNamed(documentPath: string, kinds: CellKinds): string[] {
  let text: string;
  try {
    text = readText(documentPath, 'the file', DOCUMENT_LIMIT_BYTES);
  } catch {
    return []; // loading the document reports it
  }
  let names: string[];
  try {
    const doc = readDocument(text, { kinds }).document;
    names = doc.cells.flatMap((c) => kinds.filesRead(c));
  } catch {
    return [];
  }
  return [...new Set(names)].filter((n) => isSafeFileName(n) && isParquetName(n));
}

/**
 * Decodes the Parquet files the document at `documentPath` names, so that loading it finds
 * their text. Resolves at once when it names none.
 */
export async function preloadParquet(documentPath: string, kinds: CellKinds): Promise<void> {
  for (const name of parquetNamed(documentPath, kinds)) {
    let real: string;
    try {
      real = besideDocument(documentPath, name);
    } catch {
      continue; // reading the table reports it, with the same check
    }
    try {
      const bytes = readBytes(real, 'the data file', CSV_LIMIT_BYTES);
      // the Parquet reader loads only for documents that name a Parquet file
      const { parquetCsv } = await import('../doc/parquet.ts');
      decoded.set(real, { text: await parquetCsv(bytes, MAX_TABLE_ROWS) });
    } catch (err) {
      decoded.set(real, { problem: err instanceof Error ? err.message : String(err) });
    }
  }
}

/** True when a command on `documentPath` must decode files before it loads the document. */
export function needsPreload(documentPath: string | undefined, kinds: CellKinds): boolean {
  return documentPath !== undefined && parquetNamed(documentPath, kinds).length > 0;
}

/** The text a table reads from the data file `name` beside the document. */
export function dataFileText(documentPath: string, name: string): string {
  const real = besideDocument(documentPath, name);
  if (!isParquetName(name)) return readText(real, 'the CSV file', CSV_LIMIT_BYTES);
  const d = decoded.get(real);
  if (d === undefined) throw new FileProblem(importMsg.parquetNotDecoded(name));
  if ('problem' in d) throw new FileProblem(d.problem);
  return d.text;
}
