/**
 * Which document the page has open and where it came from: opening one (a file, a dropped
 * text, a report, a sample, one kept in this browser, a new one), saving it to a file, and
 * the banner that says what happened. Opening never loses another document's work: the one
 * open before is written to its own slot first (src/app/keeper.ts), and an edited sample or
 * a kept state with other text is kept aside rather than replaced.
 */
import { CELL_KINDS } from '../../cells/kinds.ts';
import { documentTitle, type Document } from '../doc/document.ts';
import { DocumentError, readDocument, writeDocument } from '../doc/format.ts';
import { NotUtf8Error } from '../doc/utf8.ts';
import { pageMsg } from '../messages/page.ts';
import { fileKey, forget, listSaved, loadSaved, newKey, sampleKey, type SavedState } from './autosave.ts';
import type { ArrivingFiles } from './arriving-files.ts';
import type { Banner } from './banner.ts';
import { FileTooLargeError, fileNameFor, pickFile, saveText } from './files.ts';
import { documentFromReport } from './handoff/report-open.ts';
import { DocumentKeeper, type Opening } from './keeper.ts';
import { isImportable } from './table-import.ts';

/** What opening and saving need of the page. */
export interface OpenDocumentHost {
  doc(): Document;
  /** The banner shown now. */
  banner(): Banner | null;
  say(banner: Banner | null): void;
  /** The other documents kept in this browser, newest first, for the toolbar to list. */
  listKept(kept: readonly SavedState[]): void;
  /** Shows a document read: it takes over the page (what was under way, a rename, ends). */
  load(doc: Document): void;
  readonly keeper: DocumentKeeper;
  readonly arrivals: ArrivingFiles;
}

export class OpenDocument {
  /** The file the document was opened from or saved to, by name (null: never a file). */
  fileName: string | null = null;
  private fileHandle: FileSystemFileHandle | null = null;
  /** The samples the page offers, by file name. */
  samples: ReadonlyMap<string, string> = new Map();
  /** Documents being opened from the browser's keeping (read asynchronously). */
  private readonly opening = new Set<Promise<void>>();
  private readonly host: OpenDocumentHost;

  constructor(host: OpenDocumentHost) {
    this.host = host;
  }

  /** Waits until no document is being read from the browser's keeping. */
  async opened(): Promise<void> {
    while (this.opening.size > 0) await Promise.all([...this.opening]);
  }

  /** Runs an opening and notes it until it ends, so that `opened` waits for it. */
  private track(p: Promise<void>): Promise<void> {
    this.opening.add(p);
    const done = (): void => void this.opening.delete(p);
    p.then(done, done);
    return p;
  }

  /**
   * Opens a document in its own slot; the one open before stays kept in its slot. A text
   * that is not a document changes nothing and says why.
   */
  open(o: Opening): boolean {
    const host = this.host;
    let doc: Document;
    try {
      doc = readDocument(o.text, { kinds: CELL_KINDS }).document;
    } catch (err) {
      if (err instanceof DocumentError) {
        host.say({ kind: 'problem', text: pageMsg.notOpened(o.fileName, err.message) });
        return false;
      }
      throw err;
    }
    // the document open until now is written to its own slot before this one takes over
    void host.keeper.take(o.key).then(() => this.refreshKept());
    this.fileName = o.fileName;
    host.arrivals.replaceWith(o.files);
    host.load(doc);
    const missing = host.arrivals.missing(doc);
    host.say(
      o.original !== undefined
        ? { kind: 'info', text: o.notice ?? '', actions: [{ label: pageMsg.openOriginal(), run: () => void this.openOriginal(o.original!.name, o.original!.text) }] }
        : o.notice !== undefined
          ? { kind: 'info', text: o.notice }
          : missing.length > 0
            ? { kind: 'info', text: pageMsg.openedMissingFiles(o.fileName, missing) }
            : null,
    );
    return true;
  }

  /**
   * After files were taken back from the browser's keeping: the banner names them, with one
   * click to leave them out, and any file still missing. A banner put up since `said` (the
   * one shown when the document opened) is left as it is.
   */
  private sayRestored(fileName: string, taken: readonly string[], said: Banner | null): void {
    const host = this.host;
    if (host.banner() !== said) return;
    host.say({
      kind: 'info',
      text: pageMsg.restoredFiles(fileName, taken, host.arrivals.missing(host.doc())),
      actions: [
        {
          label: pageMsg.leaveOutFiles(),
          run: () => {
            host.arrivals.drop(taken);
            host.say({ kind: 'info', text: pageMsg.openedMissingFiles(fileName, host.arrivals.missing(host.doc())) });
          },
        },
      ],
    });
  }

