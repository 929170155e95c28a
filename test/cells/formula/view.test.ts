// @vitest-environment happy-dom
import { CompletionContext } from '@codemirror/autocomplete';
import { forEachDiagnostic } from '@codemirror/lint';
import { runScopeHandlers } from '@codemirror/view';
import { afterEach, describe, expect, it } from 'vitest';
import { formulaCompletions, formulaExtensions, formulaSetup } from '../../../cells/formula/editor-setup.ts';
import { EDIT_DELAY_MS, FurrowFormulaCell } from '../../../cells/formula/view.ts';
import { EDIT_EVENT, type CellViewState, type EditEventDetail, type NameCatalogue } from '../../../cells/view-api.ts';
import type { Cell } from '../../../src/doc/document.ts';
import { errorValue, record, type Value } from '../../../src/lang/values.ts';

const catalogue: NameCatalogue = {
  builtins: [
    { name: 'mean', signature: 'mean(x)', doc: 'The mean of the values. Missing values are left out.', returns: 'a number', category: 'summaries', params: [{ name: 'x', description: 'a column of numbers', doc: 'The values.' }] },
    {
      name: 'round',
      signature: 'round(x, digits: 0)',
      doc: 'Rounds to a number of decimals.',
      returns: 'a number',
      category: 'maths',
      params: [
        { name: 'x', description: 'a number', doc: 'The value.' },
        { name: 'digits', description: 'a number', doc: 'How many decimals.' },
      ],
    },
  ],
  cells: [{ name: 'plots', type: 'table', members: ['block', 'yield'] }],
};

const ok = (value: Value): CellViewState => ({ status: 'ok', value, parts: null, warnings: [], error: null, progress: null });
const wait = (ms: number) => new Promise((r) => setTimeout(r, ms));

let mounted: FurrowFormulaCell[] = [];
afterEach(() => {
  for (const el of mounted) el.remove();
  mounted = [];
});

async function mount(body: string, state: CellViewState | null = null) {
  const el = document.createElement('furrow-formula-cell');
  el.cell = { id: 'c7', marker: 'formula', eol: '\n', body };
  el.state = state;
  el.catalogue = catalogue;
  const edits: EditEventDetail[] = [];
  const undo: string[] = [];
  document.body.addEventListener(EDIT_EVENT, (e) => edits.push((e as CustomEvent<EditEventDetail>).detail));
  el.addEventListener('furrow-undo', () => undo.push('undo'));
  el.addEventListener('furrow-redo', () => undo.push('redo'));
  document.body.append(el);
  mounted.push(el);
  await el.updateComplete;
  return { el, edits, undo };
}

const shadow = (el: HTMLElement) => el.shadowRoot!;

