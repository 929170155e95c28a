import { describe, expect, it } from 'vitest';
import {
  HEADER_ROW,
  at,
  clampSelection,
  commandForKey,
  editorCommandForKey,
  enterMove,
  moveSelection,
  selectionRect,
  tabMove,
  type KeyInput,
} from '../../../cells/table/grid-keys.ts';

const e = { rows: 5, cols: 3 };
const key = (k: string, mods: Partial<KeyInput> = {}): KeyInput => ({ key: k, code: '', shift: false, alt: false, mod: false, ...mods });

describe('moving the selection', () => {
  it('stops at every edge, the row of names being the top one', () => {
    expect(moveSelection(at(0, 0), e, -1, 0).focus).toEqual({ r: HEADER_ROW, c: 0 });
    expect(moveSelection(at(HEADER_ROW, 0), e, -1, 0).focus).toEqual({ r: HEADER_ROW, c: 0 });
    expect(moveSelection(at(4, 2), e, 1, 0).focus).toEqual({ r: 4, c: 2 });
    expect(moveSelection(at(4, 2), e, 0, 1).focus).toEqual({ r: 4, c: 2 });
    expect(moveSelection(at(2, 0), e, 0, -1).focus).toEqual({ r: 2, c: 0 });
  });
  it('jumps to the edges with Mod, reaching the names only from the first row', () => {
    expect(moveSelection(at(3, 1), e, -1, 0, { jump: true }).focus).toEqual({ r: 0, c: 1 });
    expect(moveSelection(at(0, 1), e, -1, 0, { jump: true }).focus).toEqual({ r: HEADER_ROW, c: 1 });
    expect(moveSelection(at(1, 1), e, 1, 0, { jump: true }).focus).toEqual({ r: 4, c: 1 });
    expect(moveSelection(at(1, 1), e, 0, 1, { jump: true }).focus).toEqual({ r: 1, c: 2 });
  });
  it('extends from the anchor with Shift', () => {
    const s = moveSelection(moveSelection(at(1, 1), e, 1, 0, { extend: true }), e, 0, -1, { extend: true });
    expect(s.anchor).toEqual({ r: 1, c: 1 });
    expect(selectionRect(s)).toEqual({ r0: 1, r1: 2, c0: 0, c1: 1 });
  });
  it('Enter goes down and stays on the last row; Shift+Enter goes up to the names', () => {
    expect(enterMove(at(1, 2), e, false).focus).toEqual({ r: 2, c: 2 });
    expect(enterMove(at(4, 2), e, false).focus).toEqual({ r: 4, c: 2 });
    expect(enterMove(at(0, 2), e, true).focus).toEqual({ r: HEADER_ROW, c: 2 });
    expect(enterMove(at(HEADER_ROW, 0), { rows: 0, cols: 2 }, false).focus).toEqual({ r: HEADER_ROW, c: 0 });
  });
  it('Tab goes right and wraps to the next row; at the last field it lets focus leave', () => {
    expect(tabMove(at(1, 1), e, false)?.focus).toEqual({ r: 1, c: 2 });
    expect(tabMove(at(1, 2), e, false)?.focus).toEqual({ r: 2, c: 0 });
    expect(tabMove(at(4, 2), e, false)).toBeNull();
    expect(tabMove(at(1, 0), e, true)?.focus).toEqual({ r: 0, c: 2 });
    expect(tabMove(at(HEADER_ROW, 0), e, true)).toBeNull();
  });
  it('clamps a selection into a grid that shrank', () => {
    const s = { anchor: { r: 9, c: 7 }, focus: { r: 2, c: 1 } };
    expect(clampSelection(s, e)).toEqual({ anchor: { r: 4, c: 2 }, focus: { r: 2, c: 1 } });
    const fits = at(1, 1);
    expect(clampSelection(fits, e)).toBe(fits);
    expect(clampSelection(at(3, 0), { rows: 0, cols: 1 }).focus).toEqual({ r: HEADER_ROW, c: 0 });
  });
});

