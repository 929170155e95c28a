/**
 * The grid's selection and its keyboard, as pure functions: a key press becomes a command,
 * a command moves a selection. No DOM here, so every rule is tested in Node.
 *
 * Positions count data rows from 0; the row of column names is HEADER_ROW (-1), so that a
 * column is renamed the way a field is edited.
 */

/** The row of column names. */
export const HEADER_ROW = -1;

/** A field of the grid (or a column name when r is HEADER_ROW). */
export interface Pos {
  readonly r: number;
  readonly c: number;
}

/** A selection: the anchor stays put while Shift extends the focus. */
export interface Selection {
  readonly anchor: Pos;
  readonly focus: Pos;
}

/** An inclusive rectangle of positions. */
export interface Rect {
  readonly r0: number;
  readonly r1: number;
  readonly c0: number;
  readonly c1: number;
}

/** The size of a grid: data rows (the header row comes on top) and columns. */
export interface Extent {
  readonly rows: number;
  readonly cols: number;
}

/** A selection of one position. */
export function at(r: number, c: number): Selection {
  const p = { r, c };
  return { anchor: p, focus: p };
}

/** The rectangle a selection covers. */
export function selectionRect(s: Selection): Rect {
  return {
    r0: Math.min(s.anchor.r, s.focus.r),
    r1: Math.max(s.anchor.r, s.focus.r),
    c0: Math.min(s.anchor.c, s.focus.c),
    c1: Math.max(s.anchor.c, s.focus.c),
  };
}

/** True when a rectangle holds one position. */
export function isSingle(r: Rect): boolean {
  return r.r0 === r.r1 && r.c0 === r.c1;
}

/** True when a position lies in a rectangle. */
export function inRect(rect: Rect, r: number, c: number): boolean {
  return r >= rect.r0 && r <= rect.r1 && c >= rect.c0 && c <= rect.c1;
}

function clampPos(p: Pos, e: Extent): Pos {
  const r = Math.max(HEADER_ROW, Math.min(e.rows - 1, p.r));
  const c = Math.max(0, Math.min(e.cols - 1, p.c));
  return r === p.r && c === p.c ? p : { r, c };
}

/** The selection brought inside a grid that shrank (undo, deleted rows or columns). */
export function clampSelection(s: Selection, e: Extent): Selection {
  const anchor = clampPos(s.anchor, e);
  const focus = clampPos(s.focus, e);
  return anchor === s.anchor && focus === s.focus ? s : { anchor, focus };
}

/** How a move goes: by steps, or to the last filled position of the grid in that direction. */
export interface MoveOptions {
  /** Keep the anchor and move the focus only (Shift). */
  readonly extend?: boolean;
  /** Go to the edge of the grid (Mod). */
  readonly jump?: boolean;
}

/**
 * Moves the focus by (dr, dc), staying inside the grid: a move past an edge stops at it.
 * A jump up stops at the first data row before it reaches the column names.
 */
export function moveSelection(s: Selection, e: Extent, dr: number, dc: number, opts: MoveOptions = {}): Selection {
  const f = s.focus;
  let r = f.r + dr;
  let c = f.c + dc;
  if (opts.jump) {
    if (dr > 0) r = e.rows - 1;
    else if (dr < 0) r = f.r > 0 ? 0 : HEADER_ROW;
    if (dc > 0) c = e.cols - 1;
    else if (dc < 0) c = 0;
  }
  const to = clampPos({ r, c }, e);
  return opts.extend ? { anchor: s.anchor, focus: to } : { anchor: to, focus: to };
}

/** Moves to a given position (Home, End, a click), extending when asked. */
export function selectTo(s: Selection, e: Extent, p: Pos, extend = false): Selection {
  const to = clampPos(p, e);
  return extend ? { anchor: s.anchor, focus: to } : { anchor: to, focus: to };
}

