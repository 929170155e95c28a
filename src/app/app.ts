/**
 * `<furrow-app>`: the page. It owns the document's history (the store), the evaluation
 * worker's bridge and the keeping of documents, and lays the cells out as a sheet: each
 * cell with a margin that says what it is, what it is called and how it stands.
 *
 *   view --Edit--> store (undo/redo) --Edit--> bridge --Edit--> worker: document + engine
 *                    \--> keeper (autosave per document, lazy)              |
 *   view <-- cell states and values <-- bridge <-- results + plans ---------+
 *
 * Pieces with one job each: src/app/keeper.ts (which document, kept where), drop.ts
 * (files dropped on the page), visible-cells.ts (cells on screen first), cell-margin.ts
 * (the margin), app-styles.ts (the look); the words are in src/messages/page.ts.
 */
import { LitElement, html, nothing } from 'lit';
import { repeat } from 'lit/directives/repeat.js';
import { CELL_KINDS } from '../../cells/kinds.ts';
import { EDIT_EVENT, FLUSH_EVENT, type EditEventDetail } from '../../cells/view-api.ts';
import { CELL_VIEWS } from '../../cells/views.ts';
import { documentTitle, headerFields, markerKind, type Cell, type Document } from '../doc/document.ts';
import { freshCellId, withTitle, type Edit } from '../doc/edits.ts';
import { DocumentError, readDocument, writeDocument } from '../doc/format.ts';
import { NotUtf8Error } from '../doc/utf8.ts';
import type { CellKind } from '../graph/cell-kind.ts';
import { isPlainName } from '../lang/lexer.ts';
import { pageMsg, startMsg, shellWords } from '../messages/page.ts';
import { shared } from '../views/theme.ts';
import { appStyles } from './app-styles.ts';
import { fileKey, forget, listSaved, loadSaved, newKey, sampleKey, type SavedState } from './autosave.ts';
import { EvaluationBridge } from './bridge.ts';
import { cellMargin } from './cell-margin.ts';
import { ArrivingFiles, type ArrivalsHost } from './arriving-files.ts';
import { cellCommandFor, type CellCommand } from './cell-keys.ts';
import { HELP_CLOSE_EVENT, HELP_INSERT_EVENT, type FurrowHelp, type HelpInsertDetail } from './help/help-panel.ts';
import './help/help-panel.ts';
import { FileDrop } from './drop.ts';
import './import-offer.ts';
import type { ImportChoice } from './import-offer.ts';
import { isImportable, namesTaken, type ImportSource } from './table-import.ts';
import { FileTooLargeError, fileNameFor, pickFile, saveText } from './files.ts';
import { DocumentKeeper, type Opening } from './keeper.ts';
import { DocumentStore } from './store.ts';
import './handoff/hand-off.ts';
import { documentFromReport } from './handoff/report-open.ts';
import { VisibleCells } from './visible-cells.ts';

/** A message shown in the banner under the toolbar, with buttons for what may follow. */
interface Banner {
  readonly kind: 'info' | 'problem';
  readonly text: string;
  readonly actions?: readonly { readonly label: string; readonly run: () => void }[];
}

/** Names a pattern's first name not yet taken in a document: `value1`, `value2`, … */
function freshNames(doc: Document): (base: string) => string {
  const names = namesTaken(doc);
  return (base: string): string => {
    for (let k = 1; ; k++) {
      const n = `${base}${k}`;
      if (!names.has(n)) return n;
    }
  };
}

/** A new cell of a kind, named with the first name of its pattern not yet taken. */
function newCell(doc: Document, kind: CellKind): Cell | null {
  if (kind.template === undefined) return null;
  const { marker, body } = kind.template(freshNames(doc));
  return { id: freshCellId(doc), marker, eol: '\n', body };
}

/** The kinds the page offers to add, in their listed order. */
const ADDABLE = CELL_KINDS.all().filter((k) => k.template !== undefined);

/** A cell view that can take the caret itself (the formula's editor, a note's text). */
interface FocusableView extends HTMLElement {
  focusEditor?: () => Promise<void>;
}

/** The page. */
export class FurrowApp extends LitElement {
  static override properties = {
    doc: { state: true },
    banner: { state: true },
    importing: { state: true },
    renaming: { state: true },
    tick: { state: true },
    kept: { state: true },
    helpOpen: { state: true },
  };

