import fc from 'fast-check';
import { msg } from '../../src/messages/language.ts';
import { describe, expect, it } from 'vitest';
import { applyEdit, freshCellId } from '../../src/doc/edits.ts';
import { editMsg } from '../../src/messages/page.ts';
import { CELL_KINDS } from '../../cells/kinds.ts';
import { documentTitle, headerFields, type Document } from '../../src/doc/document.ts';
import { DocumentError, readDocument, writeDocument } from '../../src/doc/format.ts';

const SAMPLE = `furrow 1
title: Pruning methods in a pear orchard
author: Orchard trials group

--- note
Twenty-four trees, eight orchard rows.

--- table trees
row,method,yield_kg
1,open,41.2

--- formula
fit = mean(trees.yield_kg)
`;

const roundTrip = (text: string): string => writeDocument(readDocument(text).document);

describe('reading documents', () => {
  it('reads the header, the three cell kinds and their bodies', () => {
    const { document: d, warnings } = readDocument(SAMPLE, { kinds: CELL_KINDS });
    expect(warnings).toEqual([]);
    expect(documentTitle(d)).toBe('Pruning methods in a pear orchard');
    expect(headerFields(d).get('author')).toBe('Orchard trials group');
    expect(d.cells.map((c) => c.marker)).toEqual(['note', 'table trees', 'formula']);
    expect(d.cells[1]!.body).toBe('row,method,yield_kg\n1,open,41.2\n\n');
    expect(CELL_KINDS.readMarker('table plots from plots.csv')).toEqual({ kind: 'table', name: 'plots', file: 'plots.csv', extra: [] });
    expect(CELL_KINDS.readMarker('table plots from my plots.csv')).toEqual({ kind: 'table', name: 'plots', file: 'my plots.csv', extra: [] });
    expect(CELL_KINDS.readMarker('note aside')).toEqual({ kind: 'note', name: null, file: null, extra: ['aside'] });
    expect(CELL_KINDS.readMarker('sketch 3d')).toBeNull();
  });
  it('refuses a file that is not a document, and a later version, in plain words', () => {
    expect(() => readDocument('hello\n')).toThrow(DocumentError);
    expect(() => readDocument('')).toThrow(/first line must be "furrow 1"/);
    expect(() => readDocument('furrow 2\n')).toThrow(/format version 2/);
    expect(() => readDocument('row,method\n1,open\n')).toThrow(/not a Furrow document/);
  });
  it('a first line with stray spaces says so, instead of naming version 1 as unreadable', () => {
    expect(() => readDocument('furrow 1 \ntitle: x\n')).toThrow(msg.firstLineSpacing('furrow 1 '));
    expect(() => readDocument('furrow\t1\n')).toThrow(msg.firstLineSpacing('furrow\t1'));
    expect(() => readDocument('furrow 1 \n')).not.toThrow(/version 1/);
  });
  it('keeps unknown header keys and cell kinds, with a warning', () => {
    const text = 'furrow 1\ntitle: x\nsponsor: nobody\n\n--- sketch 3d\nwhatever\n--- formula\nx = 1\n--- sealed\n';
    const { document: d, warnings } = readDocument(text, { kinds: CELL_KINDS });
    expect(warnings.map((w) => w.line)).toEqual([3, 5]);
    expect(warnings[0]!.message).toBe(msg.unknownHeaderKey('sponsor'));
    expect(warnings[1]!.message).toBe(msg.unknownCellKind('sketch'));
    expect(d.cells[0]!.body).toBe('whatever\n');
    expect(writeDocument(d)).toBe(text);
  });
  it('escapes body lines that would read as markers, and reads them back', () => {
    const d: Document = {
      bom: false,
      firstLine: 'furrow 1',
      firstEol: '\n',
      header: 'title: t\n\n',
      cells: [{ id: 'c1', marker: 'note', eol: '\n', body: '--- not a cell\n\\--- nor this\n\\\\--- nor this\n---no space\n' }],
    };
    const text = writeDocument(d);
    expect(text).toBe('furrow 1\ntitle: t\n\n--- note\n\\--- not a cell\n\\\\--- nor this\n\\\\\\--- nor this\n---no space\n');
    const back = readDocument(text).document;
    expect(back.cells).toHaveLength(1);
    expect(back.cells[0]!.body).toBe(d.cells[0]!.body);
  });
  it('round-trips hand-written awkward cases byte for byte', () => {
    const cases = [
      'furrow 1',
      'furrow 1\n',
      'furrow 1\r\ntitle: crlf\r\n\r\n--- note\r\nhello\r\n--- formula\r\nx = 1\r\n',
      'furrow 1\n--- note',
      'furrow 1\n--- note\nno final newline',
      '\uFEFFfurrow 1\ntitle: with a byte order mark\n',
      'furrow 1\n\n\n--- formula\n\n\nx = 1\n\n\n\n',
      'furrow 1\nnot a key line\n--- note\n\\--- escaped\n',
      'furrow 1\n--- \n--- table\n--- table t from a b.csv\n',
      'furrow 1\n--- note\n\t--- indented is not a marker\n ---  nor this\n',
    ];
    for (const c of cases) expect(roundTrip(c)).toBe(c);
  });
});

