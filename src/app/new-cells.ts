/**
 * New cells the page adds: from a kind's template (the add buttons, the cell key) or from an
 * example in the help panel. Each takes the first name of its pattern the document does not
 * use yet, so that a new cell never shadows or collides with one already there.
 */
import { CELL_KINDS } from '../../cells/kinds.ts';
import type { Cell, Document } from '../doc/document.ts';
import { freshCellId } from '../doc/edits.ts';
import type { CellKind } from '../graph/cell-kind.ts';
import { namesTaken } from './table-import.ts';

/** Names a pattern's first name not yet taken in a document: `value1`, `value2`, … */
export function freshNames(doc: Document): (base: string) => string {
  const names = namesTaken(doc);
  return (base: string): string => {
    for (let k = 1; ; k++) {
      const n = `${base}${k}`;
      if (!names.has(n)) return n;
    }
  };
}

/** A new cell of a kind, named with the first name of its pattern not yet taken. */
export function newCell(doc: Document, kind: CellKind): Cell | null {
  if (kind.template === undefined) return null;
  const { marker, body } = kind.template(freshNames(doc));
  return { id: freshCellId(doc), marker, eol: '\n', body };
}

/** A formula cell holding an example from the help panel, named after its function. */
export function exampleCell(doc: Document, fn: string, text: string): { readonly cell: Cell; readonly name: string } {
  const name = freshNames(doc)(fn.replace(/_+$/, ''));
  return { cell: { id: freshCellId(doc), marker: 'formula', eol: '\n', body: `${name} = ${text}\n\n` }, name };
}

/** The kinds the page offers to add, in their listed order. */
export const ADDABLE = CELL_KINDS.all().filter((k) => k.template !== undefined);