/**
 * Tab: the next field to the right, then the first field of the next row (Shift: the other
 * way). Null at the grid's last (first) field, so that focus can leave the grid there and a
 * keyboard user is never trapped.
 */
export function tabMove(s: Selection, e: Extent, back: boolean): Selection | null {
  const { r, c } = s.focus;
  if (!back) {
    if (c + 1 < e.cols) return at(r, c + 1);
    if (r + 1 < e.rows) return at(r + 1, 0);
    return null;
  }
  if (c > 0) return at(r, c - 1);
  if (r > HEADER_ROW) return at(r - 1, e.cols - 1);
  return null;
}

/** Enter: the field below (Shift: above); at the last (first) row the selection stays. */
export function enterMove(s: Selection, e: Extent, back: boolean): Selection {
  const { r, c } = s.focus;
  const to = back ? Math.max(HEADER_ROW, r - 1) : Math.min(Math.max(e.rows - 1, HEADER_ROW), r + 1);
  return at(to, c);
}

/** A key press as the grid needs it (the DOM's KeyboardEvent reduces to this). */
export interface KeyInput {
  readonly key: string;
  /** The physical key, for shortcuts that must not depend on the keyboard layout. */
  readonly code: string;
  readonly shift: boolean;
  readonly alt: boolean;
  /** Ctrl, or Cmd on a Mac. */
  readonly mod: boolean;
  /** An input method is composing text. */
  readonly composing?: boolean;
}

/** What a key does in the grid when no field is being edited. */
export type GridCommand =
  | { readonly kind: 'move'; readonly dr: number; readonly dc: number; readonly extend: boolean; readonly jump: boolean }
  | { readonly kind: 'page'; readonly dir: 1 | -1; readonly extend: boolean }
  | { readonly kind: 'row-edge'; readonly end: boolean; readonly extend: boolean; readonly corner: boolean }
  | { readonly kind: 'enter' | 'tab'; readonly back: boolean }
  | { readonly kind: 'edit' }
  /** Start editing with this text in place of the field. */
  | { readonly kind: 'type'; readonly text: string }
  /** An input method or a dead key begins: open the editor empty and let the browser type. */
  | { readonly kind: 'compose' }
  | { readonly kind: 'clear' }
  | { readonly kind: 'collapse' }
  | { readonly kind: 'select-all' }
  | { readonly kind: 'insert-row'; readonly below: boolean }
  | { readonly kind: 'insert-column'; readonly right: boolean }
  | { readonly kind: 'delete-rows' }
  | { readonly kind: 'delete-columns' }
  | { readonly kind: 'undo' }
  | { readonly kind: 'redo' };

const ARROWS: ReadonlyMap<string, readonly [number, number]> = new Map([
  ['ArrowUp', [-1, 0]],
  ['ArrowDown', [1, 0]],
  ['ArrowLeft', [0, -1]],
  ['ArrowRight', [0, 1]],
] as const);

/**
 * The grid's shortcuts for changing its shape, shown in tooltips. Alt+Shift keeps them clear
 * of the browser's own shortcuts and of typing; letters are matched by physical key because
 * Alt changes the character a key types on some systems.
 */
export const SHAPE_KEYS = {
  rowBelow: 'Alt+Shift+↓',
  rowAbove: 'Alt+Shift+↑',
  columnRight: 'Alt+Shift+→',
  columnLeft: 'Alt+Shift+←',
  deleteRows: 'Alt+Shift+R',
  deleteColumns: 'Alt+Shift+C',
} as const;

/** One character a key types, or null (names such as "Enter", or several characters). */
function typedCharacter(key: string): string | null {
  if (key.length === 0) return null;
  const chars = [...key];
  return chars.length === 1 ? key : null;
}

