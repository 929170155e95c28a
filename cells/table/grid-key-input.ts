/** A keyboard event as the grid's key tables read it (cells/table/grid-keys.ts). */
import type { KeyInput } from './grid-keys.ts';

export function keyInput(e: KeyboardEvent): KeyInput {
  return { key: e.key, code: e.code, shift: e.shiftKey, alt: e.altKey, mod: e.ctrlKey || e.metaKey, composing: e.isComposing };
}
