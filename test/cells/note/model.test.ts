/**
 * Splitting a note into text and placeholders: what is a placeholder, what an unclosed
 * brace does, and that the split costs time in proportion to the note's length.
 */
import { describe, expect, it } from 'vitest';
import { MAX_NOTE_PLACEHOLDERS, analyseNote, splitNote } from '../../../cells/note/model.ts';
import { msg } from '../../../src/messages/language.ts';

const placeholders = (text: string) => splitNote(text).filter((p) => p.type === 'placeholder');

describe('splitNote', () => {
  it('finds placeholders, skips quoted braces and keeps \\{ as text', () => {
    const ps = placeholders('Mean {round(m, 2)} and {p_text("}")} but \\{ not this}');
    expect(ps.map((p) => (p.type === 'placeholder' ? p.source : ''))).toEqual(['round(m, 2)', 'p_text("}")']);
    expect(ps.every((p) => p.type === 'placeholder' && p.error === null)).toBe(true);
  });

  it('an unclosed brace is an error on its own line and the rest still reads', () => {
    const ps = placeholders('first {oops\nsecond {fine}');
    expect(ps.length).toBe(2);
    expect(ps[0]!.type === 'placeholder' && ps[0]!.error !== null).toBe(true);
    expect(ps[1]!.type === 'placeholder' && ps[1]!.source === 'fine' && ps[1]!.error === null).toBe(true);
  });

  it('a quote left open ends at the end of its line', () => {
    const ps = placeholders('a {"open\nb {x}');
    expect(ps.length).toBe(2);
    expect(ps[1]!.type === 'placeholder' && ps[1]!.source).toBe('x');
  });

  describe('is linear in the length of the note (1 MB adversarial inputs)', () => {
    // every scanner over user text must be linear: a note with many unclosed braces
    // rescanned to its end for each of them
    const MB = 1_000_000;
    const cases: [string, string][] = [
      ['unclosed braces with open quotes, one per line', '{"abc\n'.repeat(MB / 6)],
      ['unclosed braces, one per line', '{abc\n'.repeat(MB / 5)],
      ['one unclosed brace, then long lines without braces', `{${'abcdefghi\n'.repeat(MB / 10)}`],
      ['a brace then a million quotes', `{${'"'.repeat(MB)}`],
      ['only braces', '{'.repeat(MB)],
      ['braces and backslashes', '\\{{'.repeat(MB / 3)],
    ];
    for (const [what, text] of cases) {
      it(what, () => {
        const t0 = performance.now();
        const pieces = splitNote(text);
        const ms = performance.now() - t0;
        expect(pieces.length).toBeGreaterThan(0);
        // linear reads 1 MB in tens of milliseconds; a rescan per brace would take minutes.
        // The bound is the scanner tests' own (test/attacks/scanners.test.ts), wide enough
        // for a machine busy with other work
        expect(ms).toBeLessThan(5000);
      });
    }
  });
});

describe('the limit of live values in a note', () => {
  it('a note past the limit is one plain error, not thousands of placeholders; at the limit it evaluates', () => {
    const cell = (n: number) => ({ id: 'n1', marker: 'note', eol: '\n', body: '{1 + 1} '.repeat(n) });
    const over = analyseNote(cell(MAX_NOTE_PLACEHOLDERS + 1));
    expect(over.problem?.message).toBe(msg.tooManyPlaceholders(MAX_NOTE_PLACEHOLDERS + 1, MAX_NOTE_PLACEHOLDERS));
    expect(over.reads).toEqual([]);
    const at = analyseNote(cell(MAX_NOTE_PLACEHOLDERS));
    expect(at.problem).toBeNull();
    const out = at.evaluate({} as never);
    expect(out.parts).toHaveLength(MAX_NOTE_PLACEHOLDERS);
    expect(out.value).toBe('2 '.repeat(MAX_NOTE_PLACEHOLDERS));
  });
});
