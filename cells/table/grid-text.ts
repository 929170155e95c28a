/**
 * The table cell's body as CSV text: shown when the body does not read as a table (with the
 * reason and the row at fault, so that nothing is lost and it can be mended), or when the
 * user asks for it. Typing there sends the text as the body.
 */
import { html, nothing, type TemplateResult } from 'lit';
import { freshBody, visibleBody } from '../../src/doc/document.ts';
import { gridMsg } from '../../src/messages/grid.ts';
import { keyInput } from './grid-key-input.ts';
import type { ToolbarHost } from './grid-toolbar.ts';

/** What the text view needs of the element: the toolbar's host, and reading a typed body. */
export interface TextHost extends ToolbarHost {
  /** The body text the grid (or its reading error) came from. */
  readonly readBody: string | null;
  /** Reads a body typed here (the grid, or why it does not read). */
  read(body: string): void;
}

export class GridText {
  private readonly host: TextHost;

  constructor(host: TextHost) {
    this.host = host;
  }

  render(): TemplateResult {
    const host = this.host;
    const err = host.gridError;
    const body = host.readBody ?? host.cell.body;
    let intro: TemplateResult;
    if (err !== null) {
      const row = body.slice(err.from, err.to);
      intro = html`<p class="line problem" role="alert">
        ${gridMsg.rawIntro(err.message)}
        ${row.trim() !== '' ? html`<br /><code>${row.length > 160 ? `${row.slice(0, 159)}…` : row}</code>` : nothing}
        ${err.to > err.from ? html`<button @click=${this.showErrorRow}>${gridMsg.rawRow()}</button>` : nothing}
      </p>`;
    } else {
      const g = host.grid;
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
        aria-label=${gridMsg.textLabel(host.tableName ?? '')}
        aria-invalid=${err !== null ? 'true' : 'false'}
        @input=${this.onInput}
        @keydown=${this.onKey}
      ></textarea>
    </div>`;
  }

  /** After a draw: the text follows the body unless it is the text being typed. */
  afterUpdate(): void {
    const host = this.host;
    const raw = host.renderRoot.querySelector<HTMLTextAreaElement>('textarea.raw-text');
    const body = host.readBody ?? host.cell?.body ?? null;
    if (raw !== null && body !== null && freshBody(raw.value) !== body) raw.value = visibleBody({ ...host.cell, body });
  }

  private readonly onInput = (e: Event): void => {
    const host = this.host;
    const text = (e.currentTarget as HTMLTextAreaElement).value;
    const body = freshBody(text);
    host.textPinned = true;
    host.read(body);
    host.send({ type: 'body', id: host.cell.id, body }, `text:${host.cell.id}`);
    host.requestUpdate();
  };

  private readonly onKey = (e: KeyboardEvent): void => {
    const k = keyInput(e);
    if (!k.mod || k.alt) return;
    const lower = e.key.toLowerCase();
    if (lower === 'z' || (lower === 'y' && !k.shift)) {
      e.preventDefault();
      e.stopPropagation();
      const redo = lower === 'y' || k.shift;
      this.host.dispatchEvent(new CustomEvent(redo ? 'furrow-redo' : 'furrow-undo', { bubbles: true, composed: true }));
    }
  };

  private readonly showErrorRow = (): void => {
    const err = this.host.gridError;
    const ta = this.host.renderRoot.querySelector<HTMLTextAreaElement>('textarea.raw-text');
    if (err === null || ta === null) return;
    ta.focus();
    ta.setSelectionRange(err.from, err.to);
    const line = ta.value.slice(0, err.from).split('\n').length - 1;
    const lh = parseFloat(getComputedStyle(ta).lineHeight) || 18;
    ta.scrollTop = Math.max(0, (line - 2) * lh);
  };
}
