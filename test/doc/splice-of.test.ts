/**
 * `spliceOf` (src/doc/edits.ts): a cell made by a splice says which splice of which body made
 * it, so the table view that sent the splice can take the body back without comparing two
 * long texts; any other cell, and a cell remade by undo or redo from another body, says
 * nothing that would let a view skip the comparison.
 */
import { describe, expect, it } from 'vitest';
import { applyEdit, spliceOf, type Edit } from '../../src/doc/edits.ts';
import { readDocument } from '../../src/doc/format.ts';

const doc = readDocument('furrow 1\ntitle: t\n\n--- table big\nk,y\n1,10\n2,20\n\n--- formula\ns = sum(big.y)\n').document;
const table = doc.cells.find((c) => c.marker.startsWith('table'))!;

describe('spliceOf', () => {
  it('names the splice and the body it was cut into, for the cell the splice made', () => {
    const at = table.body.indexOf('10');
    const edit: Edit = { type: 'splice', id: table.id, from: at, to: at + 2, text: '11' };
    const after = applyEdit(doc, edit).document;
    const made = after.cells.find((c) => c.id === table.id)!;
    expect(made.body).toBe(table.body.replace('10', '11'));
    const tag = spliceOf(made)!;
    expect(tag.edit).toBe(edit);
    expect(tag.base).toBe(table.body);
    // the body is that splice of that body, character for character
    expect(made.body).toBe(tag.base.slice(0, at) + '11' + tag.base.slice(at + 2));
  });

  it('says nothing of cells made otherwise, or left as they were', () => {
    expect(spliceOf(table)).toBeUndefined();
    const body: Edit = { type: 'body', id: table.id, body: 'k,y\n1,3\n' };
    const after = applyEdit(doc, body).document;
    expect(spliceOf(after.cells.find((c) => c.id === table.id)!)).toBeUndefined();
    // an untouched cell of a spliced document keeps no tag
    const at = table.body.indexOf('20');
    const spliced = applyEdit(doc, { type: 'splice', id: table.id, from: at, to: at + 2, text: '21' }).document;
    expect(spliceOf(spliced.cells.find((c) => c.marker === 'formula')!)).toBeUndefined();
  });

  it('the same splice applied again to another body is told apart by that body', () => {
    const at = table.body.indexOf('10');
    const edit: Edit = { type: 'splice', id: table.id, from: at, to: at + 2, text: '12' };
    const once = applyEdit(doc, edit);
    // undo, then redo with the very same edit object: the body it is cut into now is the
    // undo's result, not the body the view cut
    const undone = applyEdit(once.document, once.inverse).document;
    const redone = applyEdit(undone, edit).document.cells.find((c) => c.id === table.id)!;
    expect(spliceOf(redone)!.edit).toBe(edit);
    expect(spliceOf(redone)!.base).toBe(undone.cells.find((c) => c.id === table.id)!.body);
  });
});
