/**
 * The bad inputs of the engine's contract: each gives an error on its own cell, with a
 * position and plain words; every other cell still evaluates; the document writes back
 * byte for byte.
 */
import { describe, expect, it } from 'vitest';
import { readDocument, writeDocument } from '../../src/doc/format.ts';
import { isError } from '../../src/lang/values.ts';
import { run } from '../helpers.ts';

const GOOD = '--- table t\nblock,y\n1,2.5\n2,3.5\n\n--- formula\nok = mean(t.y) + 1\n\n--- note\nThe mean plus one is {ok}.\n\n';

interface Case {
  readonly what: string;
  /** The bad cell(s), as document text. */
  readonly cells: string;
  /** What the message must say. */
  readonly says: RegExp;
  /** The exact characters the error must cover, in the first bad cell's text (when checked). */
  readonly covers?: string;
}

const cases: Case[] = [
  { what: 'an unterminated string', cells: '--- formula\nbad = "open\n', says: /never closed/, covers: '"open' },
  { what: 'an unbalanced bracket', cells: '--- formula\nbad = (1 + 2\n', says: /never closed/, covers: '(' },
  { what: 'a closing bracket too many', cells: '--- formula\nbad = (1 + 2))\n', says: /no matching opening bracket/, covers: ')' },
  { what: '1 +', cells: '--- formula\nbad = 1 +\n', says: /"\+" needs a value after it/, covers: '+' },
  { what: 'a name that does not exist', cells: '--- formula\nbad = mean(t.y) * okk\n', says: /no cell or table called "okk". Did you mean ok\?/, covers: 'okk' },
  { what: 'a column of another length', cells: '--- formula\nbad = t.y + [1, 2, 3]\n', says: /different lengths \(2 and 3\)/, covers: '+' },
  { what: 'text where a number is needed', cells: '--- table u\nv\n1\nabc\n\n--- formula\nbad = mean(u.v)\n', says: /row 2 is "abc", which is not a number/ },
  { what: 'a ragged CSV row', cells: '--- table u\na,b\n1,2\n3\n', says: /Row 2 has 1 field, but the header has 2/, covers: '3' },
  { what: 'a header that repeats a column name', cells: '--- table u\na,b,a\n1,2,3\n', says: /names the column "a" twice/, covers: 'a,b,a' },
  { what: 'a cycle', cells: '--- formula\na = b + 1\n\n--- formula\nb = a * 2\n', says: /cycle \(a → b → a\)/, covers: 'b' },
  { what: '10,000-deep brackets', cells: `--- formula\nbad = ${'('.repeat(10_000)}1${')'.repeat(10_000)}\n`, says: /nested more than 200 levels/, covers: '(' },
  { what: 'a 10 MB single-line formula', cells: `--- formula\nbad = ${'1 + '.repeat(2_621_440)}1\n`, says: /characters long; formulas are limited to 1,000,000/ },
];

describe('bad input gives an error on its own cell and loses nothing', () => {
  for (const c of cases) {
    it(c.what, () => {
      const text = `furrow 1\ntitle: bad input\n\n${GOOD}${c.cells}`;
      const { engine, states } = run(text);
      const good = states.slice(0, 3);
      const bad = states.slice(3);
      // every other cell still evaluates
      expect(good.map((s) => s.status)).toEqual(['ok', 'ok', 'ok']);
      expect(engine.valueOf('ok')).toBe(4);
      expect(good[2]!.value).toBe('The mean plus one is 4.');
      // the bad cell holds the error, with a position and plain words
      const failed = bad.filter((s) => s.status === 'error');
      expect(failed.length).toBeGreaterThan(0);
      const e = failed[0]!.error!;
      expect(e.message).toMatch(c.says);
      expect(e.from).toBeGreaterThanOrEqual(0);
      expect(e.to).toBeGreaterThanOrEqual(e.from);
      if (c.covers !== undefined) {
        const cell = engine.document!.cells[states.indexOf(failed[0]!)]!;
        expect(cell.body.slice(e.from, e.to)).toBe(c.covers);
      }
      // no message leaks a stack trace or an internal name
      expect(e.message).not.toMatch(/at .*\.ts|TypeError|undefined|\[object/);
      // the document writes back byte for byte
      expect(writeDocument(readDocument(text).document)).toBe(text);
      expect(writeDocument(engine.document!)).toBe(text);
      expect(bad.every((s) => s.status !== 'ok' || !isError(s.value))).toBe(true);
    });
  }
});