  declare doc: Document;
  declare banner: Banner | null;
  /** A CSV file or workbook offered as a table, while the user chooses. */
  declare importing: ImportSource | null;
  declare renaming: string | null;
  /** Bumped when cell states change, so the cells re-render. */
  declare tick: number;
  /** Other documents kept in this browser, newest first. */
  declare kept: readonly SavedState[];
  /** Whether the help panel is open. */
  declare helpOpen: boolean;

  private store!: DocumentStore;
  private bridge!: EvaluationBridge;
  private readonly keeper: DocumentKeeper;
  private fileName: string | null = null;
  private fileHandle: FileSystemFileHandle | null = null;
  /** Data files arriving: attached, dropped, or brought by a document. */
  private readonly arrivals: ArrivingFiles;
  private get files(): Map<string, string> {
    return this.arrivals.files;
  }
  private saveProblem: string | null = null;
  private samples: ReadonlyMap<string, string> = new Map();
  private readonly visible = new VisibleCells(this, (id) => this.bridge.state(id));

  constructor() {
    super();
    this.arrivals = new ArrivingFiles(this.arrivalsHost());
    this.banner = null;
    this.importing = null;
    this.renaming = null;
    this.tick = 0;
    this.kept = [];
    this.helpOpen = false;
    this.keeper = new DocumentKeeper({
      state: () => ({ text: writeDocument(this.store.document), title: documentTitle(this.store.document), fileName: this.fileName, files: [...this.files] }),
      saved: (ok, error) => {
        this.saveProblem = ok ? null : (error ?? 'unknown');
        this.tick++;
      },
      shared: () => {
        this.banner = { kind: 'info', text: pageMsg.sharedWithTab() };
      },
      savedElsewhere: () => {
        this.banner = { kind: 'info', text: pageMsg.savedInOtherTab(), actions: [{ label: pageMsg.reload(), run: () => void this.reopenKept(this.keeper.key) }] };
      },
    });
    new FileDrop(this, {
      csv: (name, bytes) => this.arrivals.csvArrived(name, bytes),
      workbook: (name, bytes) => void this.arrivals.offerImport(name, bytes),
      data: (name, bytes) => this.arrivals.attach(name, bytes),
      document: (name, text) => {
        if (this.openText(text, name)) this.fileHandle = null;
      },
      problem: (text) => {
        this.banner = { kind: 'problem', text };
      },
    });
  }

  /** Starts the page on a document (see DocumentKeeper.initial for which). */
  start(opening: Opening, options: { samples?: ReadonlyMap<string, string>; notice?: string } = {}): void {
    this.samples = options.samples ?? new Map();
    if (this.store === undefined) this.setUp();
    if (!this.open(opening)) throw new DocumentError(pageMsg.keptUnreadable());
    if (options.notice) this.banner = { kind: 'info', text: options.notice };
  }

  /** The store and the worker's bridge, made once for the page's life. */
  private setUp(): void {
    const empty: Document = { bom: false, firstLine: 'furrow 1', firstEol: '\n', header: '', cells: [] };
    this.store = new DocumentStore(empty);
    this.bridge = new EvaluationBridge(
      {
        onStates: () => {
          this.tick++;
        },
        onFailure: (message) => {
          this.banner = { kind: 'problem', text: message };
        },
      },
      () => this.store.document,
    );
    this.store.subscribe((d, reason, edit) => {
      this.doc = d;
      if (edit === null) this.bridge.load(d);
      else {
        this.bridge.edit(edit);
        this.keeper.touch();
      }
    });
  }

  /** Waits until every evaluation sent has come back (for tests and measurements). */
  async settled(): Promise<void> {
    // a document being read from the browser's keeping comes first, then its evaluation
    while (this.opening.size > 0) await Promise.all([...this.opening]);
    return this.bridge.settled();
  }

  /** Documents being opened from the browser's keeping (read asynchronously). */
  private readonly opening = new Set<Promise<void>>();

  /** Runs an opening and notes it until it ends, so that `settled` waits for it. */
  private track(p: Promise<void>): Promise<void> {
    this.opening.add(p);
    const done = (): void => void this.opening.delete(p);
    p.then(done, done);
    return p;
  }

