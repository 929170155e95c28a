/**
 * The table cell's view, `<furrow-table-cell>`: the table's name and size, and its CSV body
 * as a grid to move around, type into, paste into and copy from.
 *
 * The view never changes the document: every change is a `body` (or `marker`) edit sent
 * with emitEdit. It keeps the grid it read (cells/table/grid-model.ts) and reads the body
 * again only when a different body arrives (undo, another view); its own edits come back
 * as the very text it sent and are recognised. A body that does not read as a table is
 * shown as its text with the reason, so that nothing is lost; a table read from a CSV file
 * is shown read-only from its value.
 *
 * The element composes parts with one job each, which see it through GridHost
 * (grid-host.ts):
 *   grid-rows.ts       which rows are drawn (the shared row-window model), scrolling to a row
 *   grid-selection.ts  selecting with the pointer
 *   grid-editor.ts     the field editor (typing, committing, flushing when the page goes)
 *   grid-clipboard.ts  copy, cut and paste (with a first row of names into a new table)
 *   grid-commands.ts   the grid's keys and commands
 *   grid-toolbar.ts    the bar above: name, size, Save CSV, tools, import, grid or text
 *   grid-text.ts       the body as CSV text
 *   grid-sheet.ts      the grid's templates
 */
import { LitElement, html, nothing, type PropertyValues, type TemplateResult } from 'lit';
import { shared } from '../../src/views/theme.ts';
import { CsvError } from '../../src/doc/csv-error.ts';
import type { Cell } from '../../src/doc/document.ts';
import { spliceOf, type Edit } from '../../src/doc/edits.ts';
import { settleText } from '../../src/doc/settle-text.ts';
import { afterHeldDrawing, drawingHeld } from '../../src/views/draw-gate.ts';
import { isTable, type Table } from '../../src/lang/values.ts';
import { emitEdit, type CellViewState, type NameCatalogue } from '../view-api.ts';
import { tableMarker } from './model.ts';
import { GridClipboard } from './grid-clipboard.ts';
import { GridCommands } from './grid-commands.ts';
import { GridEditor } from './grid-editor.ts';
import type { EditorState, Shown, StatusLine } from './grid-host.ts';
import { HEADER_ROW, at, clampSelection, type GridCommand, type Selection } from './grid-keys.ts';
import { columnWidths, widenForRows } from './grid-layout.ts';
import { gridMsg } from '../../src/messages/grid.ts';
import { readBodyGrid, sourceOfBody, sourceOfTable, type BodyGrid } from './grid-model.ts';
import { GridRows } from './grid-rows.ts';
import { GridSelection } from './grid-selection.ts';
import { renderSheet } from './grid-sheet.ts';
import { GridText, type TextHost } from './grid-text.ts';
import { GridToolbar } from './grid-toolbar.ts';
import { tableCellStyles } from './view-styles.ts';

/** `<furrow-table-cell>`: a table cell as a grid. Properties `cell`, `state`, `catalogue`. */
export class TableCellView extends LitElement implements TextHost {
  static override properties = {
    cell: { attribute: false },
    state: { attribute: false },
    catalogue: { attribute: false },
    sel: { state: true },
    editor: { state: true },
    status: { state: true },
    nameProblem: { state: true },
    textPinned: { state: true },
    printing: { state: true },
  };

  static override styles = [shared, tableCellStyles];

  declare cell: Cell;
  declare state: CellViewState | null;
  declare catalogue: NameCatalogue;
  declare sel: Selection;
  declare editor: EditorState | null;
  declare status: StatusLine | null;
  declare nameProblem: string | null;
  /** The CSV text stays on screen (the user asked for it, or is mending it). */
  declare textPinned: boolean;
  declare printing: boolean;

  /** The grid of the body (null for a file table or a body that does not read). */
  grid: BodyGrid | null = null;
  /** Why the body does not read as a table. */
  gridError: CsvError | null = null;
  /** The body text that `grid` or `gridError` came from. */
  readBody: string | null = null;
  /**
   * The last splice this view sent, the document body it was cut into and the body the view
   * made of it: the cell that comes back made by exactly that splice of exactly that body
   * holds that text, so it is taken without comparing two long texts character by character.
   */
  private sentSplice: { readonly edit: Edit; readonly base: string } | null = null;
  private cellId: string | null = null;
  private sourceCache: { key: BodyGrid | Table; source: Shown['source']; widths: number[] } | null = null;

