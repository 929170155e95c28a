/**
 * A name typed after the name a new formula cell offers (`value1 = yield_mean = mean(...)`):
 * the page offers one click that keeps the typed name (cells/formula/model.ts
 * `secondNameFix`), and offers nothing for other texts.
 */
import { describe, expect, it } from 'vitest';
import { parseFormula, secondNameFix } from '../../cells/formula/model.ts';
import { msg } from '../../src/messages/language.ts';

const fixed = (text: string): string | null => {
  const f = secondNameFix(text);
  return f === null ? null : text.slice(0, f.from) + f.insert + text.slice(f.to);
};

describe('the fix for a second name', () => {
  it('keeps the name typed and the expression, and the result parses', () => {
    const text = 'value1 = yield_mean = mean(plots.y)';
    // the problem it answers: the parser's, at the second =
    expect(parseFormula(text).error?.message).toBe(msg.singleEquals());
    expect(secondNameFix(text)?.name).toBe('yield_mean');
    expect(fixed(text)).toBe('yield_mean = mean(plots.y)');
    expect(parseFormula(fixed(text)!).error).toBeNull();
    // blanks before the offered name, a line break after its =, and everything from the typed
    // name on are kept as typed
    expect(fixed('  value2 =\n  total=sum(x) # all plots')).toBe('  \n  total=sum(x) # all plots');
    // a comment or line break typed between the offered name and the new one is kept
    expect(fixed('value1 = # why\ntotal = 1')).toBe('# why\ntotal = 1');
    expect(parseFormula(fixed('value1 = # why\ntotal = 1')!).error).toBeNull();
    expect(fixed('value1 =\n  total = 1')).toBe('\n  total = 1');
    expect(fixed('value1 = gain = ')).toBe('gain = ');
  });

  it('offers nothing where it does not fit', () => {
    for (const text of ['value1 = ', 'value1 = 3', 'value1 = a == b', 'a = b + c = 2', 'value1 = 2 = 3', '= a = b', 'value1 = "x" = 2', 'value1 = true = 2', '']) {
      expect(secondNameFix(text), text).toBeNull();
    }
  });
});
