/**
 * The limits stated in the README, each ending in a plain error (on the cell, or for the
 * document as a whole), never a frozen page.
 */
import { describe, expect, it } from 'vitest';
import { MAX_TABLE_COLUMNS, MAX_TABLE_ROWS } from '../../cells/table/model.ts';
import { DocumentError, MAX_CELLS, readDocument } from '../../src/doc/format.ts';
import { msg } from '../../src/messages/language.ts';
import { isError } from '../../src/lang/values.ts';
import { doc, run } from '../helpers.ts';

describe('limits', () => {
  it(`a document of more than ${MAX_CELLS} cells is refused in words`, () => {
    const text = `furrow 1\n${'--- formula\nx = 1\n'.repeat(MAX_CELLS + 1)}`;
    expect(() => readDocument(text)).toThrow(DocumentError);
    expect(() => readDocument(text)).toThrow(msg.tooManyCells(MAX_CELLS + 1, MAX_CELLS));
    expect(readDocument(`furrow 1\n${'--- note\n'.repeat(MAX_CELLS)}`).document.cells.length).toBe(MAX_CELLS);
  });
  it(`a table of more than ${MAX_TABLE_COLUMNS} columns is an error on its cell`, () => {
    const header = Array.from({ length: MAX_TABLE_COLUMNS + 1 }, (_, j) => `c${j}`).join(',');
    const row = Array.from({ length: MAX_TABLE_COLUMNS + 1 }, () => '1').join(',');
    const v = run(doc('--- table t', header, row)).states[0]!.value;
    expect(isError(v) && v.message).toBe(msg.tooManyColumns(MAX_TABLE_COLUMNS + 1, MAX_TABLE_COLUMNS));
  });
  it(`a table of more than ${MAX_TABLE_ROWS.toLocaleString('en')} rows is an error on its cell`, () => {
    const v = run(doc('--- table t', `y\n${'1\n'.repeat(MAX_TABLE_ROWS + 1)}`)).states[0]!.value;
    expect(isError(v) && v.message).toBe(msg.tooManyRows(MAX_TABLE_ROWS + 1, MAX_TABLE_ROWS));
  }, 120_000);
});
