/**
 * Opening and saving `.furrow` files: the File System Access API where the browser has it,
 * an upload and a download otherwise.
 */
import { decodeUtf8 } from '../doc/utf8.ts';
import { pageMsg } from '../messages/page.ts';

/**
 * The largest file the page reads: a document, a report, or a data file to attach or import
 * (the command line's limit for a document). A larger one is refused by its size before a
 * byte of it is read, so a hostile or mistaken pick cannot freeze the page or exhaust it.
 */
export const PAGE_FILE_LIMIT_BYTES = 64 * 1024 * 1024;

/** A file larger than the page reads; its message is the words the page shows. */
export class FileTooLargeError extends Error {
  constructor(name: string, limit: number) {
    super(pageMsg.fileTooLarge(name, limit));
    this.name = 'FileTooLargeError';
  }
}

/** Refuses a file larger than the page reads, by the size it states (nothing is read). */
export function checkFileSize(file: { readonly size: number; readonly name?: string }, limit = PAGE_FILE_LIMIT_BYTES): void {
  if (file.size > limit) throw new FileTooLargeError(file.name ?? 'The file', limit);
}

interface PickerWindow {
  showOpenFilePicker?: (o: unknown) => Promise<FileSystemFileHandle[]>;
  showSaveFilePicker?: (o: unknown) => Promise<FileSystemFileHandle>;
}

const TYPES = [{ description: 'Furrow documents', accept: { 'text/plain': ['.furrow'] } }];
/** What Open accepts: documents, and reports, which carry their document. */
const OPEN_TYPES = [
  { description: 'Furrow documents and reports', accept: { 'text/plain': ['.furrow'], 'text/html': ['.html'] } },
  { description: 'Data to add as a table (CSV, workbook)', accept: { 'text/csv': ['.csv'], 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet': ['.xlsx'] } },
];

/** A file the user picked: its name, its bytes, and its text (read as UTF-8 when asked for). */
export interface PickedFile {
  readonly name: string;
  readonly bytes: Uint8Array;
  /** The bytes as UTF-8 text; throws NotUtf8Error when they are not. */
  readonly text: string;
  readonly handle: FileSystemFileHandle | null;
}

async function picked(file: File, handle: FileSystemFileHandle | null): Promise<PickedFile> {
  checkFileSize(file);
  const bytes = new Uint8Array(await file.arrayBuffer());
  let text: string | null = null;
  return {
    name: file.name,
    bytes,
    handle,
    get text(): string {
      text ??= decodeUtf8(bytes);
      return text;
    },
  };
}

/** Reads a File as UTF-8, refusing bytes that are not UTF-8 text and a file past the page's limit. */
export async function readFileText(file: Blob & { readonly name?: string }): Promise<string> {
  checkFileSize(file);
  return decodeUtf8(new Uint8Array(await file.arrayBuffer()));
}

/** Asks for a file to open; null when the user cancels. */
export async function pickFile(accept = '.furrow,.html,.csv,.xlsx,text/plain'): Promise<PickedFile | null> {
  const w = window as unknown as PickerWindow;
  if (w.showOpenFilePicker && accept.includes('.furrow')) {
    try {
      const [handle] = await w.showOpenFilePicker({ types: OPEN_TYPES, multiple: false });
      if (!handle) return null;
      return await picked(await handle.getFile(), handle);
    } catch (e) {
      if (e instanceof DOMException && e.name === 'AbortError') return null;
      throw e;
    }
  }
  return new Promise((resolve, reject) => {
    const input = document.createElement('input');
    input.type = 'file';
    input.accept = accept;
    input.addEventListener('change', () => {
      const file = input.files?.[0];
      if (!file) return resolve(null);
      picked(file, null).then(resolve, reject);
    });
    input.addEventListener('cancel', () => resolve(null));
    input.click();
  });
}

/** Saves text to a file: to the handle it came from, a picked one, or as a download. */
export async function saveText(text: string, name: string, handle: FileSystemFileHandle | null): Promise<FileSystemFileHandle | null> {
  const w = window as unknown as PickerWindow;
  let target = handle;
  if (target === null && w.showSaveFilePicker) {
    try {
      target = await w.showSaveFilePicker({ suggestedName: name, types: TYPES });
    } catch (e) {
      if (e instanceof DOMException && e.name === 'AbortError') return handle;
      target = null;
    }
  }
  if (target !== null) {
    const writable = await (target as FileSystemFileHandle & { createWritable(): Promise<FileSystemWritableFileStream> }).createWritable();
    await writable.write(text);
    await writable.close();
    return target;
  }
  const url = URL.createObjectURL(new Blob([text], { type: 'text/plain;charset=utf-8' }));
  const a = document.createElement('a');
  a.href = url;
  a.download = name;
  document.body.append(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
  return null;
}

/** A file name for a document title. */
export function fileNameFor(title: string): string {
  const base = title
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 60);
  return `${base || 'trial'}.furrow`;
}
