// @vitest-environment happy-dom
import { LitElement, html } from 'lit';
import { guard } from 'lit/directives/guard.js';
import { repeat } from 'lit/directives/repeat.js';
import { afterEach, beforeAll, describe, expect, it } from 'vitest';
import { VisibleCells } from '../../src/app/visible-cells.ts';

/** The sections an observer watches now (happy-dom has no layout, so it stands in for one). */
const watching = new Set<Element>();
beforeAll(() => {
  (globalThis as { IntersectionObserver?: unknown }).IntersectionObserver = class {
    private readonly mine = new Set<Element>();
    observe(e: Element): void {
      this.mine.add(e);
      watching.add(e);
    }
    unobserve(e: Element): void {
      this.mine.delete(e);
      watching.delete(e);
    }
    disconnect(): void {
      for (const e of this.mine) watching.delete(e);
      this.mine.clear();
    }
  };
});

interface FakeCell {
  readonly id: string;
  readonly kind: string;
}

/** A sheet drawn as the page draws it: sections keyed by cell id, each behind a guard. */
class Sheet extends LitElement {
  static override properties = { cells: { attribute: false } };
  declare cells: readonly FakeCell[] | null;
  readonly visible = new VisibleCells(
    this,
    () => null,
    () => (this.cells ? this.cells.map((c) => c.id) : null),
  );
  constructor() {
    super();
    this.cells = null;
  }
  override render() {
    if (this.cells === null) return html`<main>loading</main>`;
    return html`<main>
      ${repeat(
        this.cells,
        (c) => c.id,
        (c, i) => {
          this.visible.stateFor(c.id);
          return guard([c, i], () => html`<section class="cell" data-cell=${c.id} data-kind=${c.kind}></section>`);
        },
      )}
    </main>`;
  }
}
customElements.define('test-visible-sheet', Sheet);

const cells = (n: number, kind = 'formula'): FakeCell[] => Array.from({ length: n }, (_, i) => ({ id: `c${i + 1}`, kind }));

/** The ids of the sections drawn that no observer watches. */
function unwatched(s: Sheet): string[] {
  return [...s.shadowRoot!.querySelectorAll<HTMLElement>('section.cell')].filter((e) => !watching.has(e)).map((e) => e.dataset.cell!);
}

async function show(s: Sheet, next: readonly FakeCell[] | null): Promise<void> {
  s.cells = next;
  await s.updateComplete;
}

afterEach(() => {
  document.body.innerHTML = '';
});

describe('the cells watched for being on screen', () => {
  it('are every section drawn, through new documents, loading, kinds changed and cells replaced', async () => {
    const s = document.createElement('test-visible-sheet') as Sheet;
    document.body.append(s);
    await s.updateComplete;
    await show(s, cells(3));
    expect(unwatched(s)).toEqual([]);
    // another document with as many cells (ids are positions, so the same ids)
    await show(s, cells(3, 'note'));
    expect(unwatched(s)).toEqual([]);
    // back to loading, then a document again: the sheet is drawn afresh
    await show(s, null);
    await show(s, cells(3));
    expect(s.shadowRoot!.querySelectorAll('section.cell')).toHaveLength(3);
    expect(unwatched(s)).toEqual([]);
    // a cell deleted and one added in one step
    await show(s, [...cells(2), { id: 'n1', kind: 'table' }]);
    expect(unwatched(s)).toEqual([]);
  });

  it('are watched again when the sheet is taken out of the page and put back', async () => {
    const s = document.createElement('test-visible-sheet') as Sheet;
    document.body.append(s);
    await show(s, cells(3));
    const box = document.createElement('div');
    document.body.append(box);
    box.append(s);
    await s.updateComplete;
    expect(unwatched(s)).toEqual([]);
  });
});
