// @vitest-environment happy-dom
import { afterEach, describe, expect, it } from 'vitest';
import { EDIT_EVENT, type CellViewState, type EditEventDetail } from '../../../cells/view-api.ts';
import { TableCellView } from '../../../cells/table/view.ts';
import { gridMsg } from '../../../src/messages/grid.ts';
import { drawingHeld, holdDrawing, releaseDrawing } from '../../../src/views/draw-gate.ts';
import { tableFromGrid } from '../../../cells/table/model.ts';
import { parseCsv } from '../../../src/doc/csv.ts';
import type { Cell } from '../../../src/doc/document.ts';
import { applyEdit, type Edit } from '../../../src/doc/edits.ts';
import { msg } from '../../../src/messages/language.ts';

const TREES = 'row,method,yield_kg\n1,open,41.2\n1,spindle,38.9\n2,open,40.1\n\n';

interface Mounted {
  el: TableCellView;
  edits: EditEventDetail[];
  root: ShadowRoot;
  /** The body the view was given first. */
  start: string;
}

/** A body with one edit applied (a whole body, or a splice of part of it). */
function withEdit(body: string, e: Edit): string {
  if (e.type === 'body') return e.body;
  if (e.type === 'splice') return body.slice(0, e.from) + e.text + body.slice(e.to);
  return body;
}

/** The body after the view's edits 0..i, applied in order to the body it was given. */
function bodyAfter(m: Mounted, i: number): string {
  return m.edits.slice(0, i + 1).reduce((b, d) => withEdit(b, d.edit), m.start);
}

async function mount(cell: Cell, state: CellViewState | null = null): Promise<Mounted> {
  const el = document.createElement('furrow-table-cell');
  const edits: EditEventDetail[] = [];
  el.addEventListener(EDIT_EVENT, (e) => edits.push((e as CustomEvent<EditEventDetail>).detail));
  el.cell = cell;
  el.state = state;
  el.catalogue = { builtins: [], cells: [{ name: 'fit', type: 'record', members: [] }] };
  document.body.append(el);
  await el.updateComplete;
  return { el, edits, root: el.shadowRoot!, start: cell.body };
}

/** Does what the shell does with an edit: hands the view the cell with the new body. */
async function echo(m: Mounted, cell: Cell): Promise<Cell> {
  const last = m.edits[m.edits.length - 1]!.edit;
  const next = last.type === 'marker' ? { ...cell, marker: last.marker } : { ...cell, body: withEdit(cell.body, last) };
  m.el.cell = next;
  await m.el.updateComplete;
  return next;
}

function key(target: EventTarget, k: string, mods: KeyboardEventInit = {}): void {
  target.dispatchEvent(new KeyboardEvent('keydown', { key: k, bubbles: true, composed: true, cancelable: true, ...mods }));
}

function fieldText(root: ShadowRoot, r: number, c: number): string | null {
  return root.querySelector(`#f-${r}-${c}`)?.textContent ?? null;
}

afterEach(() => {
  releaseDrawing();
  document.body.innerHTML = '';
});

