/**
 * A number column with its levels put in order (level_order) shares its array of values
 * with the table's column. When a field of another column is typed over, that cell runs
 * again and gives a new column over the same, unchanged array: it is the same value (its
 * readers need not run again) and the page already holds it (nothing is sent whole). Only a
 * column whose arrays an edit wrote in place is told apart from its successor by sharing
 * them (src/lang/column-changes.ts `noteWrittenOver`).
 */
import { describe, expect, it } from 'vitest';
import { CELL_KINDS } from '../../cells/kinds.ts';
import { ColumnSender } from '../../src/app/column-ledger.ts';
import { applyEdit, cellsTouched } from '../../src/doc/edits.ts';
import { readDocument } from '../../src/doc/format.ts';
import { BUILTINS } from '../../src/functions/index.ts';
import { Engine } from '../../src/graph/engine.ts';
import type { Value } from '../../src/lang/values.ts';
import { typeOver } from './typed-over.ts';

// long enough for the page's ledger to keep the columns (LEDGER_MIN_LENGTH)
const ROWS = 2000;
function startText(): string {
  const lines = ['plot,dose,yield'];
  for (let i = 0; i < ROWS; i++) lines.push(`${i + 1},${[0, 10, 20][i % 3]},${(i % 7) + 1}.5`);
  return ['furrow 1', 'title: t', '', '--- table t', lines.join('\n'), '', '--- formula', 'd = level_order(t.dose, [0, 10, 20])', '', '--- formula', 'k = levels(d)', '', '--- formula', 's = sum(t.yield)', ''].join('\n');
}

describe('a column sharing the table column\'s values, unchanged by an edit', () => {
  it('is neither taken as changed nor sent whole again when another column is typed over', () => {
    let doc = readDocument(startText(), { kinds: CELL_KINDS }).document;
    const engine = new Engine({ registry: BUILTINS, kinds: CELL_KINDS });
    const sender = new ColumnSender();
    const send = (ran: readonly string[]): Map<string, string> => {
      const batch = sender.batch();
      const kinds = new Map<string, string>();
      for (const id of ran) {
        const s = engine.state(id)!;
        const w = batch.encode(id, { value: s.value as Value, parts: s.parts });
        kinds.set(id, (w.value as { kind: string }).kind);
      }
      batch.commit([]);
      return kinds;
    };
    send(engine.update(doc));
    expect(engine.state(doc.cells[1]!.id)!.status).toBe('ok');
    const dVersion = engine.state(doc.cells[1]!.id)!.version;
    const edit = typeOver(doc, 5, 2, '99.5');
    doc = applyEdit(doc, edit).document;
    const ran = engine.update(doc, { touched: cellsTouched(edit) });
    const kinds = send(ran);
    const d = doc.cells[1]!.id;
    const k = doc.cells[2]!.id;
    // d's column is what it was: not sent whole again
    expect(kinds.get(d)).not.toBe('column-sent');
    // and its value did not change, so the cell that reads only d need not run again
    expect(engine.state(d)!.version).toBe(dVersion);
    expect(ran).not.toContain(k);
  });
});