describe('<furrow-formula-cell>', () => {
  it('draws the formula as coloured static text before the editor exists', async () => {
    const { el } = await mount('m = mean(plots.yield)\n\n');
    if (el.editorView === null) {
      const pre = shadow(el).querySelector('pre.static')!;
      expect(pre.textContent).toBe('m = mean(plots.yield)');
      expect(pre.querySelector('.tok-builtin')!.textContent).toBe('mean');
      expect(pre.querySelector('.tok-member')!.textContent).toBe('yield');
    }
    await el.ensureEditor();
    expect(el.editorView!.state.doc.toString()).toBe('m = mean(plots.yield)');
    expect(shadow(el).querySelector('pre.static')).toBeNull();
  });

  it('draws its static text again when the text or its problem changes', async () => {
    const { el } = await mount('y = mean(plots.yield)\n\n', ok(3));
    // the static text is what a cell shows before its editor exists
    expect(el.editorView).toBeNull();
    const pre = () => shadow(el).querySelector('pre.static')!;
    const first = pre().querySelector('.tok-builtin');
    // a new value, same text: the coloured text is left as it was drawn
    el.state = ok(4);
    await el.updateComplete;
    expect(pre().querySelector('.tok-builtin')).toBe(first);
    expect(pre().querySelector('.marked')).toBeNull();
    // the evaluation fails on `plots.yield`: those characters are underlined
    el.state = { status: 'error', value: null, parts: null, warnings: [], error: errorValue('no such column', 9, 20), progress: null };
    await el.updateComplete;
    expect([...pre().querySelectorAll('.marked')].map((m) => m.textContent).join('')).toBe('plots.yield');
    // a new text is drawn
    el.cell = { id: 'c7', marker: 'formula', eol: '\n', body: 'z = 2\n\n' };
    el.state = ok(2);
    await el.updateComplete;
    expect(pre().textContent).toBe('z = 2');
    expect(pre().querySelector('.marked')).toBeNull();
  });

  it('sends a burst of typing as one body edit with the merge key', async () => {
    const { el, edits } = await mount('x = 1\n\n');
    await el.ensureEditor();
    const view = el.editorView!;
    view.dispatch({ changes: { from: 5, insert: '2' } });
    view.dispatch({ changes: { from: 6, insert: '3' } });
    expect(edits).toHaveLength(0);
    await wait(EDIT_DELAY_MS + 60);
    expect(edits).toEqual([{ edit: { type: 'body', id: 'c7', body: 'x = 123\n\n' }, mergeKey: 'body:c7' }]);
  });

  it('takes a new body from the shell without sending it back, and ignores its own edit coming back', async () => {
    const { el, edits } = await mount('x = 1\n\n');
    await el.ensureEditor();
    const view = el.editorView!;
    view.dispatch({ changes: { from: 5, insert: '0' } });
    el.flush();
    expect(edits).toHaveLength(1);
    // the shell applies the edit and hands the cell back, while the user has typed more
    view.dispatch({ changes: { from: 6, insert: '0' } });
    el.cell = { ...el.cell, body: 'x = 10\n\n' };
    await el.updateComplete;
    expect(view.state.doc.toString()).toBe('x = 100');
    // undo in the shell: the text changes under the editor
    el.flush();
    el.cell = { ...el.cell, body: 'x = 1\n\n' };
    await el.updateComplete;
    expect(view.state.doc.toString()).toBe('x = 1');
    // and redo back to the last sent body is taken too
    el.cell = { ...el.cell, body: 'x = 100\n\n' };
    await el.updateComplete;
    expect(view.state.doc.toString()).toBe('x = 100');
    await wait(EDIT_DELAY_MS + 60);
    expect(edits.map((e) => (e.edit as { body: string }).body)).toEqual(['x = 10\n\n', 'x = 100\n\n']);
  });

  it('asks the shell for undo and redo instead of keeping a history', async () => {
    const { el, undo, edits } = await mount('x = 1\n\n');
    await el.ensureEditor();
    const view = el.editorView!;
    view.dispatch({ changes: { from: 5, insert: '9' } });
    // Mod is Cmd on a Mac and Ctrl elsewhere, as CodeMirror reads the platform
    const mac = /Mac|iP(hone|[oa]d)/.test(navigator.platform);
    const key = (init: KeyboardEventInit) => runScopeHandlers(view, new KeyboardEvent('keydown', { ...init, ctrlKey: !mac, metaKey: mac }), 'editor');
    expect(key({ key: 'z' })).toBe(true);
    // what was typed is sent before the undo, so undo takes it back
    expect(edits).toHaveLength(1);
    // a browser reports Shift-z as "Z" with key code 90; CodeMirror finds the binding from the code
    expect(key({ key: 'Z', shiftKey: true, keyCode: 90 } as KeyboardEventInit)).toBe(true);
    expect(key({ key: 'y' })).toBe(true);
    expect(undo).toEqual(['undo', 'redo', 'redo']);
    expect(view.state.doc.toString()).toBe('x = 19');
  });

  it('underlines the parse error under its characters and says it in words', async () => {
    const { el } = await mount('x = 2 +* 3\n\n');
    await el.ensureEditor();
    await el.updateComplete;
    const marks: [number, number, string][] = [];
    forEachDiagnostic(el.editorView!.state, (d, from, to) => marks.push([from, to, d.severity]));
    expect(marks).toEqual([[7, 8, 'error']]);
    expect(shadow(el).querySelector('.problem')!.textContent).toMatch(/\*/);
  });

  it('underlines the evaluation error of the text that was evaluated', async () => {
    const e = errorValue('There is no name "yeild".', 14, 19);
    const { el } = await mount('m = mean(plots.yeild)\n\n', { status: 'error', value: e, parts: null, warnings: [], error: e, progress: null });
    await el.ensureEditor();
    await el.updateComplete;
    const marks: [number, number][] = [];
    forEachDiagnostic(el.editorView!.state, (_d, from, to) => marks.push([from, to]));
    expect(marks).toEqual([[14, 19]]);
    expect(shadow(el).querySelector('.problem')!.textContent).toBe('There is no name "yeild".');
    // the error value is said once, not drawn again as a value
    expect(shadow(el).querySelector('furrow-value')).toBeNull();
  });

  it('shows the value, keeps it dimmed while updating, and shows progress and warnings', async () => {
    const { el } = await mount('m = 3.5\n\n', ok(3.5));
    const value = shadow(el).querySelector('furrow-value')!;
    expect(value.value).toBe(3.5);
    expect(value.getAttribute('name')).toBe('m');
    el.state = { status: 'pending', value: 3.5, parts: null, warnings: ['2 missing values were left out'], error: null, progress: 0.4 };
    await el.updateComplete;
    expect(shadow(el).querySelector('.result.stale')).not.toBeNull();
    expect(shadow(el).querySelector('.status')!.textContent).toMatch(/updating/);
    expect(shadow(el).querySelector('[role=progressbar]')!.getAttribute('aria-valuenow')).toBe('40');
    expect(shadow(el).querySelector('ul.warnings')!.textContent).toMatch(/2 missing values/);
  });

  it('lets the editor go when the cell leaves the page', async () => {
    const { el } = await mount('x = 1\n\n', ok(record([])));
    await el.ensureEditor();
    const view = el.editorView!;
    el.remove();
    expect(el.editorView).toBeNull();
    expect(view.dom.isConnected).toBe(false);
  });

  it('completes built-ins with their doc, members after a dot, and named arguments', async () => {
    const { el } = await mount('r = round(plots.y\n\n');
    await el.ensureEditor();
    const state = el.editorView!.state;
    const member = formulaCompletions(new CompletionContext(state, state.doc.length, false))!;
    expect(member.options.map((o) => o.label)).toEqual(['block', 'yield']);
    el.editorView!.dispatch({ changes: { from: 0, to: state.doc.length, insert: 'r = round(1, di' } });
    const s2 = el.editorView!.state;
    const arg = formulaCompletions(new CompletionContext(s2, s2.doc.length, false))!;
    expect(arg.options.find((o) => o.label === 'digits:')).toMatchObject({ apply: 'digits: ', detail: 'a number' });
    const mean = arg.options.find((o) => o.label === 'mean')!;
    expect(mean.detail).toBe('(x)');
    const info = (mean.info as (c: typeof mean) => Node)(mean) as HTMLElement;
    expect(info.textContent).toContain('mean(x)');
    expect(info.textContent).toContain('The mean of the values.');
    expect(info.textContent).not.toContain('Missing values are left out');
  });

  it('shares one configuration between editors', async () => {
    const a = await mount('a = 1\n\n');
    const b = await mount('b = 2\n\n');
    await a.el.ensureEditor();
    await b.el.ensureEditor();
    // the language facet is the same object in both: one extensions array for the page
    const la = a.el.editorView!.state.facet((await import('@codemirror/language')).language);
    const lb = b.el.editorView!.state.facet((await import('@codemirror/language')).language);
    expect(la).not.toBeNull();
    expect(la).toBe(lb);
  });
});