describe('the round trip, as a property', () => {
  // Lines built from fragments that matter to the format: markers, escaped markers,
  // header-like lines, CSV, blank lines, carriage returns, unicode.
  const fragment = fc.oneof(
    fc.constantFrom('--- note', '--- formula', '--- table t', '--- table t from x.csv', '--- odd kind', '--- ', '---', '\\--- x', '\\\\--- y', 'title: x', 'a,b', '"q,1",2', '', ' ', '#', '{x}', 'é ✓'),
    fc.string({ maxLength: 12 }),
  );
  const line = fc.tuple(fc.array(fragment, { minLength: 1, maxLength: 3 }), fc.constantFrom('\n', '\r\n', '\n')).map(([parts, eol]) => parts.join('') + eol);
  const fileText = fc
    .tuple(fc.boolean(), fc.array(line, { maxLength: 25 }), fc.boolean(), fc.constantFrom('\n', '\r\n'))
    .map(([bom, lines, dropLast, eol]) => {
      let t = `${bom ? '\uFEFF' : ''}furrow 1${eol}${lines.join('')}`;
      if (dropLast) t = t.replace(/\r?\n$/, '');
      return t;
    });

  it('reading then writing any document gives back the same bytes', () => {
    fc.assert(fc.property(fileText, (t) => roundTrip(t) === t), { numRuns: 3000 });
  });

  const body = fc.array(line, { maxLength: 8 }).map((ls) => ls.join(''));
  const cell = fc.tuple(fc.constantFrom('note', 'formula', 'table t', 'table u from u.csv', 'mystery kind'), body);
  const docs = fc.tuple(fc.array(cell, { maxLength: 8 }), fc.constantFrom('title: x\n', 'title: x\n\n', '')).map(
    ([cells, header]): Document => ({
      bom: false,
      firstLine: 'furrow 1',
      firstEol: '\n',
      header,
      cells: cells.map(([marker, b], i) => ({ id: `c${i + 1}`, marker, eol: '\n', body: b })),
    }),
  );

  it('writing then reading gives back the same cells, whatever the bodies hold', () => {
    fc.assert(
      fc.property(docs, (d) => {
        const back = readDocument(writeDocument(d)).document;
        // bodies that do not end a line get one added before the next marker; compare on that
        const expected = d.cells.map((c, i) => (i < d.cells.length - 1 && c.body !== '' && !c.body.endsWith('\n') ? `${c.body}\n` : c.body));
        expect(back.cells.map((c) => c.marker)).toEqual(d.cells.map((c) => c.marker));
        expect(back.cells.map((c) => c.body)).toEqual(expected);
        expect(back.header).toBe(d.header);
      }),
      { numRuns: 2000 },
    );
  });
});

describe('edits as values', () => {
  it('apply and undo exactly, structural edits included', () => {
    const d0 = readDocument(SAMPLE).document;
    const id = freshCellId(d0);
    const steps = [
      { type: 'insert', index: 1, cell: { id, marker: 'formula', eol: '\n', body: 'y = 2\n\n' } },
      { type: 'body', id: 'c3', body: 'fit = 3\n' },
      { type: 'splice', id: 'c3', from: 6, to: 7, text: '41' },
      { type: 'move', id: 'c1', index: 3 },
      { type: 'marker', id: 'c2', marker: 'table plants' },
      { type: 'delete', id },
      { type: 'header', header: 'title: other\n' },
    ] as const;
    let d = d0;
    const inverses = [];
    for (const s of steps) {
      const r = applyEdit(d, s);
      d = r.document;
      inverses.unshift(r.inverse);
    }
    expect(d.cells.map((c) => c.id)).toEqual(['c2', 'c3', 'c1']);
    expect(d.cells.find((c) => c.id === 'c3')!.body).toBe('fit = 41\n');
    for (const inv of inverses) d = applyEdit(d, inv).document;
    expect(writeDocument(d)).toBe(SAMPLE);
  });

  it('a splice replaces a range of a body, its inverse restores it, and a range outside the body is refused', () => {
    const d0 = readDocument(SAMPLE).document;
    const body = d0.cells.find((c) => c.id === 'c2')!.body;
    fc.assert(
      fc.property(fc.nat(body.length), fc.nat(body.length), fc.string(), (a, b, text) => {
        const [from, to] = a <= b ? [a, b] : [b, a];
        const r = applyEdit(d0, { type: 'splice', id: 'c2', from, to, text });
        expect(r.document.cells.find((c) => c.id === 'c2')!.body).toBe(body.slice(0, from) + text + body.slice(to));
        expect(writeDocument(applyEdit(r.document, r.inverse).document)).toBe(SAMPLE);
      }),
      { seed: 7, numRuns: 300 },
    );
    for (const [from, to] of [[-1, 0], [3, 2], [0, body.length + 1], [0.5, 1]] as const) {
      expect(() => applyEdit(d0, { type: 'splice', id: 'c2', from, to, text: 'x' })).toThrow(editMsg.spliceOutside(from, to, body.length));
    }
  });
});
