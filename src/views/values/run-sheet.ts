/**
 * `<furrow-run-sheet>`: shown under a table that is a layout (a table with a `drawn` record,
 * made by random_layout or latin_layout). One line says how the layout was drawn, so the
 * seed is on screen where the plan is; a button saves the layout as a run sheet (CSV with
 * empty measurement columns, src/doc/run-sheet.ts) to take to the field or bench.
 */
import { css, html, LitElement, nothing } from 'lit';
import { runSheet } from '../../doc/run-sheet.ts';
import type { Table } from '../../lang/values.ts';
import { shared } from '../theme.ts';
import { downloadCsv } from '../download.ts';
import { sheetWords } from '../../messages/page.ts';

/** The file name of a run sheet for a layout named `name`. */
export function runSheetFileName(name: string | null): string {
  const base = (name ?? 'layout').replace(/[^A-Za-z0-9_.-]/g, '_');
  return `${base}-run-sheet.csv`;
}

/** The line that says how a layout was drawn. */
export function drawnLine(t: Table): string | null {
  const d = t.drawn;
  if (d === undefined) return null;
  const f = (k: string) => d.fields.get(k);
  return `Drawn by ${String(f('drawn_by'))} with seed ${String(f('seed'))}: ${String(f('design'))}, ${String(f('plots'))} plots; generator ${String(f('generator'))}; ${String(f('algorithm'))}.`;
}

export class FurrowRunSheet extends LitElement {
  static override properties = {
    layout: { attribute: false },
    name: { type: String },
  };

  declare layout: Table | null;
  declare name: string | null;

  constructor() {
    super();
    this.layout = null;
    this.name = null;
  }

  static override styles = [
    shared,
    css`
      :host {
        display: block;
        margin-top: 0.4rem;
      }
      p {
        margin: 0 0 0.35rem;
        font-size: 0.8rem;
        color: var(--ink-soft, #4a5058);
      }
      button {
        font: inherit;
        font-size: 0.85rem;
      }
    `,
  ];

  private save(): void {
    if (this.layout === null) return;
    downloadCsv(runSheetFileName(this.name), runSheet(this.layout));
  }

  override render() {
    if (this.layout === null) return nothing;
    const line = drawnLine(this.layout);
    return html`${line === null ? nothing : html`<p class="drawn">${line}</p>`}
      <button type="button" class="run-sheet" @click=${() => this.save()}>${sheetWords.saveRunSheet()}</button>`;
  }
}

if (!customElements.get('furrow-run-sheet')) customElements.define('furrow-run-sheet', FurrowRunSheet);
