/**
 * Data files arriving in the page: attached with the toolbar, dropped, or carried by a
 * document opened from the browser's keeping or a report. Each is kept by name (as text, or
 * a Parquet file as its bytes) and sent to the worker as the text its tables read; a CSV
 * file or workbook that no table names is offered as a new table instead.
 */
import { CELL_KINDS } from '../../cells/kinds.ts';
import type { Cell, Document } from '../doc/document.ts';
import { NotUtf8Error } from '../doc/utf8.ts';
import { importMsg } from '../messages/import.ts';
import { pageMsg } from '../messages/page.ts';
import { engineText, storedFile } from './data-files.ts';
import { FileTooLargeError, pickFile } from './files.ts';
import type { ImportChoice } from './import-offer.ts';
import { importedTableCell, importSource, type ImportSource } from './table-import.ts';

/** What the files need of the page. */
export interface ArrivalsHost {
  readonly doc: Document;
  /** The file or workbook offered as a table, while the user chooses (the page shows it). */
  importing: ImportSource | null;
  /** Says something in the page's banner. */
  say(kind: 'info' | 'problem', text: string): void;
  /** Hands the worker a file's text, for the tables that read it (undefined: the file is gone). */
  toWorker(name: string, text: string | undefined): void;
  /** The document's kept state changed (its files are part of it). */
  touched(): void;
  /** Adds a cell at the end of the document, as one step of undo, and shows it. */
  append(cell: Cell): void;
}

export class ArrivingFiles {
  /** The files kept, by name: text, or a Parquet file's bytes as stored (data-files.ts). */
  readonly files = new Map<string, string>();
  private readonly host: ArrivalsHost;

  constructor(host: ArrivalsHost) {
    this.host = host;
  }

  /**
   * The files of a document being opened: they replace the files of the document open before
   * (which were kept with it, in its own slot), so that a table of this document never reads
   * another trial's file of the same name. The worker forgets every file that goes or changes
   * at once, before the document is sent to it; the new texts follow (a Parquet file once it
   * is decoded), and the tables that read them evaluate again.
   */
  replaceWith(files: ReadonlyArray<readonly [string, string]>): void {
    const coming = new Map(files);
    for (const [name, stored] of [...this.files]) {
      if (coming.get(name) === stored) continue;
      this.files.delete(name);
      this.host.toWorker(name, undefined);
    }
    const changed = files.filter(([name, stored]) => this.files.get(name) !== stored);
    for (const [name, stored] of changed) this.files.set(name, stored);
    this.send(changed);
  }

  /**
   * Files kept in the browser with the very text of the document just opened (it was opened
   * again from a file or the samples, which do not carry them): taken back, so that they are
   * not lost at the next save. A file of the same name the opening brought stays.
   */
  restore(files: ReadonlyArray<readonly [string, string]>): string[] {
    const taken = files.filter(([name]) => !this.files.has(name));
    if (taken.length === 0) return [];
    for (const [name, stored] of taken) this.files.set(name, stored);
    this.send(taken);
    this.host.touched();
    return taken.map(([name]) => name);
  }

  /** The data files a document's tables name that the page does not have. */
  missing(doc: Document): string[] {
    return [...new Set(doc.cells.flatMap((c) => CELL_KINDS.filesRead(c)))].filter((f) => !this.files.has(f));
  }

  /** Leaves files out of the open document: the tables that read them say they are missing. */
  drop(names: readonly string[]): void {
    let changed = false;
    for (const name of names) {
      if (!this.files.delete(name)) continue;
      this.host.toWorker(name, undefined);
      changed = true;
    }
    if (changed) this.host.touched();
  }

  /** Files kept by the page, sent to the worker as the text its tables read (Parquet decoded). */
  private send(files: ReadonlyArray<readonly [string, string]>): void {
    for (const [name, stored] of files) {
      engineText(name, stored).then(
        (text) => {
          if (this.files.get(name) === stored) this.host.toWorker(name, text);
        },
        (err: unknown) => this.host.say('problem', pageMsg.csvUnreadable(`${name}: ${err instanceof Error ? err.message : String(err)}`)),
      );
    }
  }

  /** A data file for the tables that name it: the worker re-evaluates the cells that read it. */
  attach(name: string, bytes: Uint8Array): void {
    let stored: string;
    try {
      stored = storedFile(name, bytes);
    } catch {
      this.host.say('problem', pageMsg.notUtf8(name));
      return;
    }
    this.files.set(name, stored);
    this.send([[name, stored]]);
    this.host.touched();
    this.host.say('info', pageMsg.attached(name));
  }

  /** A CSV file dropped: for the tables that name it if any do, else offered as a new table. */
  csvArrived(name: string, bytes: Uint8Array): void {
    const named = this.host.doc.cells.some((c) => CELL_KINDS.filesRead(c).includes(name));
    if (!named) return void this.offerImport(name, bytes);
    this.attach(name, bytes);
  }

  /** Reads a CSV file or a workbook and offers its sheets as a table. */
  async offerImport(name: string, bytes: Uint8Array): Promise<void> {
    try {
      this.host.importing = await importSource(name, bytes);
    } catch (err) {
      this.host.importing = null;
      this.host.say('problem', err instanceof NotUtf8Error ? pageMsg.notUtf8(name) : pageMsg.csvUnreadable(err instanceof Error ? err.message : String(err)));
    }
  }

  /** The chosen sheet becomes a table cell at the end of the document (one step of undo). */
  addImported(choice: ImportChoice): void {
    const source = this.host.importing;
    const sheet = source?.sheets[choice.sheet];
    if (source === null || sheet === undefined) return;
    const cell = importedTableCell(this.host.doc, choice.name, sheet);
    this.host.importing = null;
    this.host.append(cell);
    this.host.say('info', importMsg.added(choice.name, source.fileName));
  }

  /** The toolbar's attach: a data file picked by the user. */
  async attachPicked(): Promise<void> {
    try {
      const f = await pickFile('.csv,.parquet,text/csv,text/plain');
      if (f === null) return;
      this.attach(f.name, f.bytes);
    } catch (err) {
      this.host.say('problem', err instanceof FileTooLargeError ? err.message : pageMsg.csvUnreadable(String(err)));
    }
  }
}
