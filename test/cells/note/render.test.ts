// @vitest-environment happy-dom
/**
 * How a note's Markdown reaches the page: raw HTML written in a note is shown as text, live
 * values go in as DOM nodes after sanitizing, and a note cannot fake the page's own marks.
 * (The sanitizer itself is exercised in real Chromium by the browser tests: happy-dom's
 * parser differs from a browser's in ways that matter to it.)
 */
import { describe, expect, it } from 'vitest';
import { EMPHASIS_MARKS_PER_PARAGRAPH, MARKDOWN_ELEMENTS, NOTE_MARKDOWN_LIMIT, noteMarkdownHtml } from '../../../cells/note/markdown.ts';
import { placeSlots } from '../../../cells/note/view.ts';

/** The note as DOM, parsed by an inert template and given its slots. */
function dom(text: string): HTMLElement {
  const t = document.createElement('template');
  t.innerHTML = noteMarkdownHtml(text).html;
  const sources = [...text.matchAll(/\{[^}]*\}/g)].map((m) => m[0]);
  placeSlots(t.content, sources);
  const div = document.createElement('div');
  div.append(t.content);
  return div;
}

describe('raw HTML in a note', () => {
  it('is escaped before any parser sees it', () => {
    const text = 'Hello <img src=x onerror="alert(1)"> and <script>alert(2)</script>\n\n<div onclick="x()">block</div>';
    const { html } = noteMarkdownHtml(text);
    expect(html).not.toMatch(/<(img|script|div)\b/);
    const div = dom(text);
    expect(Array.from(div.querySelectorAll('*'), (e) => e.tagName.toLowerCase())).toEqual(['p', 'p']);
    expect(div.textContent).toContain('<img src=x onerror="alert(1)">');
    expect(div.textContent).toContain('<div onclick="x()">block</div>');
  });

  it('cannot fake a live value with the page classes', () => {
    const div = dom('A fake <span class="slot" data-slot="0">42</span> value and {1 + 1}');
    expect(div.querySelectorAll('[data-slot]').length).toBe(1);
    expect(div.querySelectorAll('.slot').length).toBe(1);
    expect(div.textContent).toContain('<span class="slot" data-slot="0">42</span>');
  });
});

describe('the allow-list of both sanitizers', () => {
  it('holds every element and attribute Markdown makes', () => {
    const html = noteMarkdownHtml('# H\n\n3. a\n\n| a | b |\n|:-:|--:|\n| 1 | 2 |\n\n- [ ] task\n\n```js\ncode\n```\n\n[l](https://example.invalid "t") ![i](data:image/png;base64,AAAA "t") ~~d~~ *e* **s** `c`\n\n> q\n\n---\nline  \nbreak').html;
    const div = document.createElement('div');
    div.innerHTML = html;
    for (const el of div.querySelectorAll('*')) {
      const tag = el.tagName.toLowerCase();
      if (tag === 'input') continue; // a task list's checkbox: both sanitizers drop it
      // the class Markdown puts on a fenced code block names its language; neither page nor report uses it
      const attrs = el.getAttributeNames().filter((a) => !(tag === 'code' && a === 'class'));
      expect(MARKDOWN_ELEMENTS.has(tag), tag).toBe(true);
      for (const a of attrs) expect(MARKDOWN_ELEMENTS.get(tag), `${tag} ${a}`).toContain(a);
    }
  });
  it('lets no address out but a link and a picture, and none of the page\'s own marks', () => {
    const kept = [...MARKDOWN_ELEMENTS].flatMap(([tag, attrs]) => attrs.map((a) => `${tag} ${a}`));
    // attributes that make a browser load or go to an address (HTML Living Standard, from memory)
    const addresses = ['href', 'src', 'srcset', 'poster', 'background', 'action', 'formaction', 'cite', 'longdesc', 'usemap', 'ping', 'data', 'xlink:href', 'manifest', 'codebase', 'lowsrc', 'dynsrc'];
    expect(kept.filter((k) => addresses.includes(k.split(' ')[1]!)).sort()).toEqual(['a href', 'img src']);
    expect(kept.filter((k) => /^(class|id|style|on.*|data-.*|slot|name|form)$/.test(k.split(' ')[1]!))).toEqual([]);
    expect([...MARKDOWN_ELEMENTS.keys()].filter((t) => ['span', 'div', 'style', 'script', 'iframe', 'svg', 'video', 'audio', 'object', 'form', 'input', 'link', 'base', 'meta'].includes(t))).toEqual([]);
  });
});

describe('placeholders', () => {
  it('become one slot element each, in order, inside the Markdown structure', () => {
    expect(noteMarkdownHtml('# Mean {m}\n\n* first {a}\n* second **{b}**').slots).toBe(3);
    const div = dom('# Mean {m}\n\n* first {a}\n* second **{b}**');
    expect(Array.from(div.querySelectorAll('[data-slot]'), (e) => e.getAttribute('data-slot'))).toEqual(['0', '1', '2']);
    expect(div.querySelector('h1 [data-slot="0"]')).not.toBeNull();
    expect(div.querySelector('strong [data-slot="2"]')).not.toBeNull();
  });

  it('inside an attribute stay as their source and cannot end the tag', () => {
    // marked writes these into attributes (percent-encoded in the address), where a value
    // spliced in as HTML text could close the attribute and open a tag of its own
    const div = dom('[go](https://example.invalid/{x}) ![a {y} b](data:image/png;base64,AAAA)');
    expect(div.querySelectorAll('[data-slot]').length).toBe(0);
    expect(div.querySelectorAll('*').length).toBe(3); // p, a, img
    expect(div.querySelector('a')!.getAttribute('href')).toBe('https://example.invalid/{x}');
    expect(div.querySelector('img')!.getAttribute('alt')).toBe('a {y} b');
    expect(div.innerHTML).not.toContain('\uE000');
  });

  it('a private-use marker typed in the note is not taken for a slot', () => {
    const div = dom('odd \uE0000\uE001 text and {v}');
    expect(div.querySelectorAll('[data-slot]').length).toBe(1);
    expect(div.textContent).not.toContain('\uE000');
  });
});

describe('rendering time is bounded for hostile notes', () => {
  // Every scanner over user text must be linear. The Markdown renderer pairs emphasis marks in
  // quadratic time (500,000 marks took seven minutes) and recurses on nested quotes; the note
  // view bounds both. 1 MB adversarial inputs, and ones just under the Markdown limit.
  const sizes = [1_000_000, NOTE_MARKDOWN_LIMIT - 10];
  const units = ['*a', '_a', '**a', '*_', '~~a', '[', '[a](', '>', '`', '<', '<!--', '&#', '\\', '![', '[[', '# a\n', '|a', '{"'];
  for (const size of sizes) {
    for (const unit of units) {
      it(`${JSON.stringify(unit)} repeated to ${size} characters`, () => {
        const text = unit.repeat(Math.floor(size / unit.length));
        const t0 = performance.now();
        const { html } = noteMarkdownHtml(text);
        expect(html.length).toBeGreaterThan(0);
        expect(performance.now() - t0).toBeLessThan(5000);
      });
    }
  }
  it('a paragraph with too many emphasis marks shows them as written', () => {
    const { html } = noteMarkdownHtml(`${'*a'.repeat(EMPHASIS_MARKS_PER_PARAGRAPH + 1)}\n\nfine *one*`);
    expect(html).not.toContain('<em>a</em>');
    expect(html).toContain('fine <em>one</em>');
  });
});
