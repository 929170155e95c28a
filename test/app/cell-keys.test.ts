// The keys for cells must not take a key that the formula editor, the table grid or the
// browser already uses. The editor's keymaps are read from the CodeMirror packages the
// editor is built from; the grid's from its own key table; the browser's are listed here.
import { closeBracketsKeymap, completionKeymap } from '@codemirror/autocomplete';
import { defaultKeymap } from '@codemirror/commands';
import type { KeyBinding } from '@codemirror/view';
import { describe, expect, it } from 'vitest';
import { CELL_KEYS, cellCommandFor, type CellKey } from '../../src/app/cell-keys.ts';
import { commandForKey, editorCommandForKey } from '../../cells/table/grid-keys.ts';

/** A key as CodeMirror writes it (`Shift-Alt-PageUp`), on Linux and Windows. */
function written(k: CellKey): string {
  return [k.mod ? 'Mod' : '', k.alt ? 'Alt' : '', k.shift ? 'Shift' : '', k.key].filter((p) => p !== '').join('-');
}

/** A CodeMirror key name with its modifiers in one order, Ctrl read as Mod (not on a Mac). */
function normal(name: string): string {
  const parts = name.split(/-(?!$)/);
  const key = parts.pop()!;
  const mods = new Set(parts.map((p) => (p === 'Ctrl' || p === 'Control' || p === 'Cmd' || p === 'Meta' || p === 'c' || p === 'm' ? 'Mod' : p === 'a' ? 'Alt' : p === 's' ? 'Shift' : p)));
  return [...['Mod', 'Alt', 'Shift'].filter((m) => mods.has(m)), key].join('-');
}

function editorKeys(bindings: readonly KeyBinding[]): Set<string> {
  const out = new Set<string>();
  for (const b of bindings) {
    for (const name of [b.key, b.linux, b.win, b.mac]) {
      if (name === undefined) continue;
      out.add(normal(name));
      if (b.shift !== undefined) out.add(normal(`Shift-${name}`));
    }
  }
  return out;
}

describe('keys for cells', () => {
  it('match their own key event and no other', () => {
    for (const k of CELL_KEYS) {
      expect(cellCommandFor({ key: k.key, altKey: k.alt, shiftKey: k.shift, ctrlKey: k.mod, metaKey: false })).toBe(k.command);
      // Cmd on a Mac is the same as Ctrl
      if (k.mod) expect(cellCommandFor({ key: k.key, altKey: k.alt, shiftKey: k.shift, ctrlKey: false, metaKey: true })).toBe(k.command);
      // the same key with one modifier more or less is not a cell key of this command
      expect(cellCommandFor({ key: k.key, altKey: !k.alt, shiftKey: k.shift, ctrlKey: k.mod, metaKey: false })).not.toBe(k.command);
      expect(cellCommandFor({ key: k.key, altKey: k.alt, shiftKey: !k.shift, ctrlKey: k.mod, metaKey: false })).not.toBe(k.command);
    }
    expect(new Set(CELL_KEYS.map(written)).size).toBe(CELL_KEYS.length);
    expect(new Set(CELL_KEYS.map((k) => k.command)).size).toBe(CELL_KEYS.length);
  });

  it("take no key of the formula editor's keymaps", () => {
    const taken = editorKeys([...defaultKeymap, ...closeBracketsKeymap, ...completionKeymap]);
    // the reading of the keymaps works: keys they are known to hold are found
    expect(taken.has('Mod-Enter')).toBe(true);
    expect(taken.has('Alt-ArrowUp')).toBe(true);
    expect(taken.has('Alt-Shift-ArrowUp')).toBe(true);
    expect(taken.has('Shift-PageUp')).toBe(true);
    for (const k of CELL_KEYS) expect(taken.has(written(k)), written(k)).toBe(false);
  });

  it("take no key of the table grid, neither between fields nor while one is typed in (besides Ctrl+Enter's commit, which leaving the field does too)", () => {
    for (const k of CELL_KEYS) {
      const input = { key: k.key, code: k.key, shift: k.shift, alt: k.alt, mod: k.mod };
      expect(commandForKey(input), k.keys).toBeNull();
      const inField = editorCommandForKey(input, 'in-place');
      if (k.command === 'add-below') expect(inField).toEqual({ kind: 'commit', via: 'stay', dr: 0, dc: 0 });
      else expect(inField, k.keys).toBeNull();
    }
  });

  it("take none of the browser's own keys", () => {
    // common practice, no source: the browser keys a page cannot or should not take over
    // (history, tabs, clearing data, help, reload, full screen, developer tools)
    const browser = ['Alt-ArrowLeft', 'Alt-ArrowRight', 'Alt-Home', 'Mod-PageUp', 'Mod-PageDown', 'Mod-Shift-Delete', 'F1', 'F5', 'F6', 'F11', 'F12', 'Mod-Shift-PageUp', 'Mod-Shift-PageDown'];
    for (const k of CELL_KEYS) expect(browser, k.keys).not.toContain(written(k));
  });
});
