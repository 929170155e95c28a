/**
 * Reading files for the command line, with the limits a reviewer opening someone else's
 * document needs: a document or a CSV file beside it is read only when it is a regular file
 * (a FIFO would hang the reader, a device would never end), a CSV file only when its real
 * path, symbolic links resolved, lies in the document's own folder, and nothing larger than
 * a stated size is read (the read itself stops there, so a file that grows cannot get past
 * it).
 */
import { isAscii } from 'node:buffer';
import { closeSync, constants, fstatSync, openSync, readSync, realpathSync } from 'node:fs';
import { dirname, join, relative, isAbsolute, sep } from 'node:path';
import { NotUtf8Error, decodeUtf8 } from '../doc/utf8.ts';
import { cliMsg } from '../messages/cli.ts';

/** The largest document the command line reads. */
export const DOCUMENT_LIMIT_BYTES = 64 * 1024 * 1024;
/** The largest CSV file beside a document that the command line reads. */
export const CSV_LIMIT_BYTES = 256 * 1024 * 1024;

/** A file that cannot be read, in plain words (the command ends with status 2). */
export class FileProblem extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'FileProblem';
  }
}

/**
 * Reads at most `limit` bytes of a regular file; refuses anything else. Opened without
 * blocking, so that a FIFO is refused instead of waiting for a writer.
 */
export function readBytes(path: string, what: string, limit: number): Uint8Array {
  let fd: number;
  try {
    fd = openSync(path, constants.O_RDONLY | (constants.O_NONBLOCK ?? 0));
  } catch (err) {
    const code = (err as { code?: string }).code;
    if (code === 'ENOENT') throw new FileProblem(cliMsg.noSuchFile(what, path));
    if (code === 'EACCES' || code === 'EPERM') throw new FileProblem(cliMsg.permissionDenied(what, path));
    if (code === 'EISDIR') throw new FileProblem(cliMsg.isFolder(what, path));
    throw new FileProblem(cliMsg.unreadable(what, path, (err as Error).message));
  }
  try {
    const st = fstatSync(fd);
    if (st.isDirectory()) throw new FileProblem(cliMsg.isFolder(what, path));
    if (!st.isFile()) throw new FileProblem(cliMsg.notRegular(what, path));
    if (st.size > limit) throw new FileProblem(cliMsg.tooLarge(what, path, limit));
    // Read into one buffer of the size the file says it has, plus one byte to notice a file
    // that grew while it was read (then the rest comes in bounded chunks, up to the limit):
    // no copy of the bytes on the common path.
    const first = Buffer.allocUnsafe(st.size + 1);
    let total = 0;
    for (;;) {
      const n = readSync(fd, first, total, first.length - total, null);
      if (n === 0) return new Uint8Array(first.buffer, first.byteOffset, total);
      total += n;
      if (total === first.length) break;
    }
    const chunks: Buffer[] = [first];
    const chunk = Buffer.allocUnsafe(1 << 20);
    for (;;) {
      if (total > limit) throw new FileProblem(cliMsg.tooLarge(what, path, limit));
      const n = readSync(fd, chunk, 0, Math.min(chunk.length, limit + 1 - total), null);
      if (n === 0) break;
      chunks.push(Buffer.from(chunk.subarray(0, n)));
      total += n;
    }
    return new Uint8Array(Buffer.concat(chunks, total));
  } finally {
    closeSync(fd);
  }
}

/** Reads a text file as UTF-8, refusing other bytes. */
export function readText(path: string, what: string, limit: number): string {
  const bytes = readBytes(path, what, limit);
  // Most data files are plain ASCII, whose UTF-8 text is its Latin-1 text; Node 20 decodes
  // Latin-1 by copying, some fifty times faster than its UTF-8 decoder (18 MB: 1 ms against
  // 55 ms, test/bench/csv-run.bench.ts).
  if (isAscii(bytes)) return Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).toString('latin1');
  try {
    return decodeUtf8(bytes);
  } catch (err) {
    if (err instanceof NotUtf8Error) throw new FileProblem(cliMsg.notUtf8(what, path));
    throw err;
  }
}

/**
 * The path of a file a document names beside itself, checked: its real path (links
 * resolved) must lie in the real folder of the document (or below it).
 */
export function besideDocument(documentPath: string, name: string): string {
  const folder = realpathSync(dirname(documentPath));
  const path = join(dirname(documentPath), name);
  let real: string;
  try {
    real = realpathSync(path);
  } catch (err) {
    const code = (err as { code?: string }).code;
    if (code === 'ENOENT') throw new FileProblem(cliMsg.noSuchFile(cliMsg.theCsvFile(), path));
    throw new FileProblem(cliMsg.unreadable(cliMsg.theCsvFile(), path, (err as Error).message));
  }
  const rel = relative(folder, real);
  if (rel === '' || rel === '..' || rel.startsWith(`..${sep}`) || isAbsolute(rel)) {
    throw new FileProblem(cliMsg.outsideFolder(name));
  }
  return real;
}
