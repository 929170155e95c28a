/**
 * Bytes to text for documents and CSV files, the same in the page and on the command line:
 * UTF-8 only (a byte that is not UTF-8 is refused, never replaced), and a byte-order mark is
 * kept as a character, so that a document that starts with one is written back with it and a
 * second mark is not silently swallowed.
 */

/** Bytes that are not UTF-8 text. */
export class NotUtf8Error extends Error {
  constructor() {
    super('not UTF-8 text');
    this.name = 'NotUtf8Error';
  }
}

/** Decodes UTF-8 bytes exactly; throws NotUtf8Error on any invalid byte. */
export function decodeUtf8(bytes: Uint8Array): string {
  try {
    return new TextDecoder('utf-8', { fatal: true, ignoreBOM: true }).decode(bytes);
  } catch {
    throw new NotUtf8Error();
  }
}
