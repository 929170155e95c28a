/**
 * What the evaluation worker does for one field typed into a 100,000-row table whose column
 * a formula sums: apply the edit (a splice of the body), update the engine (the table read
 * again in the changed row, the sum), and encode the results against the page's column
 * ledger. Edits follow each other with no pause, so each one also pays for making the
 * body the last one spliced whole, which the worker does while idle (src/doc/settle-text.ts).
 * Prints the time and the size of the message that goes back to the page; never
 * fails a build, but checks the sum and that the table crossed as a patch.
 */
import { cpus } from 'node:os';
import { serialize } from 'node:v8';
import { afterAll, bench, describe } from 'vitest';
import { CELL_KINDS } from '../../cells/kinds.ts';
import { ColumnSender } from '../../src/app/column-ledger.ts';
import { applyEdit, cellsTouched, type Edit } from '../../src/doc/edits.ts';
import { readDocument } from '../../src/doc/format.ts';
import { BUILTINS } from '../../src/functions/index.ts';
import { Engine } from '../../src/graph/engine.ts';

const N = 100_000;
const rows = ['k,y'];
for (let i = 0; i < N; i++) rows.push(`${i + 1},${(i % 10) + 1}`);
let doc = readDocument(`furrow 1\ntitle: A long table\n\n--- formula\ntotal = sum(big.y)\n\n--- table big\n${rows.join('\n')}\n`).document;
const engine = new Engine({ registry: BUILTINS, kinds: CELL_KINDS });
const ledger = new ColumnSender();
const bigId = doc.cells.find((c) => c.marker.startsWith('table'))!.id;

function send(ran: readonly string[]): number {
  const batch = ledger.batch();
  const results = ran.map((id) => {
    const s = engine.state(id)!;
    return { id, ...batch.encode(id, { value: s.value, parts: s.parts }) };
  });
  batch.commit([]);
  return serialize(results).length;
}

const firstBytes = send(engine.update(doc));
let lastBytes = 0;
let k = 0;

function check(ok: boolean, what: string): void {
  if (!ok) throw new Error(`bench made the wrong result: ${what}`);
}

describe(`a field edit in a ${N.toLocaleString('en-US')}-row table, in the worker (${cpus()[0]?.model ?? 'unknown CPU'})`, () => {
  bench('apply the splice, update the engine, encode the results', () => {
    const body = doc.cells.find((c) => c.id === bigId)!.body;
    const at = body.indexOf('\n1,') + 3;
    const end = body.indexOf('\n', at);
    const value = 20 + (k++ % 50);
    const edit: Edit = { type: 'splice', id: bigId, from: at, to: end, text: String(value) };
    doc = applyEdit(doc, edit).document;
    const ran = engine.update(doc, { touched: cellsTouched(edit) });
    lastBytes = send(ran);
    check(engine.valueOf('total') === 550_000 - 1 + value, `the total: ${String(engine.valueOf('total'))}`);
  });
  afterAll(() => {
    check(lastBytes < 1000, `the message back: ${lastBytes} bytes`);
    console.log(`  the document's first message to the page: ${(firstBytes / 1e6).toFixed(1)} MB; after a field edit: ${lastBytes} bytes`);
  });
});
