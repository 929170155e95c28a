/**
 * Where a value comes from: the cells a cell reads, directly or not, back to the data, in
 * an order where each cell comes after the cells it reads. Pure (names are read from the
 * cells' text), so the page can show the chain without asking the worker.
 */
import type { Cell } from '../../doc/document.ts';
import type { NameUse } from '../../lang/ast.ts';
import { splitNote } from '../../../cells/note/model.ts';
import { namesRead } from '../../lang/ast.ts';
import { markerKind } from '../../doc/document.ts';
import { definedName, namesReadBy } from './page-states.ts';

/** One step of a chain: a cell and how far it is from the cell asked about. */
export interface ChainStep {
  readonly cell: Cell;
  /** 1-based position in the document. */
  readonly position: number;
  readonly name: string | null;
  /** Steps between this cell and the cell asked about (0 for that cell itself). */
  readonly distance: number;
  /** The names it reads that the chain follows. */
  readonly reads: readonly string[];
}

/** The names a cell reads, from its text (formulas and notes; tables read none). */
export function cellReads(cell: Cell): readonly NameUse[] {
  const kind = markerKind(cell.marker);
  if (kind === 'formula') return namesReadBy(cell);
  if (kind === 'note') return splitNote(cell.body).flatMap((p) => (p.type === 'placeholder' && p.expr !== null ? namesRead(p.expr) : []));
  return [];
}

/**
 * The chain of cells that the value of `cellId` depends on, sources first, the cell itself
 * last. Names defined twice are not followed (the cell that reads them shows an error).
 */
export function dependencyChain(cells: readonly Cell[], cellId: string): ChainStep[] {
  const definers = new Map<string, Cell[]>();
  for (const c of cells) {
    const n = definedName(c);
    if (n !== null) definers.set(n, [...(definers.get(n) ?? []), c]);
  }
  const position = new Map(cells.map((c, i) => [c.id, i + 1] as const));
  const start = cells.find((c) => c.id === cellId);
  if (start === undefined) return [];
  const distance = new Map<string, number>([[start.id, 0]]);
  const reads = new Map<string, string[]>();
  const queue: Cell[] = [start];
  while (queue.length > 0) {
    const c = queue.shift()!;
    const names = [...new Set(cellReads(c).map((u) => u.name))];
    const followed: string[] = [];
    for (const n of names) {
      const defs = definers.get(n);
      if (defs === undefined || defs.length !== 1) continue;
      followed.push(n);
      const d = defs[0]!;
      if (!distance.has(d.id)) {
        distance.set(d.id, distance.get(c.id)! + 1);
        queue.push(d);
      }
    }
    reads.set(c.id, followed);
  }
  // sources first: a depth-first walk that lists a cell after everything it reads (an
  // explicit stack, so a long chain cannot overflow; a cycle is listed once and not followed)
  const byId = new Map(cells.map((c) => [c.id, c] as const));
  const order: string[] = [];
  const seen = new Set<string>();
  const stack: { id: string; next: number }[] = [{ id: start.id, next: 0 }];
  seen.add(start.id);
  while (stack.length > 0) {
    const top = stack[stack.length - 1]!;
    const names = reads.get(top.id) ?? [];
    if (top.next < names.length) {
      const d = definers.get(names[top.next++]!)![0]!;
      if (!seen.has(d.id)) {
        seen.add(d.id);
        stack.push({ id: d.id, next: 0 });
      }
      continue;
    }
    stack.pop();
    order.push(top.id);
  }
  return order.map((id) => {
    const cell = byId.get(id)!;
    return { cell, position: position.get(id)!, name: definedName(cell), distance: distance.get(id)!, reads: reads.get(id) ?? [] };
  });
}
