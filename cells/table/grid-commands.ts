/**
 * The grid's commands, from a key (cells/table/grid-keys.ts reads the key) or a toolbar
 * button: moving and extending the selection, opening the field editor, undo and redo (the
 * page's), and the changes of shape (clear, add or delete rows and columns).
 */
import type { GridEditor } from './grid-editor.ts';
import type { GridHost } from './grid-host.ts';
import {
  HEADER_ROW,
  at,
  clampSelection,
  commandForKey,
  enterMove,
  moveSelection,
  selectTo,
  selectionRect,
  tabMove,
  type GridCommand,
} from './grid-keys.ts';
import { gridMsg } from '../../src/messages/grid.ts';
import { clearRect, deleteColumns, deleteRows, insertColumns, insertRows, isRefusal } from './grid-model.ts';
import { keyInput } from './grid-key-input.ts';
import type { GridRows } from './grid-rows.ts';

export class GridCommands {
  private readonly host: GridHost;
  private readonly editor: GridEditor;
  private readonly rows: GridRows;

  constructor(host: GridHost, editor: GridEditor, rows: GridRows) {
    this.host = host;
    this.editor = editor;
    this.rows = rows;
  }

  /** A key pressed on the grid (not in the field editor). */
  readonly onKey = (e: KeyboardEvent): void => {
    const host = this.host;
    if (host.editor !== null) return;
    const cmd = commandForKey(keyInput(e));
    if (cmd === null) return;
    if (cmd.kind === 'tab') {
      const next = tabMove(host.sel, host.extent, cmd.back);
      // at the grid's first or last field Tab leaves the grid
      if (next === null) return;
      e.preventDefault();
      host.select(next);
      return;
    }
    if (cmd.kind === 'compose') {
      // a dead key or an input method: open the editor now, within this key press, and let
      // the browser go on composing there
      this.editor.start('', 'replace');
      host.drawNow();
      return;
    }
    e.preventDefault();
    if (cmd.kind === 'undo' || cmd.kind === 'redo') {
      // the page's undo, not ours: stop here so that the page does not see the key twice
      e.stopPropagation();
    }
    this.run(cmd);
  };

  /** Runs a grid command. */
  run(cmd: GridCommand): void {
    const host = this.host;
    const e = host.extent;
    if (e.cols === 0) return;
    const sel = host.sel;
    const rect = selectionRect(sel);
    switch (cmd.kind) {
      case 'move':
        host.select(moveSelection(sel, e, cmd.dr, cmd.dc, { extend: cmd.extend, jump: cmd.jump }));
        return;
      case 'page':
        host.select(moveSelection(sel, e, cmd.dir * this.rows.pageRows(), 0, { extend: cmd.extend }));
        return;
      case 'row-edge': {
        const f = sel.focus;
        const p = cmd.corner ? { r: cmd.end ? e.rows - 1 : 0, c: cmd.end ? e.cols - 1 : 0 } : { r: f.r, c: cmd.end ? e.cols - 1 : 0 };
        host.select(selectTo(sel, e, p, cmd.extend));
        return;
      }
      case 'enter':
        host.select(enterMove(sel, e, cmd.back));
        return;
      case 'tab': {
        const next = tabMove(sel, e, cmd.back);
        if (next !== null) host.select(next);
        return;
      }
      case 'collapse':
        host.select(at(sel.focus.r, sel.focus.c));
        return;
      case 'select-all':
        host.sel = { anchor: { r: HEADER_ROW, c: 0 }, focus: { r: Math.max(HEADER_ROW, e.rows - 1), c: e.cols - 1 } };
        return;
      case 'undo':
      case 'redo':
        host.dispatchEvent(new CustomEvent(cmd.kind === 'undo' ? 'furrow-undo' : 'furrow-redo', { bubbles: true, composed: true }));
        return;
      case 'edit':
        this.editor.start(null, 'in-place');
        return;
      case 'type':
        this.editor.start(cmd.text, 'replace');
        return;
      case 'compose':
        this.editor.start('', 'replace');
        return;
    }
    // the rest change the table
    const g = host.grid;
    if (g === null) {
      if (host.readOnly) host.say('problem', gridMsg.readOnly(host.file ?? ''));
      return;
    }
    host.status = null;
    switch (cmd.kind) {
      case 'clear':
        if (rect.r1 < 0) host.say('problem', gridMsg.headerNotCleared());
        else host.commit(clearRect(g, rect));
        return;
      case 'insert-row': {
        const where = cmd.below ? Math.max(0, rect.r1 + 1) : Math.max(0, rect.r0);
        host.commit(insertRows(g, where, 1));
        host.select(at(where, host.sel.focus.c));
        break;
      }
      case 'insert-column': {
        const where = cmd.right ? rect.c1 + 1 : rect.c0;
        host.commit(insertColumns(g, where, 1));
        // on the new column's name, so that typing names it
        host.select(at(HEADER_ROW, where));
        break;
      }
      case 'delete-rows': {
        const r0 = Math.max(0, rect.r0);
        if (rect.r1 < 0 || g.rows.length === 0) return;
        const next = deleteRows(g, r0, rect.r1);
        host.commit(next);
        host.select(at(Math.min(r0, next.rows.length - 1), host.sel.focus.c));
        break;
      }
      case 'delete-columns': {
        const next = deleteColumns(g, rect.c0, rect.c1);
        if (isRefusal(next)) {
          host.say('problem', next.refused);
          return;
        }
        host.commit(next);
        host.select(at(host.sel.focus.r, Math.min(rect.c0, next.header.length - 1)));
        break;
      }
    }
    host.sel = clampSelection(host.sel, host.extent);
    void host.updateComplete.then(() => host.focusGrid());
  }
}
