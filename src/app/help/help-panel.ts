/**
 * `<furrow-help>`: the built-in functions at hand, drawn from the one registry (each entry's
 * name, category, signature, doc, parameters and example, as the worker sends them), with a
 * search box, the categories as filters, a button that adds an example as a new formula cell
 * (fitted to the open document, see help-model.ts) and the keys that work on cells.
 *
 * It changes nothing itself: adding an example dispatches `furrow-help-insert` with the
 * formula's text and the built-in's name, and the shell adds the cell.
 */
import { css, html, LitElement, nothing } from 'lit';
import type { BuiltinInfo, NameCatalogue } from '../../../cells/view-api.ts';
import { startMsg, shellWords } from '../../messages/page.ts';
import { shared } from '../../views/theme.ts';
import { CELL_KEYS } from '../cell-keys.ts';
import { byCategory, fitExample, searchBuiltins } from './help-model.ts';

/** The event that asks the shell to add an example as a cell. */
export const HELP_INSERT_EVENT = 'furrow-help-insert';

/** Detail of {@link HELP_INSERT_EVENT}. */
export interface HelpInsertDetail {
  readonly text: string;
  readonly fn: string;
}

/** The event that asks the shell to close the panel. */
export const HELP_CLOSE_EVENT = 'furrow-help-close';

