/**
 * `<furrow-app>`: the page. It owns the document (with its history), the evaluation
 * worker and autosave, and lays the cells out as a sheet: each cell with a margin that says
 * what it is, what it is called and how it stands.
 *
 *   edit in a view --(Edit)--> store (undo/redo) --> worker (evaluate what changed)
 *                                        \--> autosave (IndexedDB)
 *   worker results --> bridge (per-cell states) --> views
 */
import { LitElement, css, html, nothing } from 'lit';
import { repeat } from 'lit/directives/repeat.js';
import { CELL_VIEWS } from '../../cells/views.ts';
import { EDIT_EVENT, type CellViewState, type EditEventDetail } from '../../cells/view-api.ts';
import { CELL_KINDS } from '../../cells/kinds.ts';
import { documentTitle, headerFields, markerKind, type Cell, type Document } from '../doc/document.ts';
import type { CellKind } from '../graph/cell-kind.ts';
import { freshCellId, withTitle, type Edit } from '../doc/edits.ts';
import { DocumentError, readDocument, writeDocument } from '../doc/format.ts';
import { isPlainName } from '../lang/lexer.ts';
import { Autosaver, type SavedState } from './autosave.ts';
import { EvaluationBridge } from './bridge.ts';
import { fileNameFor, pickFile, readFileText, saveText } from './files.ts';
import { DocumentStore } from './store.ts';
import { shared } from '../views/theme.ts';

/** A message shown in the banner under the toolbar. */
interface Banner {
  readonly kind: 'info' | 'problem';
  readonly text: string;
}

const STATUS_WORDS: Record<string, string> = {
  ok: '',
  pending: 're-evaluating',
  error: 'error',
  upstream: 'depends on an error',
  inert: 'kept, not evaluated',
};

/** A new cell of a kind, named with the first name of its pattern not yet taken. */
function newCell(doc: Document, kind: CellKind): Cell | null {
  if (kind.template === undefined) return null;
  const names = new Set(doc.cells.map((c) => CELL_KINDS.nameOf(c)).filter((n): n is string => n !== null));
  const fresh = (base: string): string => {
    for (let k = 1; ; k++) {
      const n = `${base}${k}`;
      if (!names.has(n)) return n;
    }
  };
  const { marker, body } = kind.template(fresh);
  return { id: freshCellId(doc), marker, eol: '\n', body };
}

/** The kinds the page offers to add, in their listed order. */
const ADDABLE = CELL_KINDS.all().filter((k) => k.template !== undefined);

/** The page. */
export class FurrowApp extends LitElement {
  static override properties = {
    doc: { state: true },
    banner: { state: true },
    renaming: { state: true },
    tick: { state: true },
  };

  declare doc: Document;
  declare banner: Banner | null;
  declare renaming: string | null;
  /** Bumped when cell states change, so the cells re-render. */
  declare tick: number;

  private store!: DocumentStore;
  private bridge!: EvaluationBridge;
  private readonly autosaver = new Autosaver();
  private fileName: string | null = null;
  private fileHandle: FileSystemFileHandle | null = null;
  private files = new Map<string, string>();
  private savedToFile = true;
  private saveProblem: string | null = null;
  private samples: ReadonlyMap<string, string> = new Map();
  /**
   * Cells on screen (or near it). A wave of new values renders these first; cells off
   * screen keep the state they were last drawn with until the next frame, so that an edit
   * in a long document shows its visible consequences at once.
   */
  private readonly onScreen = new Set<string>();
  private readonly drawn = new Map<string, CellViewState | null>();
  private catchUp = false;
  private catchUpScheduled = false;
  private observer: IntersectionObserver | null = null;

  constructor() {
    super();
    this.banner = null;
    this.renaming = null;
    this.tick = 0;
  }

