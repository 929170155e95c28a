/**
 * A note's Markdown as HTML text, without a DOM: the part of a note's rendering that the
 * page (cells/note/view.ts, which then sanitizes with DOMPurify and puts live values in as
 * DOM nodes) and the report (src/report, which sanitizes with its own allow-list) share.
 *
 * Raw HTML written in a note comes out as visible text: no tag a document's author wrote
 * ever reaches an HTML parser. Each `{placeholder}` becomes a marker made of private-use
 * characters, which the caller replaces by the live value. Rendering time is bounded for
 * hostile notes (see EMPHASIS_MARKS_PER_PARAGRAPH and NOTE_MARKDOWN_LIMIT).
 */
import { Marked } from 'marked';
import { splitNote, type NotePiece } from './model.ts';

/** A placeholder of a note, as splitNote gives it. */
export type Placeholder = Extract<NotePiece, { type: 'placeholder' }>;

/**
 * Markers for placeholders while the Markdown is rendered: characters from the private-use
 * area, which a note's own text never keeps (see `markdownSource`).
 */
export const SLOT_OPEN = '\uE000';
export const SLOT_CLOSE = '\uE001';
export const SLOT = /\uE000(\d+)\uE001/g;
export const PRIVATE_MARKS = /[\uE000\uE001]/g;
/** A marker as it may stand in an attribute: raw, or percent-encoded in an address. */
export const ATTRIBUTE_SLOT = /(?:\uE000|%EE%80%80)(\d+)(?:\uE001|%EE%80%81)/gi;

/**
 * The elements a note's Markdown makes, with the attributes each may keep: the allow-list of
 * both sanitizers, the page's (cells/note/view.ts) and the report's (src/report/sanitize.ts).
 * The only attributes that carry an address are a link's href and a picture's src, and each
 * sanitizer narrows their values further; nothing here makes a browser fetch anything.
 */
export const MARKDOWN_ELEMENTS: ReadonlyMap<string, readonly string[]> = new Map([
  ['p', []],
  ['h1', []],
  ['h2', []],
  ['h3', []],
  ['h4', []],
  ['h5', []],
  ['h6', []],
  ['em', []],
  ['strong', []],
  ['del', []],
  ['code', []],
  ['pre', []],
  ['blockquote', []],
  ['ul', []],
  ['ol', ['start']],
  ['li', []],
  ['a', ['href', 'title']],
  ['img', ['src', 'alt', 'title']],
  ['table', []],
  ['thead', []],
  ['tbody', []],
  ['tr', []],
  ['th', ['align']],
  ['td', ['align']],
  ['hr', []],
  ['br', []],
]);

/**
 * Emphasis marks (`*`, `_`, `~`) a paragraph may hold before they are shown as written. The
 * Markdown renderer pairs emphasis marks in time that grows with the square of their number
 * in one paragraph (measured: 20,000 marks took 2.3 s, 500,000 over seven minutes); no note
 * a person writes comes near this, and a hostile one must not freeze the page.
 */
export const EMPHASIS_MARKS_PER_PARAGRAPH = 1000;
/** Longest note rendered as Markdown; a longer one is shown as plain text. */
export const NOTE_MARKDOWN_LIMIT = 200_000;

/**
 * A Markdown renderer of our own instance (the shared `marked` object stays untouched) that
 * writes raw HTML from the note as visible text: Markdown covers what a note needs, and no
 * tag a document's author wrote ever reaches an HTML parser in the page.
 */
const markdown = new Marked({ gfm: true, async: false });
markdown.use({
  renderer: {
    // a block of raw HTML reads as a paragraph of its text; inline tags as their text
    html: ({ text, block }) => (block ? `<p>${escapeHtml(text.replace(/\s+$/, ''))}</p>\n` : escapeHtml(text)),
  },
});

export function escapeHtml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => (c === '&' ? '&amp;' : c === '<' ? '&lt;' : c === '>' ? '&gt;' : c === '"' ? '&quot;' : '&#39;'));
}

function emphasisMarks(s: string): number {
  let n = 0;
  for (let i = 0; i < s.length; i++) {
    const c = s.charCodeAt(i);
    if (c === 42 || c === 95 || c === 126) n++;
  }
  return n;
}

/** Paragraphs with too many emphasis marks get them escaped, so they read as written. */
function boundEmphasis(md: string): string {
  if (emphasisMarks(md) <= EMPHASIS_MARKS_PER_PARAGRAPH) return md;
  return md
    .split(/(\n[ \t]*\n)/)
    .map((block) => (emphasisMarks(block) > EMPHASIS_MARKS_PER_PARAGRAPH ? block.replace(/[*_~]/g, '\\$&') : block))
    .join('');
}

/** The Markdown a note renders: placeholders become markers, stray private marks are dropped. */
function markdownSource(pieces: readonly NotePiece[]): { md: string; slots: number } {
  let md = '';
  let slots = 0;
  for (const p of pieces) {
    if (p.type === 'text') md += p.text.replace(PRIVATE_MARKS, '\uFFFD');
    else md += `${SLOT_OPEN}${slots++}${SLOT_CLOSE}`;
  }
  return { md: boundEmphasis(md), slots };
}

/** Markdown to HTML, or, past the limits, the text escaped in one preformatted block. */
function markdownHtml(md: string): string {
  const plain = (): string => `<pre>${escapeHtml(md)}</pre>`;
  if (md.length > NOTE_MARKDOWN_LIMIT) return plain();
  try {
    return markdown.parse(md) as string;
  } catch (err) {
    // thousands of nested quotes or lists exhaust the renderer's stack: show the text as written
    if (err instanceof RangeError || (err instanceof Error && /call stack/i.test(err.message))) return plain();
    throw err;
  }
}

/** A note's pieces rendered: the HTML with markers, and the placeholders in order. */
export function notePiecesHtml(pieces: readonly NotePiece[]): { html: string; placeholders: Placeholder[] } {
  return {
    html: markdownHtml(markdownSource(pieces).md),
    placeholders: pieces.filter((p): p is Placeholder => p.type === 'placeholder'),
  };
}

/**
 * A note's Markdown as HTML text before sanitizing, with a marker for each placeholder and
 * every raw tag of the note escaped. No DOM needed.
 */
export function noteMarkdownHtml(text: string): { html: string; slots: number } {
  const r = notePiecesHtml(splitNote(text));
  return { html: r.html, slots: r.placeholders.length };
}

/** The source of each placeholder, braces included, as a note shows a failed one. */
export function placeholderSources(text: string): string[] {
  return splitNote(text).flatMap((p) => (p.type === 'placeholder' ? [p.raw.replace(PRIVATE_MARKS, '')] : []));
}