  /** Writes what autosave is holding (before the page goes away). */
  flushSave(): Promise<void> {
    return this.keeper.flush();
  }

  override connectedCallback(): void {
    super.connectedCallback();
    this.addEventListener(EDIT_EVENT, this.onEdit as EventListener);
    this.addEventListener('furrow-undo', this.onUndo);
    this.addEventListener('furrow-redo', this.onRedo);
    this.addEventListener(HELP_INSERT_EVENT, this.onHelpInsert as EventListener);
    this.addEventListener(HELP_CLOSE_EVENT, this.onHelpClose);
    // before any editor sees the key: the cell keys are chosen to mean nothing to them
    window.addEventListener('keydown', this.onCellKey, true);
    window.addEventListener('keydown', this.onKeydown);
    window.addEventListener('pagehide', this.onLeave);
    document.addEventListener('visibilitychange', this.onVisibility);
  }

  override disconnectedCallback(): void {
    super.disconnectedCallback();
    this.removeEventListener(EDIT_EVENT, this.onEdit as EventListener);
    this.removeEventListener('furrow-undo', this.onUndo);
    this.removeEventListener('furrow-redo', this.onRedo);
    this.removeEventListener(HELP_INSERT_EVENT, this.onHelpInsert as EventListener);
    this.removeEventListener(HELP_CLOSE_EVENT, this.onHelpClose);
    window.removeEventListener('keydown', this.onCellKey, true);
    window.removeEventListener('keydown', this.onKeydown);
    window.removeEventListener('pagehide', this.onLeave);
    document.removeEventListener('visibilitychange', this.onVisibility);
  }

  private readonly onLeave = (): void => {
    // views hand over what is typed but not yet sent, then the document is kept
    window.dispatchEvent(new Event(FLUSH_EVENT));
    this.keeper.leave();
  };

  private readonly onVisibility = (): void => {
    if (document.visibilityState === 'hidden') this.onLeave();
  };

  private readonly onEdit = (e: CustomEvent<EditEventDetail>): void => {
    e.stopPropagation();
    this.apply(e.detail.edit, e.detail.mergeKey ?? null);
  };

  private apply(edit: Edit, mergeKey: string | null = null): void {
    try {
      this.store.apply(edit, mergeKey);
      // a discrete edit (a field entered, a cell added or moved) is written at once; typing,
      // which comes as edits that merge, is written when it pauses
      if (mergeKey === null) void this.keeper.flush();
    } catch (err) {
      this.banner = { kind: 'problem', text: pageMsg.editRefused(err instanceof Error ? err.message : String(err)) };
    }
  }

  private readonly onUndo = (): void => {
    if (!this.store.undo()) this.banner = { kind: 'info', text: pageMsg.nothingToUndo() };
  };

  private readonly onRedo = (): void => {
    if (!this.store.redo()) this.banner = { kind: 'info', text: pageMsg.nothingToRedo() };
  };

  private readonly onKeydown = (e: KeyboardEvent): void => {
    const mod = e.ctrlKey || e.metaKey;
    if (!mod) return;
    const target = e.composedPath()[0];
    // editors handle their own keys and send furrow-undo / furrow-redo
    if (target instanceof HTMLElement && (target.isContentEditable || target.tagName === 'TEXTAREA' || target.tagName === 'INPUT')) return;
    if (e.key === 'z' || e.key === 'Z') {
      e.preventDefault();
      if (e.shiftKey) this.onRedo();
      else this.onUndo();
    } else if (e.key === 'y') {
      e.preventDefault();
      this.onRedo();
    } else if (e.key === 's') {
      e.preventDefault();
      void this.saveFile();
    }
  };

  // ---- keys for cells (src/app/cell-keys.ts) ------------------------------------------

  private readonly onCellKey = (e: KeyboardEvent): void => {
    const command = cellCommandFor(e);
    if (command === null || this.doc === undefined) return;
    e.preventDefault();
    e.stopPropagation();
    const cell = this.cellOf(e);
    if (command !== 'help') this.keepTyping();
    this.runCellCommand(command, cell);
  };