  private readonly rows = new GridRows(this);
  private readonly fieldEditor = new GridEditor(this, this.rows);
  private readonly selection = new GridSelection(this, this.fieldEditor);
  private readonly clipboard = new GridClipboard(this);
  private readonly commands = new GridCommands(this, this.fieldEditor, this.rows);
  private readonly toolbar = new GridToolbar(this);
  private readonly text = new GridText(this);

  constructor() {
    super();
    this.state = null;
    this.catalogue = { builtins: [], cells: [] };
    this.sel = at(0, 0);
    this.editor = null;
    this.status = null;
    this.nameProblem = null;
    this.textPinned = false;
    this.printing = false;
  }

  // ---- what is shown ------------------------------------------------------------------

  get file(): string | null {
    return this.cell ? tableMarker(this.cell).file : null;
  }

  get tableName(): string | null {
    return this.cell ? tableMarker(this.cell).name : null;
  }

  get readOnly(): boolean {
    return this.file !== null;
  }

  /** The fields on screen, with column widths, kept while the grid or value is the same. */
  get shown(): Shown | null {
    let key: BodyGrid | Table | null = null;
    if (this.file === null) key = this.grid;
    else {
      const v = this.state?.value ?? null;
      key = v !== null && isTable(v) ? v : null;
    }
    if (key === null) return null;
    if (this.sourceCache?.key !== key) {
      const source = 'kind' in key ? sourceOfTable(key) : sourceOfBody(key);
      // widths follow the columns, not each edit: keep them while the header stays
      const old = this.sourceCache;
      const sameColumns =
        old !== null && old.source.header.length === source.header.length && old.source.header.every((h, i) => h === source.header[i]);
      // rows typed over: only they can widen a column (the sample of rows stays the same)
      const rows = 'kind' in key ? undefined : key.change?.of === old?.key ? key.change?.rows : undefined;
      const widths =
        sameColumns && rows !== undefined && rows.count === rows.to - rows.from
          ? widenForRows(old.widths, source, rows.from, rows.to)
          : sameColumns
            ? columnWidths(source).map((w, i) => Math.max(w, old.widths[i] ?? 0))
            : columnWidths(source);
      this.sourceCache = { key, source, widths };
    }
    return this.sourceCache;
  }

  get extent(): { rows: number; cols: number } {
    const s = this.shown?.source;
    return { rows: s?.rowCount ?? 0, cols: s?.header.length ?? 0 };
  }

  // ---- keeping in step with the document ------------------------------------------------

  override willUpdate(changed: PropertyValues): void {
    if (changed.has('cell') && this.cell) this.takeCell();
    if (changed.has('cell') || changed.has('state')) {
      const e = this.extent;
      if (e.cols > 0) this.sel = clampSelection(this.sel, e);
    }
  }

  /** Reads a new cell: keeps the grid when the body is the one this view shows. */
  private takeCell(): void {
    const cell = this.cell;
    if (cell.id !== this.cellId) {
      this.cellId = cell.id;
      this.grid = null;
      this.gridError = null;
      this.readBody = null;
      this.editor = null;
      this.sel = at(0, 0);
      this.textPinned = false;
    }
    if (tableMarker(cell).file !== null) {
      this.grid = null;
      this.gridError = null;
      this.readBody = null;
      return;
    }
    // The store applies each edit at once and the shell hands bodies back in order, so a
    // body this view sent comes back as the one it shows; any other body (undo, another
    // view) is read afresh.
    const body = cell.body;
    const sent = this.sentSplice;
    this.sentSplice = null;
    const made = sent === null ? undefined : spliceOf(cell);
    // `made.base === sent.base`: one string, the document's, in the usual case (a pointer test)
    if (sent !== null && made !== undefined && made.edit === sent.edit && made.base === sent.base && this.readBody !== null) {
      // the body is the text this view spliced itself (the store cut the same text the same
      // way): keep the document's own string for the next comparisons, and as the grid's
      // text, so that the next edit makes one string of the body (its own and the
      // document's were two equal 1 MB texts in a 100,000-row table, each built afresh)
      this.readBody = body;
      if (this.grid !== null && this.grid.text.length === body.length) {
        const same = { ...this.grid, text: body };
        // the same rows: the fields shown and their widths stay the old grid's
        if (this.sourceCache?.key === this.grid) this.sourceCache = { ...this.sourceCache, key: same };
        this.grid = same;
      }
      return;
    }
    if (body === this.readBody) {
      // the same text: keep the document's own string, so that later checks against the
      // document's body compare one string with itself, not a long text character by character
      this.readBody = body;
      return;
    }
    this.read(body);
    if (this.editor !== null && !this.grid) this.editor = null;
  }

