/**
 * The note cell's view: Markdown rendered through a sanitizer, with `{expression}`
 * placeholders showing live values. Double-click (or Enter on the focused note) opens the
 * text for editing; leaving the editor shows the rendered note again.
 *
 * A note from someone else's document is data: raw HTML written in it is shown as text, so
 * no tag its author wrote reaches a parser; the Markdown is rendered by marked and then
 * sanitized by DOMPurify with an allow-list of what Markdown makes (javascript: links,
 * remote images and the page's own classes removed); live values go in afterwards as DOM
 * nodes holding text.
 */
import DOMPurify from 'dompurify';
import { LitElement, css, html, nothing, type PropertyValues } from 'lit';
import { freshBody, visibleBody, type Cell } from '../../src/doc/document.ts';
import { isError, type Value } from '../../src/lang/values.ts';
import { shared } from '../../src/views/theme.ts';
import { emitEdit, type CellViewState, type NameCatalogue } from '../view-api.ts';
import { sheetWords, startMsg } from '../../src/messages/page.ts';
import { MAX_NOTE_PLACEHOLDERS, groupNoteProblems, listedPlaceholders, placeholderCount, placeholderText, splitNote } from './model.ts';
import { msg } from '../../src/messages/language.ts';
import { ATTRIBUTE_SLOT, MARKDOWN_ELEMENTS, PRIVATE_MARKS, SLOT, SLOT_OPEN, notePiecesHtml, type Placeholder } from './markdown.ts';

/**
 * The sanitizer keeps only what Markdown makes (MARKDOWN_ELEMENTS): no attribute the page uses
 * for its own marks (class, data-*, a fake live value), and no address but a link's href and a
 * picture's src, both narrowed by the hook below. Attributes are checked per element.
 */
const ALLOWED_TAGS = [...MARKDOWN_ELEMENTS.keys()];
const ALLOWED_ATTR = [...new Set([...MARKDOWN_ELEMENTS.values()].flat())];

