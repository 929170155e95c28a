/**
 * The keys that work on whole cells, anywhere on the page (in editors too): add a cell below,
 * move a cell, delete one, go to the cell above or below, open the help. Chosen to stay
 * clear of the browser's own keys (Alt+arrows go back and forward, Ctrl+Shift+Delete clears
 * the browsing data, F1 opens the browser's help), of the formula editor's (Alt+arrows move
 * lines, Shift+Alt+arrows copy them, Mod+Enter inserts a blank line) and of the table
 * grid's (Alt+Shift+arrows add rows and columns, Alt+Enter a line break in a field).
 * The help panel lists them from this table.
 */

/** What a cell key does. */
export type CellCommand = 'add-below' | 'move-up' | 'move-down' | 'delete' | 'previous' | 'next' | 'help';

/** One key of the table: the key as written in the help, and how a key event matches it. */
export interface CellKey {
  readonly command: CellCommand;
  /** The key as the help shows it (Ctrl reads Cmd on a Mac). */
  readonly keys: string;
  readonly does: string;
  readonly key: string;
  readonly alt: boolean;
  readonly shift: boolean;
  /** Ctrl, or Cmd on a Mac. */
  readonly mod: boolean;
}

export const CELL_KEYS: readonly CellKey[] = [
  { command: 'add-below', keys: 'Ctrl+Shift+Enter', does: 'add a formula cell below this one, with the caret in it', key: 'Enter', alt: false, shift: true, mod: true },
  { command: 'previous', keys: 'Alt+Page Up', does: 'go to the cell above', key: 'PageUp', alt: true, shift: false, mod: false },
  { command: 'next', keys: 'Alt+Page Down', does: 'go to the cell below', key: 'PageDown', alt: true, shift: false, mod: false },
  { command: 'move-up', keys: 'Alt+Shift+Page Up', does: 'move this cell up', key: 'PageUp', alt: true, shift: true, mod: false },
  { command: 'move-down', keys: 'Alt+Shift+Page Down', does: 'move this cell down', key: 'PageDown', alt: true, shift: true, mod: false },
  { command: 'delete', keys: 'Alt+Shift+Delete', does: 'delete this cell (Ctrl+Z brings it back)', key: 'Delete', alt: true, shift: true, mod: false },
  { command: 'help', keys: 'Alt+Shift+F1', does: 'open or close this help', key: 'F1', alt: true, shift: true, mod: false },
];

/** The parts of a key event the table reads. */
export interface KeyPress {
  readonly key: string;
  readonly altKey: boolean;
  readonly shiftKey: boolean;
  readonly ctrlKey: boolean;
  readonly metaKey: boolean;
}

/** The cell command a key press asks for, or null. */
export function cellCommandFor(e: KeyPress): CellCommand | null {
  const mod = e.ctrlKey || e.metaKey;
  for (const k of CELL_KEYS) {
    if (e.key === k.key && e.altKey === k.alt && e.shiftKey === k.shift && mod === k.mod) return k.command;
  }
  return null;
}
