/**
 * The cell kinds, one line each. A kind is a folder under cells/ whose `kind.ts` describes
 * it (marker grammar, new-cell template, name, margin label, printing, analysis) and whose
 * view is listed in cells/views.ts. The engine, the shell and the command line are handed
 * this collection; none of them names a kind.
 */
import { CellKinds } from '../src/graph/kinds.ts';
import { formulaKind } from './formula/kind.ts';
import { noteKind } from './note/kind.ts';
import { sealedKind } from './sealed/kind.ts';
import { tableKind } from './table/kind.ts';

/** Every kind, in the order the page offers to add them. */
export const CELL_KINDS = new CellKinds([noteKind, tableKind, formulaKind, sealedKind]);