  /**
   * Hands over what is being typed before a cell command moves, adds or deletes cells: views
   * send text still in their typing pause, and the focused field or editor is left (a table
   * field keeps its text when it loses the focus), so the command's edit comes after it.
   */
  private keepTyping(): void {
    window.dispatchEvent(new Event(FLUSH_EVENT));
    let active: Element | null = document.activeElement;
    while (active?.shadowRoot?.activeElement) active = active.shadowRoot.activeElement;
    if (active instanceof HTMLElement) active.blur();
  }

  /** The cell an event came from (the one holding the focus), if any. */
  private cellOf(e: Event): Cell | null {
    for (const t of e.composedPath()) {
      if (t instanceof HTMLElement && t.tagName === 'SECTION' && t.dataset.cell !== undefined) {
        return this.doc.cells.find((c) => c.id === t.dataset.cell) ?? null;
      }
    }
    return null;
  }

  private runCellCommand(command: CellCommand, cell: Cell | null): void {
    const cells = this.doc.cells;
    const i = cell === null ? -1 : cells.findIndex((c) => c.id === cell.id);
    switch (command) {
      case 'help':
        this.toggleHelp();
        return;
      case 'add-below': {
        const formula = ADDABLE.find((k) => k.kind === 'formula') ?? ADDABLE[0];
        if (formula !== undefined) this.addCell(formula, i < 0 ? cells.length : i + 1);
        return;
      }
      case 'previous':
      case 'next': {
        const to = i < 0 ? (command === 'next' ? 0 : cells.length - 1) : i + (command === 'next' ? 1 : -1);
        const target = cells[to];
        if (target !== undefined) void this.focusCell(target.id, false);
        return;
      }
      case 'move-up':
      case 'move-down':
        if (cell !== null) this.moveCell(cell, command === 'move-up' ? -1 : 1, true);
        return;
      case 'delete': {
        if (cell === null) return;
        const next = cells[i + 1] ?? cells[i - 1];
        this.deleteCell(cell);
        if (next !== undefined) void this.focusCell(next.id, false);
        return;
      }
    }
  }

  /**
   * Puts the caret in a cell: a formula's editor, a new note's text, a table's grid. `write`
   * opens a note for writing (a new note); going to a note only focuses it (Enter edits).
   */
  private async focusCell(id: string, write: boolean): Promise<void> {
    await this.updateComplete;
    const section = this.renderRoot.querySelector<HTMLElement>(`section[data-cell="${id}"]`);
    if (section === null) return;
    section.scrollIntoView({ block: 'nearest' });
    const view = section.querySelector<FocusableView>('.body > *');
    if (view === null) return;
    if (view.focusEditor !== undefined && (write || view.tagName !== 'FURROW-NOTE-CELL')) {
      await view.focusEditor();
      return;
    }
    if ('updateComplete' in view) await (view as unknown as LitElement).updateComplete;
    const root = view.shadowRoot ?? view;
    const target = root.querySelector<HTMLElement>('[role="grid"], [tabindex="0"]');
    target?.focus();
  }

  // ---- the help panel -----------------------------------------------------------------

  private toggleHelp(): void {
    this.helpOpen = !this.helpOpen;
    if (this.helpOpen) {
      void this.updateComplete.then(() => this.renderRoot.querySelector<FurrowHelp>('furrow-help')?.focusSearch());
    }
  }

  private readonly onHelpClose = (): void => {
    this.helpOpen = false;
  };

  /** An example from the help panel becomes a named formula cell at the end of the document. */
  private readonly onHelpInsert = (e: CustomEvent<HelpInsertDetail>): void => {
    e.stopPropagation();
    const name = freshNames(this.doc)(e.detail.fn.replace(/_+$/, ''));
    const cell: Cell = { id: freshCellId(this.doc), marker: 'formula', eol: '\n', body: `${name} = ${e.detail.text}\n\n` };
    this.apply({ type: 'insert', index: this.doc.cells.length, cell });
    this.banner = { kind: 'info', text: startMsg.helpInserted(name) };
    void this.updateComplete.then(() => this.renderRoot.querySelector<HTMLElement>(`section[data-cell="${cell.id}"]`)?.scrollIntoView({ block: 'nearest' }));
  };

  // ---- document operations ------------------------------------------------------------

