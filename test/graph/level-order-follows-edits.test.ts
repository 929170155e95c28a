/**
 * A column with its levels put in order (`level_order`, `{ ...c, order }`) shares its
 * number column's arrays and its decimal-text object. A field typed over in place must still
 * reach the cells that read the ordered column, and every cell must read as a fresh engine
 * reads the same document.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { CELL_KINDS } from '../../cells/kinds.ts';
import { applyEdit, cellsTouched } from '../../src/doc/edits.ts';
import { readDocument } from '../../src/doc/format.ts';
import { BUILTINS } from '../../src/functions/index.ts';
import { Engine } from '../../src/graph/engine.ts';
import { shown, typeOver } from './typed-over.ts';


const ROWS = 300;
const NAMES = ['t', 'o', 'mo', 'so'];

function startText(): string {
  const lines = ['plot,a,b'];
  for (let i = 0; i < ROWS; i++) lines.push(`${i + 1},${i % 2 === 0 ? '2' : '25'},${i}.5`);
  return ['furrow 1', 'title: ordered', '', '--- table t', lines.join('\n'), '', '--- formula', 'o = level_order(t.a, [2, 25])', '', '--- formula', 'mo = mean(o)', '', '--- formula', 'so = sum(o)', ''].join('\n');
}


describe('a field typed shorter in the last row of an ordered column', () => {
  it('reaches the cells that read the ordered column', () => {
    let doc = readDocument(startText(), { kinds: CELL_KINDS }).document;
    const engine = new Engine({ registry: BUILTINS, kinds: CELL_KINDS });
    engine.update(doc);
    // last row (index ROWS-1, odd) holds "25": typed over with "2", one character shorter
    const edit = typeOver(doc, ROWS - 1, 1, '2');
    doc = applyEdit(doc, edit).document;
    engine.update(doc, { touched: cellsTouched(edit) });
    const fresh = new Engine({ registry: BUILTINS, kinds: CELL_KINDS });
    fresh.update(doc);
    for (const name of NAMES) expect(shown(engine.valueOf(name)), name).toBe(shown(fresh.valueOf(name)));
  });
});

describe('fields of an ordered column typed over, in any row, longer and shorter', () => {
  it('every cell is what a fresh evaluation gives, edit after edit', () => {
    // the levels stay 2 and 25 (however typed), so level_order keeps holding
    const level = fc.constantFrom('2', '25', '2.0', '25.00', ' 2', '25 ');
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.oneof(fc.nat({ max: ROWS - 1 }), fc.constant(ROWS - 1)), fc.integer({ min: 1, max: 2 }), level), { minLength: 1, maxLength: 10 }), (edits) => {
        let doc = readDocument(startText(), { kinds: CELL_KINDS }).document;
        const engine = new Engine({ registry: BUILTINS, kinds: CELL_KINDS });
        engine.update(doc);
        for (const [row, col, text] of edits) {
          // rows 0 and 1 keep one of each level
          const edit = typeOver(doc, Math.max(2, row), col, text);
          doc = applyEdit(doc, edit).document;
          engine.update(doc, { touched: cellsTouched(edit) });
          const fresh = new Engine({ registry: BUILTINS, kinds: CELL_KINDS });
          fresh.update(doc);
          for (const name of NAMES) expect(shown(engine.valueOf(name)), name).toBe(shown(fresh.valueOf(name)));
        }
      }),
      { numRuns: 60, seed: 11 },
    );
  });
});
