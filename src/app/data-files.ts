/**
 * The data files a page's document names, as the page keeps them: a CSV file as its text, a
 * Parquet file as its bytes in base64 (so that keeping it in the browser, carrying it in a
 * report and fingerprinting it all work on the file's own bytes). The worker's engine reads
 * table text: a Parquet file is decoded into that text here, before it is sent.
 */
import { isParquetName } from '../doc/document.ts';
import { decodeUtf8 } from '../doc/utf8.ts';

/** How the page keeps a file's bytes. */
export function storedFile(name: string, bytes: Uint8Array): string {
  if (!isParquetName(name)) return decodeUtf8(bytes);
  let s = '';
  for (let i = 0; i < bytes.length; i += 0x8000) s += String.fromCharCode(...bytes.subarray(i, i + 0x8000));
  return btoa(s);
}

/** The bytes of a file as kept (the fingerprint covers these). */
export function storedBytes(name: string, stored: string): Uint8Array {
  if (!isParquetName(name)) return new TextEncoder().encode(stored);
  const raw = atob(stored);
  const out = new Uint8Array(raw.length);
  for (let i = 0; i < raw.length; i++) out[i] = raw.charCodeAt(i);
  return out;
}

/** The most rows a data file may give a table (the table's own limit). */
const MAX_ROWS = 5_000_000;

/** The text the engine reads for a kept file: a Parquet file decoded, a CSV file as it is. */
export async function engineText(name: string, stored: string): Promise<string> {
  if (!isParquetName(name)) return stored;
  const { parquetCsv } = await import('../doc/parquet.ts');
  return parquetCsv(storedBytes(name, stored), MAX_ROWS);
}
