/**
 * What the tests of fields typed over share: a value shown with its decimal texts, and the
 * splice that types a text over one field of a table cell's body.
 */
import type { Document } from '../../src/doc/document.ts';
import type { Edit } from '../../src/doc/edits.ts';
import { toJson } from '../../src/lang/json.ts';
import { decimalAt, isNumberColumn, type Value } from '../../src/lang/values.ts';

/** A value as JSON, with the decimal texts of number columns (JSON does not show them). */
export function shown(v: Value | undefined): string {
  if (v === undefined) return 'undefined';
  const texts: unknown[] = [];
  const walk = (x: Value): void => {
    if (typeof x !== 'object') return;
    if (x.kind === 'column' && isNumberColumn(x)) texts.push(x.decimals === null ? null : Array.from({ length: x.values.length }, (_, i) => decimalAt(x.decimals!, i)));
    if (x.kind === 'table') x.columns.forEach(walk);
    if (x.kind === 'record') for (const f of x.fields.values()) walk(f);
  };
  walk(v);
  return `${toJson(v)} ${JSON.stringify(texts)}`;
}

/** The splice that types `text` over field `col` of data row `row` of the body of cell `cellIndex` (a table). */
export function typeOver(doc: Document, row: number, col: number, text: string, cellIndex = 0): Edit {
  const cell = doc.cells[cellIndex]!;
  const body = cell.body;
  let at = body.indexOf('\n') + 1;
  for (let r = 0; r < row; r++) at = body.indexOf('\n', at) + 1;
  let end = body.indexOf('\n', at);
  if (end < 0) end = body.length;
  const fields = body.slice(at, end).split(',');
  let from = at;
  for (let c = 0; c < col; c++) from += fields[c]!.length + 1;
  return { type: 'splice', id: cell.id, from, to: from + fields[col]!.length, text };
}
