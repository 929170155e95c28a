/**
 * The table cell's view, `<furrow-table-cell>`: the table's name and size, and its CSV body
 * as a grid to move around, type into, paste into and copy from.
 *
 * The view never changes the document: every change is a `body` (or `marker`) edit sent
 * with emitEdit. It keeps the grid it read (cells/table/grid-model.ts) and reads the body
 * again only when a different body arrives (undo, another view); its own edits come back
 * as the very text it sent and are recognised. Only the rows in the window are drawn
 * (fixed row height, a spacer for the rest), and one text field, laid over the field being
 * edited, does all the editing.
 *
 * A body that does not read as a table is shown as its text with the reason, so that
 * nothing is lost; a table read from a CSV file is shown read-only from its value.
 */
import { LitElement, html, nothing, type PropertyValues, type TemplateResult } from 'lit';
import { shared } from '../../src/views/theme.ts';
import { CsvError } from '../../src/doc/csv.ts';
import { decodeUtf8 } from '../../src/doc/utf8.ts';
import { freshBody, visibleBody, type Cell } from '../../src/doc/document.ts';
import { tableMarker, writeTableMarker } from './model.ts';
import type { Edit } from '../../src/doc/edits.ts';
import { isPlainName } from '../../src/lang/lexer.ts';
import { isTable, type Table } from '../../src/lang/values.ts';
import { FLUSH_EVENT, emitEdit, type CellViewState, type NameCatalogue } from '../view-api.ts';
import { columnReading, fieldProblem, holdsNumbers, markedCount, tableNameProblem } from './grid-checks.ts';
import {
  HEADER_ROW,
  SHAPE_KEYS,
  at,
  clampSelection,
  commandForKey,
  editorCommandForKey,
  enterMove,
  inRect,
  moveSelection,
  selectTo,
  selectionRect,
  tabMove,
  type EditMode,
  type GridCommand,
  type KeyInput,
  type Pos,
  type Selection,
} from './grid-keys.ts';
import { ROW_HEIGHT, columnWidths, oneLine, rowNumberWidth, scrollToShowRow, visibleRows } from './grid-layout.ts';
import { gridMsg } from './grid-messages.ts';
import {
  bodyOfText,
  clearRect,
  deleteColumns,
  deleteRows,
  fieldsIn,
  insertColumns,
  insertRows,
  isRefusal,
  pasteBlock,
  readBodyGrid,
  renameColumn,
  setField,
  sourceOfBody,
  sourceOfTable,
  type BodyGrid,
  type FieldSource,
} from './grid-model.ts';
import { blockToTsv, readBlock } from './grid-paste.ts';
import { tableCellStyles } from './view-styles.ts';
import { tableCsv } from '../../src/doc/table-csv.ts';
import { downloadCsv, fileNameFor } from '../../src/views/download.ts';

/** Rows laid out in full when the page is printed. */
const PRINT_LIMIT = 2000;
/** The largest CSV file the import reads. */
const IMPORT_LIMIT_MB = 64;

interface EditorState {
  readonly pos: Pos;
  readonly mode: EditMode;
  /** The text the editor opens with. */
  readonly initial: string;
  readonly left: number;
  readonly top: number;
  readonly width: number;
  readonly height: number;
  readonly problem: string | null;
}

interface StatusLine {
  readonly kind: 'info' | 'problem';
  readonly text: string;
}

function keyInput(e: KeyboardEvent): KeyInput {
  return { key: e.key, code: e.code, shift: e.shiftKey, alt: e.altKey, mod: e.ctrlKey || e.metaKey, composing: e.isComposing };
}

/** `<furrow-table-cell>`: a table cell as a grid. Properties `cell`, `state`, `catalogue`. */
export class TableCellView extends LitElement {
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
  private grid: BodyGrid | null = null;
  /** Why the body does not read as a table. */
  private gridError: CsvError | null = null;
  /** The body text that `grid` or `gridError` came from. */
  private readBody: string | null = null;
  private cellId: string | null = null;
  private sourceCache: { key: BodyGrid | Table; source: FieldSource; widths: number[] } | null = null;
  private viewTop = 0;
  private windowHeight = 0;
  private drawn = { first: 0, last: 0 };
  private scrollPending = false;
  private dragging = false;
  private resizeObserver: ResizeObserver | null = null;

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

  override connectedCallback(): void {
    super.connectedCallback();
    window.addEventListener('beforeprint', this.onBeforePrint);
    window.addEventListener('afterprint', this.onAfterPrint);
    window.addEventListener('pointerup', this.onPointerUp);
    window.addEventListener(FLUSH_EVENT, this.onFlush);
  }

  /** The table as it reads now, if it reads as one. */
  private savable(): Table | null {
    const v = this.state?.value;
    return v !== null && v !== undefined && typeof v === 'object' && v.kind === 'table' ? v : null;
  }

  private saveCsv(): void {
    const t = this.savable();
    if (t !== null) downloadCsv(fileNameFor(tableMarker(this.cell).name, 'csv'), tableCsv(t));
  }

