// @vitest-environment happy-dom
import { afterEach, describe, expect, it } from 'vitest';
import '../../../src/views/values/chart.ts';
import type { FurrowChart } from '../../../src/views/values/chart.ts';
import type { Chart } from '../../../src/lang/values.ts';

let mounted: HTMLElement[] = [];
afterEach(() => {
  for (const el of mounted) el.remove();
  mounted = [];
});

async function draw(value: Chart): Promise<FurrowChart> {
  const el = document.createElement('furrow-chart');
  el.value = value;
  document.body.append(el);
  mounted.push(el);
  // vega-embed is loaded on first use; wait until the element settles
  for (let i = 0; i < 200; i++) {
    await new Promise((r) => setTimeout(r, 25));
    const root = el.shadowRoot!;
    if (root.querySelector('.frame svg') !== null || root.querySelector('.failed') !== null) break;
  }
  await el.updateComplete;
  return el;
}

describe('<furrow-chart>', () => {
  it('draws a spec as SVG with its caption, and no menu even when the spec asks for one', async () => {
    const el = await draw({
      kind: 'chart',
      spec: {
        usermeta: { embedOptions: { actions: true } },
        data: { values: [{ x: 1, y: 2 }, { x: 2, y: 4 }] },
        mark: 'point',
        encoding: { x: { field: 'x', type: 'quantitative' }, y: { field: 'y', type: 'quantitative' } },
      },
      caption: 'Two points.',
    });
    const root = el.shadowRoot!;
    expect(root.querySelector('.failed')).toBeNull();
    expect(root.querySelector('.frame svg')).not.toBeNull();
    expect(root.querySelector('.vega-actions')).toBeNull();
    expect(root.querySelector('details')).toBeNull();
    expect(root.querySelector('figcaption')!.textContent).toBe('Two points.');
  });

  it('loads nothing for a spec that names a file, and shows the refusal as a warning', async () => {
    const el = await draw({ kind: 'chart', spec: { data: { url: '/etc/passwd' }, mark: 'point', encoding: { x: { field: 'a', type: 'nominal' } } }, caption: '' });
    await new Promise((r) => setTimeout(r, 50));
    await el.updateComplete;
    const warnings = [...el.shadowRoot!.querySelectorAll('.warnings li')].map((li) => li.textContent);
    expect(warnings.some((w) => /refused: \/etc\/passwd/.test(w ?? ''))).toBe(true);
  });

  it('says so when a spec is not plain data', async () => {
    const cyclic: Record<string, unknown> = { mark: 'point' };
    cyclic.self = cyclic;
    const el = await draw({ kind: 'chart', spec: cyclic, caption: '' });
    expect(el.shadowRoot!.querySelector('.failed')!.textContent).toMatch(/not plain data/);
  });
});
