// @vitest-environment happy-dom
import { describe, expect, it } from 'vitest';
import { applyMarks, type CellMark } from '../../../src/app/handoff/marks.ts';
import type { NoteDoubt } from '../../../src/seal/doubt.ts';

/** A sheet of sections as the page draws them, under a shadow root of its own. */
function sheet(ids: readonly string[]): ShadowRoot {
  const host = document.createElement('div');
  document.body.append(host);
  const root = host.attachShadow({ mode: 'open' });
  for (const id of ids) root.append(section(id));
  return root;
}

function section(id: string): HTMLElement {
  const s = document.createElement('section');
  s.className = 'cell';
  s.dataset.cell = id;
  return s;
}

const marked = (root: ShadowRoot) => [...root.querySelectorAll<HTMLElement>('section[data-verify]')].map((s) => `${s.dataset.cell}:${s.dataset.verify}`);
const changed = (note: string): ReadonlyMap<string, CellMark> => new Map([['b', { verify: 'changed', note }]]);
const none = new Map<string, never>();

describe('marks of the hand-off on the sheet', () => {
  it('are put on the cells due and taken off once no longer due', () => {
    const root = sheet(['a', 'b', 'c']);
    applyMarks(root, changed('differs from its seal'), none);
    expect(marked(root)).toEqual(['b:changed']);
    expect(root.querySelector<HTMLElement>('[data-cell="b"]')!.dataset.verifyNote).toBe('differs from its seal');
    applyMarks(root, none, none);
    expect(marked(root)).toEqual([]);
    expect(root.querySelector<HTMLElement>('[data-cell="b"]')!.dataset.verifyNote).toBeUndefined();
  });

  it('are put again on a cell the page drew afresh', () => {
    const root = sheet(['a', 'b']);
    applyMarks(root, changed('x'), none);
    root.querySelector('[data-cell="b"]')!.replaceWith(section('b'));
    expect(marked(root)).toEqual([]);
    applyMarks(root, changed('x'), none);
    expect(marked(root)).toEqual(['b:changed']);
  });

  it('leave cells alone that were not marked and are not due', () => {
    const root = sheet(['a', 'b']);
    applyMarks(root, changed('x'), none);
    // an attribute on a cell never marked is not the marks' business, so it stays
    root.querySelector<HTMLElement>('[data-cell="a"]')!.dataset.verify = 'kept';
    applyMarks(root, none, none);
    expect(marked(root)).toEqual(['a:kept']);
  });

  it('mark a note in doubt and clear it when the doubt is gone', () => {
    const root = sheet(['n']);
    const doubts = new Map<string, NoteDoubt>([['n', { claims: ['the difference is at least 2'], slots: new Set([0]) }]]);
    applyMarks(root, none, doubts);
    const s = root.querySelector<HTMLElement>('[data-cell="n"]')!;
    expect(s.dataset.doubt).toBe('');
    expect(s.title).not.toBe('');
    applyMarks(root, none, none);
    expect(s.dataset.doubt).toBeUndefined();
    expect(s.hasAttribute('title')).toBe(false);
  });
});
