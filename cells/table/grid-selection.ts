/**
 * Selecting fields with the pointer in the table cell's grid: a press selects a field (with
 * Shift, extends the selection), a drag extends it, a row number selects its row, the corner
 * the whole table, and a double click opens the field editor. Keys select through the grid's
 * commands (cells/table/grid-keys.ts).
 */
import type { ReactiveController } from 'lit';
import type { GridEditor } from './grid-editor.ts';
import type { GridHost } from './grid-host.ts';
import { HEADER_ROW, at, selectTo } from './grid-keys.ts';

/** The field a pointer event is over ({r, c}; c = -1 for a row number), or null. */
function posOf(e: Event): { r: number; c: number } | null {
  for (const t of e.composedPath()) {
    if (!(t instanceof HTMLElement)) continue;
    if (t.classList.contains('scroller')) return null;
    const r = t.dataset['r'];
    const c = t.dataset['c'];
    if (r !== undefined && c !== undefined) return { r: Number(r), c: Number(c) };
  }
  return null;
}

export class GridSelection implements ReactiveController {
  private readonly host: GridHost;
  private readonly editor: GridEditor;
  private dragging = false;

  constructor(host: GridHost, editor: GridEditor) {
    this.host = host;
    this.editor = editor;
    host.addController(this);
  }

  hostConnected(): void {
    window.addEventListener('pointerup', this.onPointerUp);
  }

  hostDisconnected(): void {
    window.removeEventListener('pointerup', this.onPointerUp);
  }

  private readonly onPointerUp = (): void => {
    this.dragging = false;
  };

  readonly onPointerDown = (e: PointerEvent): void => {
    if (e.button !== 0) return;
    const p = posOf(e);
    if (p === null) return;
    const host = this.host;
    this.editor.commitOpen();
    const ext = host.extent;
    e.preventDefault();
    host.focusGrid();
    if (p.c < 0) {
      // a row number selects its row; the corner, the whole table
      if (p.r === HEADER_ROW) host.run({ kind: 'select-all' });
      else
        host.sel = e.shiftKey
          ? { anchor: { r: host.sel.anchor.r, c: 0 }, focus: { r: p.r, c: ext.cols - 1 } }
          : { anchor: { r: p.r, c: 0 }, focus: { r: p.r, c: ext.cols - 1 } };
      return;
    }
    host.sel = selectTo(host.sel, ext, p, e.shiftKey);
    this.dragging = true;
  };

  readonly onPointerMove = (e: PointerEvent): void => {
    if (!this.dragging || (e.buttons & 1) === 0) return;
    const p = posOf(e);
    if (p === null || p.c < 0) return;
    const host = this.host;
    const f = host.sel.focus;
    if (f.r !== p.r || f.c !== p.c) host.sel = selectTo(host.sel, host.extent, p, true);
  };

  readonly onDoubleClick = (e: MouseEvent): void => {
    const p = posOf(e);
    if (p === null || p.c < 0) return;
    this.host.sel = at(p.r, p.c);
    this.editor.start(null, 'in-place');
  };
}
