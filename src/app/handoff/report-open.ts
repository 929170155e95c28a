/**
 * Opening a report back as its document: a report carries the document's bytes and those of
 * its data files (src/report/source.ts); this gives them back as the page's texts.
 */
import { isParquetName } from '../../doc/document.ts';
import { carriedDocument } from '../../report/source.ts';
import { storedFile } from '../data-files.ts';

/** A document taken out of a report. */
export interface OpenedReport {
  readonly name: string;
  readonly text: string;
  readonly files: ReadonlyArray<readonly [string, string]>;
}

/** Decodes UTF-8 keeping a byte order mark, so the document writes back byte for byte. */
function decode(bytes: Uint8Array): string {
  return new TextDecoder('utf-8', { fatal: true, ignoreBOM: true }).decode(bytes);
}

/** The document a report's HTML carries, or null when the text is not a Furrow report. */
export function documentFromReport(html: string): OpenedReport | null {
  if (!/^\s*<!doctype html/i.test(html)) return null;
  const carried = carriedDocument(html);
  if (carried === null) return null;
  try {
    return { name: carried.name, text: decode(carried.bytes), files: [...carried.files].map(([n, b]) => [n, isParquetName(n) ? storedFile(n, b) : decode(b)] as const) };
  } catch {
    return null; // not UTF-8: then it is not a report of ours, and opens as what it is
  }
}
