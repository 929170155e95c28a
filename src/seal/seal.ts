/**
 * Sealing a document, without touching files: the document is brought to its sealed shape
 * (any old sealed section removed, the last cell closed by a blank line) and a new section is
 * appended, built from the values of that very document.
 *
 *   doc --withoutSeal--> base --closeLastCell--> prepared --evaluate--> states
 *        prepared + states + fingerprint(prepared, files) --sealBody--> sealed document
 *
 * The fingerprint covers `prepared`, which is exactly the sealed document's text without
 * the section, so the section never counts in its own fingerprint.
 */
import type { Cell, Document } from '../doc/document.ts';
import type { CellState } from '../graph/engine.ts';
import { SEALED_KIND, fingerprint, withoutSeal } from './fingerprint.ts';
import { sealBody } from './section.ts';

/** The line terminator a document mostly uses. */
export function documentEol(doc: Document): string {
  return doc.firstEol === '\r\n' ? '\r\n' : '\n';
}

/**
 * The document as it will stand above its seal: old sealed sections removed, and the last
 * cell's text ending in a blank line, so that the section starts on a line of its own and
 * sealing again gives the same bytes.
 */
export function prepareForSeal(doc: Document): Document {
  const base = withoutSeal(doc);
  const eol = documentEol(doc);
  const last = base.cells[base.cells.length - 1];
  if (last === undefined) {
    const header = base.header === '' || /\n$/.test(base.header) ? base.header : base.header + eol;
    return { ...base, firstEol: base.firstEol === '' ? eol : base.firstEol, header };
  }
  if (last.eol === '') {
    // a marker line at the very end of the file: end it first
    return prepareForSeal({ ...base, cells: [...base.cells.slice(0, -1), { ...last, eol }] });
  }
  let body = last.body;
  // an empty body stays empty (a table read from a file has none); text ends in a blank line
  if (body !== '') {
    if (!body.endsWith('\n')) body += eol;
    if (!/\n\r?\n$/.test(body)) body += eol;
  }
  if (body === last.body) return base;
  return { ...base, cells: [...base.cells.slice(0, -1), { ...last, body }] };
}

/**
 * The sealed document: `prepared` (from {@link prepareForSeal}) with a sealed section made
 * from `states`, the engine's states for `prepared`.
 */
export function sealDocument(prepared: Document, states: readonly CellState[], files: ReadonlyMap<string, Uint8Array>): Document {
  const eol = documentEol(prepared);
  const body = sealBody(states, fingerprint(prepared, files), eol);
  const cell: Cell = { id: `sealed-${prepared.cells.length + 1}`, marker: SEALED_KIND, eol, body };
  return { ...prepared, cells: [...prepared.cells, cell] };
}
