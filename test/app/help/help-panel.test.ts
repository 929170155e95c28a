// @vitest-environment happy-dom
import { afterEach, describe, expect, it } from 'vitest';
import { builtinInfos } from '../../../src/app/builtin-info.ts';
import { CELL_KEYS } from '../../../src/app/cell-keys.ts';
import { FurrowHelp, HELP_CLOSE_EVENT, HELP_INSERT_EVENT, type HelpInsertDetail } from '../../../src/app/help/help-panel.ts';
import { BUILTINS } from '../../../src/functions/index.ts';

const ALL = builtinInfos(BUILTINS);

let mounted: FurrowHelp[] = [];
afterEach(() => {
  for (const el of mounted) el.remove();
  mounted = [];
});

async function mount(cells: FurrowHelp['catalogue']['cells'] = []): Promise<FurrowHelp> {
  const el = document.createElement('furrow-help') as FurrowHelp;
  el.catalogue = { builtins: ALL, cells };
  document.body.append(el);
  mounted.push(el);
  await el.updateComplete;
  return el;
}

const root = (el: FurrowHelp) => el.shadowRoot!;
const shownNames = (el: FurrowHelp) => [...root(el).querySelectorAll('details')].map((d) => (d as HTMLElement).dataset.builtin);

describe('<furrow-help>', () => {
  it('lists every built-in under its category, and the keys for cells', async () => {
    const el = await mount();
    expect(shownNames(el).sort()).toEqual(ALL.map((b) => b.name).sort());
    const keys = [...root(el).querySelectorAll('table.keys kbd')].map((k) => k.textContent);
    expect(keys).toEqual(CELL_KEYS.map((k) => k.keys));
  });

  it('narrows to what a search finds, and opens the entry when one is left', async () => {
    const el = await mount([{ name: 'harvest', type: 'table', members: ['yield', 'variety', 'block'] }]);
    const input = root(el).querySelector<HTMLInputElement>('input[type="search"]')!;
    input.value = 'latin_square';
    input.dispatchEvent(new Event('input'));
    await el.updateComplete;
    expect(shownNames(el)).toEqual(['latin_square']);
    expect(root(el).querySelector('.signature')?.textContent).toBe('latin_square(y, treatment, row, column)');
    input.value = 'blocked';
    input.dispatchEvent(new Event('input'));
    await el.updateComplete;
    expect(shownNames(el)[0]).toBe('blocked');
  });

  it("adds an example fitted to the document's table, and says what a document lacks", async () => {
    const el = await mount([{ name: 'harvest', type: 'table', members: ['yield', 'variety', 'block'] }]);
    el.opened = new Set(['blocked', 'rank_sum']);
    await el.updateComplete;
    const inserted: HelpInsertDetail[] = [];
    document.body.addEventListener(HELP_INSERT_EVENT, (e) => inserted.push((e as CustomEvent<HelpInsertDetail>).detail));
    const blocked = root(el).querySelector('details[data-builtin="blocked"]')!;
    blocked.querySelector<HTMLButtonElement>('.example button')!.click();
    expect(inserted).toEqual([{ text: 'blocked(harvest.yield, harvest.variety, harvest.block)', fn: 'blocked' }]);
    const rank = root(el).querySelector('details[data-builtin="rank_sum"] .example .fit')!;
    expect(rank.classList.contains('lacking')).toBe(true);
    expect(rank.textContent).toMatch(/has no trial \(hours, drug\)/);
  });

  it('asks to be closed with Escape or its button', async () => {
    const el = await mount();
    let closed = 0;
    document.body.addEventListener(HELP_CLOSE_EVENT, () => closed++);
    root(el).querySelector<HTMLButtonElement>('button.close')!.click();
    el.dispatchEvent(new KeyboardEvent('keydown', { key: 'Escape', bubbles: true, composed: true }));
    expect(closed).toBe(2);
  });
});