  /** Adds a cell of a kind at a place, and puts the caret in it. */
  private addCell(kind: CellKind, index: number): void {
    const cell = newCell(this.doc, kind);
    if (cell === null) return;
    this.apply({ type: 'insert', index, cell });
    void this.focusCell(cell.id, true);
  }

  private deleteCell(cell: Cell): void {
    this.apply({ type: 'delete', id: cell.id });
    this.banner = { kind: 'info', text: pageMsg.cellDeleted(), actions: [{ label: startMsg.undo(), run: () => this.onUndo() }] };
  }

  private moveCell(cell: Cell, by: number, keepFocus = false): void {
    const i = this.doc.cells.findIndex((c) => c.id === cell.id);
    const to = i + by;
    if (to < 0 || to >= this.doc.cells.length) return;
    this.apply({ type: 'move', id: cell.id, index: to });
    // a moved cell's editor is made anew: the caret follows it
    if (keepFocus) void this.focusCell(cell.id, false);
  }

  private rename(cell: Cell, name: string): void {
    this.renaming = null;
    const kind = CELL_KINDS.of(cell);
    const old = CELL_KINDS.nameOf(cell);
    if (name === old || name === '') return;
    if (!isPlainName(name)) {
      this.banner = { kind: 'problem', text: pageMsg.notAName(name) };
      return;
    }
    if (kind?.rename === undefined) return;
    const text = kind.rename(cell, name);
    const edits: Edit[] = [];
    if (text.marker !== cell.marker) edits.push({ type: 'marker', id: cell.id, marker: text.marker });
    if (text.body !== cell.body) edits.push({ type: 'body', id: cell.id, body: text.body });
    if (edits.length > 0) this.apply(edits.length === 1 ? edits[0]! : { type: 'batch', edits });
  }

  private setTitle(title: string): void {
    if (title.trim() === (headerFields(this.doc).get('title')?.trim() ?? '')) return;
    this.apply({ type: 'header', header: withTitle(this.doc.header, title) });
  }

  // ---- opening, keeping, saving -------------------------------------------------------

  /**
   * Opens a document in its own slot; the one open before stays kept in its slot. A text
   * that is not a document changes nothing and says why.
   */
  private open(o: Opening): boolean {
    let doc: Document;
    try {
      doc = readDocument(o.text, { kinds: CELL_KINDS }).document;
    } catch (err) {
      if (err instanceof DocumentError) {
        this.banner = { kind: 'problem', text: pageMsg.notOpened(o.fileName, err.message) };
        return false;
      }
      throw err;
    }
    // the document open until now is written to its own slot before this one takes over
    void this.keeper.take(o.key).then(() => this.refreshKept());
    this.fileName = o.fileName;
    this.arrivals.replaceWith(o.files);
    this.renaming = null;
    this.store.load(doc);
    const missing = this.arrivals.missing(doc);
    this.banner =
      o.original !== undefined
        ? { kind: 'info', text: o.notice ?? '', actions: [{ label: pageMsg.openOriginal(), run: () => void this.openOriginal(o.original!.name, o.original!.text) }] }
        : o.notice !== undefined
          ? { kind: 'info', text: o.notice }
          : missing.length > 0
            ? { kind: 'info', text: pageMsg.openedMissingFiles(o.fileName, missing) }
            : null;
    return true;
  }

  /**
   * After files were taken back from the browser's keeping: the banner names them, with one
   * click to leave them out, and any file still missing. A banner put up since `said` (the
   * one shown when the document opened) is left as it is.
   */
  private sayRestored(fileName: string, taken: readonly string[], said: Banner | null): void {
    if (this.banner !== said) return;
    this.banner = {
      kind: 'info',
      text: pageMsg.restoredFiles(fileName, taken, this.arrivals.missing(this.doc)),
      actions: [
        {
          label: pageMsg.leaveOutFiles(),
          run: () => {
            this.arrivals.drop(taken);
            this.banner = { kind: 'info', text: pageMsg.openedMissingFiles(fileName, this.arrivals.missing(this.doc)) };
          },
        },
      ],
    };
  }

