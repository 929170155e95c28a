/**
 * The offer shown when a CSV file or a workbook is opened or dropped: which sheet, under
 * which name, and a look at its columns before it becomes a table cell. Emits
 * `furrow-import-add` ({sheet, name}) or `furrow-import-cancel`; the shell adds the cell.
 */
import { LitElement, css, html } from 'lit';
import { isPlainName } from '../lang/lexer.ts';
import { importMsg } from '../messages/import.ts';
import type { ImportSource } from './table-import.ts';
import { tableNameFor } from './table-import.ts';

export interface ImportChoice {
  readonly sheet: number;
  readonly name: string;
}

/** Column names shown before "and N more". */
const PREVIEW_COLUMNS = 8;

export class ImportOffer extends LitElement {
  static override properties = {
    source: { attribute: false },
    taken: { attribute: false },
    sheet: { state: true },
    name: { state: true },
  };

  declare source: ImportSource | null;
  /** Names the document's cells take. */
  declare taken: ReadonlySet<string>;
  declare sheet: number;
  declare name: string;
  private named = false;

  static override styles = css`
    :host {
      display: block;
      max-width: 58rem;
      margin: 0.8rem auto 0;
      font-family: var(--font-ui);
      color: var(--ink);
    }
    form {
      display: grid;
      gap: 0.45rem;
      padding: 0.7rem 0.9rem;
      border: 1px solid var(--rule-strong);
      border-left: 4px solid var(--accent);
      border-radius: var(--radius);
      background: var(--sheet);
    }
    h2 {
      font-size: 0.95rem;
      margin: 0;
    }
    label {
      display: flex;
      gap: 0.5rem;
      align-items: center;
      flex-wrap: wrap;
      font-size: 0.86rem;
    }
    .size,
    .columns {
      color: var(--ink-soft);
      font-size: 0.86rem;
      overflow-wrap: anywhere;
    }
    .problem {
      color: var(--error);
      font-size: 0.86rem;
    }
    .actions {
      display: flex;
      gap: 0.5rem;
    }
    input,
    select {
      font: inherit;
    }
    input {
      font-family: var(--font-code);
      min-width: 12rem;
    }
  `;

  constructor() {
    super();
    this.source = null;
    this.taken = new Set();
    this.sheet = 0;
    this.name = '';
  }

  override willUpdate(changed: Map<string, unknown>): void {
    if (changed.has('source')) {
      this.sheet = 0;
      this.named = false;
    }
    if (!this.named && this.source !== null) {
      const s = this.source.sheets[this.sheet];
      // a CSV file is named after its file, a worksheet after its sheet
      this.name = tableNameFor(this.source.sheets.length > 1 && s !== undefined ? s.label : this.source.fileName, this.taken);
    }
  }

  private problem(): string | null {
    if (!isPlainName(this.name)) return importMsg.badName(this.name);
    if (this.taken.has(this.name)) return importMsg.nameTaken(this.name);
    return null;
  }

  private submit(e: Event): void {
    e.preventDefault();
    if (this.problem() !== null) return;
    const detail: ImportChoice = { sheet: this.sheet, name: this.name };
    this.dispatchEvent(new CustomEvent('furrow-import-add', { detail, bubbles: true, composed: true }));
  }

  private cancel(): void {
    this.dispatchEvent(new CustomEvent('furrow-import-cancel', { bubbles: true, composed: true }));
  }

  override render() {
    const src = this.source;
    if (src === null) return html``;
    const sheet = src.sheets[this.sheet];
    const problem = this.problem();
    const columns = sheet === undefined ? [] : sheet.header.slice(0, PREVIEW_COLUMNS);
    const more = sheet === undefined ? 0 : sheet.header.length - columns.length;
    return html`
      <form @submit=${(e: Event) => this.submit(e)} aria-label=${importMsg.offerTitle(src.fileName)}>
        <h2>${importMsg.offerTitle(src.fileName)}</h2>
        ${src.sheets.length > 1
          ? html`<label
              >${importMsg.sheetLabel()}
              <select
                class="sheet"
                @change=${(e: Event) => {
                  this.sheet = Number((e.target as HTMLSelectElement).value);
                }}
              >
                ${src.sheets.map((s, i) => html`<option value=${i} ?selected=${i === this.sheet}>${s.label}</option>`)}
              </select></label
            >`
          : null}
        ${sheet === undefined
          ? null
          : html`<div class="size">${importMsg.sheetSize(sheet.rows.length, sheet.header.length)}</div>
              <div class="columns">${importMsg.preview(more > 0 ? [...columns, `… ${more} more`] : columns)}</div>`}
        <label
          >${importMsg.nameLabel()}
          <input
            class="name"
            .value=${this.name}
            spellcheck="false"
            aria-invalid=${problem !== null ? 'true' : 'false'}
            @input=${(e: Event) => {
              this.name = (e.target as HTMLInputElement).value.trim();
              this.named = true;
            }}
        /></label>
        ${problem !== null ? html`<div class="problem" role="alert">${problem}</div>` : null}
        <div class="actions">
          <button type="submit" class="add" ?disabled=${problem !== null}>${importMsg.add()}</button>
          <button type="button" class="cancel" @click=${() => this.cancel()}>${importMsg.cancel()}</button>
        </div>
      </form>
    `;
  }
}

if (!customElements.get('furrow-import-offer')) customElements.define('furrow-import-offer', ImportOffer);
