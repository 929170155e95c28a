/**
 * Which live numbers in notes rest on a failing claim: a placeholder is in doubt when it
 * reads a name that a claim that does not hold also reads, so a sentence written beside
 * numbers that no longer support it is marked where it is read (the page and the report).
 */
import type { Cell } from '../doc/document.ts';
import type { CellState } from '../graph/engine.ts';
import { namesRead, type NameUse } from '../lang/ast.ts';
import { splitNote } from '../../cells/note/model.ts';
import { markerKind } from '../doc/document.ts';

/** The placeholders in doubt in one note, and the claims that cast it. */
export interface NoteDoubt {
  /** Indices of the note's placeholders, in order of appearance (0-based). */
  readonly slots: ReadonlySet<number>;
  /** The statements of the failing claims. */
  readonly claims: readonly string[];
}

/** For each note cell with a placeholder in doubt, by cell id. */
export function notesInDoubt(cells: readonly Cell[], states: readonly CellState[], readsOf: (id: string) => readonly NameUse[]): Map<string, NoteDoubt> {
  const failing: { statement: string; names: Set<string> }[] = [];
  states.forEach((s, i) => {
    const v = s.value;
    if (typeof v === 'object' && v.kind === 'claim' && !v.holds) {
      failing.push({ statement: v.statement, names: new Set(readsOf(cells[i]!.id).map((u) => u.name)) });
    }
  });
  const out = new Map<string, NoteDoubt>();
  if (failing.length === 0) return out;
  for (const cell of cells) {
    if (markerKind(cell.marker) !== 'note') continue;
    const slots = new Set<number>();
    const claims = new Set<string>();
    let k = 0;
    for (const p of splitNote(cell.body)) {
      if (p.type !== 'placeholder') continue;
      const names = p.expr === null ? [] : namesRead(p.expr).map((u) => u.name);
      for (const f of failing) {
        if (names.some((n) => f.names.has(n))) {
          slots.add(k);
          claims.add(f.statement);
        }
      }
      k++;
    }
    if (slots.size > 0) out.set(cell.id, { slots, claims: [...claims] });
  }
  return out;
}
