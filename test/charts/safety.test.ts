/**
 * Charts drawn in Node load nothing: not a URL, not a local file. The same spec drawn with
 * vega's default loader does read the file, so the check means something.
 */
import { existsSync } from 'node:fs';
import * as vega from 'vega';
import { compile } from 'vega-lite';
import { describe, expect, it } from 'vitest';
import { renderSvg } from '../../src/charts/render.ts';
import { reachingKeys } from '../../src/charts/safety.ts';

/** Points drawn in an SVG: the paths inside the symbol mark's group. */
function symbolsDrawn(svg: string): number {
  const at = svg.indexOf('class="mark-symbol role-mark');
  if (at < 0) throw new Error('no symbol mark in the SVG');
  const body = svg.slice(at, svg.indexOf('</g>', at));
  return (body.match(/<path/g) ?? []).length;
}

function asking(url: string) {
  return {
    data: { url, format: { type: 'dsv', delimiter: ':' } },
    mark: 'point',
    encoding: { x: { field: 'root', type: 'nominal' } },
  };
}

describe('renderSvg loads nothing from outside', () => {
  it('draws no row of a URL and records a warning', async () => {
    const { svg, warnings } = await renderSvg(asking('https://example.invalid/x.csv'));
    expect(symbolsDrawn(svg)).toBe(0);
    expect(warnings.some((w) => /refused/.test(w))).toBe(true);
  });
  it.runIf(existsSync('/etc/passwd'))('draws no row of a local file and records a warning', async () => {
    const { svg, warnings } = await renderSvg(asking('/etc/passwd'));
    expect(symbolsDrawn(svg)).toBe(0);
    expect(warnings.some((w) => /refused: \/etc\/passwd/.test(w))).toBe(true);
  });
  // The check above means something only if vega's default loader reads the file
  // (docs/libraries.md section 3: in Node it does).
  it.runIf(existsSync('/etc/passwd'))("would have drawn the file's rows with vega's default loader", async () => {
    const view = new vega.View(vega.parse(compile(asking('/etc/passwd') as never).spec), { renderer: 'none', loader: vega.loader() });
    const svg = await view.toSVG();
    view.finalize();
    expect(symbolsDrawn(svg)).toBeGreaterThan(0);
  });
  it('draws inline data as usual (the counting works)', async () => {
    const { svg, warnings } = await renderSvg({ data: { values: [{ a: 1 }, { a: 2 }, { a: 3 }] }, mark: 'point', encoding: { x: { field: 'a', type: 'quantitative' } } });
    expect(symbolsDrawn(svg)).toBe(3);
    expect(warnings).toEqual([]);
  });
  it('drops usermeta before drawing and refuses what is not a JSON object', async () => {
    const { warnings } = await renderSvg({ usermeta: { embedOptions: { actions: true } }, data: { values: [{ a: 1 }] }, mark: 'point' });
    expect(warnings).toEqual([]);
    await expect(renderSvg([1, 2])).rejects.toThrow(/plain JSON object/);
  });
});

describe('reachingKeys', () => {
  it('finds url, href and usermeta anywhere, data included', () => {
    const spec = {
      usermeta: {},
      layer: [{ data: { url: 'x.csv' } }, { encoding: { href: { field: 'link' } } }],
      data: { values: [{ a: 1, nested: [{ url: 'y' }] }] },
    };
    expect(reachingKeys(spec)).toEqual(['data.values.0.nested.0.url', 'layer.0.data.url', 'layer.1.encoding.href', 'usermeta']);
    expect(reachingKeys({ mark: 'point', data: { values: [{ link: 'https://example.invalid' }] } })).toEqual([]);
  });
});