  read(body: string): void {
    this.readBody = body;
    try {
      this.grid = readBodyGrid(body);
      this.gridError = null;
    } catch (err) {
      if (!(err instanceof CsvError)) throw err;
      this.grid = null;
      this.gridError = err;
    }
  }

  commit(next: BodyGrid, mergeKey?: string, withAnswer = false): void {
    const before = this.grid;
    const c = next.change;
    // a change made from the grid shown changes its text (setField gives the same grid back
    // when it would not); any other grid is compared
    if (next === before || (c?.of !== before && next.text === this.readBody)) return;
    // a change of some rows of the body the document holds travels as that change alone
    const spliced = c !== undefined && before !== null && c.of === before && this.readBody === this.cell.body;
    const base = this.cell.body;
    this.grid = next;
    this.gridError = null;
    this.readBody = next.text;
    const edit: Edit = spliced ? { type: 'splice', id: this.cell.id, from: c.from, to: c.to, text: c.text } : { type: 'body', id: this.cell.id, body: next.text };
    this.sentSplice = spliced ? { edit, base } : null;
    emitEdit(this, edit, mergeKey, withAnswer);
    this.requestUpdate();
  }

  send(edit: Edit, mergeKey?: string): void {
    emitEdit(this, edit, mergeKey);
  }

  /** Draws when the page's drawing is free (src/views/draw-gate.ts). */
  protected override scheduleUpdate(): void | Promise<unknown> {
    return afterHeldDrawing(() => super.scheduleUpdate());
  }

  say(kind: StatusLine['kind'], text: string): void {
    this.status = { kind, text };
  }

  select(next: Selection): void {
    this.sel = next;
    this.rows.revealAfterUpdate();
  }

  focusGrid(): void {
    // While drawing is held the grid takes the focus once drawn: moving it now is a change
    // of the page that the browser would draw before the worker's answer could join it.
    // A key that comes meanwhile ends the hold (grid-editor.ts).
    if (drawingHeld() !== null) {
      this.focusOnDraw = true;
      this.requestUpdate();
      return;
    }
    this.renderRoot.querySelector<HTMLElement>('.scroller')?.focus({ preventScroll: true });
  }

  /** The grid takes the focus after the next draw (focusGrid while drawing is held). */
  private focusOnDraw = false;

  drawNow(): void {
    this.performUpdate();
  }

  /** Runs a grid command (from a key or a button). */
  run(cmd: GridCommand): void {
    this.commands.run(cmd);
  }

  /** Pastes text at the selection (what a paste event does; public for tests and the shell). */
  pasteText(text: string): void {
    this.clipboard.paste(text);
  }

  /** Replaces the body with a CSV file's text when it reads as a table; says why when not. */
  importFile(f: Blob & { readonly name?: string }): Promise<void> {
    return this.toolbar.importFile(f);
  }

  // ---- rendering ----------------------------------------------------------------------------

  /** The CSV text is drawn in place of the grid (the body does not read, or the user asked). */
  private showsText(): boolean {
    return this.file === null && (this.gridError !== null || this.textPinned);
  }

  /** The next draw draws the grid. */
  private drawsGrid(): boolean {
    return !this.showsText() && this.shown !== null;
  }

  override render(): TemplateResult | typeof nothing {
    if (!this.cell) return nothing;
    const file = this.file;
    const shown = this.shown;
    const showText = this.showsText();
    return html`
      ${this.toolbar.render(shown?.source ?? null, showText)}
      ${this.nameProblem !== null ? html`<p class="line problem" role="alert">${this.nameProblem}</p>` : nothing}
      ${file !== null ? html`<p class="line file">${gridMsg.fileLine(file)}</p>` : nothing}
      ${this.renderStateLine()}
      ${showText ? this.text.render() : shown !== null ? this.renderGrid(shown) : this.renderNoGrid()}
      <p class="status ${this.status?.kind ?? ''}" role="status" aria-live="polite">${this.status?.text ?? ''}</p>
      ${this.clipboard.renderOffer()}
    `;
  }

