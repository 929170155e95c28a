/**
 * The cell kinds of one engine, looked up by marker word. The shell, the command line and
 * the graph ask this collection about a cell (its marker, name, files, heading) and never
 * switch on a kind themselves; a cell of a kind not listed is kept and shown as it is.
 */
import { markerKind, type Cell, type Marker } from '../doc/document.ts';
import type { CellKind } from './cell-kind.ts';

export class CellKinds {
  private readonly byWord = new Map<string, CellKind>();

  constructor(kinds: Iterable<CellKind>) {
    for (const k of kinds) {
      if (this.byWord.has(k.kind)) throw new Error(`cell kind ${k.kind} listed twice`);
      if (!/^[a-z][a-z_]*$/.test(k.kind)) throw new Error(`cell kind "${k.kind}" is not one lower-case word`);
      this.byWord.set(k.kind, k);
    }
  }

  /** These kinds and more (a later one with the same word replaces the earlier). */
  with(...more: CellKind[]): CellKinds {
    const all = new Map(this.byWord);
    for (const k of more) all.set(k.kind, k);
    return new CellKinds(all.values());
  }

  get(word: string): CellKind | undefined {
    return this.byWord.get(word);
  }

  /** Every kind, in the order listed (the order of the page's add buttons). */
  all(): CellKind[] {
    return [...this.byWord.values()];
  }

  /** The kind of a cell, or undefined for a kind not listed. */
  of(cell: Cell): CellKind | undefined {
    return this.byWord.get(markerKind(cell.marker));
  }

  /** Reads a marker line: null for a kind not listed (src/doc's MarkerGrammar). */
  readMarker(marker: string): Marker | null {
    const word = markerKind(marker);
    const kind = this.byWord.get(word);
    if (kind === undefined) return null;
    const rest = marker.replace(/^[ \t]*\S+[ \t]*/, '');
    return { kind: word, ...kind.readMarker(rest) };
  }

  /** The name a cell goes by, or null. */
  nameOf(cell: Cell): string | null {
    return this.of(cell)?.nameOf(cell) ?? null;
  }

  /** The files beside the document that a cell reads. */
  filesRead(cell: Cell): readonly string[] {
    return this.of(cell)?.filesRead(cell) ?? [];
  }
}