describe('moving a cell', () => {
  it('sends what was typed just before the move once the cell is back on the page', async () => {
    const { el, edits } = await mount('x = 1\n\n');
    await el.ensureEditor();
    el.editorView!.dispatch({ changes: { from: 5, insert: '2' } });
    const parent = el.parentElement!;
    el.remove();
    await wait(EDIT_DELAY_MS + 60);
    // nothing was sent into the void while detached
    expect(edits).toHaveLength(0);
    parent.append(el);
    expect(edits.map((e) => e.edit)).toEqual([{ type: 'body', id: 'c7', body: 'x = 12\n\n' }]);
    await el.updateComplete;
    expect(el.shadowRoot!.querySelector('pre.static')?.textContent ?? el.editorView?.state.doc.toString()).toBe('x = 12');
  });
});

// a cell body that changes id (the element reused for another cell) must not send the old text to the new cell
describe('reuse for another cell', () => {
  it('sends pending text to the cell it was typed in', async () => {
    const { el, edits } = await mount('x = 1\n\n');
    await el.ensureEditor();
    el.editorView!.dispatch({ changes: { from: 5, insert: '5' } });
    const other: Cell = { id: 'c8', marker: 'formula', eol: '\n', body: 'y = 2\n\n' };
    el.cell = other;
    await el.updateComplete;
    expect(edits.map((e) => e.edit)).toEqual([{ type: 'body', id: 'c7', body: 'x = 15\n\n' }]);
    expect(el.editorView!.state.doc.toString()).toBe('y = 2');
  });

  it('gives an editor made before the built-ins arrived the same extensions as one made after', async () => {
    const el = document.createElement('furrow-formula-cell');
    el.cell = { id: 'c9', marker: 'formula', eol: '\n', body: 'm = mean(plots.yield)\n\n' };
    const none: NameCatalogue['builtins'] = [];
    el.catalogue = { builtins: none, cells: [] };
    document.body.append(el);
    mounted.push(el);
    await el.ensureEditor();
    const view = el.editorView!;
    expect(formulaSetup.get(view.state)).toBe(formulaExtensions(none));
    el.catalogue = catalogue;
    await el.updateComplete;
    expect(el.editorView).toBe(view);
    expect(formulaSetup.get(view.state)).toBe(formulaExtensions(catalogue.builtins));
    expect(view.state.doc.toString()).toBe('m = mean(plots.yield)');
  });

  it('shows a new formula as empty, with no problem, and a value only once one is typed', async () => {
    const { el } = await mount('value1 = \n\n', ok({ kind: 'missing' }));
    expect(shadow(el).querySelector('p.empty')?.textContent).toMatch(/^empty/);
    expect(shadow(el).querySelector('.problem')).toBeNull();
    expect(shadow(el).querySelector('furrow-value')).toBeNull();
    el.cell = { id: 'c7', marker: 'formula', eol: '\n', body: 'value1 = 2\n\n' };
    el.state = ok(2);
    await el.updateComplete;
    expect(shadow(el).querySelector('p.empty')).toBeNull();
    expect(shadow(el).querySelector('furrow-value')).not.toBeNull();
  });
});
