/**
 * A sealed section damaged by hand in any way is reported, never a crash, and never passes.
 */
import fc from 'fast-check';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { readDocument, writeDocument } from '../../src/doc/format.ts';
import { prepareForSeal, sealDocument } from '../../src/seal/seal.ts';
import { verifyDocument } from '../../src/seal/verify.ts';
import { run } from '../helpers.ts';

const text = readFileSync('samples/tread-wear.furrow', 'utf8');
const prepared = prepareForSeal(readDocument(text).document);
const sealedText = writeDocument(sealDocument(prepared, run(writeDocument(prepared)).states, new Map()));
const sealAt = sealedText.indexOf('--- sealed\n') + '--- sealed\n'.length;
const head = sealedText.slice(0, sealAt);
const body = sealedText.slice(sealAt);

function verdictOf(t: string): ReturnType<typeof verifyDocument> {
  const { engine } = run(t);
  return verifyDocument(engine.document!, engine.states(), new Map());
}

describe('hand edits of a sealed section', () => {
  it('the sealed sample verifies as written', () => {
    expect(verdictOf(sealedText).matches).toBe(true);
  });
  it('any line removed, doubled or cut, or junk inserted, is reported and does not pass', () => {
    const lines = body.split('\n').slice(0, -1);
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: lines.length - 1 }),
        fc.constantFrom('remove', 'double', 'cut', 'junk', 'flip'),
        fc.integer({ min: 0, max: 10_000 }),
        (at, how, k) => {
          const line = lines[at]!;
          const edited = [...lines];
          if (how === 'remove') edited.splice(at, 1);
          else if (how === 'double') edited.splice(at, 0, line);
          else if (how === 'cut') edited[at] = line.slice(0, k % Math.max(1, line.length));
          else if (how === 'junk') edited.splice(at, 0, `~${'x'.repeat(k % 7)} junk ${k}`);
          else {
            // change one digit somewhere in the line, if it has one
            const digits = [...line.matchAll(/\d/g)].map((m) => m.index!);
            if (digits.length === 0) return;
            const i = digits[k % digits.length]!;
            edited[at] = line.slice(0, i) + String((Number(line[i]) + 1) % 10) + line.slice(i + 1);
          }
          const t = head + edited.map((l) => `${l}\n`).join('');
          if (t === sealedText) return;
          const v = verdictOf(t);
          // a blank line removed or doubled changes nothing a reader needs: it may pass
          if (line.trim() === '' && (how === 'remove' || how === 'double')) return;
          expect(v.matches, `${how} line ${at + 1}: ${line.slice(0, 60)}`).toBe(false);
        },
      ),
      { numRuns: 300 },
    );
  });
});
