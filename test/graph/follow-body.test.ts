/**
 * Fields typed along rows and undone, in a table with a quoted text column and a second
 * table: every cell reads as a fresh engine reads the same document, edit after edit.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { CELL_KINDS } from '../../cells/kinds.ts';
import type { Document } from '../../src/doc/document.ts';
import { applyEdit, cellsTouched } from '../../src/doc/edits.ts';
import { readDocument } from '../../src/doc/format.ts';
import { BUILTINS } from '../../src/functions/index.ts';
import { Engine } from '../../src/graph/engine.ts';
import { shown, typeOver } from './typed-over.ts';


const ROWS = 20;
const NAMES = ['t', 'u', 'y', 'z', 's', 'm', 'v', 'w'];
function startText(): string {
  const a = ['plot,a,b,c'];
  const b = ['plot,a,b'];
  for (let i = 0; i < ROWS; i++) {
    a.push(`${i + 1},${(i % 7) + 1}.5,${i % 3},x${i}`);
    b.push(`${i + 1},${(i % 7) + 1}.5,${i % 3}`);
  }
  return ['furrow 1', 'title: t', '', '--- table t', a.join('\n'), '', '--- table u', b.join('\n'), '', '--- formula', 'y = t.a', '', '--- formula', 'z = t.b', '', '--- formula', 's = sum(t.a) + sum(u.a)', '', '--- formula', 'm = mean(t.b)', '', '--- formula', 'v = variance(t.b)', '', '--- formula', 'w = sd(t.a) + sum(u.b)', ''].join('\n');
}


const text = fc.constantFrom('', ' ', '0', '2.5', '1e3', '7', '7.0', '123.456', '-1', 'x', ' 4 ');
const step = fc.oneof(
  { weight: 4, arbitrary: fc.tuple(fc.constant('type' as const), fc.nat({ max: 1 }), fc.nat({ max: ROWS - 1 }), fc.integer({ min: 1, max: 2 }), text) },
  { weight: 1, arbitrary: fc.tuple(fc.constant('undo' as const), fc.constant(0), fc.constant(0), fc.constant(0), fc.constant('')) },
);

describe('fields typed along rows, and undone', () => {
  it('every cell is what a fresh evaluation gives', () => {
    fc.assert(
      fc.property(fc.array(step, { minLength: 1, maxLength: 14 }), (steps) => {
        let doc = readDocument(startText(), { kinds: CELL_KINDS }).document;
        const engine = new Engine({ registry: BUILTINS, kinds: CELL_KINDS });
        engine.update(doc);
        const history: Document[] = [];
        for (const [kind, ci, row, col, t] of steps) {
          if (kind === 'undo') {
            const prev = history.pop();
            if (prev === undefined) continue;
            doc = prev;
            engine.update(doc);
          } else {
            const edit = typeOver(doc, row, col, t, ci);
            history.push(doc);
            doc = applyEdit(doc, edit).document;
            engine.update(doc, { touched: cellsTouched(edit) });
          }
          const fresh = new Engine({ registry: BUILTINS, kinds: CELL_KINDS });
          fresh.update(doc);
          for (const name of NAMES) expect(shown(engine.valueOf(name)), name).toBe(shown(fresh.valueOf(name)));
        }
      }),
      { numRuns: 150, seed: 7 },
    );
  });
});