  /** Opens a document's text read from a file (or dropped): its slot is the file's name. */
  openText(text: string, fileName: string): boolean {
    // a report made by Furrow carries its document and CSV files: it opens as that document
    const report = documentFromReport(text);
    if (report !== null) [text, fileName] = [report.text, report.name];
    const key = fileKey(fileName);
    const opened = this.open({ key, text, fileName, files: report?.files ?? [] });
    if (!opened) return false;
    if (this.banner === null) this.banner = { kind: 'info', text: pageMsg.opened(fileName) };
    const said = this.banner;
    // a kept state of the same file with other text (edits never saved to it) is kept aside;
    // with the same text, the data files attached to it are taken back, and the page says so
    void loadSaved(key).then(async (kept) => {
      if (kept !== null && kept.text !== text) await this.keeper.keepAside(kept);
      else if (kept !== null && this.keeper.key === key) {
        const taken = this.arrivals.restore(kept.files);
        if (taken.length > 0) this.sayRestored(fileName, taken, said);
      }
      this.keeper.touch();
      await this.refreshKept();
    });
    return true;
  }

  /** The original of a sample, instead of the edited copy: the copy is kept aside first. */
  private openOriginal(name: string, text: string): Promise<void> {
    return this.track(this.openOriginalNow(name, text));
  }

  private async openOriginalNow(name: string, text: string): Promise<void> {
    const kept = await this.keeper.readKept(this.keeper.key);
    const title = kept !== null ? await this.keeper.keepAside(kept) : documentTitle(this.doc);
    await forget(sampleKey(name));
    this.fileHandle = null;
    if (this.open({ key: sampleKey(name), text, fileName: name, files: [] })) {
      this.banner = { kind: 'info', text: pageMsg.originalOpen(name, title) };
    }
  }

  private openSample(name: string): Promise<void> {
    return this.track(this.openSampleNow(name));
  }

  private async openSampleNow(name: string): Promise<void> {
    const text = this.samples.get(name);
    if (text === undefined) return;
    // read after typing not yet written is: the sample that is open then opens as the
    // edited copy, instead of the text from before the typing
    const o = await DocumentKeeper.sample(name, text, (key) => this.keeper.readKept(key));
    this.fileHandle = null;
    this.open(o);
  }

  /** Opens a document kept in this browser. */
  private reopenKept(key: string): Promise<void> {
    return this.track(this.reopenKeptNow(key));
  }

  private async reopenKeptNow(key: string): Promise<void> {
    const kept = await this.keeper.readKept(key);
    if (kept === null) return;
    this.fileHandle = null;
    this.open({ key: kept.key, text: kept.text, fileName: kept.fileName, files: kept.files });
  }

  private async refreshKept(): Promise<void> {
    this.kept = (await listSaved()).filter((s) => s.key !== this.keeper.key);
  }

  private async openFile(): Promise<void> {
    try {
      const f = await pickFile();
      if (f === null) return;
      if (isImportable(f.name)) return void (await this.arrivals.offerImport(f.name, f.bytes));
      if (this.openText(f.text, f.name)) this.fileHandle = f.handle;
    } catch (err) {
      this.banner = { kind: 'problem', text: err instanceof FileTooLargeError ? err.message : pageMsg.unreadable(err instanceof NotUtf8Error, String(err)) };
    }
  }

  /** What the arriving files need of the page. */
  private arrivalsHost(): ArrivalsHost {
    const app = this;
    return {
      get doc() {
        return app.doc;
      },
      get importing() {
        return app.importing;
      },
      set importing(v) {
        app.importing = v;
      },
      say: (kind, text) => (this.banner = { kind, text }),
      toWorker: (name, text) => this.bridge.files([[name, text]]),
      touched: () => this.keeper.touch(),
      append: (cell) => {
        this.apply({ type: 'insert', index: this.doc.cells.length, cell });
        void this.updateComplete.then(() => {
          this.renderRoot.querySelector<HTMLElement>(`[data-cell="${cell.id}"]`)?.scrollIntoView({ block: 'nearest' });
        });
      },
    };
  }

  private async saveFile(): Promise<void> {
    try {
      const name = this.fileName ?? fileNameFor(documentTitle(this.doc));
      this.fileHandle = await saveText(writeDocument(this.doc), name, this.fileHandle);
      this.fileName = this.fileHandle?.name ?? name;
      // from now on the document is kept under its file's name; a new document's slot empties
      const before = this.keeper.key;
      await this.keeper.take(fileKey(this.fileName));
      this.keeper.touch();
      if (before.startsWith('new:')) await forget(before);
      void this.refreshKept();
      this.banner = { kind: 'info', text: pageMsg.savedAs(this.fileName) };
    } catch (err) {
      this.banner = { kind: 'problem', text: pageMsg.saveFailed(String(err)) };
    }
  }

