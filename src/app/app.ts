/**
 * `<furrow-app>`: the page. It owns the document's history (the store), the evaluation
 * worker's bridge and the keeping of documents, and lays the cells out as a sheet: each
 * cell with a margin that says what it is, what it is called and how it stands.
 *
 *   view --Edit--> store (undo/redo) --Edit--> bridge --Edit--> worker: document + engine
 *                    \--> keeper (autosave per document, lazy)              |
 *   view <-- cell states and values <-- bridge <-- results + plans ---------+
 *
 * This element composes and applies edits; pieces with one job each do the rest:
 * open-document.ts (opening, saving, samples, kept documents), keeper.ts (which document,
 * kept where), page-keys.ts (the keys), cell-focus.ts (the caret into a cell), new-cells.ts
 * (cells the page adds), drop.ts and arriving-files.ts (files coming in), visible-cells.ts
 * (cells on screen first), toolbar.ts, banner.ts, title-block.ts, cell-section.ts and
 * cell-margin.ts (what is drawn), app-styles.ts (the look); the words are in
 * src/messages/page.ts.
 */
import { LitElement, html, nothing } from 'lit';
import { repeat } from 'lit/directives/repeat.js';
import { guard } from 'lit/directives/guard.js';
import { CELL_KINDS } from '../../cells/kinds.ts';
import { EDIT_EVENT, FLUSH_EVENT, type EditEventDetail } from '../../cells/view-api.ts';
import { documentTitle, headerFields, type Cell, type Document } from '../doc/document.ts';
import { withTitle, type Edit } from '../doc/edits.ts';
import { DocumentError, writeDocument } from '../doc/format.ts';
import type { CellKind } from '../graph/cell-kind.ts';
import { isPlainName } from '../lang/lexer.ts';
import { pageMsg, startMsg, shellWords } from '../messages/page.ts';
import { shared } from '../views/theme.ts';
import { appStyles } from './app-styles.ts';
import type { SavedState } from './autosave.ts';
import { bannerView, type Banner } from './banner.ts';
import { EvaluationBridge } from './bridge.ts';
import { ArrivingFiles, type ArrivalsHost } from './arriving-files.ts';
import { focusCell } from './cell-focus.ts';
import { cellSection, type CellPlace } from './cell-section.ts';
import { HELP_CLOSE_EVENT, HELP_INSERT_EVENT, type FurrowHelp, type HelpInsertDetail } from './help/help-panel.ts';
import './help/help-panel.ts';
import { FileDrop } from './drop.ts';
import './import-offer.ts';
import type { ImportChoice } from './import-offer.ts';
import { namesTaken, type ImportSource } from './table-import.ts';
import { DocumentKeeper, type Opening } from './keeper.ts';
import { ADDABLE, exampleCell, newCell } from './new-cells.ts';
import { OpenDocument, type OpenDocumentHost } from './open-document.ts';
import { PageKeys } from './page-keys.ts';
import { DocumentStore } from './store.ts';
import './handoff/hand-off.ts';
import { titleBlock } from './title-block.ts';
import { statusLine, toolbar } from './toolbar.ts';
import { VisibleCells } from './visible-cells.ts';
import { afterHeldDrawing, holdDrawing } from '../views/draw-gate.ts';

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
  /** The document open, where it came from, and opening and saving documents. */
  private readonly openDocument: OpenDocument;
  /** Data files arriving: attached, dropped, or brought by a document. */
  private readonly arrivals: ArrivingFiles;
  private get files(): Map<string, string> {
    return this.arrivals.files;
  }
  private saveProblem: string | null = null;
  private readonly visible = new VisibleCells(
    this,
    (id) => this.bridge.state(id),
    () => (this.doc ? this.doc.cells.map((c) => c.id) : null),
  );

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
      state: () => ({
        text: writeDocument(this.store.document),
        title: documentTitle(this.store.document),
        fileName: this.openDocument.fileName,
        files: [...this.files],
      }),
      saved: (ok, error) => {
        this.saveProblem = ok ? null : (error ?? 'unknown');
        this.tick++;
      },
      shared: () => {
        this.banner = { kind: 'info', text: pageMsg.sharedWithTab() };
      },
      savedElsewhere: () => {
        this.banner = { kind: 'info', text: pageMsg.savedInOtherTab(), actions: [{ label: pageMsg.reload(), run: () => void this.openDocument.reopenKept(this.keeper.key) }] };
      },
    });
    this.openDocument = new OpenDocument(this.openDocumentHost());
    new FileDrop(this, {
      csv: (name, bytes) => this.arrivals.csvArrived(name, bytes),
      workbook: (name, bytes) => void this.arrivals.offerImport(name, bytes),
      data: (name, bytes) => this.arrivals.attach(name, bytes),
      document: (name, text) => this.openDocument.dropped(name, text),
      problem: (text) => {
        this.banner = { kind: 'problem', text };
      },
    });
    new PageKeys(this, {
      doc: () => this.doc,
      undo: () => this.onUndo(),
      redo: () => this.onRedo(),
      save: () => void this.openDocument.saveFile(),
      toggleHelp: () => this.toggleHelp(),
      addCell: (kind, index) => this.addCell(kind, index),
      moveCell: (cell, by, keepFocus) => this.moveCell(cell, by, keepFocus),
      deleteCell: (cell) => this.deleteCell(cell),
      focusCell: (id, write) => void this.focusCell(id, write),
    });
  }

  /** Starts the page on a document (see DocumentKeeper.initial for which). */
  start(opening: Opening, options: { samples?: ReadonlyMap<string, string>; notice?: string } = {}): void {
    this.openDocument.samples = options.samples ?? new Map();
    if (this.store === undefined) this.setUp();
    if (!this.openDocument.open(opening)) throw new DocumentError(pageMsg.keptUnreadable());
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
    await this.openDocument.opened();
    return this.bridge.settled();
  }

  /** Writes what autosave is holding (before the page goes away). */
  flushSave(): Promise<void> {
    return this.keeper.flush();
  }

  /** Opens a document's text read from a file (or dropped): its slot is the file's name. */
  openText(text: string, fileName: string): boolean {
    return this.openDocument.openText(text, fileName);
  }

  override connectedCallback(): void {
    super.connectedCallback();
    this.addEventListener(EDIT_EVENT, this.onEdit as EventListener);
    this.addEventListener('furrow-undo', this.onUndo);
    this.addEventListener('furrow-redo', this.onRedo);
    this.addEventListener(HELP_INSERT_EVENT, this.onHelpInsert as EventListener);
    this.addEventListener(HELP_CLOSE_EVENT, this.onHelpClose);
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
    // the edit is sent: drawing waits a moment for the worker's answer (draw-gate.ts)
    if (e.detail.drawWithAnswer === true) holdDrawing(this.bridge.settled());
  };

  /** Draws when the page's drawing is free (src/views/draw-gate.ts). */
  protected override scheduleUpdate(): void | Promise<unknown> {
    return afterHeldDrawing(() => super.scheduleUpdate());
  }

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

  /** Puts the caret in a cell once the page has drawn it (see cell-focus.ts). */
  private async focusCell(id: string, write: boolean): Promise<void> {
    await this.updateComplete;
    await focusCell(this.renderRoot, id, write);
  }

  /** Shows a cell once the page has drawn it. */
  private scrollToCell(id: string): void {
    void this.updateComplete.then(() => this.renderRoot.querySelector<HTMLElement>(`section[data-cell="${id}"]`)?.scrollIntoView({ block: 'nearest' }));
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
    const { cell, name } = exampleCell(this.doc, e.detail.fn, e.detail.text);
    this.apply({ type: 'insert', index: this.doc.cells.length, cell });
    this.banner = { kind: 'info', text: startMsg.helpInserted(name) };
    this.scrollToCell(cell.id);
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

  private startRename(id: string): void {
    this.renaming = id;
    void this.updateComplete.then(() => {
      const input = this.renderRoot.querySelector<HTMLInputElement>('.name-input');
      input?.focus();
      input?.select();
    });
  }

  // ---- what the pieces need of the page -----------------------------------------------

  /** What opening and saving documents need of the page. */
  private openDocumentHost(): OpenDocumentHost {
    return {
      doc: () => this.doc,
      banner: () => this.banner,
      say: (banner) => {
        this.banner = banner;
      },
      listKept: (kept) => {
        this.kept = kept;
      },
      load: (doc) => {
        this.renaming = null;
        this.store.load(doc);
      },
      keeper: this.keeper,
      arrivals: this.arrivals,
    };
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
        this.scrollToCell(cell.id);
      },
    };
  }

  // ---- rendering ---------------------------------------------------------------------

  static override styles = [shared, appStyles];

  override render() {
    if (!this.doc) return html`<main>${shellWords.loading}</main>`;
    const catalogue = this.bridge.catalogue();
    const open = this.openDocument;
    return html`
      ${toolbar(
        {
          samples: open.samples,
          kept: this.kept,
          canUndo: this.store.canUndo,
          canRedo: this.store.canRedo,
          helpOpen: this.helpOpen,
          status: statusLine(this.doc, this.bridge, this.saveProblem),
        },
        {
          newDocument: () => open.newDocument(),
          openFile: () => void open.openFile(),
          saveFile: () => void open.saveFile(),
          attachData: () => void this.arrivals.attachPicked(),
          openSample: (name) => void open.openSample(name),
          refreshKept: () => void open.refreshKept(),
          reopenKept: (key) => void open.reopenKept(key),
          undo: () => this.onUndo(),
          redo: () => this.onRedo(),
          toggleHelp: () => this.toggleHelp(),
        },
      )}
      ${bannerView(this.banner, () => (this.banner = null))}
      ${this.importing !== null
        ? html`<furrow-import-offer
            .source=${this.importing}
            .taken=${namesTaken(this.doc)}
            @furrow-import-add=${(e: CustomEvent<ImportChoice>) => this.arrivals.addImported(e.detail)}
            @furrow-import-cancel=${() => (this.importing = null)}
          ></furrow-import-offer>`
        : nothing}
      <main class=${this.helpOpen ? 'with-help' : ''}>
        ${titleBlock(headerFields(this.doc), (title) => this.setTitle(title))}
        <furrow-hand-off .doc=${this.doc} .stateOf=${(c: Cell) => this.visible.stateFor(c.id)} .files=${this.files} .fileName=${open.fileName}></furrow-hand-off>
        ${repeat(
          this.doc.cells,
          (c) => c.id,
          (c, index) => this.renderCell(c, index, catalogue),
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
    const count = this.doc.cells.length;
    const state = this.visible.stateFor(cell.id);
    const renaming = this.renaming === cell.id;
    // A cell is drawn again only when something it shows changed. An edit gives new states
    // to the cells on screen only (visible-cells.ts); walking every other cell's template
    // again took about 3 ms of each edit in a 200-cell document.
    return guard([cell, index, count, state, renaming, catalogue], () => this.cellTemplate(cell, { index, count, state, renaming, catalogue }));
  }

  private cellTemplate(cell: Cell, place: CellPlace) {
    return cellSection(
      cell,
      place,
      {
        startRename: () => this.startRename(cell.id),
        rename: (n) => this.rename(cell, n),
        cancelRename: () => (this.renaming = null),
        move: (by) => this.moveCell(cell, by),
        remove: () => this.deleteCell(cell),
        trace: () => this.dispatchEvent(new CustomEvent('furrow-trace', { detail: cell.id })),
        add: (kind, at) => this.addCell(kind, at),
      },
    );
  }
}

if (!customElements.get('furrow-app')) customElements.define('furrow-app', FurrowApp);
