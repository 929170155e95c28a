/**
 * The title block above the cells: the document's title, edited in place (Enter ends the
 * edit, as a title holds one line), the author, and the caution the document asks to show
 * before its results.
 */
import { html, nothing, type TemplateResult } from 'lit';
import { startMsg, shellWords } from '../messages/page.ts';

/** `fields` are the document's header fields; `setTitle` gets the title as changed. */
export function titleBlock(fields: ReadonlyMap<string, string>, setTitle: (title: string) => void): TemplateResult {
  return html`<header>
    <textarea
      class="title"
      rows="1"
      aria-label=${shellWords.titleLabel}
      placeholder=${startMsg.titlePlaceholder()}
      .value=${fields.get('title')?.trim() ?? ''}
      @change=${(e: Event) => setTitle((e.target as HTMLTextAreaElement).value)}
      @keydown=${(e: KeyboardEvent) => {
        if (e.key === 'Enter') {
          e.preventDefault();
          (e.target as HTMLTextAreaElement).blur();
        }
      }}
    ></textarea>
    ${fields.get('author') ? html`<div class="byline">${fields.get('author')}</div>` : nothing}
    ${fields.get('caution') ? html`<div class="caution" role="note"><b>${shellWords.caution}</b>${fields.get('caution')}</div>` : nothing}
  </header>`;
}