describe('<furrow-table-cell>', () => {
  it('shows the name, the counts and the fields, numbers right-aligned and missing as a dot', async () => {
    const m = await mount({ id: 'c1', marker: 'table trees', eol: '\n', body: 'row,method,yield_kg\n1,open,41.20\n1,,38.9\n\n' });
    expect(m.root.querySelector<HTMLInputElement>('.table-name')!.value).toBe('trees');
    expect(m.root.querySelector('.counts')!.textContent).toBe('2 rows · 3 columns');
    expect(fieldText(m.root, 0, 2)).toBe('41.20');
    expect(m.root.querySelector('#f-0-2')!.classList.contains('num')).toBe(true);
    expect(m.root.querySelector('#f-1-1')!.textContent).toBe('·');
    expect(m.root.querySelector('#f-1-1')!.getAttribute('title')).toBe(gridMsg.missingField());
  });

  it('typing over a field and pressing Enter sends the changed row as one splice of the body with a merge key', async () => {
    const cell: Cell = { id: 'c1', marker: 'table trees', eol: '\n', body: TREES };
    const m = await mount(cell);
    const grid = m.root.querySelector<HTMLElement>('.scroller')!;
    key(grid, 'ArrowDown');
    key(grid, 'ArrowRight');
    key(grid, 'ArrowRight');
    await m.el.updateComplete;
    key(grid, '3');
    await m.el.updateComplete;
    const ta = m.root.querySelector<HTMLTextAreaElement>('textarea.editor')!;
    expect(ta).not.toBeNull();
    expect(ta.value).toBe('3');
    ta.value = '39.5';
    key(ta, 'Enter');
    await m.el.updateComplete;
    expect(m.edits).toHaveLength(1);
    const d = m.edits[0]!;
    // the row's text alone travels, not the whole body
    expect(d.edit).toEqual({ type: 'splice', id: 'c1', from: 32, to: 46, text: '1,spindle,39.5' });
    expect(bodyAfter(m, 0)).toBe('row,method,yield_kg\n1,open,41.2\n1,spindle,39.5\n2,open,40.1\n\n');
    expect(d.mergeKey).toBe('field:c1:1:2');
    expect(m.root.querySelector('textarea.editor')).toBeNull();
    // the shell hands the body back: shown as is, nothing sent again
    await echo(m, cell);
    expect(fieldText(m.root, 1, 2)).toBe('39.5');
    expect(m.edits).toHaveLength(1);
    // Enter moved the selection down
    expect(m.root.querySelector('.at')!.id).toBe('f-2-2');
  });

  it('while the page holds drawing for the answer, a field entered is sent at once, and a key typed meanwhile ends the hold and opens the next field', async () => {
    const cell: Cell = { id: 'c1', marker: 'table trees', eol: '\n', body: TREES };
    const m = await mount(cell);
    // the shell holds drawing when an edit asks for it (src/app/app.ts); the test stands in
    m.el.addEventListener(EDIT_EVENT, (e) => {
      if ((e as CustomEvent<EditEventDetail>).detail.drawWithAnswer === true) holdDrawing(new Promise(() => {}), 10_000);
    });
    const grid = m.root.querySelector<HTMLElement>('.scroller')!;
    key(grid, 'ArrowRight');
    key(grid, 'ArrowRight');
    await m.el.updateComplete;
    key(grid, '4');
    await m.el.updateComplete;
    const ta = m.root.querySelector<HTMLTextAreaElement>('textarea.editor')!;
    ta.value = '44.5';
    key(ta, 'Enter');
    // sent at once, asking to be drawn with the answer
    expect(m.edits).toHaveLength(1);
    expect(m.edits[0]!.drawWithAnswer).toBe(true);
    expect(bodyAfter(m, 0)).toBe('row,method,yield_kg\n1,open,44.5\n1,spindle,38.9\n2,open,40.1\n\n');
    expect(drawingHeld()).not.toBeNull();
    await new Promise((r) => setTimeout(r, 20));
    // nothing drawn meanwhile: the field editor is still where it was
    expect(m.root.querySelector('textarea.editor')).toBe(ta);
    expect(fieldText(m.root, 0, 2)).toBe('41.2');
    // a key typed into it now is the grid's: the hold ends and the next field opens with it
    key(ta, '7');
    expect(drawingHeld()).toBeNull();
    await m.el.updateComplete;
    const next = m.root.querySelector<HTMLTextAreaElement>('textarea.editor')!;
    expect(next.value).toBe('7');
    expect(m.el.editor?.pos).toEqual({ r: 1, c: 2 });
    expect(fieldText(m.root, 0, 2)).toBe('44.5');
    expect(m.edits).toHaveLength(1);
  });

  /**
   * Mounts the trees table, has the shell hold drawing for `holdMs` after each edit (none
   * when null), and enters `text` in row 1's method.
   */
  async function enteredWhileHeld(text: string, holdMs: number | null = 15): Promise<{ m: Mounted; grid: HTMLElement; ta: HTMLTextAreaElement }> {
    const m = await mount({ id: 'c1', marker: 'table trees', eol: '\n', body: TREES });
    if (holdMs !== null) m.el.addEventListener(EDIT_EVENT, () => holdDrawing(new Promise(() => {}), holdMs));
    const grid = m.root.querySelector<HTMLElement>('.scroller')!;
    key(grid, 'ArrowRight');
    await m.el.updateComplete;
    key(grid, 'F2');
    await m.el.updateComplete;
    const ta = m.root.querySelector<HTMLTextAreaElement>('textarea.editor')!;
    ta.value = text;
    key(ta, 'Enter');
    return { m, grid, ta };
  }

  it('while drawing is held, the grid is drawn and takes the focus once the hold ends', async () => {
    const { m, grid, ta } = await enteredWhileHeld('closed');
    expect(m.root.querySelector('textarea.editor')).toBe(ta);
    await new Promise((r) => setTimeout(r, 40));
    await m.el.updateComplete;
    expect(m.root.querySelector('textarea.editor')).toBeNull();
    expect(fieldText(m.root, 0, 1)).toBe('closed');
    expect(m.root.activeElement).toBe(grid);
  });

  it('while drawing is held, focus the user puts elsewhere on the page stays there', async () => {
    const other = document.createElement('input');
    document.body.append(other);
    const { m } = await enteredWhileHeld('closed');
    // a click into another field of the page before the drawing
    other.focus();
    await new Promise((r) => setTimeout(r, 40));
    await m.el.updateComplete;
    expect(fieldText(m.root, 0, 1)).toBe('closed');
    expect(document.activeElement).toBe(other);
  });

  it('while drawing is held, a button that takes the grid away keeps the focus it was given', async () => {
    const { m } = await enteredWhileHeld('closed');
    // the user asks for the CSV text before the drawing: the grid goes, the button keeps the focus
    const toggle = [...m.root.querySelectorAll<HTMLButtonElement>('button')].find((b) => b.textContent?.trim() === gridMsg.showText())!;
    toggle.focus();
    toggle.click();
    await new Promise((r) => setTimeout(r, 40));
    await m.el.updateComplete;
    expect(m.el.textPinned).toBe(true);
    expect(m.root.querySelector('.scroller')).toBeNull();
    expect(m.root.activeElement).toBe(toggle);
  });

  it('keeps the column widths when the shell hands back the body a field edit made', async () => {
    const { m } = await enteredWhileHeld('a much wider method name', null);
    await m.el.updateComplete;
    const widths = m.el.shown!.widths;
    // as the shell does: the store applies the splice, and the cell comes back made by it
    const doc = applyEdit({ bom: false, firstLine: 'furrow 1', firstEol: '\n', header: '', cells: [m.el.cell] }, m.edits[0]!.edit).document;
    m.el.cell = doc.cells[0]!;
    await m.el.updateComplete;
    // the same rows: the widths are not measured again from a sample of the table
    expect(m.el.shown!.widths).toBe(widths);
    expect(widths[1]).toBeGreaterThan(m.el.shown!.widths[0]!);
  });

  it('a field with a comma is quoted on write; a decimal comma is marked with its reason', async () => {
    const cell: Cell = { id: 'c1', marker: 'table trees', eol: '\n', body: TREES };
    const m = await mount(cell);
    const grid = m.root.querySelector<HTMLElement>('.scroller')!;
    key(grid, 'ArrowRight');
    key(grid, 'ArrowRight');
    await m.el.updateComplete;
    key(grid, 'F2');
    await m.el.updateComplete;
    const ta = m.root.querySelector<HTMLTextAreaElement>('textarea.editor')!;
    expect(ta.value).toBe('41.2');
    ta.value = '12,5';
    key(ta, 'Tab');
    await echo(m, cell);
    expect(bodyAfter(m, 0)).toBe('row,method,yield_kg\n1,open,"12,5"\n1,spindle,38.9\n2,open,40.1\n\n');
    const f = m.root.querySelector('#f-0-2')!;
    expect(f.classList.contains('bad')).toBe(true);
    expect(f.getAttribute('title')).toBe('"12,5" is not a number; the column yield_kg holds numbers (use a point for decimals)');
    expect(m.root.querySelector('#h-2 .bad-count')!.textContent).toBe('1 not a number');
  });

  it('Escape cancels an edit; Delete clears the selection', async () => {
    const cell: Cell = { id: 'c1', marker: 'table trees', eol: '\n', body: TREES };
    const m = await mount(cell);
    const grid = m.root.querySelector<HTMLElement>('.scroller')!;
    key(grid, 'x');
    await m.el.updateComplete;
    key(m.root.querySelector('textarea.editor')!, 'Escape');
    await m.el.updateComplete;
    expect(m.edits).toHaveLength(0);
    key(grid, 'ArrowRight', { shiftKey: true });
    key(grid, 'ArrowDown', { shiftKey: true });
    key(grid, 'Delete');
    await m.el.updateComplete;
    expect(bodyAfter(m, 0)).toBe('row,method,yield_kg\n,,41.2\n,,38.9\n2,open,40.1\n\n');
  });

  it('pastes a three-column block from a spreadsheet as three columns, growing the table', async () => {
    const cell: Cell = { id: 'c1', marker: 'table trees', eol: '\n', body: TREES };
    const m = await mount(cell);
    const grid = m.root.querySelector<HTMLElement>('.scroller')!;
    key(grid, 'ArrowDown', { ctrlKey: true });
    await m.el.updateComplete;
    const ev = new Event('paste', { bubbles: true, cancelable: true }) as ClipboardEvent;
    Object.defineProperty(ev, 'clipboardData', { value: { getData: () => '3\tvase\t37.0\r\n3\topen\t42.8\r\n' } });
    grid.dispatchEvent(ev);
    await m.el.updateComplete;
    expect(bodyAfter(m, 0)).toBe('row,method,yield_kg\n1,open,41.2\n1,spindle,38.9\n3,vase,37.0\n3,open,42.8\n\n');
    expect(m.root.querySelector('.status')!.textContent).toBe(gridMsg.pasted(2, 3, 1, 0));
  });

  it('takes a first pasted row of names over numbers as the names of a new table, with one click to keep it as data', async () => {
    const cell: Cell = { id: 'c1', marker: 'table table1', eol: '\n', body: 'block,treatment,response\n1,,\n\n' };
    const m = await mount(cell);
    const grid = m.root.querySelector<HTMLElement>('.scroller')!;
    const ev = new Event('paste', { bubbles: true, cancelable: true }) as ClipboardEvent;
    Object.defineProperty(ev, 'clipboardData', { value: { getData: () => 'variety,block,yield\nA,1,4.2\nB,1,3.9' } });
    grid.dispatchEvent(ev);
    await m.el.updateComplete;
    expect(m.edits).toHaveLength(1);
    expect(bodyAfter(m, 0)).toBe('variety,block,yield\nA,1,4.2\nB,1,3.9\n\n');
    expect(m.root.querySelector('.status')!.textContent).toBe(gridMsg.pastedWithNames(3, 3));
    expect([...m.root.querySelectorAll('.col-reads')].map((e) => e.textContent)).toEqual(['text', 'numbers', 'numbers']);
    const undo = m.root.querySelector<HTMLButtonElement>('button.names-as-data')!;
    expect(undo.textContent).toBe(gridMsg.namesRowAsData());
    undo.click();
    await m.el.updateComplete;
    expect(m.edits).toHaveLength(2);
    expect(bodyAfter(m, 1)).toBe('block,treatment,response\nvariety,block,yield\nA,1,4.2\nB,1,3.9\n\n');
    expect(m.root.querySelector('.status')!.textContent).toBe(`${gridMsg.pasted(3, 3, 2, 0)} ${gridMsg.pastedAsCsv()}`);
    expect(m.root.querySelector('button.names-as-data')).toBeNull();
  });

  it('pastes a first row of names as data into a table that holds data', async () => {
    const m = await mount({ id: 'c1', marker: 'table trees', eol: '\n', body: TREES });
    const grid = m.root.querySelector<HTMLElement>('.scroller')!;
    const ev = new Event('paste', { bubbles: true, cancelable: true }) as ClipboardEvent;
    Object.defineProperty(ev, 'clipboardData', { value: { getData: () => 'plot\tyield\n4\t39.0' } });
    grid.dispatchEvent(ev);
    await m.el.updateComplete;
    expect(bodyAfter(m, 0)).toBe('row,method,yield_kg\nplot,yield,41.2\n4,39.0,38.9\n2,open,40.1\n\n');
    expect(m.root.querySelector('button.names-as-data')).toBeNull();
  });

  it('copies the selection as tab-separated text', async () => {
    const m = await mount({ id: 'c1', marker: 'table trees', eol: '\n', body: TREES });
    const grid = m.root.querySelector<HTMLElement>('.scroller')!;
    key(grid, 'ArrowRight', { shiftKey: true });
    key(grid, 'ArrowDown', { shiftKey: true });
    let copied = '';
    const ev = new Event('copy', { bubbles: true, cancelable: true }) as ClipboardEvent;
    Object.defineProperty(ev, 'clipboardData', { value: { setData: (_t: string, s: string) => (copied = s) } });
    grid.dispatchEvent(ev);
    expect(copied).toBe('1\topen\n1\tspindle');
  });

  it('renames a column through its name; a duplicate is refused in place with the reason', async () => {
    const cell: Cell = { id: 'c1', marker: 'table trees', eol: '\n', body: TREES };
    const m = await mount(cell);
    const grid = m.root.querySelector<HTMLElement>('.scroller')!;
    key(grid, 'ArrowUp');
    await m.el.updateComplete;
    key(grid, 'F2');
    await m.el.updateComplete;
    const ta = m.root.querySelector<HTMLTextAreaElement>('textarea.editor')!;
    expect(ta.value).toBe('row');
    ta.value = 'method';
    key(ta, 'Enter');
    await m.el.updateComplete;
    expect(m.edits).toHaveLength(0);
    expect(m.root.querySelector('.editor-problem')!.textContent).toBe(gridMsg.columnNameTaken('method', 2));
    const ta2 = m.root.querySelector<HTMLTextAreaElement>('textarea.editor')!;
    ta2.value = 'orchard_row';
    key(ta2, 'Enter');
    await m.el.updateComplete;
    expect(bodyAfter(m, 0)).toBe('orchard_row,method,yield_kg\n1,open,41.2\n1,spindle,38.9\n2,open,40.1\n\n');
  });

  it('renames the table with a marker edit, refusing a name that is not plain', async () => {
    const m = await mount({ id: 'c1', marker: 'table trees', eol: '\n', body: TREES });
    const input = m.root.querySelector<HTMLInputElement>('.table-name')!;
    input.value = '2021 trial';
    key(input, 'Enter');
    await m.el.updateComplete;
    expect(m.edits).toHaveLength(0);
    expect(m.root.querySelector('.line.problem')!.textContent).toBe(msg.badTableName('2021 trial'));
    input.value = 'fit';
    key(input, 'Enter');
    await m.el.updateComplete;
    expect(m.root.querySelector('.line.problem')!.textContent).toBe(gridMsg.tableNameTaken('fit'));
    input.value = 'pear_trees';
    key(input, 'Enter');
    expect(m.edits.map((d) => d.edit)).toEqual([{ type: 'marker', id: 'c1', marker: 'table pear_trees' }]);
  });

  it('adds rows and columns with the shortcuts, new columns named column_N', async () => {
    const cell: Cell = { id: 'c1', marker: 'table trees', eol: '\n', body: 'a,b\n1,2\n\n' };
    const m = await mount(cell);
    const grid = m.root.querySelector<HTMLElement>('.scroller')!;
    key(grid, 'ArrowRight', { altKey: true, shiftKey: true });
    const c1 = await echo(m, cell);
    expect(bodyAfter(m, 0)).toBe('a,column_2,b\n1,,2\n\n');
    key(grid, 'ArrowDown', { altKey: true, shiftKey: true });
    await echo(m, c1);
    expect(bodyAfter(m, 1)).toBe('a,column_2,b\n,,\n1,,2\n\n');
  });

  it('takes a new body from outside (undo) without sending anything', async () => {
    const cell: Cell = { id: 'c1', marker: 'table trees', eol: '\n', body: TREES };
    const m = await mount(cell);
    m.el.cell = { ...cell, body: 'row,method,yield_kg\n9,vase,30\n\n' };
    await m.el.updateComplete;
    expect(fieldText(m.root, 0, 0)).toBe('9');
    expect(m.root.querySelector('.counts')!.textContent).toBe('1 row · 3 columns');
    expect(m.edits).toHaveLength(0);
  });

  it('keeps its grid when the shell hands back the body it sent, and reads an undone body afresh', async () => {
    const cell: Cell = { id: 'c1', marker: 'table trees', eol: '\n', body: TREES };
    const m = await mount(cell);
    const grid = m.root.querySelector<HTMLElement>('.scroller')!;
    key(grid, 'ArrowRight');
    key(grid, 'ArrowRight');
    await m.el.updateComplete;
    for (const v of ['50', '51']) {
      key(grid, v[0]!);
      await m.el.updateComplete;
      const ta = m.root.querySelector<HTMLTextAreaElement>('textarea.editor')!;
      ta.value = v;
      key(ta, 'Enter', { ctrlKey: true });
      await m.el.updateComplete;
    }
    expect(m.edits).toHaveLength(2);
    // the store applied both at once: the shell hands back the latest body
    m.el.cell = { ...cell, body: bodyAfter(m, 1) };
    await m.el.updateComplete;
    expect(fieldText(m.root, 0, 2)).toBe('51');
    // undo of the second edit hands back the first body: the view shows it
    m.el.cell = { ...cell, body: bodyAfter(m, 0) };
    await m.el.updateComplete;
    expect(fieldText(m.root, 0, 2)).toBe('50');
    expect(m.edits).toHaveLength(2);
  });

  it('sends undo and redo to the page and keeps the key from reaching it twice', async () => {
    const m = await mount({ id: 'c1', marker: 'table trees', eol: '\n', body: TREES });
    const grid = m.root.querySelector<HTMLElement>('.scroller')!;
    const seen: string[] = [];
    document.addEventListener('furrow-undo', () => seen.push('undo'));
    document.addEventListener('furrow-redo', () => seen.push('redo'));
    let reachedWindow = 0;
    const onWin = (): void => {
      reachedWindow++;
    };
    window.addEventListener('keydown', onWin);
    key(grid, 'z', { ctrlKey: true });
    key(grid, 'z', { ctrlKey: true, shiftKey: true });
    key(grid, 'y', { metaKey: true });
    window.removeEventListener('keydown', onWin);
    expect(seen).toEqual(['undo', 'redo', 'redo']);
    expect(reachedWindow).toBe(0);
  });

  it('lets Tab leave the grid at its last field', async () => {
    const m = await mount({ id: 'c1', marker: 'table trees', eol: '\n', body: 'a,b\n1,2\n\n' });
    const grid = m.root.querySelector<HTMLElement>('.scroller')!;
    key(grid, 'ArrowDown');
    const first = new KeyboardEvent('keydown', { key: 'Tab', bubbles: true, cancelable: true });
    grid.dispatchEvent(first);
    expect(first.defaultPrevented).toBe(true);
    const last = new KeyboardEvent('keydown', { key: 'Tab', bubbles: true, cancelable: true });
    grid.dispatchEvent(last);
    expect(last.defaultPrevented).toBe(false);
  });

  it('refuses to delete every column, saying why', async () => {
    const m = await mount({ id: 'c1', marker: 'table trees', eol: '\n', body: 'a,b\n1,2\n\n' });
    const grid = m.root.querySelector<HTMLElement>('.scroller')!;
    key(grid, 'a', { ctrlKey: true });
    key(grid, 'C', { altKey: true, shiftKey: true, code: 'KeyC' });
    await m.el.updateComplete;
    expect(m.edits).toHaveLength(0);
    expect(m.root.querySelector('.status')!.textContent).toBe(gridMsg.lastColumn());
    key(grid, 'R', { altKey: true, shiftKey: true, code: 'KeyR' });
    expect(bodyAfter(m, 0)).toBe('a,b\n\n');
  });

  it('shows a body that does not read as its text with the reason, and sends edits of the text', async () => {
    const cell: Cell = { id: 'c1', marker: 'table trees', eol: '\n', body: 'block,trt,y\n1,a,10\n1,b\n\n' };
    const m = await mount(cell);
    expect(m.root.querySelector('.scroller')).toBeNull();
    const ta = m.root.querySelector<HTMLTextAreaElement>('textarea.raw-text')!;
    expect(ta.value).toBe('block,trt,y\n1,a,10\n1,b');
    expect(m.root.querySelector('.raw .problem')!.textContent).toContain(msg.raggedRow(2, 2, 3));
    expect(m.root.querySelector('.raw .problem code')!.textContent).toBe('1,b');
    ta.value = 'block,trt,y\n1,a,10\n1,b,12';
    ta.dispatchEvent(new Event('input', { bubbles: true }));
    await m.el.updateComplete;
    expect(m.edits[0]).toEqual({ edit: { type: 'body', id: 'c1', body: 'block,trt,y\n1,a,10\n1,b,12\n\n' }, mergeKey: 'text:c1' });
    await echo(m, cell);
    // still the text (the user is mending it), now saying it reads again
    expect(m.root.querySelector('.raw .line')!.textContent).toBe(gridMsg.rawReadsAgain(2, 3));
  });

  it('shows a table read from a file read-only, from its value', async () => {
    const value = tableFromGrid(parseCsv('plot,yield_kg\n1,41.20\n2,\n'));
    const state: CellViewState = { status: 'ok', value, parts: null, warnings: [], error: null, progress: null };
    const m = await mount({ id: 'c1', marker: 'table plots from plots.csv', eol: '\n', body: '' }, state);
    expect(m.root.querySelector('.line.file')!.textContent).toBe(gridMsg.fileLine('plots.csv'));
    expect(fieldText(m.root, 0, 1)).toBe('41.20');
    const grid = m.root.querySelector<HTMLElement>('.scroller')!;
    key(grid, 'x');
    key(grid, 'Delete');
    await m.el.updateComplete;
    expect(m.edits).toHaveLength(0);
    expect(m.root.querySelector('.status')!.textContent).toBe(gridMsg.readOnly('plots.csv'));
  });

  it('imports a CSV file when it reads as a table, and says why not otherwise', async () => {
    const m = await mount({ id: 'c1', marker: 'table trees', eol: '\n', body: TREES });
    await m.el.importFile(Object.assign(new Blob(['\uFEFFplot,y\r\n1,2\r\n1,3\r\n']), { name: 'bench.csv' }));
    // the file's own line ends kept, with the blank line after it in the same line end
    expect(m.edits[0]!.edit).toEqual({ type: 'body', id: 'c1', body: 'plot,y\r\n1,2\r\n1,3\r\n\r\n' });
    expect(m.root.querySelector('.status')!.textContent).toBe(gridMsg.imported('bench.csv', 2, 2));
    expect(fieldText(m.root, 1, 1)).toBe('3');
    await m.el.importFile(Object.assign(new Blob(['plot,plot\n1,2\n']), { name: 'bad.csv' }));
    expect(m.edits).toHaveLength(1);
    expect(m.root.querySelector('.status')!.textContent).toBe(gridMsg.importFailed('bad.csv', msg.duplicateHeader('plot', 1, 2)));
  });

  it('draws only the rows in the window of a long table', async () => {
    const lines = ['plot,y'];
    for (let i = 0; i < 100_000; i++) lines.push(`${i + 1},${(i % 97) / 10}`);
    const m = await mount({ id: 'c1', marker: 'table big', eol: '\n', body: `${lines.join('\n')}\n\n` });
    const drawn = m.root.querySelectorAll('.rows .row').length;
    expect(drawn).toBeGreaterThan(0);
    expect(drawn).toBeLessThanOrEqual(60);
    expect(m.root.querySelector<HTMLElement>('.body')!.style.height).toBe(`${100_000 * 26}px`);
  });
});
