/**
 * The page's view of the cells in the shape the hand-off code takes (the engine's
 * CellState), so the page verifies a sealed document and lists its claims with the same
 * code as the command line, from the values the worker sent.
 */
import type { CellViewState } from '../../../cells/view-api.ts';
import { parseFormula } from '../../../cells/formula/model.ts';
import { markerKind, type Cell, type Document } from '../../doc/document.ts';
import { CELL_KINDS } from '../../../cells/kinds.ts';
import type { CellState } from '../../graph/engine.ts';
import { namesRead, type NameUse } from '../../lang/ast.ts';
import { MISSING } from '../../lang/values.ts';

/** The name a cell defines, read from its text. */
export function definedName(cell: Cell): string | null {
  return CELL_KINDS.nameOf(cell);
}

/**
 * Every cell's state as the engine would give it, or null while any cell is still being
 * computed (a verdict on half-computed values would be wrong).
 */
export function settledStates(doc: Document, stateOf: (cell: Cell) => CellViewState | null): CellState[] | null {
  const out: CellState[] = [];
  for (const cell of doc.cells) {
    const kind = markerKind(cell.marker);
    const s = stateOf(cell);
    const inert = kind === 'sealed' || !['note', 'table', 'formula'].includes(kind);
    if (!inert && (s === null || s.status === 'pending' || s.value === null)) return null;
    out.push({
      id: cell.id,
      kind,
      name: inert ? null : definedName(cell),
      value: s?.value ?? MISSING,
      parts: s?.parts ?? null,
      warnings: s?.warnings ?? [],
      status: inert ? 'inert' : (s!.status as CellState['status']),
      error: s?.error ?? null,
      version: 0,
      evaluations: 0,
    });
  }
  return out;
}

/** The names a formula cell reads, from its text (for the claims that cast doubt on notes). */
export function namesReadBy(cell: Cell | undefined): readonly NameUse[] {
  if (cell === undefined || markerKind(cell.marker) !== 'formula') return [];
  const { statement } = parseFormula(cell.body);
  return statement === null ? [] : namesRead(statement.expr);
}
