/**
 * Edits of a document, as values. Applying an edit gives a new document and the edit that
 * undoes it, so undo and redo need nothing else, and the same edits travel to the worker
 * that evaluates and to the autosave store.
 */
import { editMsg } from '../messages/page.ts';
import type { Cell, Document } from './document.ts';

export type Edit =
  | { readonly type: 'body'; readonly id: string; readonly body: string }
  /**
   * Characters [from, to) of a cell's body replaced by `text`: what a field typed into a
   * long table sends, so that the edit (and its undo) is the size of the change, not of
   * the body.
   */
  | { readonly type: 'splice'; readonly id: string; readonly from: number; readonly to: number; readonly text: string }
  | { readonly type: 'marker'; readonly id: string; readonly marker: string }
  | { readonly type: 'insert'; readonly index: number; readonly cell: Cell }
  | { readonly type: 'delete'; readonly id: string }
  | { readonly type: 'move'; readonly id: string; readonly index: number }
  | { readonly type: 'header'; readonly header: string }
  /** Several edits as one step of undo. */
  | { readonly type: 'batch'; readonly edits: readonly Edit[] };

/** An edit that cannot apply to this document (an unknown cell, a marker with a newline). */
export class EditError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'EditError';
  }
}

function indexOf(doc: Document, id: string): number {
  const i = doc.cells.findIndex((c) => c.id === id);
  if (i < 0) throw new EditError(editMsg.noCell(id));
  return i;
}

/**
 * For a cell made by a splice: the splice and the body it was applied to. A view that sent
 * the splice can tell from it, without comparing two long texts, that the body coming back
 * is the one it computed itself (the same text spliced the same way).
 */
const spliced = new WeakMap<Cell, { readonly edit: Edit; readonly base: string }>();

/** The splice that made this cell's body, and the body it was applied to; undefined for any other cell. */
export function spliceOf(cell: Cell): { readonly edit: Edit; readonly base: string } | undefined {
  return spliced.get(cell);
}

/** Applies an edit; returns the new document and the edit that reverses it. */
export function applyEdit(doc: Document, edit: Edit): { document: Document; inverse: Edit } {
  switch (edit.type) {
    case 'body': {
      const i = indexOf(doc, edit.id);
      const old = doc.cells[i]!;
      const cells = doc.cells.slice();
      cells[i] = { ...old, body: edit.body };
      return { document: { ...doc, cells }, inverse: { type: 'body', id: edit.id, body: old.body } };
    }
    case 'splice': {
      const i = indexOf(doc, edit.id);
      const old = doc.cells[i]!;
      const { from, to } = edit;
      if (!Number.isInteger(from) || !Number.isInteger(to) || from < 0 || to < from || to > old.body.length) {
        throw new EditError(editMsg.spliceOutside(from, to, old.body.length));
      }
      const cells = doc.cells.slice();
      const next: Cell = { ...old, body: old.body.slice(0, from) + edit.text + old.body.slice(to) };
      spliced.set(next, { edit, base: old.body });
      cells[i] = next;
      return {
        document: { ...doc, cells },
        inverse: { type: 'splice', id: edit.id, from, to: from + edit.text.length, text: old.body.slice(from, to) },
      };
    }
    case 'marker': {
      if (/[\r\n]/.test(edit.marker)) throw new EditError(editMsg.lineBreakInMarker());
      const i = indexOf(doc, edit.id);
      const old = doc.cells[i]!;
      const cells = doc.cells.slice();
      cells[i] = { ...old, marker: edit.marker, eol: old.eol === '' ? '\n' : old.eol };
      return { document: { ...doc, cells }, inverse: { type: 'marker', id: edit.id, marker: old.marker } };
    }
    case 'insert': {
      if (doc.cells.some((c) => c.id === edit.cell.id)) throw new EditError(editMsg.idTaken(edit.cell.id));
      if (/[\r\n]/.test(edit.cell.marker)) throw new EditError(editMsg.lineBreakInMarker());
      const index = Math.max(0, Math.min(edit.index, doc.cells.length));
      const cells = doc.cells.slice();
      cells.splice(index, 0, edit.cell);
      return { document: { ...doc, cells }, inverse: { type: 'delete', id: edit.cell.id } };
    }
    case 'delete': {
      const i = indexOf(doc, edit.id);
      const cells = doc.cells.slice();
      const [old] = cells.splice(i, 1);
      return { document: { ...doc, cells }, inverse: { type: 'insert', index: i, cell: old! } };
    }
    case 'move': {
      const i = indexOf(doc, edit.id);
      const cells = doc.cells.slice();
      const [c] = cells.splice(i, 1);
      const to = Math.max(0, Math.min(edit.index, cells.length));
      cells.splice(to, 0, c!);
      return { document: { ...doc, cells }, inverse: { type: 'move', id: edit.id, index: i } };
    }
    case 'header':
      return { document: { ...doc, header: edit.header }, inverse: { type: 'header', header: doc.header } };
    case 'batch': {
      let d = doc;
      const inverses: Edit[] = [];
      for (const e of edit.edits) {
        const r = applyEdit(d, e);
        d = r.document;
        inverses.unshift(r.inverse);
      }
      return { document: d, inverse: { type: 'batch', edits: inverses } };
    }
  }
}

/** A cell id not used in the document. */
export function freshCellId(doc: Document, prefix = 'n'): string {
  const used = new Set(doc.cells.map((c) => c.id));
  for (let k = doc.cells.length + 1; ; k++) {
    const id = `${prefix}${k}`;
    if (!used.has(id)) return id;
  }
}

/** Replaces the title line of the header, or adds one. */
export function withTitle(header: string, title: string): string {
  const clean = title.replace(/[\r\n]+/g, ' ').trim();
  if (/^title:.*$/m.test(header)) return header.replace(/^title:.*$/m, `title: ${clean}`);
  return `title: ${clean}\n${header}`;
}

/**
 * The cells an edit touches: those whose marker or body it sets, those it adds, removes or
 * moves. A header edit touches none. The evaluation worker tells the engine these, so that
 * nobody compares whole documents to learn what changed.
 */
export function cellsTouched(edit: Edit, into: Set<string> = new Set()): Set<string> {
  switch (edit.type) {
    case 'body':
    case 'splice':
    case 'marker':
    case 'delete':
    case 'move':
      into.add(edit.id);
      break;
    case 'insert':
      into.add(edit.cell.id);
      break;
    case 'header':
      break;
    case 'batch':
      for (const e of edit.edits) cellsTouched(e, into);
      break;
  }
  return into;
}
