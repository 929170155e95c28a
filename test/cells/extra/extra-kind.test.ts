/**
 * A cell kind added from the test folder alone (./list-kind.ts) is read, written,
 * evaluated and printed: the document format, the graph and the command line take the
 * kinds they are handed and switch on none.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { CELL_KINDS } from '../../../cells/kinds.ts';
import { main } from '../../../src/cli/main.ts';
import { readDocument, writeDocument } from '../../../src/doc/format.ts';
import { BUILTINS } from '../../../src/functions/index.ts';
import { Engine } from '../../../src/graph/engine.ts';
import { isColumn } from '../../../src/lang/values.ts';
import { listKind } from './list-kind.ts';

const KINDS = CELL_KINDS.with(listKind);
const TEXT = 'furrow 1\ntitle: doses\n\n--- list doses\n2\n4\n\n9\n\n--- formula\ntotal = sum(doses)\n\n--- note\nTotal {total}.\n';

describe('a cell kind from the test folder', () => {
  it('is read without a warning by a reader that knows it, and warned about by one that does not', () => {
    expect(readDocument(TEXT, { kinds: KINDS }).warnings).toEqual([]);
    const plain = readDocument(TEXT, { kinds: CELL_KINDS }).warnings;
    expect(plain.map((w) => w.line)).toEqual([4]);
    expect(KINDS.readMarker('list doses extra')).toEqual({ kind: 'list', name: 'doses', file: null, extra: ['extra'] });
    expect(readDocument(TEXT.replace('--- list doses', '--- list doses twice'), { kinds: KINDS }).warnings.map((w) => w.line)).toEqual([4]);
  });

  it('is written back byte for byte', () => {
    expect(writeDocument(readDocument(TEXT, { kinds: KINDS }).document)).toBe(TEXT);
  });

  it('is evaluated, and read by formulas and notes', () => {
    const engine = new Engine({ registry: BUILTINS, kinds: KINDS });
    engine.update(readDocument(TEXT, { kinds: KINDS }).document);
    const doses = engine.valueOf('doses');
    expect(doses !== undefined && isColumn(doses)).toBe(true);
    expect(engine.valueOf('total')).toBe(15);
    expect(engine.states().map((s) => [s.kind, s.name, s.status])).toEqual([
      ['list', 'doses', 'ok'],
      ['formula', 'total', 'ok'],
      ['note', null, 'ok'],
    ]);
    // the engine that does not know the kind keeps the cell and does not evaluate it
    const plain = new Engine({ registry: BUILTINS, kinds: CELL_KINDS });
    plain.update(readDocument(TEXT).document);
    expect(plain.states()[0]!.status).toBe('inert');
    expect(plain.states()[1]!.status).toBe('error');
  });

  it('is described for the page: template, name, rename', () => {
    const cell = { id: 'c1', ...listKind.template!((base) => `${base}7`), eol: '\n' };
    expect(cell.marker).toBe('list list7');
    expect(KINDS.nameOf(cell)).toBe('list7');
    expect(listKind.rename!(cell, 'doses').marker).toBe('list doses');
  });

  it('is printed by the command line', () => {
    const dir = mkdtempSync(join(tmpdir(), 'furrow-kind-'));
    const file = join(dir, 'doses.furrow');
    writeFileSync(file, TEXT);
    const out: string[] = [];
    const err: string[] = [];
    const code = main(['run', file], { out: (s) => out.push(s), err: (s) => err.push(s) }, KINDS);
    expect(err).toEqual([]);
    expect(code).toBe(0);
    const text = out.join('\n');
    expect(text).toContain('[1] list doses');
    expect(text).toContain('[2] formula total');
    expect(text).toContain('Total 15.');
    // a fault with no range points at the marker line, as the kind says
    writeFileSync(file, TEXT.replace('--- list doses', '--- list 3doses'));
    const bad: string[] = [];
    expect(main(['run', file], { out: (s) => bad.push(s), err: () => {} }, KINDS)).toBe(1);
    expect(bad.join('\n')).toContain('[1] list 3doses: error at line 4');
  });
});
