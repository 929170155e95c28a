/**
 * The report's allow-list for a note's HTML.
 */
import { describe, expect, it } from 'vitest';
import { noteMarkdownHtml } from '../../cells/note/markdown.ts';
import { sanitizeMarkdownHtml } from '../../src/report/sanitize.ts';
import { svgProblem } from '../../src/report/svg-check.ts';

const render = (md: string): string => sanitizeMarkdownHtml(noteMarkdownHtml(md).html);

describe('sanitizeMarkdownHtml', () => {
  it('keeps what Markdown makes', () => {
    expect(render('# Title\n\nSome *em* and **strong** and `code`.')).toBe('<h1>Title</h1>\n<p>Some <em>em</em> and <strong>strong</strong> and <code>code</code>.</p>\n');
    expect(render('| a | b |\n|:--|--:|\n| 1 | 2 |')).toContain('<th align="left">a</th>');
    expect(render('3. three\n4. four')).toContain('<ol start="3">');
  });
  it('shows raw HTML of a note as text', () => {
    const out = render('<script>alert(1)</script>\n\nand <img src=x onerror=alert(1)> inline');
    expect(out).not.toMatch(/<script|<img/);
    expect(out).toContain('&lt;script&gt;alert(1)&lt;/script&gt;');
  });
  it('lets no address out but a place in the report and a picture inside the document', () => {
    expect(render('[a](https://example.invalid/x)')).toBe('<p><a>a</a></p>\n');
    expect(render('[a](javascript:alert(1))')).toBe('<p><a>a</a></p>\n');
    expect(render('[a](#cell-3)')).toBe('<p><a href="#cell-3">a</a></p>\n');
    expect(render('![p](https://example.invalid/p.png)')).toBe('<p><img alt="p"></p>\n');
    expect(render('![p](data:image/png;base64,iVBORw0KGgo=)')).toBe('<p><img src="data:image/png;base64,iVBORw0KGgo=" alt="p"></p>\n');
  });
  it('escapes a tag it does not know and drops attributes it does not allow, whatever the input', () => {
    expect(sanitizeMarkdownHtml('<p class="live" id="x" onclick="f()">a</p><iframe src="//x"></iframe><svg onload=f()>')).toBe(
      '<p>a</p>&lt;iframe src=&quot;//x&quot;&gt;&lt;/iframe&gt;&lt;svg onload=f()&gt;',
    );
    expect(sanitizeMarkdownHtml('<a href="&#106;avascript:x">a</a> < b & c &amp; d')).toBe('<a>a</a> &lt; b &amp; c &amp; d');
    expect(sanitizeMarkdownHtml('<img src="data:image/svg+xml;base64,PHN2Zz4=" alt="a">')).toBe('<img alt="a">');
    expect(sanitizeMarkdownHtml('<!-- c --><p>x</p>')).toBe('&lt;!-- c --&gt;<p>x</p>');
  });
});

describe('svgProblem', () => {
  it('takes plain drawing with escaped text', () => {
    expect(svgProblem('<svg width="2"><g clip-path="url(#c1)"><text aria-label="a &lt;img onerror=x&gt;">&lt;script&gt;</text></g></svg>')).toBe(null);
  });
  it.each([
    ['<svg><script>x</script></svg>', 'it holds a <script> element'],
    ['<svg><g onclick="x"></g></svg>', 'it holds an event attribute'],
    ['<svg><a href="https://x"></a></svg>', 'it holds a <a> element'],
    ['<svg><image href="https://x"/></svg>', 'it holds a <image> element'],
    ['<svg><path fill="url(https://x)"/></svg>', 'it refers to an address'],
    ['<svg><path d=M0></svg>', 'it holds markup that is not a plain tag at character 6'],
    ['<svg><foreignObject></foreignObject></svg>', 'it holds a <foreignObject> element'],
  ])('refuses %s', (svg, problem) => {
    expect(svgProblem(svg)).toBe(problem);
  });
});