  /** Starts the page on a document (and the CSV files its tables name). */
  start(text: string, options: { fileName: string | null; files?: ReadonlyArray<readonly [string, string]>; samples?: ReadonlyMap<string, string>; notice?: string }): void {
    const doc = readDocument(text, { kinds: CELL_KINDS }).document;
    this.doc = doc;
    this.fileName = options.fileName;
    this.samples = options.samples ?? new Map();
    this.files = new Map(options.files ?? []);
    this.store = new DocumentStore(doc);
    this.bridge = new EvaluationBridge({
      onStates: () => {
        this.tick++;
      },
      onFailure: (message) => {
        this.banner = { kind: 'problem', text: message };
      },
    });
    if (this.files.size > 0) this.bridge.files([...this.files]);
    this.store.subscribe((d, reason) => {
      const before = this.doc;
      this.doc = d;
      const changed = reason === 'load' ? 'all' : changedCells(before, d);
      this.bridge.update(d, changed);
      if (reason !== 'load') this.savedToFile = false;
      this.scheduleSave();
    });
    this.autosaver.onSaved = (ok, error) => {
      this.saveProblem = ok ? null : (error ?? 'unknown');
      this.tick++;
    };
    this.bridge.update(doc, 'all');
    if (options.notice) this.banner = { kind: 'info', text: options.notice };
    this.scheduleSave();
  }

  /** Waits until every evaluation sent has come back (for tests and measurements). */
  settled(): Promise<void> {
    return this.bridge.settled();
  }

  /** Writes what autosave is holding (before the page goes away). */
  flushSave(): Promise<void> {
    return this.autosaver.flush();
  }

  private scheduleSave(): void {
    const state: SavedState = { text: writeDocument(this.doc), fileName: this.fileName, files: [...this.files], savedAt: Date.now() };
    this.autosaver.schedule(state);
  }

  override connectedCallback(): void {
    super.connectedCallback();
    this.addEventListener(EDIT_EVENT, this.onEdit as EventListener);
    this.addEventListener('furrow-undo', this.onUndo);
    this.addEventListener('furrow-redo', this.onRedo);
    window.addEventListener('keydown', this.onKeydown);
    window.addEventListener('pagehide', this.onPageHide);
    window.addEventListener('dragover', this.onDragOver);
    window.addEventListener('drop', this.onDrop);
  }

  override disconnectedCallback(): void {
    super.disconnectedCallback();
    this.removeEventListener(EDIT_EVENT, this.onEdit as EventListener);
    this.removeEventListener('furrow-undo', this.onUndo);
    this.removeEventListener('furrow-redo', this.onRedo);
    window.removeEventListener('keydown', this.onKeydown);
    window.removeEventListener('pagehide', this.onPageHide);
    window.removeEventListener('dragover', this.onDragOver);
    window.removeEventListener('drop', this.onDrop);
  }

  private readonly onDragOver = (e: DragEvent): void => {
    if (e.dataTransfer?.types.includes('Files')) e.preventDefault();
  };

  /** A dropped .furrow file opens (nothing is lost if it is not a document); a .csv is attached. */
  private readonly onDrop = (e: DragEvent): void => {
    const file = e.dataTransfer?.files[0];
    if (file === undefined) return;
    // a cell view that takes a drop itself says so by preventing the default
    if (e.defaultPrevented) return;
    e.preventDefault();
    void readFileText(file).then(
      (text) => {
        if (/\.csv$/i.test(file.name)) {
          this.files.set(file.name, text);
          this.bridge.files([[file.name, text]]);
          this.bridge.update(this.doc, this.cellsReading(file.name));
          this.scheduleSave();
          this.banner = { kind: 'info', text: `Attached ${file.name}.` };
          return;
        }
        if (!this.confirmReplace()) return;
        if (this.openText(text, file.name)) this.fileHandle = null;
      },
      () => {
        this.banner = { kind: 'problem', text: `${file.name} was not opened: it is not UTF-8 text, so it is not a Furrow document. Nothing on the page was changed.` };
      },
    );
  };

  private readonly onPageHide = (): void => {
    void this.autosaver.flush();
  };

  private readonly onEdit = (e: CustomEvent<EditEventDetail>): void => {
    e.stopPropagation();
    this.apply(e.detail.edit, e.detail.mergeKey ?? null);
  };

  private apply(edit: Edit, mergeKey: string | null = null): void {
    try {
      this.store.apply(edit, mergeKey);
    } catch (err) {
      this.banner = { kind: 'problem', text: `That change could not be made: ${err instanceof Error ? err.message : String(err)}` };
    }
  }

  private readonly onUndo = (): void => {
    if (!this.store.undo()) this.banner = { kind: 'info', text: 'Nothing to undo.' };
  };

