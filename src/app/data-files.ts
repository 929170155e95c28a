/**
 * The data files a page's document names, as the page keeps them: a CSV file as its text, a
 * Parquet file as its bytes in base64 (so that keeping it in the browser, carrying it in a
 * report and fingerprinting it all work on the file's own bytes). The worker's engine reads
 * table text: a Parquet file is decoded into that text here, before it is sent.
 */
import { MAX_TABLE_ROWS } from '../../cells/table/model.ts';
import { isParquetName } from '../doc/document.ts';
import { decodeUtf8 } from '../doc/utf8.ts';
import { fromBase64, toBase64 } from '../report/source.ts';

/** How the page keeps a file's bytes. */
export function storedFile(name: string, bytes: Uint8Array): string {
  return isParquetName(name) ? toBase64(bytes) : decodeUtf8(bytes);
}

/** The bytes of a file as kept (the fingerprint covers these). */
export function storedBytes(name: string, stored: string): Uint8Array {
  return isParquetName(name) ? fromBase64(stored) : new TextEncoder().encode(stored);
}

/** The text the engine reads for a kept file: a Parquet file decoded, a CSV file as it is. */
export async function engineText(name: string, stored: string): Promise<string> {
  if (!isParquetName(name)) return stored;
  const { parquetCsv } = await import('../doc/parquet.ts');
  return parquetCsv(storedBytes(name, stored), MAX_TABLE_ROWS);
}