  private renderGrid(shown: Shown): TemplateResult {
    // the window first: the editor is laid over a row of it
    const window = this.rows.window();
    const ed = this.editor;
    const editor = ed !== null ? this.fieldEditor.render(ed) : null;
    const onName = ed !== null && ed.pos.r === HEADER_ROW;
    return renderSheet(
      {
        source: shown.source,
        widths: shown.widths,
        sel: this.sel,
        tableName: this.tableName,
        readOnly: this.readOnly,
        window,
        bodyHeight: this.rows.bodyHeight(),
        nameEditor: onName ? editor : null,
        fieldEditor: onName ? null : editor,
      },
      {
        onKey: this.commands.onKey,
        onCopy: this.clipboard.onCopy,
        onCut: this.clipboard.onCut,
        onPaste: this.clipboard.onPaste,
        onScroll: this.rows.onScroll,
        onPointerDown: this.selection.onPointerDown,
        onPointerMove: this.selection.onPointerMove,
        onDoubleClick: this.selection.onDoubleClick,
      },
    );
  }

  /**
   * What the engine reports that the grid does not show itself (a table without a name, a
   * missing file), and its warnings. Not while it recomputes: the report may be stale.
   */
  private renderStateLine(): TemplateResult | typeof nothing {
    const s = this.state;
    if (!s || s.status === 'pending') return nothing;
    const lines: TemplateResult[] = [];
    const err = s.error;
    // the body's own reading problem is shown with its text already
    if (err && !(this.file === null && (this.gridError !== null || err.to > err.from))) lines.push(html`<p class="line problem">${err.message}</p>`);
    for (const w of s.warnings) lines.push(html`<p class="line">${w}</p>`);
    return lines.length > 0 ? html`${lines}` : nothing;
  }

  private renderNoGrid(): TemplateResult {
    const file = this.file;
    if (file !== null && !this.state?.error) return html`<p class="line">${gridMsg.fileReading(file)}</p>`;
    return html``;
  }

  protected override update(changed: PropertyValues): void {
    // The grid takes the focus before the draw takes the field editor away: a focused
    // element taken out of the page costs the browser a layout of its own (measured in the
    // 200-cell document of the browser tests: 1.2 ms for focus, removal and layout in this
    // order, 2.1 ms the other way round). Only when this draw keeps the grid that is there.
    if (this.focusOnDraw && this.drawsGrid() && this.renderRoot.querySelector('.scroller') !== null) this.takeFocusOnDraw();
    super.update(changed);
  }

  override updated(changed: PropertyValues): void {
    super.updated(changed);
    this.fieldEditor.afterUpdate(changed);
    this.text.afterUpdate();
    if (this.focusOnDraw) this.takeFocusOnDraw();
    // An edit's result is drawn: once that frame is painted, the body the edit spliced is
    // made whole, so that the next keystroke does not pay for it (src/doc/settle-text.ts).
    // (The grid is the token, not its text: `!==` between two long texts compares their
    // characters, and would itself make the new one whole.)
    const grid = this.grid;
    if (changed.has('state') && grid !== null && grid !== this.settledGrid) {
      this.settledGrid = grid;
      requestAnimationFrame(() => setTimeout(() => settleText(grid.text), 0));
    }
  }

  /** The grid whose text was last made whole. */
  private settledGrid: BodyGrid | null = null;

  /** The focus asked for while drawing was held (focusGrid) moves to the grid, if it is drawn. */
  private takeFocusOnDraw(): void {
    this.focusOnDraw = false;
    // unless a key typed meanwhile opened the editor again, which has the focus now, or
    // the user put the focus somewhere else on the page meanwhile
    if (this.editor === null && focusIsNowhereOrIn(this)) this.renderRoot.querySelector<HTMLElement>('.scroller')?.focus({ preventScroll: true });
  }
}

/**
 * True when the page's focus is on nothing (the body: the field editor that had it was taken
 * away) or inside `view`, looking through shadow roots.
 */
function focusIsNowhereOrIn(view: HTMLElement): boolean {
  let active: Element | null = document.activeElement;
  while (active !== null && active !== view && active.shadowRoot?.activeElement) active = active.shadowRoot.activeElement;
  return active === null || active === document.body || active === view || view.shadowRoot?.contains(active) === true;
}

if (!customElements.get('furrow-table-cell')) customElements.define('furrow-table-cell', TableCellView);

declare global {
  interface HTMLElementTagNameMap {
    'furrow-table-cell': TableCellView;
  }
}
