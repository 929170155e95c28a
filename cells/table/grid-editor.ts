/**
 * The field editor of the table cell's grid: one text field laid over the field (or column
 * name) being edited does all the typing. It opens on a key or a double click, keeps its text
 * on Enter, Tab, an arrow (in replace mode) or leaving, and is committed when the page goes
 * away (FLUSH_EVENT), so that nothing typed is lost.
 */
import { html, nothing, type PropertyValues, type ReactiveController, type TemplateResult } from 'lit';
import { FLUSH_EVENT } from '../view-api.ts';
import { releaseDrawing } from '../../src/views/draw-gate.ts';
import type { EditorState, GridHost } from './grid-host.ts';
import { HEADER_ROW, at, editorCommandForKey, enterMove, moveSelection, tabMove, type EditMode } from './grid-keys.ts';
import { ROW_HEIGHT } from './grid-layout.ts';
import { gridMsg } from '../../src/messages/grid.ts';
import { isRefusal, renameColumn, setFieldUsingUp } from './grid-model.ts';
import { keyInput } from './grid-key-input.ts';
import type { GridRows } from './grid-rows.ts';

export class GridEditor implements ReactiveController {
  private readonly host: GridHost;
  private readonly rows: GridRows;

  constructor(host: GridHost, rows: GridRows) {
    this.host = host;
    this.rows = rows;
    host.addController(this);
  }

  hostConnected(): void {
    window.addEventListener(FLUSH_EVENT, this.onFlush);
  }

  hostDisconnected(): void {
    window.removeEventListener(FLUSH_EVENT, this.onFlush);
  }

  /** After a draw: a newly opened editor takes its text and the focus. */
  afterUpdate(changed: PropertyValues): void {
    if (!changed.has('editor')) return;
    const old = changed.get('editor') as EditorState | null | undefined;
    const ed = this.host.editor;
    const ta = this.textarea;
    if (ed !== null && ta !== null && (old === null || old === undefined || old.pos !== ed.pos)) {
      ta.value = ed.initial;
      ta.focus({ preventScroll: true });
      ta.setSelectionRange(ed.initial.length, ed.initial.length);
    }
  }

  private get textarea(): HTMLTextAreaElement | null {
    return this.host.renderRoot.querySelector<HTMLTextAreaElement>('textarea.editor');
  }

  get open(): boolean {
    return this.host.editor !== null;
  }

  /** The page goes away: a field being typed is committed, as leaving it would. */
  private readonly onFlush = (): void => {
    if (this.host.editor !== null) this.finish(this.textarea?.value ?? '', true);
  };

  /** Commits what the open editor holds, as leaving it would (before a click elsewhere). */
  commitOpen(): void {
    if (this.host.editor !== null) this.finish(this.textarea?.value ?? '', true);
  }

  /** Opens the editor on the focused field: with `text` in place of the field, or its own text. */
  start(text: string | null, mode: EditMode): void {
    const host = this.host;
    const src = host.shown?.source;
    if (!src) return;
    if (host.grid === null) {
      host.say('problem', gridMsg.readOnly(host.file ?? ''));
      return;
    }
    const pos = host.sel.focus;
    host.sel = at(pos.r, pos.c);
    this.rows.revealFocus();
    const name = host.renderRoot.querySelector<HTMLElement>(`.scroller #h-${pos.c}`);
    const left = name?.offsetLeft ?? 0;
    const width = name?.offsetWidth ?? 80;
    const height = pos.r === HEADER_ROW ? (name?.offsetHeight ?? ROW_HEIGHT) : ROW_HEIGHT;
    const own = pos.r === HEADER_ROW ? (src.header[pos.c] ?? '') : src.field(pos.r, pos.c);
    host.status = null;
    host.editor = { pos, mode, initial: text ?? own, left, width: Math.max(width, 40), height: Math.max(height, ROW_HEIGHT), problem: null };
  }

  private readonly onInput = (): void => {
    const ed = this.host.editor;
    if (ed?.problem) this.host.editor = { ...ed, problem: null };
  };