/** A doc's text with its `backticked` names drawn as code (lit escapes every piece). */
function withCode(text: string) {
  return text.split(/`([^`]+)`/).map((piece, i) => (i % 2 === 1 ? html`<code>${piece}</code>` : piece));
}

export class FurrowHelp extends LitElement {
  static override properties = {
    catalogue: { attribute: false },
    query: { state: true },
    category: { state: true },
    opened: { state: true },
  };

  /** The built-ins and the document's names (to fit examples). */
  declare catalogue: NameCatalogue;
  declare query: string;
  declare category: string | null;
  /** The entries shown open, by name. */
  declare opened: ReadonlySet<string>;

  constructor() {
    super();
    this.catalogue = { builtins: [], cells: [] };
    this.query = '';
    this.category = null;
    this.opened = new Set();
    // Escape closes the panel (a search being typed is cleared first, by the search box)
    this.addEventListener('keydown', (e: KeyboardEvent) => {
      if (e.key === 'Escape') this.close();
    });
  }

  private close(): void {
    this.dispatchEvent(new CustomEvent(HELP_CLOSE_EVENT, { bubbles: true, composed: true }));
  }

  /** Puts the caret in the search box (when the panel opens). */
  async focusSearch(): Promise<void> {
    await this.updateComplete;
    const input = this.renderRoot.querySelector<HTMLInputElement>('input[type="search"]');
    input?.focus();
    input?.select();
  }

  static override styles = [
    shared,
    css`
      :host {
        display: flex;
        flex-direction: column;
        box-sizing: border-box;
        height: 100%;
        background: var(--sheet);
        border-left: 3px solid var(--accent);
        font-size: 0.86rem;
        color: var(--ink);
      }
      .head {
        display: flex;
        align-items: baseline;
        gap: 0.5rem;
        padding: 0.7rem 0.9rem 0.4rem;
      }
      h2 {
        margin: 0;
        font-family: var(--font-text);
        font-size: 1.1rem;
        font-weight: 600;
      }
      .count {
        color: var(--muted);
        font-size: 0.75rem;
      }
      .close {
        margin-left: auto;
        border: none;
        background: none;
        font-size: 1rem;
        cursor: pointer;
        color: var(--ink-soft);
      }
      .find {
        padding: 0 0.9rem 0.4rem;
      }
      .find input {
        box-sizing: border-box;
        width: 100%;
        font: inherit;
        padding: 0.3rem 0.5rem;
        border: 1px solid var(--rule-strong);
        border-radius: var(--radius);
        background: var(--paper);
      }
      .find input:focus {
        outline: 2px solid var(--accent-soft);
        border-color: var(--accent);
      }
      .groups {
        display: flex;
        flex-wrap: wrap;
        gap: 0.25rem;
        padding: 0 0.9rem 0.5rem;
        border-bottom: 1px solid var(--rule);
      }
      .groups button {
        font: inherit;
        font-size: 0.75rem;
        padding: 0.05rem 0.45rem;
        border: 1px solid var(--rule-strong);
        border-radius: 0.8rem;
        background: none;
        color: var(--ink-soft);
        cursor: pointer;
      }
      .groups button[aria-pressed='true'] {
        background: var(--accent);
        border-color: var(--accent);
        color: var(--sheet);
      }
      .list {
        flex: 1;
        overflow-y: auto;
        padding: 0.3rem 0.9rem 1rem;
      }
      h3 {
        margin: 0.8rem 0 0.2rem;
        font-size: 0.72rem;
        font-weight: 600;
        letter-spacing: 0.08em;
        text-transform: uppercase;
        color: var(--muted);
      }
      details {
        border-bottom: 1px solid var(--rule);
      }
      summary {
        cursor: pointer;
        padding: 0.3rem 0;
        list-style: none;
        display: flex;
        gap: 0.5rem;
        align-items: baseline;
      }
      summary::-webkit-details-marker {
        display: none;
      }
      summary::before {
        content: '▸';
        color: var(--muted);
        font-size: 0.7rem;
      }
      details[open] summary::before {
        content: '▾';
      }
      summary code {
        font-family: var(--font-code);
        color: var(--accent);
        font-weight: 600;
      }
      summary .gist {
        color: var(--ink-soft);
        overflow: hidden;
        text-overflow: ellipsis;
        white-space: nowrap;
        min-width: 0;
      }
      .entry {
        padding: 0 0 0.6rem 1rem;
      }
      .signature {
        display: block;
        font-family: var(--font-code);
        font-size: 0.82rem;
        background: var(--paper);
        padding: 0.3rem 0.5rem;
        border-radius: var(--radius);
        overflow-wrap: anywhere;
      }
      .entry p {
        margin: 0.4rem 0 0;
        line-height: 1.45;
      }
      dl {
        margin: 0.4rem 0 0;
        display: grid;
        grid-template-columns: max-content 1fr;
        gap: 0.15rem 0.6rem;
      }
      dt {
        font-family: var(--font-code);
        font-size: 0.8rem;
      }
      dd {
        margin: 0;
        color: var(--ink-soft);
      }
      .returns {
        color: var(--ink-soft);
      }
      .entry p code,
      dd code,
      .gist code {
        font-family: var(--font-code);
        font-size: 0.9em;
        background: var(--paper);
        padding: 0 0.15em;
        border-radius: 2px;
      }
      .example {
        margin-top: 0.5rem;
        padding: 0.4rem 0.5rem;
        border: 1px dashed var(--rule-strong);
        border-radius: var(--radius);
      }
      .example code {
        display: block;
        font-family: var(--font-code);
        font-size: 0.82rem;
        overflow-wrap: anywhere;
      }
      .example .label {
        font-size: 0.72rem;
        color: var(--muted);
      }
      .example .fit {
        font-size: 0.78rem;
        color: var(--ink-soft);
      }
      .example .fit.lacking {
        color: var(--upstream);
      }
      .example button {
        margin-top: 0.35rem;
        font: inherit;
        font-size: 0.8rem;
        padding: 0.15rem 0.6rem;
        border: 1px solid var(--accent);
        border-radius: var(--radius);
        background: var(--accent-soft);
        color: var(--ink);
        cursor: pointer;
      }
      .none {
        color: var(--muted);
        font-style: italic;
      }
      table.keys {
        border-collapse: collapse;
        width: 100%;
      }
      table.keys td {
        padding: 0.2rem 0.4rem 0.2rem 0;
        border-bottom: 1px solid var(--rule);
        vertical-align: top;
      }
      kbd {
        font-family: var(--font-code);
        font-size: 0.76rem;
        white-space: nowrap;
        padding: 0 0.25rem;
        border: 1px solid var(--rule-strong);
        border-radius: 3px;
        background: var(--paper);
      }
      .keys-note {
        color: var(--muted);
        font-size: 0.75rem;
        margin: 0.2rem 0 0.3rem;
      }
    `,
  ];

  private toggle(name: string, open: boolean): void {
    const next = new Set(this.opened);
    if (open) next.add(name);
    else next.delete(name);
    this.opened = next;
  }

  private insert(text: string, fn: string): void {
    this.dispatchEvent(new CustomEvent<HelpInsertDetail>(HELP_INSERT_EVENT, { detail: { text, fn }, bubbles: true, composed: true }));
  }

  override render() {
    const all = this.catalogue.builtins;
    const found = searchBuiltins(all, this.query, this.category);
    const searching = this.query.trim() !== '';
    const groups = byCategory(all);
    return html`
      <div class="head">
        <h2 id="help-heading">${startMsg.helpHeading()}</h2>
        <span class="count">${startMsg.helpCount(found.length, all.length)}</span>
        <button class="close" aria-label=${startMsg.helpClose()} title=${startMsg.helpClose()} @click=${() => this.close()}>✕</button>
      </div>
      <div class="find">
        <input
          type="search"
          aria-label=${startMsg.helpSearch()}
          placeholder=${startMsg.helpSearchPlaceholder()}
          spellcheck="false"
          .value=${this.query}
          @input=${(e: Event) => (this.query = (e.target as HTMLInputElement).value)}
          @keydown=${(e: KeyboardEvent) => {
            if (e.key === 'Escape' && this.query !== '') {
              e.stopPropagation();
              this.query = '';
            }
          }}
        />
      </div>
      <div class="groups" role="group" aria-label=${shellWords.categories}>
        <button aria-pressed=${this.category === null ? 'true' : 'false'} @click=${() => (this.category = null)}>${startMsg.helpAll()}</button>
        ${groups.map(
          (g) => html`<button aria-pressed=${this.category === g.category ? 'true' : 'false'} @click=${() => (this.category = this.category === g.category ? null : g.category)}>${g.category}</button>`,
        )}
      </div>
      <div class="list" role="region" aria-labelledby="help-heading">
        ${found.length === 0 ? html`<p class="none">${startMsg.helpNothingFound(this.query.trim())}</p>` : nothing}
        ${searching
          ? found.map((b) => this.renderEntry(b, found.length === 1))
          : groups
              .filter((g) => this.category === null || g.category === this.category)
              .map((g) => html`<h3>${g.category}</h3>${g.builtins.map((b) => this.renderEntry(b, false))}`)}
        <h3>${startMsg.helpKeysHeading()}</h3>
        <p class="keys-note">${startMsg.helpKeysNote()}</p>
        <table class="keys">
          ${CELL_KEYS.map((k) => html`<tr><td><kbd>${k.keys}</kbd></td><td>${k.does}</td></tr>`)}
        </table>
      </div>
    `;
  }

  private renderEntry(b: BuiltinInfo, openAlone: boolean) {
    const open = openAlone || this.opened.has(b.name);
    const gist = b.doc.replace(/\s+/g, ' ').split(/(?<=[.!?])\s/)[0] ?? '';
    return html`<details data-builtin=${b.name} ?open=${open} @toggle=${(e: Event) => this.toggle(b.name, (e.target as HTMLDetailsElement).open)}>
      <summary><code>${b.name}</code><span class="gist">${withCode(gist)}</span></summary>
      ${open ? this.renderBody(b) : nothing}
    </details>`;
  }

  private renderBody(b: BuiltinInfo) {
    return html`<div class="entry">
      <code class="signature">${b.signature}</code>
      <p>${withCode(b.doc)}</p>
      ${b.params.length > 0
        ? html`<dl>
            ${b.params.map((p) => html`<dt>${p.name}</dt><dd>${p.description}${p.doc !== '' ? html`: ${withCode(p.doc)}` : nothing}</dd>`)}
          </dl>`
        : nothing}
      ${b.returns !== '' ? html`<p class="returns">${startMsg.helpReturns(b.returns)}</p>` : nothing}
      ${b.example !== undefined && b.example !== '' ? this.renderExample(b, b.example) : nothing}
    </div>`;
  }

  private renderExample(b: BuiltinInfo, example: string) {
    const fit = fitExample(example, this.catalogue.cells);
    const label =
      fit.renamed.length > 0 ? startMsg.helpInsertAdapted(fit.renamed.map(([from]) => from).join(', '), fit.renamed.map(([, to]) => to).join(', ')) : startMsg.helpInsert();
    return html`<div class="example">
      <span class="label">${startMsg.helpExample()}</span>
      <code>${fit.text}</code>
      ${fit.reads.length > 0
        ? html`<div class="fit ${fit.missing.length > 0 ? 'lacking' : ''}" role="note">
            ${startMsg.helpNeeds(fit.reads.join('; '))}
            ${fit.missing.length > 0 ? startMsg.helpMissing(fit.missing.join('; ')) : startMsg.helpReady()}
          </div>`
        : nothing}
      <button title=${startMsg.helpInsertTitle()} @click=${() => this.insert(fit.text, b.name)}>${label}</button>
    </div>`;
  }
}

if (!customElements.get('furrow-help')) customElements.define('furrow-help', FurrowHelp);
