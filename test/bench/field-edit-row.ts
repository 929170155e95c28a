// Fields typed along a row of a 100,000-row table (columns a and b in turn, lengths changing):
// what the evaluation worker spends per edit in engine.update, with the body made whole
// between edits as the worker does while idle (src/doc/settle-text.ts). Prints the median and
// the 90th percentile with the machine; never asserted.
//
//   npx tsx test/bench/field-edit-row.ts
import { cpus, hostname } from 'node:os';
import { CELL_KINDS } from '../../cells/kinds.ts';
import { applyEdit, cellsTouched, type Edit } from '../../src/doc/edits.ts';
import { readDocument } from '../../src/doc/format.ts';
import { settleText } from '../../src/doc/settle-text.ts';
import { BUILTINS } from '../../src/functions/index.ts';
import { Engine } from '../../src/graph/engine.ts';
const rows = ['k,a,b'];
for (let i = 0; i < 100_000; i++) rows.push(`${i + 1},${(i % 10) + 1},${(i % 7) + 2}.5`);
let doc = readDocument(`furrow 1\ntitle: t\n\n--- formula\nsa = sum(big.a)\n\n--- formula\nsb = sum(big.b)\n\n--- table big\n${rows.join('\n')}\n`).document;
const engine = new Engine({ registry: BUILTINS, kinds: CELL_KINDS });
engine.update(doc);
const id = doc.cells.find((c) => c.marker.startsWith('table'))!.id;
const times: number[] = [];
for (let k = 0; k < 40; k++) {
  const body = doc.cells.find((c) => c.id === id)!.body;
  const row = 1 + (k >> 1);
  const col = 1 + (k & 1);
  let at = body.indexOf('\n') + 1;
  for (let r = 0; r < row; r++) at = body.indexOf('\n', at) + 1;
  const fields = body.slice(at, body.indexOf('\n', at)).split(',');
  let from = at;
  for (let c = 0; c < col; c++) from += fields[c]!.length + 1;
  const edit: Edit = { type: 'splice', id, from, to: from + fields[col]!.length, text: String(10 + (k % 90)) };
  const t0 = performance.now();
  doc = applyEdit(doc, edit).document;
  engine.update(doc, { touched: cellsTouched(edit) });
  times.push(performance.now() - t0);
  if (!Number.isFinite(engine.valueOf(col === 1 ? 'sa' : 'sb') as number)) throw new Error('the sum is not a number');
  for (const c of doc.cells) settleText(c.body);
}
times.sort((a, b) => a - b);
console.log(`fields typed along a row of 100,000 (${hostname()}, ${cpus()[0]?.model ?? 'unknown CPU'}): median ${times[20]!.toFixed(2)} ms, 90th percentile ${times[36]!.toFixed(2)} ms per edit`);