  /** The page goes away: a field being typed is committed, as leaving it would. */
  private readonly onFlush = (): void => {
    if (this.editor !== null) this.finishEdit(this.renderRoot.querySelector<HTMLTextAreaElement>('textarea.editor')?.value ?? '', true);
  };

  override disconnectedCallback(): void {
    super.disconnectedCallback();
    window.removeEventListener('beforeprint', this.onBeforePrint);
    window.removeEventListener('afterprint', this.onAfterPrint);
    window.removeEventListener('pointerup', this.onPointerUp);
    window.removeEventListener(FLUSH_EVENT, this.onFlush);
    this.resizeObserver?.disconnect();
    this.resizeObserver = null;
  }

  private readonly onBeforePrint = (): void => {
    this.printing = true;
  };
  private readonly onAfterPrint = (): void => {
    this.printing = false;
  };
  private readonly onPointerUp = (): void => {
    this.dragging = false;
  };

  // ---- what is shown ------------------------------------------------------------------

  /** The CSV file a table reads, or null for a table with a body. */
  private get file(): string | null {
    return this.cell ? tableMarker(this.cell).file : null;
  }

  private get tableName(): string | null {
    return this.cell ? tableMarker(this.cell).name : null;
  }

  private get readOnly(): boolean {
    return this.file !== null;
  }

