/**
 * The engine on a long chain: 2,000 formula cells, each reading the one before. Loading
 * evaluates all of them once; an edit of the last cell re-evaluates that one cell only.
 * Prints figures; never fails a build.
 */
import { cpus } from 'node:os';
import { afterAll, bench, describe } from 'vitest';
import { applyEdit } from '../../src/doc/edits.ts';
import { readDocument } from '../../src/doc/format.ts';
import { BUILTINS } from '../../src/functions/index.ts';
import { CELL_KINDS } from '../../cells/kinds.ts';
import { Engine } from '../../src/graph/engine.ts';

const N = 2000;
function chainText(n: number): string {
  const cells = ['--- formula\nv1 = 1\n'];
  for (let i = 2; i <= n; i++) cells.push(`--- formula\nv${i} = v${i - 1} + 1\n`);
  return `furrow 1\ntitle: chain\n\n${cells.join('\n')}`;
}
const text = chainText(N);
const notes: string[] = [];

describe(`chain of ${N} formula cells (${cpus()[0]?.model ?? 'unknown CPU'})`, () => {
  bench('read and evaluate the whole document', () => {
    const engine = new Engine({ registry: BUILTINS, kinds: CELL_KINDS });
    engine.update(readDocument(text).document);
  });

  const engine = new Engine({ registry: BUILTINS, kinds: CELL_KINDS });
  let doc = readDocument(text).document;
  engine.update(doc);
  const last = doc.cells[N - 1]!.id;
  let k = 0;
  bench('edit the last cell', () => {
    k++;
    doc = applyEdit(doc, { type: 'body', id: last, body: `v${N} = v${N - 1} + ${k}\n` }).document;
    const ran = engine.update(doc);
    if (ran.length !== 1) throw new Error(`expected one evaluation, got ${ran.length}`);
    if (k === 1) notes.push(`an edit of the last cell re-evaluated ${ran.length} cell`);
  });

  const first = doc.cells[0]!.id;
  bench('edit the first cell (everything below follows)', () => {
    k++;
    doc = applyEdit(doc, { type: 'body', id: first, body: `v1 = ${k}\n` }).document;
    engine.update(doc);
  });
});

afterAll(() => {
  for (const n of notes) console.log(n);
});
