/**
 * A note's Markdown as HTML text, without a DOM: the part of a note's rendering that the
 * page (cells/note/view.ts, which then sanitizes with DOMPurify and puts live values in as
 * DOM nodes) and the report (src/report, which sanitizes with its own allow-list) share.
 *
 * Raw HTML written in a note comes out as visible text: no tag a document's author wrote
 * ever reaches an HTML parser. Each `{placeholder}` becomes a marker made of private-use
 * characters, which the caller replaces by the live value.
 */
import { Marked } from 'marked';
import { splitNote } from './model.ts';

/**
 * Markers for placeholders while the Markdown is rendered: characters from the private-use
 * area, which a note's own text never keeps (see `markdownSource`).
 */
export const SLOT_OPEN = '\uE000';
export const SLOT_CLOSE = '\uE001';
export const SLOT = /\uE000(\d+)\uE001/g;
const PRIVATE_MARKS = /[\uE000\uE001]/g;
/** A marker as it may stand in an attribute: raw, or percent-encoded in an address. */
export const ATTRIBUTE_SLOT = /(?:\uE000|%EE%80%80)(\d+)(?:\uE001|%EE%80%81)/gi;

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

/** The Markdown a note renders: placeholders become markers, stray private marks are dropped. */
function markdownSource(text: string): { md: string; slots: number } {
  let md = '';
  let slots = 0;
  for (const p of splitNote(text)) {
    if (p.type === 'text') md += p.text.replace(PRIVATE_MARKS, '\uFFFD');
    else md += `${SLOT_OPEN}${slots++}${SLOT_CLOSE}`;
  }
  return { md, slots };
}

/**
 * A note's Markdown as HTML text before sanitizing, with a marker for each placeholder and
 * every raw tag of the note escaped. No DOM needed. Exported for tests.
 */
export function noteMarkdownHtml(text: string): { html: string; slots: number } {
  const { md, slots } = markdownSource(text);
  return { html: markdown.parse(md) as string, slots };
}

/** The source of each placeholder, braces included, as a note shows a failed one. */
export function placeholderSources(text: string): string[] {
  return splitNote(text).flatMap((p) => (p.type === 'placeholder' ? [p.raw.replace(PRIVATE_MARKS, '')] : []));
}