describe('keys in the grid', () => {
  it('arrows move, Shift extends, Mod jumps', () => {
    expect(commandForKey(key('ArrowDown'))).toEqual({ kind: 'move', dr: 1, dc: 0, extend: false, jump: false });
    expect(commandForKey(key('ArrowLeft', { shift: true }))).toEqual({ kind: 'move', dr: 0, dc: -1, extend: true, jump: false });
    expect(commandForKey(key('ArrowUp', { mod: true }))).toEqual({ kind: 'move', dr: -1, dc: 0, extend: false, jump: true });
  });
  it('Enter, Tab, F2, Delete, Backspace, Escape', () => {
    expect(commandForKey(key('Enter', { shift: true }))).toEqual({ kind: 'enter', back: true });
    expect(commandForKey(key('Tab'))).toEqual({ kind: 'tab', back: false });
    expect(commandForKey(key('F2'))).toEqual({ kind: 'edit' });
    expect(commandForKey(key('Delete'))).toEqual({ kind: 'clear' });
    expect(commandForKey(key('Backspace'))).toEqual({ kind: 'clear' });
    expect(commandForKey(key('Escape'))).toEqual({ kind: 'collapse' });
  });
  it('a typed character starts editing; Mod shortcuts do not type; AltGr does', () => {
    expect(commandForKey(key('7'))).toEqual({ kind: 'type', text: '7' });
    expect(commandForKey(key('É', { shift: true }))).toEqual({ kind: 'type', text: 'É' });
    expect(commandForKey(key('😀'))).toEqual({ kind: 'type', text: '😀' });
    expect(commandForKey(key('c', { mod: true }))).toBeNull();
    expect(commandForKey(key('v', { mod: true }))).toBeNull();
    expect(commandForKey(key('@', { mod: true, alt: true }))).toEqual({ kind: 'type', text: '@' });
    expect(commandForKey(key('Process'))).toEqual({ kind: 'compose' });
    expect(commandForKey(key('Shift', { shift: true }))).toBeNull();
  });
  it('undo and redo go to the page; Mod+A selects all', () => {
    expect(commandForKey(key('z', { mod: true }))).toEqual({ kind: 'undo' });
    expect(commandForKey(key('Z', { mod: true, shift: true }))).toEqual({ kind: 'redo' });
    expect(commandForKey(key('y', { mod: true }))).toEqual({ kind: 'redo' });
    expect(commandForKey(key('a', { mod: true }))).toEqual({ kind: 'select-all' });
  });
  it('Alt+Shift changes the shape, letters matched by physical key', () => {
    const as = { alt: true, shift: true };
    expect(commandForKey(key('ArrowDown', as))).toEqual({ kind: 'insert-row', below: true });
    expect(commandForKey(key('ArrowUp', as))).toEqual({ kind: 'insert-row', below: false });
    expect(commandForKey(key('ArrowRight', as))).toEqual({ kind: 'insert-column', right: true });
    expect(commandForKey(key('ArrowLeft', as))).toEqual({ kind: 'insert-column', right: false });
    // a Mac types ‰ and Ç for these keys with Option+Shift
    expect(commandForKey({ ...key('‰', as), code: 'KeyR' })).toEqual({ kind: 'delete-rows' });
    expect(commandForKey({ ...key('Ç', as), code: 'KeyC' })).toEqual({ kind: 'delete-columns' });
  });
});

describe('keys in the field editor', () => {
  it('Enter and Tab keep the text and move; Shift reverses; Escape cancels; Alt+Enter breaks the line', () => {
    expect(editorCommandForKey(key('Enter'), 'replace')).toEqual({ kind: 'commit', via: 'enter', dr: 1, dc: 0 });
    expect(editorCommandForKey(key('Enter', { shift: true }), 'in-place')).toEqual({ kind: 'commit', via: 'enter', dr: -1, dc: 0 });
    expect(editorCommandForKey(key('Tab', { shift: true }), 'replace')).toEqual({ kind: 'commit', via: 'tab', dr: 0, dc: -1 });
    expect(editorCommandForKey(key('Escape'), 'replace')).toEqual({ kind: 'cancel' });
    expect(editorCommandForKey(key('Enter', { alt: true }), 'replace')).toEqual({ kind: 'newline' });
  });
  it('arrows leave a field being typed over, but move the caret in a field opened with F2', () => {
    expect(editorCommandForKey(key('ArrowRight'), 'replace')).toEqual({ kind: 'commit', via: 'arrow', dr: 0, dc: 1 });
    expect(editorCommandForKey(key('ArrowRight'), 'in-place')).toBeNull();
    expect(editorCommandForKey(key('ArrowRight', { shift: true }), 'replace')).toBeNull();
    expect(editorCommandForKey(key('F2'), 'replace')).toEqual({ kind: 'toggle-mode' });
    expect(editorCommandForKey(key('x'), 'replace')).toBeNull();
  });
});