/** The command for a key pressed in the grid, or null when the key is not the grid's. */
export function commandForKey(k: KeyInput): GridCommand | null {
  if (k.composing || k.key === 'Process' || k.key === 'Dead') return { kind: 'compose' };
  const arrow = ARROWS.get(k.key);
  if (k.alt && k.shift && !k.mod) {
    if (k.key === 'ArrowDown' || k.key === 'ArrowUp') return { kind: 'insert-row', below: k.key === 'ArrowDown' };
    if (k.key === 'ArrowRight' || k.key === 'ArrowLeft') return { kind: 'insert-column', right: k.key === 'ArrowRight' };
    if (k.code === 'KeyR') return { kind: 'delete-rows' };
    if (k.code === 'KeyC') return { kind: 'delete-columns' };
  }
  if (k.mod && !k.alt) {
    const lower = k.key.toLowerCase();
    if (lower === 'z') return { kind: k.shift ? 'redo' : 'undo' };
    if (lower === 'y' && !k.shift) return { kind: 'redo' };
    if (lower === 'a' && !k.shift) return { kind: 'select-all' };
    if (arrow) return { kind: 'move', dr: arrow[0], dc: arrow[1], extend: k.shift, jump: true };
    if (k.key === 'Home' || k.key === 'End') return { kind: 'row-edge', end: k.key === 'End', extend: k.shift, corner: true };
    // copy, cut and paste arrive as clipboard events; everything else is the browser's
    return null;
  }
  if (arrow && !k.alt) return { kind: 'move', dr: arrow[0], dc: arrow[1], extend: k.shift, jump: false };
  switch (k.key) {
    case 'PageUp':
    case 'PageDown':
      return k.alt ? null : { kind: 'page', dir: k.key === 'PageDown' ? 1 : -1, extend: k.shift };
    case 'Home':
    case 'End':
      return k.alt ? null : { kind: 'row-edge', end: k.key === 'End', extend: k.shift, corner: false };
    case 'Enter':
      return k.alt ? null : { kind: 'enter', back: k.shift };
    case 'Tab':
      return k.alt ? null : { kind: 'tab', back: k.shift };
    case 'F2':
      return { kind: 'edit' };
    case 'Delete':
    case 'Backspace':
      return k.alt ? null : { kind: 'clear' };
    case 'Escape':
      return { kind: 'collapse' };
  }
  // Ctrl+Alt is AltGr on some keyboards, and Alt (Option) types characters on a Mac
  const ch = typedCharacter(k.key);
  if (ch !== null && (!k.mod || k.alt)) return { kind: 'type', text: ch };
  return null;
}

/** How the field editor was opened: arrows leave the field (typing over it) or move the caret. */
export type EditMode = 'replace' | 'in-place';

/** What a key does while a field is being edited. */
export type EditorCommand =
  /** Keep the new text and move: by Enter and Tab rules, by an arrow, or not at all. */
  | { readonly kind: 'commit'; readonly via: 'enter' | 'tab' | 'arrow' | 'stay'; readonly dr: number; readonly dc: number }
  | { readonly kind: 'cancel' }
  | { readonly kind: 'newline' }
  | { readonly kind: 'toggle-mode' };

/** The command for a key pressed in the field editor, or null to let the editor type. */
export function editorCommandForKey(k: KeyInput, mode: EditMode): EditorCommand | null {
  if (k.composing || k.key === 'Process') return null;
  switch (k.key) {
    case 'Escape':
      return { kind: 'cancel' };
    case 'Enter':
      if (k.alt) return { kind: 'newline' };
      if (k.mod) return { kind: 'commit', via: 'stay', dr: 0, dc: 0 };
      return { kind: 'commit', via: 'enter', dr: k.shift ? -1 : 1, dc: 0 };
    case 'Tab':
      return { kind: 'commit', via: 'tab', dr: 0, dc: k.shift ? -1 : 1 };
    case 'F2':
      return { kind: 'toggle-mode' };
  }
  const arrow = ARROWS.get(k.key);
  if (arrow && mode === 'replace' && !k.shift && !k.alt && !k.mod) return { kind: 'commit', via: 'arrow', dr: arrow[0], dc: arrow[1] };
  return null;
}