  private readonly onRedo = (): void => {
    if (!this.store.redo()) this.banner = { kind: 'info', text: 'Nothing to redo.' };
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

  // ---- document operations ------------------------------------------------------------

  /** The ids of the cells that read a file beside the document. */
  private cellsReading(file: string): string[] {
    return this.doc.cells.filter((c) => CELL_KINDS.filesRead(c).includes(file)).map((c) => c.id);
  }

  private addCell(kind: CellKind, index: number): void {
    const cell = newCell(this.doc, kind);
    if (cell === null) return;
    this.apply({ type: 'insert', index, cell });
    void this.updateComplete.then(() => {
      const el = this.renderRoot.querySelector<HTMLElement>(`[data-cell="${cell.id}"]`);
      el?.scrollIntoView({ block: 'nearest' });
    });
  }

  private deleteCell(cell: Cell): void {
    this.apply({ type: 'delete', id: cell.id });
    this.banner = { kind: 'info', text: 'Cell deleted. Undo (Ctrl+Z) brings it back.' };
  }

  private moveCell(cell: Cell, by: number): void {
    const i = this.doc.cells.findIndex((c) => c.id === cell.id);
    const to = i + by;
    if (to < 0 || to >= this.doc.cells.length) return;
    this.apply({ type: 'move', id: cell.id, index: to });
  }

  private rename(cell: Cell, name: string): void {
    this.renaming = null;
    const kind = CELL_KINDS.of(cell);
    const old = CELL_KINDS.nameOf(cell);
    if (name === old || name === '') return;
    if (!isPlainName(name)) {
      this.banner = { kind: 'problem', text: `"${name}" cannot be a name: it starts with a letter or _, then letters, digits or _.` };
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
    if (title.trim() === documentTitle(this.doc)) return;
    this.apply({ type: 'header', header: withTitle(this.doc.header, title) });
  }

  private confirmReplace(): boolean {
    if (this.savedToFile) return true;
    return window.confirm('Replace the current document? Its latest state is kept in this browser only until another document replaces it; save it to a file first if you need it.');
  }

  /** Opens a document from text; a text that is not a document changes nothing. */
  openText(text: string, fileName: string | null): boolean {
    try {
      const doc = readDocument(text, { kinds: CELL_KINDS }).document;
      this.fileName = fileName;
      this.store.load(doc);
      this.savedToFile = true;
      const missing = [...new Set(doc.cells.flatMap((c) => CELL_KINDS.filesRead(c)))].filter((f) => !this.files.has(f));
      this.banner = missing.length
        ? { kind: 'info', text: `Opened ${fileName ?? 'the document'}. Its tables read ${missing.join(', ')}: attach ${missing.length === 1 ? 'that file' : 'those files'} with "Attach CSV".` }
        : { kind: 'info', text: `Opened ${fileName ?? 'the document'}.` };
      return true;
    } catch (err) {
      if (err instanceof DocumentError) {
        this.banner = { kind: 'problem', text: `${fileName ?? 'That file'} was not opened: ${err.message} Nothing on the page was changed.` };
        return false;
      }
      throw err;
    }
  }

  private async openFile(): Promise<void> {
    try {
      const f = await pickFile();
      if (f === null) return;
      if (!this.confirmReplace()) return;
      if (this.openText(f.text, f.name)) this.fileHandle = f.handle;
    } catch (err) {
      this.banner = { kind: 'problem', text: `The file could not be read${err instanceof TypeError ? ': it is not UTF-8 text, so it is not a Furrow document' : `: ${String(err)}`}. Nothing on the page was changed.` };
    }
  }

  private async attachCsv(): Promise<void> {
    try {
      const f = await pickFile('.csv,text/csv,text/plain');
      if (f === null) return;
      this.files.set(f.name, f.text);
      this.bridge.files([[f.name, f.text]]);
      this.bridge.update(this.doc, this.cellsReading(f.name));
      this.scheduleSave();
      this.banner = { kind: 'info', text: `Attached ${f.name}.` };
    } catch (err) {
      this.banner = { kind: 'problem', text: `The CSV file could not be read: ${String(err)}.` };
    }
  }

  private async saveFile(): Promise<void> {
    try {
      const name = this.fileName ?? fileNameFor(documentTitle(this.doc));
      this.fileHandle = await saveText(writeDocument(this.doc), name, this.fileHandle);
      this.fileName = this.fileHandle?.name ?? name;
      this.savedToFile = true;
      this.banner = { kind: 'info', text: `Saved as ${this.fileName}.` };
    } catch (err) {
      this.banner = { kind: 'problem', text: `Saving failed: ${String(err)}. The document is still kept in this browser.` };
    }
  }

  private newDocument(): void {
    if (!this.confirmReplace()) return;
    this.fileHandle = null;
    this.openText('furrow 1\ntitle: Untitled trial\n\n--- note\nWhat is compared, on what, and why.\n\n', null);
    this.banner = null;
  }

  private openSample(name: string): void {
    const text = this.samples.get(name);
    if (text === undefined || !this.confirmReplace()) return;
    this.fileHandle = null;
    this.openText(text, name);
  }

  // ---- rendering ---------------------------------------------------------------------

  private stateOf(cell: Cell): CellViewState | null {
    return this.bridge.state(cell.id);
  }

  /** The state to draw a cell with now (see `onScreen`). */
  private drawState(cell: Cell): CellViewState | null {
    const latest = this.bridge.state(cell.id);
    if (this.catchUp || this.onScreen.has(cell.id) || !this.drawn.has(cell.id)) {
      this.drawn.set(cell.id, latest);
      return latest;
    }
    const old = this.drawn.get(cell.id)!;
    if (old !== latest) this.scheduleCatchUp();
    return old;
  }

  private scheduleCatchUp(): void {
    if (this.catchUpScheduled) return;
    this.catchUpScheduled = true;
    // after this frame is painted, draw the rest
    requestAnimationFrame(() =>
      setTimeout(() => {
        this.catchUpScheduled = false;
        this.catchUp = true;
        this.requestUpdate();
        void this.updateComplete.then(() => {
          this.catchUp = false;
        });
      }, 0),
    );
  }

  override updated(): void {
    if (this.observer === null) {
      this.observer = new IntersectionObserver(
        (entries) => {
          for (const e of entries) {
            const id = (e.target as HTMLElement).dataset.cell;
            if (id === undefined) continue;
            if (e.isIntersecting) {
              this.onScreen.add(id);
              if (this.drawn.get(id) !== this.bridge.state(id)) this.requestUpdate();
            } else this.onScreen.delete(id);
          }
        },
        { rootMargin: '300px 0px' },
      );
    }
    for (const sec of this.renderRoot.querySelectorAll<HTMLElement>('section.cell:not([data-watched])')) {
      sec.dataset.watched = '';
      this.observer.observe(sec);
    }
  }

  private summary(): string {
    let errors = 0;
    let upstream = 0;
    let pending = 0;
    for (const c of this.doc.cells) {
      const s = this.stateOf(c)?.status;
      if (s === 'error') errors++;
      if (s === 'upstream') upstream++;
      if (s === 'pending') pending++;
    }
    const parts: string[] = [];
    const step = this.bridge.step;
    if (step !== null && pending > 0) {
      const cell = this.doc.cells.find((c) => c.id === step.id);
      parts.push(`evaluating ${cell ? (CELL_KINDS.nameOf(cell) ?? 'a cell') : 'a cell'}: ${step.done} of ${step.total} cells checked…`);
    } else if (pending > 0) parts.push(`re-evaluating ${pending} ${pending === 1 ? 'cell' : 'cells'}…`);
    else if (errors > 0) {
      parts.push(`${errors} ${errors === 1 ? 'cell has' : 'cells have'} an error${upstream > 0 ? `, ${upstream} ${upstream === 1 ? 'depends' : 'depend'} on ${errors === 1 ? 'it' : 'them'}` : ''}`);
    }
    else parts.push('every cell up to date');
    parts.push(this.saveProblem ? `not kept in this browser (${this.saveProblem})` : 'kept in this browser');
    return parts.join(' · ');
  }

  static override styles = [
    shared,
    css`
      :host {
        display: block;
        min-height: 100vh;
        background: var(--paper);
      }
      .bar {
        position: sticky;
        top: 0;
        z-index: 5;
        display: flex;
        align-items: center;
        gap: 0.4rem;
        padding: 0.45rem 1.5rem;
        background: color-mix(in srgb, var(--paper) 92%, transparent);
        backdrop-filter: blur(4px);
        border-bottom: 1px solid var(--rule);
        font-size: 0.82rem;
      }
      .mark {
        font-family: var(--font-text);
        font-weight: 700;
        letter-spacing: 0.14em;
        font-size: 0.8rem;
        color: var(--accent);
        margin-right: 0.8rem;
      }
      .sep {
        width: 1px;
        height: 1.1rem;
        background: var(--rule-strong);
        margin: 0 0.3rem;
      }
      .bar select {
        font: inherit;
        font-size: 0.8rem;
        color: var(--ink-soft);
        background: transparent;
        border: 1px solid var(--rule-strong);
        border-radius: var(--radius);
        padding: 0.1rem 0.3rem;
      }
      .status {
        margin-left: auto;
        color: var(--muted);
        font-size: 0.78rem;
      }
      .banner {
        max-width: 58rem;
        margin: 0.8rem auto 0;
        padding: 0.45rem 0.8rem;
        font-size: 0.86rem;
        border-radius: var(--radius);
        display: flex;
        gap: 0.8rem;
        align-items: baseline;
      }
      .banner.info {
        background: var(--accent-soft);
        color: var(--ink);
      }
      .banner.problem {
        background: var(--error-soft);
        color: var(--error);
      }
      .banner button {
        margin-left: auto;
        border: none;
      }
      main {
        max-width: 58rem;
        margin: 0 auto;
        padding: 1.6rem 1.5rem 5rem;
      }
      header {
        margin: 0 0 1.6rem 8rem;
      }
      .title {
        font-family: var(--font-text);
        font-size: 1.9rem;
        font-weight: 600;
        line-height: 1.2;
        color: var(--ink);
        border: none;
        background: transparent;
        width: 100%;
        padding: 0;
        margin: 0;
        resize: none;
        field-sizing: content;
      }
      .title:focus {
        outline: none;
        box-shadow: 0 2px 0 var(--accent-soft);
      }
      .byline {
        font-family: var(--font-text);
        color: var(--ink-soft);
        margin-top: 0.3rem;
      }
      .caution {
        margin-top: 1rem;
        padding: 0.55rem 0.8rem;
        border-left: 3px solid var(--upstream);
        background: var(--upstream-soft);
        font-size: 0.9rem;
        line-height: 1.45;
      }
      .caution b {
        font-size: 0.72rem;
        letter-spacing: 0.08em;
        text-transform: uppercase;
        color: var(--upstream);
        margin-right: 0.4rem;
      }
      .cell {
        display: grid;
        grid-template-columns: 7rem 1fr;
        column-gap: 1rem;
        padding: 0.7rem 0;
        border-top: 1px solid var(--rule);
        position: relative;
      }
      .margin {
        text-align: right;
        padding-top: 0.15rem;
        font-size: 0.78rem;
        line-height: 1.3;
        border-right: 3px solid transparent;
        padding-right: 0.7rem;
        min-height: 1.6rem;
      }
      .cell.error .margin {
        border-right-color: var(--error);
      }
      .cell.upstream .margin {
        border-right-color: var(--upstream);
      }
      .cell.pending .margin {
        border-right-color: var(--pending);
      }
      .kind {
        font-size: 0.66rem;
        letter-spacing: 0.1em;
        text-transform: uppercase;
        color: var(--muted);
      }
      .name {
        display: block;
        font-family: var(--font-code);
        font-size: 0.8rem;
        color: var(--ink);
        overflow-wrap: anywhere;
        background: none;
        border: none;
        padding: 0;
        cursor: text;
        text-align: right;
        width: 100%;
      }
      .name:hover {
        color: var(--accent);
      }
      .name-input {
        font-family: var(--font-code);
        font-size: 0.8rem;
        width: 100%;
        box-sizing: border-box;
        text-align: right;
      }
      .state-word {
        display: block;
        margin-top: 0.2rem;
        font-size: 0.72rem;
      }
      .cell.error .state-word {
        color: var(--error);
      }
      .cell.upstream .state-word {
        color: var(--upstream);
      }
      .cell.pending .state-word {
        color: var(--pending);
      }
      .body {
        min-width: 0;
      }
      .tools {
        display: flex;
        justify-content: flex-end;
        gap: 0.2rem;
        margin-top: 0.4rem;
        opacity: 0;
        transition: opacity 0.12s;
      }
      .tools button {
        padding: 0 0.35rem;
        line-height: 1.25rem;
        font-size: 0.72rem;
      }
      .insert {
        position: absolute;
        left: 8rem;
        bottom: -0.75rem;
        z-index: 2;
        display: flex;
        gap: 0.3rem;
        opacity: 0;
        transition: opacity 0.12s;
      }
      .insert button {
        font-size: 0.72rem;
        padding: 0 0.4rem;
        line-height: 1.25rem;
        background: var(--paper);
      }
      .cell:hover .tools,
      .cell:focus-within .tools,
      .cell:hover .insert,
      .cell:focus-within .insert {
        opacity: 1;
      }
      .inert pre {
        font-family: var(--font-code);
        font-size: 0.82rem;
        color: var(--ink-soft);
        white-space: pre-wrap;
        margin: 0;
      }
      .add {
        display: flex;
        gap: 0.4rem;
        margin: 0.2rem 0 0 8rem;
        padding-top: 0.6rem;
        border-top: 1px solid var(--rule);
      }
      .add span {
        color: var(--muted);
        font-size: 0.8rem;
        align-self: center;
        margin-right: 0.3rem;
      }
      @media (max-width: 720px) {
        header,
        .add {
          margin-left: 0;
        }
        .cell {
          grid-template-columns: 1fr;
        }
        .margin {
          text-align: left;
          border-right: none;
          border-left: 3px solid transparent;
          padding: 0 0 0.3rem 0.5rem;
        }
      }
      @media print {
        :host {
          background: white;
        }
        .bar,
        .tools,
        .insert,
        .add,
        .banner {
          display: none;
        }
        main {
          max-width: none;
          padding: 0;
        }
        .cell {
          break-inside: avoid;
        }
      }
    `,
  ];

  override render() {
    if (!this.doc) return html`<main>Loading…</main>`;
    const fields = headerFields(this.doc);
    const catalogue = this.bridge.catalogue();
    return html`
      <nav class="bar" aria-label="Document">
        <span class="mark">FURROW</span>
        <button @click=${() => this.newDocument()} title="Start an empty document">New</button>
        <button @click=${() => void this.openFile()} title="Open a .furrow document">Open…</button>
        <button @click=${() => void this.saveFile()} title="Save as a .furrow file (Ctrl+S)">Save</button>
        <button @click=${() => void this.attachCsv()} title="Attach a CSV file that a table of this document reads">Attach CSV…</button>
        ${this.samples.size > 0
          ? html`<select
              aria-label="Open a sample"
              @change=${(e: Event) => {
                const s = e.target as HTMLSelectElement;
                if (s.value) this.openSample(s.value);
                s.value = '';
              }}
            >
              <option value="">Samples…</option>
              ${[...this.samples.keys()].map((k) => html`<option value=${k}>${k.replace(/\.furrow$/, '')}</option>`)}
            </select>`
          : nothing}
        <span class="sep"></span>
        <button @click=${this.onUndo} ?disabled=${!this.store.canUndo} title="Undo (Ctrl+Z)">Undo</button>
        <button @click=${this.onRedo} ?disabled=${!this.store.canRedo} title="Redo (Ctrl+Shift+Z)">Redo</button>
        <span class="status" role="status" aria-live="polite">${this.summary()}</span>
      </nav>
      ${this.banner
        ? html`<div class="banner ${this.banner.kind}" role=${this.banner.kind === 'problem' ? 'alert' : 'status'}>
            <span>${this.banner.text}</span><button @click=${() => (this.banner = null)} aria-label="Dismiss">✕</button>
          </div>`
        : nothing}
      <main>
        <header>
          <textarea
            class="title"
            rows="1"
            aria-label="Title"
            .value=${documentTitle(this.doc)}
            @change=${(e: Event) => this.setTitle((e.target as HTMLTextAreaElement).value)}
            @keydown=${(e: KeyboardEvent) => {
              if (e.key === 'Enter') {
                e.preventDefault();
                (e.target as HTMLTextAreaElement).blur();
              }
            }}
          ></textarea>
          ${fields.get('author') ? html`<div class="byline">${fields.get('author')}</div>` : nothing}
          ${fields.get('caution') ? html`<div class="caution" role="note"><b>Caution</b>${fields.get('caution')}</div>` : nothing}
        </header>
        ${repeat(
          this.doc.cells,
          (c) => c.id,
          (c, i) => this.renderCell(c, i, catalogue),
        )}
        <div class="add">
          <span>Add</span>
          ${ADDABLE.map((k) => html`<button @click=${() => this.addCell(k, this.doc.cells.length)}>+ ${k.label}</button>`)}
        </div>
      </main>
    `;
  }

  private renderCell(cell: Cell, index: number, catalogue: ReturnType<EvaluationBridge['catalogue']>) {
    const word = markerKind(cell.marker);
    const kind = CELL_KINDS.get(word);
    const state = this.drawState(cell);
    const status = state?.status ?? 'pending';
    const view = CELL_VIEWS.get(word);
    const name = CELL_KINDS.nameOf(cell);
    const upstreamName = status === 'upstream' ? (state?.error?.upstream ?? null) : null;
    return html`<section class="cell ${status}" data-cell=${cell.id} data-kind=${word} data-name=${name ?? ''} data-status=${status} aria-label="${word} ${name ?? ''}">
      <div class="margin">
        <span class="kind">${kind?.label ?? (word || 'cell')}</span>
        ${kind === undefined || (kind.rename === undefined && name === null)
          ? nothing
          : kind.rename === undefined
          ? html`<span class="name" title="Rename it in the cell itself">${name ?? '(unnamed)'}</span>`
          : this.renaming === cell.id
            ? html`<input
                class="name-input"
                aria-label="New name"
                .value=${name ?? ''}
                @keydown=${(e: KeyboardEvent) => {
                  if (e.key === 'Enter') this.rename(cell, (e.target as HTMLInputElement).value.trim());
                  if (e.key === 'Escape') this.renaming = null;
                }}
                @blur=${(e: Event) => this.rename(cell, (e.target as HTMLInputElement).value.trim())}
              />`
            : html`<button class="name" title="Rename" @click=${() => this.startRename(cell.id)}>${name ?? '(unnamed)'}</button>`}
        ${STATUS_WORDS[status]
          ? html`<span class="state-word" title=${state?.error?.message ?? ''}>${STATUS_WORDS[status]}${upstreamName ? html`: <code>${upstreamName}</code>` : nothing}</span>`
          : nothing}
        <span class="tools" role="toolbar" aria-label="Cell tools">
          <button title="Move up" aria-label="Move up" ?disabled=${index === 0} @click=${() => this.moveCell(cell, -1)}>↑</button>
          <button title="Move down" aria-label="Move down" ?disabled=${index === this.doc.cells.length - 1} @click=${() => this.moveCell(cell, 1)}>↓</button>
          <button title="Delete this cell (undo brings it back)" aria-label="Delete" @click=${() => this.deleteCell(cell)}>✕</button>
        </span>
      </div>
      <div class="body">
        ${view ? view(cell, state, catalogue) : html`<div class="inert"><pre>--- ${cell.marker}\n${cell.body}</pre></div>`}
      </div>
      <div class="insert" role="toolbar" aria-label="Add a cell below">
        ${ADDABLE.map((k) => html`<button title="Add a ${k.label} below" @click=${() => this.addCell(k, index + 1)}>+ ${k.label}</button>`)}
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

/** The ids of cells whose text differs between two versions of a document. */
function changedCells(before: Document, after: Document): string[] {
  const old = new Map(before.cells.map((c) => [c.id, c]));
  const out: string[] = [];
  for (const c of after.cells) {
    const o = old.get(c.id);
    if (o === undefined || o.body !== c.body || o.marker !== c.marker) out.push(c.id);
  }
  // cells that read a deleted cell's name change too: the bridge follows readers from these
  for (const c of before.cells) if (!after.cells.some((a) => a.id === c.id)) out.push(c.id);
  return out;
}

if (!customElements.get('furrow-app')) customElements.define('furrow-app', FurrowApp);