let hooksInstalled = false;
function installHooks(): void {
  if (hooksInstalled) return;
  hooksInstalled = true;
  DOMPurify.addHook('uponSanitizeAttribute', (node, data) => {
    // an attribute one element may carry is not allowed on every other (a src on a table)
    const allowed = MARKDOWN_ELEMENTS.get(node.nodeName.toLowerCase());
    if (allowed === undefined || !allowed.includes(data.attrName)) data.keepAttr = false;
  });
  DOMPurify.addHook('afterSanitizeAttributes', (node) => {
    // by nodeName rather than instanceof: the sanitizer's parse document may be another realm
    if (node.nodeName === 'A') {
      const href = node.getAttribute('href') ?? '';
      if (!/^(https?:|mailto:|#)/i.test(href)) node.removeAttribute('href');
      node.setAttribute('target', '_blank');
      node.setAttribute('rel', 'noopener noreferrer');
    }
    if (node.nodeName === 'IMG') {
      // a document may carry its own pictures, but never makes the page fetch anything
      const src = node.getAttribute('src') ?? '';
      if (!/^data:image\/(png|jpeg|gif|webp);base64,/i.test(src)) node.removeAttribute('src');
    }
  });
}

/**
 * A note's Markdown as sanitized DOM, with each placeholder an empty slot element that the
 * view fills with text. Live values are put in as DOM nodes after sanitizing, never spliced
 * into HTML text: a placeholder that landed inside an attribute (a link's address, an
 * image's description) is shown there as its source, and cannot end the tag. Exported for
 * tests.
 */
export function renderNote(text: string): { fragment: DocumentFragment; placeholders: Placeholder[]; tooMany: number | null } {
  installHooks();
  const pieces = splitNote(text);
  const count = placeholderCount(pieces);
  if (count > MAX_NOTE_PLACEHOLDERS) {
    // past the limit the note is its text, in one element: no Markdown, no slots
    const fragment = document.createDocumentFragment();
    const pre = document.createElement('pre');
    pre.textContent = text;
    fragment.append(pre);
    return { fragment, placeholders: [], tooMany: count };
  }
  const { html: raw, placeholders } = notePiecesHtml(pieces);
  const fragment = DOMPurify.sanitize(raw, {
    RETURN_DOM_FRAGMENT: true,
    ALLOWED_TAGS,
    ALLOWED_ATTR,
    ALLOW_DATA_ATTR: false,
    ALLOW_ARIA_ATTR: false,
  });
  placeSlots(
    fragment,
    placeholders.map((p) => p.raw.replace(PRIVATE_MARKS, '')),
  );
  return { fragment, placeholders, tooMany: null };
}

/**
 * Replaces the markers in text nodes by slot elements, and in attributes (where marked may
 * have percent-encoded them) by the placeholder's source. Exported for tests.
 */
export function placeSlots(root: DocumentFragment, sources: readonly string[]): void {
  const doc = root.ownerDocument;
  const texts: Text[] = [];
  const walk = (node: Node): void => {
    for (const child of Array.from(node.childNodes)) {
      if (child.nodeType === 3) texts.push(child as Text);
      else if (child.nodeType === 1) {
        const el = child as Element;
        for (const attr of Array.from(el.attributes)) {
          const shown = attr.value.replace(ATTRIBUTE_SLOT, (_m, i: string) => sources[Number(i)] ?? '');
          if (shown !== attr.value) el.setAttribute(attr.name, shown);
        }
        walk(el);
      }
    }
  };
  walk(root);
  for (const t of texts) {
    const value = t.data;
    if (!value.includes(SLOT_OPEN)) continue;
    const parts = value.split(SLOT);
    // split with a capturing group: text, index, text, index, ..., text; gathered in a
    // fragment, not spread into replaceWith's arguments, which overflow the stack past about
    // a hundred thousand (a note of 166,666 placeholders did, and the page kept the old note)
    const pieces = doc.createDocumentFragment();
    parts.forEach((part, k) => {
      if (k % 2 === 0) {
        if (part !== '') pieces.append(doc.createTextNode(part));
      } else {
        const span = doc.createElement('span');
        span.className = 'slot';
        span.dataset.slot = String(Number(part));
        pieces.append(span);
      }
    });
    t.replaceWith(pieces);
  }
}

/** `<furrow-note-cell>`: a Markdown note with live values. */
export class NoteCellView extends LitElement {
  static override properties = {
    cell: { attribute: false },
    state: { attribute: false },
    catalogue: { attribute: false },
    editing: { state: true },
  };

  declare cell: Cell;
  declare state: CellViewState | null;
  declare catalogue: NameCatalogue;
  declare editing: boolean;

  /** The rendered text and its placeholders, made once per change of the text. */
  private rendered: { body: string; node: HTMLElement; placeholders: readonly Placeholder[]; tooMany: number | null } | null = null;

  constructor() {
    super();
    this.state = null;
    this.editing = false;
  }

  static override styles = [
    shared,
    css`
      :host {
        display: block;
      }
      .prose {
        font-family: var(--font-text);
        font-size: 1.06rem;
        line-height: 1.55;
        color: var(--ink);
        padding: 0.15rem 0;
        cursor: text;
        min-height: 1.4em;
      }
      .prose :first-child {
        margin-top: 0;
      }
      .prose :last-child {
        margin-bottom: 0;
      }
      .prose h1,
      .prose h2,
      .prose h3 {
        font-family: var(--font-text);
        font-weight: 600;
        line-height: 1.25;
        margin: 0.9em 0 0.4em;
      }
      .prose h1 {
        font-size: 1.5rem;
      }
      .prose h2 {
        font-size: 1.25rem;
      }
      .prose h3 {
        font-size: 1.08rem;
      }
      .prose p {
        margin: 0.5em 0;
      }
      .prose code {
        font-family: var(--font-code);
        font-size: 0.88em;
        background: var(--paper);
        padding: 0 0.2em;
        border-radius: 2px;
      }
      .prose table {
        border-collapse: collapse;
        font-variant-numeric: tabular-nums;
      }
      .prose th,
      .prose td {
        border-bottom: 1px solid var(--rule);
        padding: 0.2em 0.6em;
      }
      .prose a {
        color: var(--accent);
      }
      .slot {
        font-variant-numeric: tabular-nums lining-nums;
        font-weight: 600;
        color: var(--accent);
        background: var(--accent-soft);
        border-radius: 3px;
        padding: 0 0.18em;
      }
      .slot.failed {
        color: var(--error);
        background: var(--error-soft);
        font-weight: 400;
        font-family: var(--font-code);
        font-size: 0.85em;
      }
      .slot.upstream {
        color: var(--upstream);
        background: var(--upstream-soft);
      }
      .slot.pending {
        opacity: 0.55;
      }
      .empty {
        color: var(--muted);
        font-style: italic;
      }
      textarea {
        box-sizing: border-box;
        width: 100%;
        min-height: 6rem;
        font-family: var(--font-code);
        font-size: 0.9rem;
        line-height: 1.5;
        color: var(--ink);
        background: var(--sheet);
        border: 1px solid var(--rule-strong);
        border-radius: var(--radius);
        padding: 0.5rem 0.6rem;
        resize: vertical;
      }
      textarea:focus {
        outline: 2px solid var(--accent-soft);
        border-color: var(--accent);
      }
      .hint {
        font-size: 0.75rem;
        color: var(--muted);
        margin-top: 0.2rem;
      }
      .problems {
        margin: 0.3rem 0 0;
        padding: 0;
        list-style: none;
        font-size: 0.82rem;
      }
      .problems li {
        color: var(--error);
      }
      .problems li.upstream {
        color: var(--upstream);
      }
      @media print {
        .hint {
          display: none;
        }
        .slot {
          background: none;
        }
      }
    `,
  ];

  override render() {
    const text = visibleBody(this.cell);
    if (this.editing) {
      return html`<textarea
          aria-label=${sheetWords.noteEditorLabel()}
          placeholder=${startMsg.notePrompt()}
          @input=${this.onInput}
          @keydown=${this.onKeydown}
          @blur=${() => this.finishEditing()}
        ></textarea>
        <div class="hint">Markdown. <code>{expression}</code> shows a live value, <code>\\{</code> a brace. Escape or click outside to finish.</div>`;
    }
    if (this.rendered === null || this.rendered.body !== this.cell.body) {
      // one container per text, kept across renders, so lit moves no nodes when only values change
      const node = document.createElement('div');
      node.className = 'markdown';
      const r = renderNote(text);
      node.append(r.fragment);
      this.rendered = { body: this.cell.body, node, placeholders: r.placeholders, tooMany: r.tooMany };
    }
    const problems = groupNoteProblems(
      this.state?.parts ?? [],
      this.rendered.placeholders.map((p) => p.source),
    );
    return html`<div
        class="prose"
        tabindex="0"
        role="document"
        aria-label=${sheetWords.noteLabel()}
        @dblclick=${() => this.startEditing()}
        @keydown=${(e: KeyboardEvent) => {
          if (e.key === 'Enter' && e.target === e.currentTarget) {
            e.preventDefault();
            this.startEditing();
          }
        }}
      >
        ${text.trim() === '' ? html`<span class="empty">${startMsg.notePrompt()} <span class="hint">${startMsg.emptyNote()}</span></span>` : this.rendered.node}
      </div>
      ${this.rendered.tooMany !== null ? html`<ul class="problems"><li>${msg.tooManyPlaceholders(this.rendered.tooMany, MAX_NOTE_PLACEHOLDERS)}</li></ul>` : nothing}
      ${problems.length > 0
        ? html`<ul class="problems">
            ${problems.map(
              (p) =>
                html`<li class=${p.upstream ? 'upstream' : ''}>
                  ${this.placeholderList(p.placeholders)}: ${p.message}
                </li>`,
            )}
          </ul>`
        : nothing}`;
  }

  override updated(changed: PropertyValues): void {
    super.updated(changed);
    if (this.editing) return;
    const parts = this.state?.parts ?? [];
    const pending = this.state?.status === 'pending';
    for (const el of this.renderRoot.querySelectorAll<HTMLElement>('[data-slot]')) {
      const i = Number(el.dataset.slot);
      const v: Value | undefined = parts[i];
      el.classList.toggle('pending', pending);
      if (v === undefined) {
        el.textContent = '…';
        el.classList.remove('failed', 'upstream');
        continue;
      }
      if (isError(v)) {
        el.textContent = `{${this.placeholderSource(i)}}`;
        el.title = v.message;
        el.classList.add('failed');
        el.classList.toggle('upstream', v.upstream !== null);
      } else {
        el.textContent = placeholderText(this.placeholderSource(i), v);
        el.removeAttribute('title');
        el.classList.remove('failed', 'upstream');
      }
    }
  }

  /** The placeholders of one problem line, the first few by name and the rest counted. */
  private placeholderList(placeholders: readonly string[]): unknown {
    const { listed, more } = listedPlaceholders(placeholders);
    return html`${listed.map((s, k) => html`${k === 0 ? '' : ', '}<code>{${s}}</code>`)}${more > 0 ? ` ${startMsg.morePlaceholders(more)}` : ''}`;
  }

  private placeholderSource(i: number): string {
    return this.rendered?.placeholders[i]?.source ?? '';
  }

  /** Opens the note for writing and puts the caret in it (a new note, a key from the shell). */
  async focusEditor(): Promise<void> {
    this.startEditing();
    await this.updateComplete;
  }

  private startEditing(): void {
    this.editing = true;
    void this.updateComplete.then(() => {
      // the text is set once, not bound: while typing, the textarea is the authority
      const ta = this.renderRoot.querySelector('textarea');
      if (ta) {
        ta.value = visibleBody(this.cell);
        ta.focus();
      }
    });
  }

  private finishEditing(): void {
    this.editing = false;
  }

  private onInput(e: Event): void {
    const text = (e.target as HTMLTextAreaElement).value;
    emitEdit(this, { type: 'body', id: this.cell.id, body: freshBody(text) }, `body:${this.cell.id}`);
  }

  private onKeydown(e: KeyboardEvent): void {
    if (e.key === 'Escape') {
      e.preventDefault();
      this.finishEditing();
      return;
    }
    const mod = e.ctrlKey || e.metaKey;
    if (mod && (e.key === 'z' || e.key === 'Z' || e.key === 'y')) {
      // the document keeps one history for every edit; the textarea's own would fight it
      e.preventDefault();
      const redo = e.key === 'y' || e.shiftKey;
      this.dispatchEvent(new CustomEvent(redo ? 'furrow-redo' : 'furrow-undo', { bubbles: true, composed: true }));
    }
  }

  override willUpdate(changed: PropertyValues): void {
    // an undo while editing: take the new text without emitting an edit
    if (changed.has('cell') && this.editing) {
      const ta = this.renderRoot.querySelector('textarea');
      const text = visibleBody(this.cell);
      if (ta && freshBody(ta.value) !== this.cell.body) ta.value = text;
    }
  }
}

if (!customElements.get('furrow-note-cell')) customElements.define('furrow-note-cell', NoteCellView);