  /** Opens a document's text read from a file (or dropped): its slot is the file's name. */
  openText(text: string, fileName: string): boolean {
    const host = this.host;
    // a report made by Furrow carries its document and CSV files: it opens as that document
    const report = documentFromReport(text);
    if (report !== null) [text, fileName] = [report.text, report.name];
    const key = fileKey(fileName);
    const opened = this.open({ key, text, fileName, files: report?.files ?? [] });
    if (!opened) return false;
    if (host.banner() === null) host.say({ kind: 'info', text: pageMsg.opened(fileName) });
    const said = host.banner();
    // a kept state of the same file with other text (edits never saved to it) is kept aside;
    // with the same text, the data files attached to it are taken back, and the page says so
    void loadSaved(key).then(async (kept) => {
      if (kept !== null && kept.text !== text) await host.keeper.keepAside(kept);
      else if (kept !== null && host.keeper.key === key) {
        const taken = host.arrivals.restore(kept.files);
        if (taken.length > 0) this.sayRestored(fileName, taken, said);
      }
      host.keeper.touch();
      await this.refreshKept();
    });
    return true;
  }

  /** A document dropped on the page: it has no file handle to save back to. */
  dropped(name: string, text: string): void {
    if (this.openText(text, name)) this.fileHandle = null;
  }

  /** The original of a sample, instead of the edited copy: the copy is kept aside first. */
  private openOriginal(name: string, text: string): Promise<void> {
    return this.track(this.openOriginalNow(name, text));
  }

  private async openOriginalNow(name: string, text: string): Promise<void> {
    const host = this.host;
    const kept = await host.keeper.readKept(host.keeper.key);
    const title = kept !== null ? await host.keeper.keepAside(kept) : documentTitle(host.doc());
    await forget(sampleKey(name));
    this.fileHandle = null;
    if (this.open({ key: sampleKey(name), text, fileName: name, files: [] })) {
      host.say({ kind: 'info', text: pageMsg.originalOpen(name, title) });
    }
  }

  openSample(name: string): Promise<void> {
    return this.track(this.openSampleNow(name));
  }

  private async openSampleNow(name: string): Promise<void> {
    const text = this.samples.get(name);
    if (text === undefined) return;
    // read after typing not yet written is: the sample that is open then opens as the
    // edited copy, instead of the text from before the typing
    const o = await DocumentKeeper.sample(name, text, (key) => this.host.keeper.readKept(key));
    this.fileHandle = null;
    this.open(o);
  }

  /** Opens a document kept in this browser. */
  reopenKept(key: string): Promise<void> {
    return this.track(this.reopenKeptNow(key));
  }

  private async reopenKeptNow(key: string): Promise<void> {
    const kept = await this.host.keeper.readKept(key);
    if (kept === null) return;
    this.fileHandle = null;
    this.open({ key: kept.key, text: kept.text, fileName: kept.fileName, files: kept.files });
  }

  async refreshKept(): Promise<void> {
    const host = this.host;
    host.listKept((await listSaved()).filter((s) => s.key !== host.keeper.key));
  }

  async openFile(): Promise<void> {
    try {
      const f = await pickFile();
      if (f === null) return;
      if (isImportable(f.name)) return void (await this.host.arrivals.offerImport(f.name, f.bytes));
      if (this.openText(f.text, f.name)) this.fileHandle = f.handle;
    } catch (err) {
      this.host.say({ kind: 'problem', text: err instanceof FileTooLargeError ? err.message : pageMsg.unreadable(err instanceof NotUtf8Error, String(err)) });
    }
  }

  async saveFile(): Promise<void> {
    const host = this.host;
    try {
      const name = this.fileName ?? fileNameFor(documentTitle(host.doc()));
      this.fileHandle = await saveText(writeDocument(host.doc()), name, this.fileHandle);
      this.fileName = this.fileHandle?.name ?? name;
      // from now on the document is kept under its file's name; a new document's slot empties
      const before = host.keeper.key;
      await host.keeper.take(fileKey(this.fileName));
      host.keeper.touch();
      if (before.startsWith('new:')) await forget(before);
      void this.refreshKept();
      host.say({ kind: 'info', text: pageMsg.savedAs(this.fileName) });
    } catch (err) {
      host.say({ kind: 'problem', text: pageMsg.saveFailed(String(err)) });
    }
  }

  newDocument(): void {
    this.fileHandle = null;
    this.open({ key: newKey(), text: pageMsg.newDocumentText(), fileName: null, files: [] });
  }
}
