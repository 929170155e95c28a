/**
 * A last look at a chart's SVG before it goes inline into a report: vega writes it from a
 * specification the project built, but level names and titles come from the document, so
 * the report takes the SVG only when every tag in it is a well-formed drawing element with
 * double-quoted attributes, none of them an event handler, and no address other than a
 * reference inside itself (clip paths). Text from the document sits escaped in text and
 * attribute values, where it is only text.
 */

const DRAWING = new Set(['svg', 'g', 'path', 'rect', 'line', 'text', 'tspan', 'circle', 'ellipse', 'polygon', 'polyline', 'title', 'desc', 'defs', 'clippath', 'lineargradient', 'radialgradient', 'stop', 'pattern', 'mask']);
const TAG = /<(\/?)([a-zA-Z][\w:-]*)((?:\s+[a-zA-Z_:][-\w:.]*="[^"<]*")*)\s*(\/?)>/y;
const ATTRIBUTE = /([a-zA-Z_:][-\w:.]*)="([^"<]*)"/g;

/** Null when the SVG may go inline; otherwise what is wrong with it, in words. */
export function svgProblem(svg: string): string | null {
  let at = svg.indexOf('<');
  if (!svg.startsWith('<svg')) return 'it does not start with <svg>';
  while (at >= 0) {
    TAG.lastIndex = at;
    const m = TAG.exec(svg);
    if (m === null) return `it holds markup that is not a plain tag at character ${at + 1}`;
    const name = m[2]!.toLowerCase();
    if (!DRAWING.has(name)) return `it holds a <${m[2]}> element`;
    for (const a of (m[3] ?? '').matchAll(ATTRIBUTE)) {
      const attr = a[1]!.toLowerCase();
      const value = a[2]!;
      if (attr.startsWith('on')) return 'it holds an event attribute';
      if ((attr === 'href' || attr === 'xlink:href') && !value.startsWith('#')) return 'it links to an address';
      for (const u of value.matchAll(/url\(([^)]*)\)/gi)) if (!u[1]!.trim().replace(/^['"]/, '').startsWith('#')) return 'it refers to an address';
      if (attr === 'style') return 'it carries a style attribute';
    }
    at = svg.indexOf('<', at + m[0].length);
  }
  return null;
}
