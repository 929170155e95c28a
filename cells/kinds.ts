/**
 * The cell kinds the engine knows, one line each. A new kind is a folder under cells/ with
 * its model (a CellKind) and its view, plus one line here.
 */
import type { CellKind } from '../src/graph/cell-kind.ts';
import { formulaKind } from './formula/model.ts';
import { noteKind } from './note/model.ts';
import { tableKind } from './table/model.ts';

/** Every evaluated cell kind, by marker word. */
export const CELL_KINDS: ReadonlyMap<string, CellKind> = new Map([
  [noteKind.kind, noteKind],
  [tableKind.kind, tableKind],
  [formulaKind.kind, formulaKind],
]);
