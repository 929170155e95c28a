import { describe, expect, it } from 'vitest';
import { completionSpot, firstSentence, offersAt } from '../../../cells/formula/editor-complete.ts';
import type { NameCatalogue } from '../../../cells/view-api.ts';

// `|` marks the cursor.
function at(src: string) {
  const pos = src.indexOf('|');
  return completionSpot(src.slice(0, pos) + src.slice(pos + 1), pos);
}

const catalogue: NameCatalogue = {
  builtins: [
    {
      name: 'pairwise',
      signature: 'pairwise(fit, method: "tukey", level: 0.95)',
      doc: 'All pairwise differences of treatment means. Tukey by default.',
      returns: 'a pairs record',
      category: 'after a fit',
      params: [
        { name: 'fit', description: 'a fit record', doc: 'The fit to compare.' },
        { name: 'method', description: 'a text: "tukey", "bonferroni", "lsd"', doc: 'How to adjust.' },
        { name: 'level', description: 'a number', doc: 'Confidence level.' },
      ],
    },
    { name: 'mean', signature: 'mean(x)', doc: 'The mean.', returns: 'a number', category: 'summaries', params: [{ name: 'x', description: 'a column of numbers', doc: 'Values.' }] },
  ],
  cells: [
    { name: 'trees', type: 'table', members: ['row', 'method', 'yield (kg)'] },
    { name: 'fit', type: 'record', members: ['mse', 'table'] },
  ],
};

describe('completionSpot', () => {
  it('finds the name being typed', () => {
    expect(at('x = me|')).toEqual({ kind: 'name', from: 4, typed: 'me', call: null });
    expect(at('x = |')).toEqual({ kind: 'name', from: 4, typed: '', call: null });
  });

  it('finds a member after name-dot', () => {
    expect(at('mean(trees.|')).toEqual({ kind: 'member', of: 'trees', from: 11, typed: '', dot: 10 });
    expect(at('mean(trees.yi|')).toEqual({ kind: 'member', of: 'trees', from: 11, typed: 'yi', dot: 10 });
  });

  it('finds the call and its named arguments so far', () => {
    expect(at('pairwise(fit, |')).toEqual({ kind: 'name', from: 14, typed: '', call: { fn: 'pairwise', named: [], atArgument: true } });
    expect(at('pairwise(fit, level: 0.9, me|')).toEqual({ kind: 'name', from: 26, typed: 'me', call: { fn: 'pairwise', named: ['level'], atArgument: true } });
    // inside a nested call, the inner one counts
    expect(at('pairwise(fit, level: mean(|')).toMatchObject({ call: { fn: 'mean', atArgument: true } });
    // after the inner call closes, the outer one again
    expect(at('pairwise(mean(x), |')).toMatchObject({ call: { fn: 'pairwise', named: [] } });
    // in the middle of an expression, not at an argument's start
    expect(at('pairwise(fit + |')).toMatchObject({ call: { fn: 'pairwise', atArgument: false } });
  });

  it('offers nothing inside texts, comments and numbers', () => {
    expect(at('x = "tre|"')).toEqual({ kind: 'none' });
    expect(at('x = "tre|')).toEqual({ kind: 'none' });
    expect(at('x = 1 # tre|')).toEqual({ kind: 'none' });
    expect(at('x = 12|')).toEqual({ kind: 'none' });
    expect(at('x = "a \\q b|"')).toEqual({ kind: 'none' });
    // after a closed text, names again
    expect(at('x = "a" + t|')).toMatchObject({ kind: 'name', typed: 't' });
    // on the next line after a comment, names again
    expect(at('x = 1 # c\n + t|')).toMatchObject({ kind: 'name', typed: 't' });
  });
});

describe('offersAt', () => {
  it('offers built-ins, cells and keywords for a typed name', () => {
    const r = offersAt(at('x = m|'), catalogue, false)!;
    expect(r.from).toBe(4);
    const labels = r.offers.map((o) => o.label);
    expect(labels).toEqual(expect.arrayContaining(['pairwise', 'mean', 'trees', 'fit', 'not']));
    const mean = r.offers.find((o) => o.label === 'mean')!;
    expect(mean).toMatchObject({ type: 'function', detail: '(x)' });
    expect(mean.builtin?.doc).toBe('The mean.');
    expect(r.offers.find((o) => o.label === 'trees')).toMatchObject({ type: 'variable', detail: 'table' });
  });

  it('pops up nothing on a blank unless asked', () => {
    expect(offersAt(at('x = |'), catalogue, false)).toBeNull();
    expect(offersAt(at('x = |'), catalogue, true)!.offers.length).toBeGreaterThan(0);
  });

  it('offers the members of a table, with brackets for a header that is not a plain name', () => {
    const r = offersAt(at('mean(trees.|'), catalogue, false)!;
    expect(r.offers.map((o) => o.label)).toEqual(['row', 'method', 'yield (kg)']);
    expect(r.offers[2]).toMatchObject({ apply: '["yield (kg)"]', replaceFrom: 10 });
    expect(offersAt(at('mean(nothing.|'), catalogue, false)).toBeNull();
  });

  it('offers the named arguments not given yet, first', () => {
    const r = offersAt(at('pairwise(fit, level: 0.9, m|'), catalogue, false)!;
    const args = r.offers.filter((o) => o.type === 'argument');
    expect(args.map((o) => o.label)).toEqual(['fit:', 'method:']);
    expect(args[1]).toMatchObject({ apply: 'method: ', detail: 'a text: "tukey", "bonferroni", "lsd"', help: 'How to adjust.', boost: 10 });
  });

  it('offers nothing inside a text', () => {
    expect(offersAt(at('x = "m|"'), catalogue, true)).toBeNull();
  });
});

describe('firstSentence', () => {
  it('keeps the first sentence on one line', () => {
    expect(firstSentence('All pairwise differences.\nTukey by default.')).toBe('All pairwise differences.');
    expect(firstSentence('No full stop here')).toBe('No full stop here');
    expect(firstSentence('Means at 0.95 level. More.')).toBe('Means at 0.95 level.');
    expect(firstSentence('x'.repeat(300)).length).toBe(180);
  });
});