  private newDocument(): void {
    this.fileHandle = null;
    this.open({ key: newKey(), text: pageMsg.newDocumentText(), fileName: null, files: [] });
  }

  // ---- rendering ---------------------------------------------------------------------

  private summary(): string {
    let errors = 0;
    let upstream = 0;
    let pending = 0;
    for (const c of this.doc.cells) {
      const s = this.bridge.state(c.id)?.status;
      if (s === 'error') errors++;
      if (s === 'upstream') upstream++;
      if (s === 'pending') pending++;
    }
    const parts: string[] = [];
    const step = this.bridge.step;
    if (step !== null && pending > 0) {
      const cell = this.doc.cells.find((c) => c.id === step.id);
      parts.push(pageMsg.evaluatingStep(cell ? CELL_KINDS.nameOf(cell) : null, step.done, step.total));
    } else if (pending > 0) parts.push(pageMsg.reEvaluating(pending));
    else if (errors > 0) parts.push(pageMsg.cellsWithErrors(errors, upstream));
    else parts.push(pageMsg.allUpToDate());
    parts.push(this.saveProblem ? pageMsg.notKept(this.saveProblem) : pageMsg.kept());
    return parts.join(' · ');
  }

  static override styles = [shared, appStyles];

  override render() {
    if (!this.doc) return html`<main>${shellWords.loading}</main>`;
    const fields = headerFields(this.doc);
    const catalogue = this.bridge.catalogue();
    return html`
      <nav class="bar" aria-label=${shellWords.toolbarLabel}>
        <span class="mark">FURROW</span>
        <button @click=${() => this.newDocument()} title=${shellWords.newTip}>${shellWords.newDocument}</button>
        <button @click=${() => void this.openFile()} title=${shellWords.openTip}>${shellWords.open}</button>
        <button @click=${() => void this.saveFile()} title=${shellWords.saveTip}>${shellWords.save}</button>
        <button @click=${() => void this.arrivals.attachPicked()} title=${shellWords.attachTip}>${shellWords.attachData}</button>
        ${this.samples.size > 0
          ? html`<select
              aria-label=${shellWords.samplesLabel}
              @change=${(e: Event) => {
                const s = e.target as HTMLSelectElement;
                if (s.value) void this.openSample(s.value);
                s.value = '';
              }}
            >
              <option value="">${shellWords.samples}</option>
              ${[...this.samples.keys()].map((k) => html`<option value=${k}>${k.replace(/\.furrow$/, '')}</option>`)}
            </select>`
          : nothing}
        ${this.kept.length > 0
          ? html`<select
              class="kept"
              aria-label=${shellWords.keptListLabel}
              @focus=${() => void this.refreshKept()}
              @change=${(e: Event) => {
                const s = e.target as HTMLSelectElement;
                if (s.value) void this.reopenKept(s.value);
                s.value = '';
              }}
            >
              <option value="">${pageMsg.keptList()}</option>
              ${this.kept.map((k) => html`<option value=${k.key}>${pageMsg.keptEntry(k.title, pageMsg.keptWhere(k.key))}</option>`)}
            </select>`
          : nothing}
        <span class="sep"></span>
        <button @click=${this.onUndo} ?disabled=${!this.store.canUndo} title=${shellWords.undoTip}>${shellWords.undo}</button>
        <button @click=${this.onRedo} ?disabled=${!this.store.canRedo} title=${shellWords.redoTip}>${shellWords.redo}</button>
        <button class="help-toggle" aria-pressed=${this.helpOpen ? 'true' : 'false'} @click=${() => this.toggleHelp()} title=${startMsg.helpButtonTitle()}>${startMsg.helpButton()}</button>
        <span class="status" role="status" aria-live="polite">${this.summary()}</span>
      </nav>
      ${this.banner
        ? html`<div class="banner ${this.banner.kind}" role=${this.banner.kind === 'problem' ? 'alert' : 'status'}>
            <span>${this.banner.text}</span>
            ${(this.banner.actions ?? []).map((a) => html`<button class="action" @click=${a.run}>${a.label}</button>`)}
            <button @click=${() => (this.banner = null)} aria-label=${shellWords.dismiss}>✕</button>
          </div>`
        : nothing}
      ${this.importing !== null
        ? html`<furrow-import-offer
            .source=${this.importing}
            .taken=${namesTaken(this.doc)}
            @furrow-import-add=${(e: CustomEvent<ImportChoice>) => this.arrivals.addImported(e.detail)}
            @furrow-import-cancel=${() => (this.importing = null)}
          ></furrow-import-offer>`
        : nothing}
      <main class=${this.helpOpen ? 'with-help' : ''}>
        <header>
          <textarea
            class="title"
            rows="1"
            aria-label=${shellWords.titleLabel}
            placeholder=${startMsg.titlePlaceholder()}
            .value=${fields.get('title')?.trim() ?? ''}
            @change=${(e: Event) => this.setTitle((e.target as HTMLTextAreaElement).value)}
            @keydown=${(e: KeyboardEvent) => {
              if (e.key === 'Enter') {
                e.preventDefault();
                (e.target as HTMLTextAreaElement).blur();
              }
            }}
          ></textarea>
          ${fields.get('author') ? html`<div class="byline">${fields.get('author')}</div>` : nothing}
          ${fields.get('caution') ? html`<div class="caution" role="note"><b>${shellWords.caution}</b>${fields.get('caution')}</div>` : nothing}
        </header>
        <furrow-hand-off .doc=${this.doc} .stateOf=${(c: Cell) => this.visible.stateFor(c.id)} .files=${this.files} .fileName=${this.fileName}></furrow-hand-off>
        ${repeat(
          this.doc.cells,
          (c) => c.id,
          (c, i) => this.renderCell(c, i, catalogue),
        )}
        <div class="add">
          <span>Add</span>
          ${ADDABLE.map((k) => html`<button @click=${() => this.addCell(k, this.doc.cells.length)}>+ ${k.label}</button>`)}
        </div>
        <p class="judgement" role="note">${shellWords.judgement}</p>
      </main>
      ${this.helpOpen ? html`<aside class="help" aria-label=${startMsg.helpHeading()}><furrow-help .catalogue=${catalogue}></furrow-help></aside>` : nothing}
    `;
  }