  /** The fields on screen, with column widths, kept while the grid or value is the same. */
  private get shown(): { source: FieldSource; widths: number[] } | null {
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
      const fresh = columnWidths(source);
      const sameColumns =
        old !== null && old.source.header.length === source.header.length && old.source.header.every((h, i) => h === source.header[i]);
      const widths = sameColumns ? fresh.map((w, i) => Math.max(w, old.widths[i] ?? 0)) : fresh;
      this.sourceCache = { key, source, widths };
    }
    return this.sourceCache;
  }

  private get extent(): { rows: number; cols: number } {
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
    if (body === this.readBody) return;
    this.read(body);
    if (this.editor !== null && !this.grid) this.editor = null;
  }

  private read(body: string): void {
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

  /** Sends a body edit for a grid this view made, and shows that grid at once. */
  private commit(next: BodyGrid, mergeKey?: string): void {
    if (next === this.grid || next.text === this.readBody) return;
    this.grid = next;
    this.gridError = null;
    this.readBody = next.text;
    this.send({ type: 'body', id: this.cell.id, body: next.text }, mergeKey);
    this.requestUpdate();
  }

  private send(edit: Edit, mergeKey?: string): void {
    emitEdit(this, edit, mergeKey);
  }

  private say(kind: StatusLine['kind'], text: string): void {
    this.status = { kind, text };
  }

  // ---- rendering ----------------------------------------------------------------------------

  override render(): TemplateResult | typeof nothing {
    if (!this.cell) return nothing;
    const file = this.file;
    const shown = this.shown;
    const showText = file === null && (this.gridError !== null || this.textPinned);
    return html`
      ${this.renderTop(shown?.source ?? null, showText)}
      ${this.nameProblem !== null ? html`<p class="line problem" role="alert">${this.nameProblem}</p>` : nothing}
      ${file !== null ? html`<p class="line file">${gridMsg.fileLine(file)}</p>` : nothing}
      ${this.renderStateLine()}
      ${showText ? this.renderText() : shown !== null ? this.renderGrid(shown.source, shown.widths) : this.renderNoGrid()}
      <p class="status ${this.status?.kind ?? ''}" role="status" aria-live="polite">${this.status?.text ?? ''}</p>
    `;
  }

  private renderTop(src: FieldSource | null, showText: boolean): TemplateResult {
    const name = this.tableName ?? '';
    const ro = this.readOnly;
    const noGrid = src === null || showText;
    return html`<div class="top">
      <input
        class="table-name"
        aria-label="Table name"
        spellcheck="false"
        autocomplete="off"
        .value=${name}
        aria-invalid=${this.nameProblem !== null ? 'true' : 'false'}
        @keydown=${this.onNameKey}
        @input=${() => {
          if (this.nameProblem !== null) this.nameProblem = null;
        }}
        @blur=${this.onNameBlur}
      />
      ${src !== null && !showText ? html`<span class="counts num">${gridMsg.counts(src.rowCount, src.header.length)}</span>` : nothing}
      ${this.savable() === null
        ? nothing
        : html`<button class="save-csv" title="Save the table as it reads now as a CSV file" @click=${() => this.saveCsv()}>Save CSV</button>`}
      ${ro ? nothing : html`<span class="tools" role="toolbar" aria-label="Table tools">
        <button ?disabled=${noGrid} title="Add a row below the selection (${SHAPE_KEYS.rowBelow}; ${SHAPE_KEYS.rowAbove} adds one above)" @click=${() => this.run({ kind: 'insert-row', below: true })}>Add row</button>
        <button ?disabled=${noGrid} title="Add a column right of the selection (${SHAPE_KEYS.columnRight}; ${SHAPE_KEYS.columnLeft} adds one left)" @click=${() => this.run({ kind: 'insert-column', right: true })}>Add column</button>
        <button ?disabled=${noGrid} title="Delete the rows the selection covers (${SHAPE_KEYS.deleteRows})" @click=${() => this.run({ kind: 'delete-rows' })}>Delete rows</button>
        <button ?disabled=${noGrid} title="Delete the columns the selection covers (${SHAPE_KEYS.deleteColumns})" @click=${() => this.run({ kind: 'delete-columns' })}>Delete columns</button>
        <button title="Replace the table with the rows of a CSV file (header row first)" @click=${this.chooseFile}>Import CSV…</button>
        <button
          title=${showText ? 'Show the table as a grid' : 'Show and edit the table as CSV text'}
          ?disabled=${showText && this.gridError !== null}
          @click=${this.toggleText}
        >${showText ? 'Grid' : 'CSV text'}</button>
      </span>
      <input class="file-input" type="file" accept=".csv,text/csv,text/plain" tabindex="-1" aria-hidden="true" @change=${this.onFileChosen} />`}
    </div>`;
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

  private renderText(): TemplateResult {
    const err = this.gridError;
    const body = this.readBody ?? this.cell.body;
    let intro: TemplateResult;
    if (err !== null) {
      const row = body.slice(err.from, err.to);
      intro = html`<p class="line problem" role="alert">
        ${gridMsg.rawIntro(err.message)}
        ${row.trim() !== '' ? html`<br /><code>${row.length > 160 ? `${row.slice(0, 159)}…` : row}</code>` : nothing}
        ${err.to > err.from ? html`<button @click=${this.showErrorRow}>${gridMsg.rawRow()}</button>` : nothing}
      </p>`;
    } else {
      const g = this.grid;
      intro = html`<p class="line">${g ? gridMsg.rawReadsAgain(g.rows.length, g.header.length) : ''}</p>`;
    }
    const lines = body.replace(/(\r?\n)+$/, '').split('\n').length;
    return html`<div class="raw ${err !== null ? 'broken' : ''}">
      ${intro}
      <textarea
        class="raw-text"
        spellcheck="false"
        autocomplete="off"
        rows=${Math.min(24, Math.max(4, lines + 1))}
        aria-label="CSV text of table ${this.tableName ?? ''}"
        aria-invalid=${err !== null ? 'true' : 'false'}
        @input=${this.onTextInput}
        @keydown=${this.onTextKey}
      ></textarea>
    </div>`;
  }

  private renderGrid(src: FieldSource, widths: number[]): TemplateResult {
    const n = src.rowCount;
    const cols = src.header.length;
    const rect = selectionRect(this.sel);
    const focus = this.sel.focus;
    const numeric = src.header.map((_, c) => holdsNumbers(src.counts.filled[c] ?? 0, src.counts.numbers[c] ?? 0));
    // room for the line under each name (what the column reads as, how many are marked)
    const room = src.header.map((_, c) => {
      const marked = markedCount(src.counts, c);
      const label = columnReading(src.counts, c).length + (marked > 0 ? 3 + gridMsg.notNumbersCount(marked).length : 0);
      return Math.ceil(label * 0.8) + 2;
    });
    const template = `${rowNumberWidth(n)}ch ${widths.map((w, c) => `${Math.max(w, room[c]!)}ch`).join(' ')}`;
    const win = this.printing ? { first: 0, last: Math.min(n, PRINT_LIMIT) } : visibleRows(this.viewTop, this.windowHeight, n);
    this.drawn = win;
    const name = this.tableName ?? 'table';
    const ed = this.editor;
    const rows: TemplateResult[] = [];
    for (let r = win.first; r < win.last; r++) rows.push(this.renderRow(src, r, rect, focus, numeric));
    return html`<div
        class="scroller ${this.readOnly ? 'read-only' : ''}"
        tabindex="0"
        role="grid"
        aria-label="Fields of ${name}"
        aria-rowcount=${n + 1}
        aria-colcount=${cols + 1}
        aria-readonly=${this.readOnly ? 'true' : 'false'}
        aria-multiselectable="true"
        aria-activedescendant=${focus.r === HEADER_ROW ? `h-${focus.c}` : `f-${focus.r}-${focus.c}`}
        @keydown=${this.onGridKey}
        @copy=${this.onCopy}
        @cut=${this.onCut}
        @paste=${this.onPaste}
        @scroll=${this.onScroll}
        @pointerdown=${this.onPointerDown}
        @pointermove=${this.onPointerMove}
        @dblclick=${this.onDoubleClick}
      >
        <div class="sheet" style="--cols: ${template}">
          <div class="row head" role="row" aria-rowindex="1">
            <div class="corner" role="columnheader" data-r="-1" data-c="-1" title="Select the whole table"></div>
            ${src.header.map((h, c) => this.renderName(src, h, c, rect, focus, numeric[c]!))}
            ${ed !== null && ed.pos.r === HEADER_ROW ? this.renderEditor(ed) : nothing}
          </div>
          <div class="body" style="height: ${n * ROW_HEIGHT}px">
            <div class="rows" style="transform: translateY(${win.first * ROW_HEIGHT}px)">${rows}</div>
            ${ed !== null && ed.pos.r !== HEADER_ROW ? this.renderEditor(ed) : nothing}
          </div>
        </div>
      </div>
      ${n === 0 ? html`<p class="empty-rows">${gridMsg.noRows(SHAPE_KEYS.rowBelow)}</p>` : nothing}
      ${n > PRINT_LIMIT ? html`<p class="line print-only">${gridMsg.printLimit(PRINT_LIMIT, n)}</p>` : nothing}`;
  }

  private renderName(src: FieldSource, h: string, c: number, rect: ReturnType<typeof selectionRect>, focus: Pos, numeric: boolean): TemplateResult {
    const marked = markedCount(src.counts, c);
    const reading = columnReading(src.counts, c);
    const tips = [h, gridMsg.columnReads(reading)];
    if (marked > 0) tips.push(gridMsg.notNumbersTitle(marked, h));
    if (!isPlainName(h)) tips.push(gridMsg.notPlainColumn(this.tableName ?? 'table', h));
    const cls = `nm${numeric ? ' num' : ''}${inRect(rect, HEADER_ROW, c) ? ' in' : ''}${focus.r === HEADER_ROW && focus.c === c ? ' at' : ''}`;
    return html`<div class=${cls} role="columnheader" id="h-${c}" data-r="-1" data-c=${c} title=${tips.join('\n')} aria-selected=${inRect(rect, HEADER_ROW, c) ? 'true' : 'false'}>
      <span class="col-name">${h}</span>
      <span class="col-reads">${reading}${marked > 0 ? html` · <span class="bad-count">${gridMsg.notNumbersCount(marked)}</span>` : nothing}</span>
    </div>`;
  }

  private renderRow(src: FieldSource, r: number, rect: ReturnType<typeof selectionRect>, focus: Pos, numeric: readonly boolean[]): TemplateResult {
    const rowIn = r >= rect.r0 && r <= rect.r1;
    const cells: TemplateResult[] = [];
    const header = src.header;
    for (let c = 0; c < header.length; c++) {
      const text = src.field(r, c);
      const problem = fieldProblem(text, header[c]!, numeric[c]!);
      const missing = text.trim() === '';
      const sel = rowIn && c >= rect.c0 && c <= rect.c1;
      const cls = `f${numeric[c] ? ' num' : ''}${missing ? ' missing' : ''}${problem !== null ? ' bad' : ''}${sel ? ' in' : ''}${focus.r === r && focus.c === c ? ' at' : ''}`;
      cells.push(
        html`<div class=${cls} role="gridcell" id="f-${r}-${c}" data-r=${r} data-c=${c} aria-selected=${sel ? 'true' : 'false'} aria-invalid=${problem !== null ? 'true' : 'false'} title=${problem ?? (missing ? gridMsg.missingField() : nothing)}>${missing ? '·' : oneLine(text)}</div>`,
      );
    }
    return html`<div class="row" role="row" aria-rowindex=${r + 2}>
      <div class="rn num${rowIn ? ' in' : ''}" role="rowheader" data-r=${r} data-c="-1">${r + 1}</div>
      ${cells}
    </div>`;
  }

  private renderEditor(ed: EditorState): TemplateResult {
    const style = `left: ${ed.left}px; top: ${ed.top}px; min-width: ${ed.width}px; min-height: ${ed.height}px`;
    return html`<textarea
        class="editor"
        rows="1"
        spellcheck="false"
        autocomplete="off"
        style=${style}
        aria-label=${ed.pos.r === HEADER_ROW ? `Name of column ${ed.pos.c + 1}` : `Row ${ed.pos.r + 1}, ${this.shown?.source.header[ed.pos.c] ?? ''}`}
        aria-invalid=${ed.problem !== null ? 'true' : 'false'}
        @keydown=${this.onEditorKey}
        @input=${this.onEditorInput}
        @blur=${this.onEditorBlur}
        @copy=${(e: Event) => e.stopPropagation()}
        @cut=${(e: Event) => e.stopPropagation()}
        @paste=${(e: Event) => e.stopPropagation()}
        @pointerdown=${(e: Event) => e.stopPropagation()}
        @dblclick=${(e: Event) => e.stopPropagation()}
      ></textarea>
      ${ed.problem !== null
        ? html`<div class="editor-problem" role="alert" style="left: ${ed.left}px; top: ${ed.top + ed.height + 4}px">${ed.problem}</div>`
        : nothing}`;
  }

  override updated(changed: PropertyValues): void {
    super.updated(changed);
    const scroller = this.scroller;
    if (scroller !== null) {
      if (this.resizeObserver === null && typeof ResizeObserver !== 'undefined') {
        this.resizeObserver = new ResizeObserver(() => this.measure());
        this.resizeObserver.observe(scroller);
      }
      if (this.windowHeight === 0 && scroller.clientHeight > 0) this.measure();
      if (this.scrollPending) {
        this.scrollPending = false;
        this.revealFocus(scroller);
      }
    }
    if (changed.has('editor')) {
      const old = changed.get('editor') as EditorState | null | undefined;
      const ed = this.editor;
      const ta = this.renderRoot.querySelector<HTMLTextAreaElement>('textarea.editor');
      if (ed !== null && ta !== null && (old === null || old === undefined || old.pos !== ed.pos)) {
        ta.value = ed.initial;
        ta.focus({ preventScroll: true });
        ta.setSelectionRange(ed.initial.length, ed.initial.length);
      }
    }
    // the CSV text follows the body unless it is the text being typed
    const raw = this.renderRoot.querySelector<HTMLTextAreaElement>('textarea.raw-text');
    const body = this.readBody ?? this.cell?.body ?? null;
    if (raw !== null && body !== null && freshBody(raw.value) !== body) raw.value = visibleBody({ ...this.cell, body });
  }

  private get scroller(): HTMLElement | null {
    return this.renderRoot.querySelector<HTMLElement>('.scroller');
  }

  private measure(): void {
    const s = this.scroller;
    if (s === null) return;
    const head = s.querySelector<HTMLElement>('.head');
    const h = s.clientHeight - (head?.offsetHeight ?? 0);
    if (h !== this.windowHeight) {
      this.windowHeight = h;
      this.redrawIfMoved();
    }
  }

  private readonly onScroll = (e: Event): void => {
    this.viewTop = (e.currentTarget as HTMLElement).scrollTop;
    this.redrawIfMoved();
  };

  /** Draws again when the window of rows has moved. */
  private redrawIfMoved(): void {
    if (this.printing) return;
    const want = visibleRows(this.viewTop, this.windowHeight, this.extent.rows);
    if (want.first !== this.drawn.first || want.last !== this.drawn.last) this.requestUpdate();
  }

  /** Scrolls so that the focused field is in view. */
  private revealFocus(s: HTMLElement): void {
    const { r, c } = this.sel.focus;
    const head = s.querySelector<HTMLElement>('.head');
    const headH = head?.offsetHeight ?? 0;
    const top = scrollToShowRow(r, s.scrollTop, s.clientHeight, headH);
    if (top !== s.scrollTop) s.scrollTop = top;
    const name = s.querySelector<HTMLElement>(`#h-${c}`);
    const corner = s.querySelector<HTMLElement>('.corner');
    if (name !== null) {
      const stuck = corner?.offsetWidth ?? 0;
      const left = name.offsetLeft;
      const right = left + name.offsetWidth;
      if (left - stuck < s.scrollLeft) s.scrollLeft = Math.max(0, left - stuck);
      else if (right > s.scrollLeft + s.clientWidth) s.scrollLeft = right - s.clientWidth;
    }
    this.viewTop = s.scrollTop;
  }

  private focusGrid(): void {
    this.scroller?.focus({ preventScroll: true });
  }

  private select(next: Selection): void {
    this.sel = next;
    this.scrollPending = true;
  }

  // ---- keys ---------------------------------------------------------------------------------

  private readonly onGridKey = (e: KeyboardEvent): void => {
    if (this.editor !== null) return;
    const cmd = commandForKey(keyInput(e));
    if (cmd === null) return;
    if (cmd.kind === 'tab') {
      const next = tabMove(this.sel, this.extent, cmd.back);
      // at the grid's first or last field Tab leaves the grid
      if (next === null) return;
      e.preventDefault();
      this.select(next);
      return;
    }
    if (cmd.kind === 'compose') {
      // a dead key or an input method: open the editor now, within this key press, and let
      // the browser go on composing there
      this.startEdit('', 'replace');
      this.performUpdate();
      return;
    }
    e.preventDefault();
    if (cmd.kind === 'undo' || cmd.kind === 'redo') {
      // the page's undo, not ours: stop here so that the page does not see the key twice
      e.stopPropagation();
    }
    this.run(cmd);
  };

  /** Runs a grid command (from a key or a button). */
  run(cmd: GridCommand): void {
    const e = this.extent;
    if (e.cols === 0) return;
    const rect = selectionRect(this.sel);
    switch (cmd.kind) {
      case 'move':
        this.select(moveSelection(this.sel, e, cmd.dr, cmd.dc, { extend: cmd.extend, jump: cmd.jump }));
        return;
      case 'page': {
        const page = Math.max(1, Math.floor((this.windowHeight || 10 * ROW_HEIGHT) / ROW_HEIGHT) - 1);
        this.select(moveSelection(this.sel, e, cmd.dir * page, 0, { extend: cmd.extend }));
        return;
      }
      case 'row-edge': {
        const f = this.sel.focus;
        const p = cmd.corner ? { r: cmd.end ? e.rows - 1 : 0, c: cmd.end ? e.cols - 1 : 0 } : { r: f.r, c: cmd.end ? e.cols - 1 : 0 };
        this.select(selectTo(this.sel, e, p, cmd.extend));
        return;
      }
      case 'enter':
        this.select(enterMove(this.sel, e, cmd.back));
        return;
      case 'tab': {
        const next = tabMove(this.sel, e, cmd.back);
        if (next !== null) this.select(next);
        return;
      }
      case 'collapse':
        this.select(at(this.sel.focus.r, this.sel.focus.c));
        return;
      case 'select-all':
        this.sel = { anchor: { r: HEADER_ROW, c: 0 }, focus: { r: Math.max(HEADER_ROW, e.rows - 1), c: e.cols - 1 } };
        return;
      case 'undo':
      case 'redo':
        this.dispatchEvent(new CustomEvent(cmd.kind === 'undo' ? 'furrow-undo' : 'furrow-redo', { bubbles: true, composed: true }));
        return;
      case 'edit':
        this.startEdit(null, 'in-place');
        return;
      case 'type':
        this.startEdit(cmd.text, 'replace');
        return;
      case 'compose':
        this.startEdit('', 'replace');
        return;
    }
    // the rest change the table
    const g = this.grid;
    if (g === null) {
      if (this.readOnly) this.say('problem', gridMsg.readOnly(this.file ?? ''));
      return;
    }
    this.status = null;
    switch (cmd.kind) {
      case 'clear':
        if (rect.r1 < 0) this.say('problem', gridMsg.headerNotCleared());
        else this.commit(clearRect(g, rect));
        return;
      case 'insert-row': {
        const where = cmd.below ? Math.max(0, rect.r1 + 1) : Math.max(0, rect.r0);
        this.commit(insertRows(g, where, 1));
        this.select(at(where, this.sel.focus.c));
        break;
      }
      case 'insert-column': {
        const where = cmd.right ? rect.c1 + 1 : rect.c0;
        this.commit(insertColumns(g, where, 1));
        // on the new column's name, so that typing names it
        this.select(at(HEADER_ROW, where));
        break;
      }
      case 'delete-rows': {
        const r0 = Math.max(0, rect.r0);
        if (rect.r1 < 0 || g.rows.length === 0) return;
        const next = deleteRows(g, r0, rect.r1);
        this.commit(next);
        this.select(at(Math.min(r0, next.rows.length - 1), this.sel.focus.c));
        break;
      }
      case 'delete-columns': {
        const next = deleteColumns(g, rect.c0, rect.c1);
        if (isRefusal(next)) {
          this.say('problem', next.refused);
          return;
        }
        this.commit(next);
        this.select(at(this.sel.focus.r, Math.min(rect.c0, next.header.length - 1)));
        break;
      }
    }
    this.sel = clampSelection(this.sel, this.extent);
    void this.updateComplete.then(() => this.focusGrid());
  }

  // ---- the field editor -------------------------------------------------------------------

  /** Opens the editor on the focused field: with `text` in place of the field, or its own text. */
  private startEdit(text: string | null, mode: EditMode): void {
    const src = this.shown?.source;
    if (!src) return;
    if (this.grid === null) {
      this.say('problem', gridMsg.readOnly(this.file ?? ''));
      return;
    }
    const pos = this.sel.focus;
    this.sel = at(pos.r, pos.c);
    const s = this.scroller;
    if (s !== null) this.revealFocus(s);
    const name = s?.querySelector<HTMLElement>(`#h-${pos.c}`) ?? null;
    const left = name?.offsetLeft ?? 0;
    const width = name?.offsetWidth ?? 80;
    const height = pos.r === HEADER_ROW ? (name?.offsetHeight ?? ROW_HEIGHT) : ROW_HEIGHT;
    const top = pos.r === HEADER_ROW ? 0 : pos.r * ROW_HEIGHT;
    const own = pos.r === HEADER_ROW ? (src.header[pos.c] ?? '') : src.field(pos.r, pos.c);
    this.status = null;
    this.editor = { pos, mode, initial: text ?? own, left, top, width: Math.max(width, 40), height: Math.max(height, ROW_HEIGHT), problem: null };
  }

  private readonly onEditorInput = (): void => {
    if (this.editor?.problem) this.editor = { ...this.editor, problem: null };
  };

  private readonly onEditorKey = (e: KeyboardEvent): void => {
    // the grid's own keys must not see what is typed here
    e.stopPropagation();
    const ed = this.editor;
    if (ed === null) return;
    const cmd = editorCommandForKey(keyInput(e), ed.mode);
    if (cmd === null) return;
    const ta = e.currentTarget as HTMLTextAreaElement;
    e.preventDefault();
    switch (cmd.kind) {
      case 'cancel':
        this.editor = null;
        this.focusGrid();
        return;
      case 'newline':
        ta.setRangeText('\n', ta.selectionStart, ta.selectionEnd, 'end');
        return;
      case 'toggle-mode':
        this.editor = { ...ed, mode: ed.mode === 'replace' ? 'in-place' : 'replace' };
        return;
      case 'commit': {
        if (!this.finishEdit(ta.value, false)) return;
        const e2 = this.extent;
        if (cmd.via === 'enter') this.select(enterMove(this.sel, e2, cmd.dr < 0));
        else if (cmd.via === 'tab') this.select(tabMove(this.sel, e2, cmd.dc < 0) ?? this.sel);
        else if (cmd.via === 'arrow') this.select(moveSelection(this.sel, e2, cmd.dr, cmd.dc));
        this.focusGrid();
      }
    }
  };

  private readonly onEditorBlur = (e: FocusEvent): void => {
    if (this.editor === null) return;
    this.finishEdit((e.currentTarget as HTMLTextAreaElement).value, true);
  };

  /**
   * Keeps the editor's text: a field edit or a column rename. A refused rename keeps the
   * editor open with the reason (or, when focus has left, closes it and says why).
   */
  private finishEdit(value: string, leaving: boolean): boolean {
    const ed = this.editor;
    const g = this.grid;
    if (ed === null || g === null) {
      this.editor = null;
      return false;
    }
    const { r, c } = ed.pos;
    if (r === HEADER_ROW) {
      const next = renameColumn(g, c, value);
      if (isRefusal(next)) {
        if (leaving) {
          this.editor = null;
          this.say('problem', next.refused);
        } else this.editor = { ...ed, problem: next.refused };
        return false;
      }
      this.editor = null;
      this.commit(next, `name:${this.cell.id}:${c}`);
      return true;
    }
    this.editor = null;
    if (r < g.rows.length && c < g.header.length) this.commit(setField(g, r, c, value), `field:${this.cell.id}:${r}:${c}`);
    return true;
  }

  // ---- pointer ------------------------------------------------------------------------------

  private posOf(e: Event): { r: number; c: number } | null {
    for (const t of e.composedPath()) {
      if (!(t instanceof HTMLElement)) continue;
      if (t.classList.contains('scroller')) return null;
      const r = t.dataset['r'];
      const c = t.dataset['c'];
      if (r !== undefined && c !== undefined) return { r: Number(r), c: Number(c) };
    }
    return null;
  }

  private readonly onPointerDown = (e: PointerEvent): void => {
    if (e.button !== 0) return;
    const p = this.posOf(e);
    if (p === null) return;
    if (this.editor !== null) this.finishEdit(this.renderRoot.querySelector<HTMLTextAreaElement>('textarea.editor')?.value ?? '', true);
    const ext = this.extent;
    e.preventDefault();
    this.focusGrid();
    if (p.c < 0) {
      // a row number selects its row; the corner, the whole table
      if (p.r === HEADER_ROW) this.run({ kind: 'select-all' });
      else this.sel = e.shiftKey ? { anchor: { r: this.sel.anchor.r, c: 0 }, focus: { r: p.r, c: ext.cols - 1 } } : { anchor: { r: p.r, c: 0 }, focus: { r: p.r, c: ext.cols - 1 } };
      return;
    }
    this.sel = selectTo(this.sel, ext, p, e.shiftKey);
    this.dragging = true;
  };

  private readonly onPointerMove = (e: PointerEvent): void => {
    if (!this.dragging || (e.buttons & 1) === 0) return;
    const p = this.posOf(e);
    if (p === null || p.c < 0) return;
    const f = this.sel.focus;
    if (f.r !== p.r || f.c !== p.c) this.sel = selectTo(this.sel, this.extent, p, true);
  };

  private readonly onDoubleClick = (e: MouseEvent): void => {
    const p = this.posOf(e);
    if (p === null || p.c < 0) return;
    this.sel = at(p.r, p.c);
    this.startEdit(null, 'in-place');
  };

  // ---- clipboard ------------------------------------------------------------------------------

  private readonly onCopy = (e: ClipboardEvent): void => {
    if (this.editor !== null) return;
    const src = this.shown?.source;
    if (!src || !e.clipboardData) return;
    const rect = selectionRect(this.sel);
    const block = fieldsIn(src, rect);
    e.clipboardData.setData('text/plain', blockToTsv(block));
    e.preventDefault();
    this.say('info', gridMsg.copied(block.length, rect.c1 - rect.c0 + 1));
  };

  private readonly onCut = (e: ClipboardEvent): void => {
    if (this.editor !== null) return;
    this.onCopy(e);
    if (this.grid === null) return;
    this.run({ kind: 'clear' });
  };

  private readonly onPaste = (e: ClipboardEvent): void => {
    if (this.editor !== null) return;
    e.preventDefault();
    this.pasteText(e.clipboardData?.getData('text/plain') ?? '');
  };

  /** Pastes text at the selection (what a paste event does; public for tests and the shell). */
  pasteText(text: string): void {
    const g = this.grid;
    if (g === null) {
      if (this.readOnly) this.say('problem', gridMsg.readOnly(this.file ?? ''));
      return;
    }
    const block = readBlock(text);
    if (!block.ok) {
      this.say('problem', block.message);
      return;
    }
    const done = pasteBlock(g, selectionRect(this.sel), block.rows);
    if (isRefusal(done)) {
      this.say('problem', done.refused);
      return;
    }
    this.commit(done.grid);
    this.sel = { anchor: { r: done.rect.r0, c: done.rect.c0 }, focus: { r: done.rect.r1, c: done.rect.c1 } };
    const how = block.format === 'csv' ? ` ${gridMsg.pastedAsCsv()}` : '';
    this.say('info', gridMsg.pasted(block.rows.length, block.width, done.addedRows, done.addedColumns) + how);
  }

  // ---- the table's name ------------------------------------------------------------------------

  private readonly onNameKey = (e: KeyboardEvent): void => {
    const input = e.currentTarget as HTMLInputElement;
    if (e.key === 'Enter') {
      e.preventDefault();
      if (this.rename(input.value)) this.focusGrid();
    } else if (e.key === 'Escape') {
      e.preventDefault();
      input.value = this.tableName ?? '';
      this.nameProblem = null;
    }
  };

  private readonly onNameBlur = (e: FocusEvent): void => {
    const input = e.currentTarget as HTMLInputElement;
    if (!this.rename(input.value)) input.value = this.tableName ?? '';
  };

  /** Renames the table; false (with the reason shown) when the name cannot be used. */
  private rename(raw: string): boolean {
    const name = raw.trim();
    const current = this.tableName;
    if (name === current) {
      this.nameProblem = null;
      return true;
    }
    const taken = new Set<string>();
    for (const c of this.catalogue?.cells ?? []) if (c.name !== current) taken.add(c.name);
    const problem = tableNameProblem(name, current, taken);
    if (problem !== null) {
      this.nameProblem = problem;
      return false;
    }
    this.nameProblem = null;
    const m = tableMarker(this.cell);
    const marker = writeTableMarker(name, m.file, m.extra);
    this.send({ type: 'marker', id: this.cell.id, marker });
    return true;
  }

  // ---- CSV text ----------------------------------------------------------------------------------

  private readonly toggleText = (): void => {
    this.textPinned = !(this.textPinned || this.gridError !== null);
    if (!this.textPinned) void this.updateComplete.then(() => this.focusGrid());
  };

  private readonly onTextInput = (e: Event): void => {
    const text = (e.currentTarget as HTMLTextAreaElement).value;
    const body = freshBody(text);
    this.textPinned = true;
    this.read(body);
    this.send({ type: 'body', id: this.cell.id, body }, `text:${this.cell.id}`);
    this.requestUpdate();
  };

  private readonly onTextKey = (e: KeyboardEvent): void => {
    const k = keyInput(e);
    if (!k.mod || k.alt) return;
    const lower = e.key.toLowerCase();
    if (lower === 'z' || (lower === 'y' && !k.shift)) {
      e.preventDefault();
      e.stopPropagation();
      const redo = lower === 'y' || k.shift;
      this.dispatchEvent(new CustomEvent(redo ? 'furrow-redo' : 'furrow-undo', { bubbles: true, composed: true }));
    }
  };

  private readonly showErrorRow = (): void => {
    const err = this.gridError;
    const ta = this.renderRoot.querySelector<HTMLTextAreaElement>('textarea.raw-text');
    if (err === null || ta === null) return;
    ta.focus();
    ta.setSelectionRange(err.from, err.to);
    const line = ta.value.slice(0, err.from).split('\n').length - 1;
    const lh = parseFloat(getComputedStyle(ta).lineHeight) || 18;
    ta.scrollTop = Math.max(0, (line - 2) * lh);
  };

  // ---- import --------------------------------------------------------------------------------------

  private readonly chooseFile = (): void => {
    this.renderRoot.querySelector<HTMLInputElement>('input.file-input')?.click();
  };

  private readonly onFileChosen = async (e: Event): Promise<void> => {
    const input = e.currentTarget as HTMLInputElement;
    const f = input.files?.[0];
    input.value = '';
    if (!f) return;
    await this.importFile(f);
  };

  /** Replaces the body with a CSV file's text when it reads as a table; says why when not. */
  async importFile(f: Blob & { readonly name?: string }): Promise<void> {
    const label = f.name ?? 'The file';
    if (this.readOnly) {
      this.say('problem', gridMsg.readOnly(this.file ?? ''));
      return;
    }
    if (f.size > IMPORT_LIMIT_MB * 1024 * 1024) {
      this.say('problem', gridMsg.importTooBig(label, IMPORT_LIMIT_MB));
      return;
    }
    let bytes: Uint8Array;
    try {
      bytes = new Uint8Array(await f.arrayBuffer());
    } catch {
      this.say('problem', gridMsg.importUnreadable(label));
      return;
    }
    let text: string;
    try {
      // refused, never repaired: a replaced byte would change a measurement without a word
      text = decodeUtf8(bytes);
    } catch {
      this.say('problem', gridMsg.importNotUtf8(label));
      return;
    }
    // a CSV file's byte-order mark is not part of its first column's name
    const body = bodyOfText(text.replace(/^\uFEFF/, ''));
    let g: BodyGrid;
    try {
      g = readBodyGrid(body);
    } catch (err) {
      if (!(err instanceof CsvError)) throw err;
      this.say('problem', gridMsg.importFailed(label, err.message));
      return;
    }
    this.textPinned = false;
    this.commit(g);
    this.sel = at(0, 0);
    this.say('info', gridMsg.imported(label, g.rows.length, g.header.length));
  }
}

if (!customElements.get('furrow-table-cell')) customElements.define('furrow-table-cell', TableCellView);

declare global {
  interface HTMLElementTagNameMap {
    'furrow-table-cell': TableCellView;
  }
}