  private readonly onKey = (e: KeyboardEvent): void => {
    const host = this.host;
    const ed = host.editor;
    // Closed but still drawn: a field was entered and the page holds drawing for the
    // worker's answer (src/views/draw-gate.ts), so this field still has the focus. The
    // hold ends and the grid is drawn now, focus included; the key goes on to the grid,
    // which takes it as it would have anyway (a character opens the next field's editor).
    if (ed === null) {
      releaseDrawing();
      host.drawNow();
      return;
    }
    // the grid's own keys must not see what is typed here
    e.stopPropagation();
    const cmd = editorCommandForKey(keyInput(e), ed.mode);
    if (cmd === null) return;
    const ta = e.currentTarget as HTMLTextAreaElement;
    e.preventDefault();
    switch (cmd.kind) {
      case 'cancel':
        host.editor = null;
        host.focusGrid();
        return;
      case 'newline':
        ta.setRangeText('\n', ta.selectionStart, ta.selectionEnd, 'end');
        return;
      case 'toggle-mode':
        host.editor = { ...ed, mode: ed.mode === 'replace' ? 'in-place' : 'replace' };
        return;
      case 'commit': {
        if (!this.finish(ta.value, false)) return;
        const e2 = host.extent;
        if (cmd.via === 'enter') host.select(enterMove(host.sel, e2, cmd.dr < 0));
        else if (cmd.via === 'tab') host.select(tabMove(host.sel, e2, cmd.dc < 0) ?? host.sel);
        else if (cmd.via === 'arrow') host.select(moveSelection(host.sel, e2, cmd.dr, cmd.dc));
        host.focusGrid();
      }
    }
  };

  private readonly onBlur = (e: FocusEvent): void => {
    if (this.host.editor === null) return;
    this.finish((e.currentTarget as HTMLTextAreaElement).value, true);
  };

  /**
   * Keeps the editor's text: a field edit or a column rename. A refused rename keeps the
   * editor open with the reason (or, when focus has left, closes it and says why).
   */
  private finish(value: string, leaving: boolean): boolean {
    const host = this.host;
    const ed = host.editor;
    const g = host.grid;
    if (ed === null || g === null) {
      host.editor = null;
      return false;
    }
    const { r, c } = ed.pos;
    if (r === HEADER_ROW) {
      const next = renameColumn(g, c, value);
      if (isRefusal(next)) {
        if (leaving) {
          host.editor = null;
          host.say('problem', next.refused);
        } else host.editor = { ...ed, problem: next.refused };
        return false;
      }
      host.editor = null;
      host.commit(next, `name:${host.cell.id}:${c}`);
      return true;
    }
    host.editor = null;
    // the grid shown is replaced by the one made here at once (commit), so it is used up
    // a field entered by a key is drawn with the worker's answer to it (draw-gate.ts)
    if (r < g.rows.length && c < g.header.length) host.commit(setFieldUsingUp(g, r, c, value), `field:${host.cell.id}:${r}:${c}`, !leaving);
    return true;
  }

  /** The editor, laid over its field; `top` is where the field's row lies in the rows drawn. */
  render(ed: EditorState): TemplateResult {
    const top = ed.pos.r === HEADER_ROW ? 0 : this.rows.rowTop(ed.pos.r);
    const style = `left: ${ed.left}px; top: ${top}px; min-width: ${ed.width}px; min-height: ${ed.height}px`;
    return html`<textarea
        class="editor"
        rows="1"
        spellcheck="false"
        autocomplete="off"
        style=${style}
        aria-label=${ed.pos.r === HEADER_ROW ? `Name of column ${ed.pos.c + 1}` : `Row ${ed.pos.r + 1}, ${this.host.shown?.source.header[ed.pos.c] ?? ''}`}
        aria-invalid=${ed.problem !== null ? 'true' : 'false'}
        @keydown=${this.onKey}
        @input=${this.onInput}
        @blur=${this.onBlur}
        @copy=${(e: Event) => e.stopPropagation()}
        @cut=${(e: Event) => e.stopPropagation()}
        @paste=${(e: Event) => e.stopPropagation()}
        @pointerdown=${(e: Event) => e.stopPropagation()}
        @dblclick=${(e: Event) => e.stopPropagation()}
      ></textarea>
      ${ed.problem !== null
        ? html`<div class="editor-problem" role="alert" style="left: ${ed.left}px; top: ${top + ed.height + 4}px">${ed.problem}</div>`
        : nothing}`;
  }
}