  private renderCell(cell: Cell, index: number, catalogue: ReturnType<EvaluationBridge['catalogue']>) {
    const word = markerKind(cell.marker);
    const kind = CELL_KINDS.get(word);
    const state = this.visible.stateFor(cell.id);
    const status = state?.status ?? 'pending';
    const view = CELL_VIEWS.get(word);
    const name = CELL_KINDS.nameOf(cell);
    return html`<section class="cell ${status}" data-cell=${cell.id} data-kind=${word} data-name=${name ?? ''} data-status=${status} aria-label="${word} ${name ?? ''}">
      ${cellMargin(
        { word, kind, name, state, status, renaming: this.renaming === cell.id, first: index === 0, last: index === this.doc.cells.length - 1 },
        {
          startRename: () => this.startRename(cell.id),
          rename: (n) => this.rename(cell, n),
          cancelRename: () => (this.renaming = null),
          move: (by) => this.moveCell(cell, by),
          remove: () => this.deleteCell(cell),
          trace: () => this.dispatchEvent(new CustomEvent('furrow-trace', { detail: cell.id })),
        },
      )}
      <div class="body">
        ${view ? view(cell, state, catalogue) : html`<div class="inert"><pre>--- ${cell.marker}\n${cell.body}</pre></div>`}
      </div>
      <div class="insert" role="toolbar" aria-label=${shellWords.addACellBelow}>
        ${ADDABLE.map((k) => html`<button title=${pageMsg.addBelow(k.label)} @click=${() => this.addCell(k, index + 1)}>+ ${k.label}</button>`)}
      </div>
    </section>`;
  }

  private startRename(id: string): void {
    this.renaming = id;
    void this.updateComplete.then(() => {
      const input = this.renderRoot.querySelector<HTMLInputElement>('.name-input');
      input?.focus();
      input?.select();
    });
  }
}

if (!customElements.get('furrow-app')) customElements.define('furrow-app', FurrowApp);

