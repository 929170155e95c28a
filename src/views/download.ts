/**
 * Saving something the page made as a file: a download of a blob under a file name, with
 * nothing sent anywhere. Names are made safe for any file system.
 */

/** A file name from a value's name and an ending (`fit` and `csv` give `fit.csv`). */
export function fileNameFor(name: string | null, ending: string, fallback = 'table'): string {
  const base = (name ?? fallback).replace(/[^A-Za-z0-9_.-]/g, '_').replace(/^\.+/, '') || fallback;
  return `${base}.${ending}`;
}

/** Offers a blob as a download. */
export function downloadBlob(fileName: string, blob: Blob): void {
  const url = URL.createObjectURL(blob);
  downloadUrl(fileName, url);
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

/** Offers an address the page made (a blob or a data URL) as a download. */
export function downloadUrl(fileName: string, url: string): void {
  const a = document.createElement('a');
  a.href = url;
  a.download = fileName;
  document.body.append(a);
  a.click();
  a.remove();
}

/** Offers CSV text as a download. */
export function downloadCsv(fileName: string, text: string): void {
  downloadBlob(fileName, new Blob([text], { type: 'text/csv;charset=utf-8' }));
}
