/**
 * How the table cell's grid is drawn: the row of column names (each with what formulas read
 * the column as, and how many fields are not numbers), the rows in the window, the row
 * numbers, and the field editor laid over its field. Templates only; the element and its
 * parts hold the state and the handlers.
 */
import { html, nothing, type TemplateResult } from 'lit';
import { isPlainName } from '../../src/lang/lexer.ts';
import type { RowWindow } from '../../src/views/values/row-window.ts';
import { columnReading, fieldProblem, holdsNumbers, markedCount } from './grid-checks.ts';
import { HEADER_ROW, SHAPE_KEYS, inRect, type Pos, type Rect, type Selection, selectionRect } from './grid-keys.ts';
import { oneLine, rowNumberWidth } from './grid-layout.ts';
import { gridMsg } from '../../src/messages/grid.ts';
import type { FieldSource } from './grid-model.ts';
import { PRINT_LIMIT } from './grid-rows.ts';

/** What a drawing of the grid needs. */
export interface SheetInput {
  readonly source: FieldSource;
  readonly widths: readonly number[];
  readonly sel: Selection;
  readonly tableName: string | null;
  readonly readOnly: boolean;
  readonly window: RowWindow;
  /** Height of the rows' box (at most the browsers' cap). */
  readonly bodyHeight: number;
  /** The field editor, when open on a column name or on a field. */
  readonly nameEditor: TemplateResult | null;
  readonly fieldEditor: TemplateResult | null;
}

/** The grid's event handlers. */
export interface SheetHandlers {
  readonly onKey: (e: KeyboardEvent) => void;
  readonly onCopy: (e: ClipboardEvent) => void;
  readonly onCut: (e: ClipboardEvent) => void;
  readonly onPaste: (e: ClipboardEvent) => void;
  readonly onScroll: (e: Event) => void;
  readonly onPointerDown: (e: PointerEvent) => void;
  readonly onPointerMove: (e: PointerEvent) => void;
  readonly onDoubleClick: (e: MouseEvent) => void;
}

export function renderSheet(p: SheetInput, on: SheetHandlers): TemplateResult {
  const src = p.source;
  const n = src.rowCount;
  const cols = src.header.length;
  const rect = selectionRect(p.sel);
  const focus = p.sel.focus;
  const numeric = src.header.map((_, c) => holdsNumbers(src.counts.filled[c] ?? 0, src.counts.numbers[c] ?? 0));
  // room for the line under each name (what the column reads as, how many are marked)
  const room = src.header.map((_, c) => {
    const marked = markedCount(src.counts, c);
    const label = columnReading(src.counts, c).length + (marked > 0 ? 3 + gridMsg.notNumbersCount(marked).length : 0);
    return Math.ceil(label * 0.8) + 2;
  });
  const template = `${rowNumberWidth(n)}ch ${p.widths.map((w, c) => `${Math.max(w, room[c]!)}ch`).join(' ')}`;
  const win = p.window;
  const name = p.tableName ?? 'table';
  const rows: TemplateResult[] = [];
  for (let r = win.first; r < win.last; r++) rows.push(renderRow(src, r, rect, focus, numeric));
  return html`<div
      class="scroller ${p.readOnly ? 'read-only' : ''}"
      tabindex="0"
      role="grid"
      aria-label=${gridMsg.fieldsLabel(name)}
      aria-rowcount=${n + 1}
      aria-colcount=${cols + 1}
      aria-readonly=${p.readOnly ? 'true' : 'false'}
      aria-multiselectable="true"
      aria-activedescendant=${focus.r === HEADER_ROW ? `h-${focus.c}` : `f-${focus.r}-${focus.c}`}
      @keydown=${on.onKey}
      @copy=${on.onCopy}
      @cut=${on.onCut}
      @paste=${on.onPaste}
      @scroll=${on.onScroll}
      @pointerdown=${on.onPointerDown}
      @pointermove=${on.onPointerMove}
      @dblclick=${on.onDoubleClick}
    >
      <div class="sheet" style="--cols: ${template}">
        <div class="row head" role="row" aria-rowindex="1">
          <div class="corner" role="columnheader" data-r="-1" data-c="-1" title=${gridMsg.wholeTableTitle()}></div>
          ${src.header.map((h, c) => renderName(src, p.tableName, h, c, rect, focus, numeric[c]!))}
          ${p.nameEditor ?? nothing}
        </div>
        <div class="body" style="height: ${p.bodyHeight}px">
          <div class="rows" style="transform: translateY(${win.padTop}px)">${rows}</div>
          ${p.fieldEditor ?? nothing}
        </div>
      </div>
    </div>
    ${n === 0 ? html`<p class="empty-rows">${gridMsg.noRows(SHAPE_KEYS.rowBelow)}</p>` : nothing}
    ${n > PRINT_LIMIT ? html`<p class="line print-only">${gridMsg.printLimit(PRINT_LIMIT, n)}</p>` : nothing}`;
}

function renderName(src: FieldSource, table: string | null, h: string, c: number, rect: Rect, focus: Pos, numeric: boolean): TemplateResult {
  const marked = markedCount(src.counts, c);
  const reading = columnReading(src.counts, c);
  const tips = [h, gridMsg.columnReads(reading)];
  if (marked > 0) tips.push(gridMsg.notNumbersTitle(marked, h));
  if (!isPlainName(h)) tips.push(gridMsg.notPlainColumn(table ?? 'table', h));
  const cls = `nm${numeric ? ' num' : ''}${inRect(rect, HEADER_ROW, c) ? ' in' : ''}${focus.r === HEADER_ROW && focus.c === c ? ' at' : ''}`;
  return html`<div class=${cls} role="columnheader" id="h-${c}" data-r="-1" data-c=${c} title=${tips.join('\n')} aria-selected=${inRect(rect, HEADER_ROW, c) ? 'true' : 'false'}>
    <span class="col-name">${h}</span>
    <span class="col-reads">${reading}${marked > 0 ? html` · <span class="bad-count">${gridMsg.notNumbersCount(marked)}</span>` : nothing}</span>
  </div>`;
}

function renderRow(src: FieldSource, r: number, rect: Rect, focus: Pos, numeric: readonly boolean[]): TemplateResult {
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
