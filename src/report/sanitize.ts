/**
 * An allow-list for the HTML of a note in the report, without a DOM. The note's Markdown is
 * rendered by marked with every raw tag of the note already escaped (cells/note/markdown.ts),
 * so the only tags are the ones Markdown makes; this pass is the second lock: it re-writes
 * each tag it allows with only the attributes it allows, escapes anything else that looks
 * like markup, and lets no address out except a link to a place in the report itself and a
 * picture carried inside the document (data:image). The report loads nothing from anywhere.
 */
import { MARKDOWN_ELEMENTS } from '../../cells/note/markdown.ts';


/** Tags dropped without a trace (a task list's checkbox): they carry nothing to read. */
const DROPPED: ReadonlySet<string> = new Set(['input']);

const ALLOWED = MARKDOWN_ELEMENTS;

const VOID: ReadonlySet<string> = new Set(['img', 'hr', 'br', 'input']);

const TAG = /<(\/?)([a-zA-Z][a-zA-Z0-9]*)((?:\s+[a-zA-Z_:][-a-zA-Z0-9_:.]*(?:\s*=\s*(?:"[^"]*"|'[^']*'|[^\s"'=<>`]+))?)*)\s*\/?>/y;
const ATTRIBUTE = /([a-zA-Z_:][-a-zA-Z0-9_:.]*)(?:\s*=\s*(?:"([^"]*)"|'([^']*)'|([^\s"'=<>`]+)))?/g;
const ENTITY = /&(?:#\d{1,7}|#x[0-9a-fA-F]{1,6}|[a-zA-Z][a-zA-Z0-9]{1,31});/y;

/** Escapes text for HTML text and attribute values. */
export function escapeHtml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => (c === '&' ? '&amp;' : c === '<' ? '&lt;' : c === '>' ? '&gt;' : c === '"' ? '&quot;' : '&#39;'));
}

/** Undoes the escapes marked writes in attribute values. */
function decodeEntities(s: string): string {
  return s.replace(/&(#\d{1,7}|#x[0-9a-fA-F]{1,6}|amp|lt|gt|quot|apos|#39);/g, (_m, e: string) => {
    if (e === 'amp') return '&';
    if (e === 'lt') return '<';
    if (e === 'gt') return '>';
    if (e === 'quot') return '"';
    if (e === 'apos') return "'";
    const code = e.startsWith('#x') ? parseInt(e.slice(2), 16) : parseInt(e.slice(1), 10);
    return code > 0 && code <= 0x10ffff ? String.fromCodePoint(code) : '\uFFFD';
  });
}

/** Whether an attribute value may stay, after decoding. */
function allowedValue(tag: string, name: string, value: string): boolean {
  const v = value.trim();
  if (name === 'href') return /^#[-\w.:]*$/.test(v);
  if (name === 'src') return /^data:image\/(?:png|jpeg|gif|webp);base64,[A-Za-z0-9+/=\s]*$/i.test(v);
  if (name === 'align') return /^(?:left|right|center)$/.test(v);
  if (name === 'start') return /^\d{1,9}$/.test(v);
  return tag !== '' && (name === 'title' || name === 'alt');
}

/**
 * Sanitizes HTML from Markdown by an allow-list.
 *
 * @param attributeText turns an allowed attribute's decoded value into the text to keep
 *   (the report puts a placeholder's source there)
 */
export function sanitizeMarkdownHtml(html: string, attributeText: (value: string) => string = (v) => v): string {
  let out = '';
  let i = 0;
  while (i < html.length) {
    const c = html[i]!;
    if (c === '<') {
      TAG.lastIndex = i;
      const m = TAG.exec(html);
      if (m !== null) {
        const closing = m[1] === '/';
        const tag = m[2]!.toLowerCase();
        i += m[0].length;
        if (DROPPED.has(tag)) continue;
        const allowed = ALLOWED.get(tag);
        if (allowed === undefined) {
          out += escapeHtml(m[0]);
          continue;
        }
        if (closing) {
          if (!VOID.has(tag)) out += `</${tag}>`;
          continue;
        }
        let attrs = '';
        for (const a of (m[3] ?? '').matchAll(ATTRIBUTE)) {
          const name = a[1]!.toLowerCase();
          if (!allowed.includes(name)) continue;
          const value = decodeEntities(a[2] ?? a[3] ?? a[4] ?? '');
          if (!allowedValue(tag, name, value)) continue;
          attrs += ` ${name}="${escapeHtml(attributeText(value))}"`;
        }
        out += `<${tag}${attrs}>`;
        continue;
      }
      out += '&lt;';
      i++;
      continue;
    }
    if (c === '>') {
      out += '&gt;';
      i++;
      continue;
    }
    if (c === '&') {
      ENTITY.lastIndex = i;
      const e = ENTITY.exec(html);
      if (e !== null) {
        out += e[0];
        i += e[0].length;
      } else {
        out += '&amp;';
        i++;
      }
      continue;
    }
    out += c;
    i++;
  }
  return out;
}
