import { describe, expect, it } from 'vitest';
import { callAt, nameAt, parameterOf, signaturePieces } from '../../../cells/formula/editor-hints.ts';
import type { BuiltinInfo } from '../../../cells/view-api.ts';

const round: BuiltinInfo = {
  name: 'round',
  signature: 'round(x, digits: 0)',
  doc: 'Rounds.',
  returns: 'a number',
  category: 'maths',
  params: [
    { name: 'x', description: 'a number', doc: 'The value.' },
    { name: 'digits', description: 'a number', doc: 'How many decimals.' },
  ],
};

const labelled: BuiltinInfo = {
  name: 'labelled',
  signature: 'labelled(x, text: "a, b", level: 0.95)',
  doc: '',
  returns: '',
  category: 'claims',
  params: [
    { name: 'x', description: '', doc: '' },
    { name: 'text', description: '', doc: '' },
    { name: 'level', description: '', doc: '' },
  ],
};

/** The position of the `|` in a text, and the text without it. */
function at(marked: string): [string, number] {
  const pos = marked.indexOf('|');
  return [marked.slice(0, pos) + marked.slice(pos + 1), pos];
}

describe('the name under the pointer', () => {
  it('finds a plain name on it or touching its end', () => {
    expect(nameAt('m = mean(plots.yield)', 5)).toEqual({ name: 'mean', from: 4, to: 8 });
    expect(nameAt('m = mean(plots.yield)', 8)).toEqual({ name: 'mean', from: 4, to: 8 });
    expect(nameAt('m = mean(plots.yield)', 10)).toEqual({ name: 'plots', from: 9, to: 14 });
  });

  it('leaves out members, argument names, numbers and texts', () => {
    expect(nameAt('plots.mean', 8)).toBeNull();
    expect(nameAt('round(x, digits: 2)', 11)).toBeNull();
    expect(nameAt('round(2.5)', 7)).toBeNull();
    expect(nameAt('"mean"', 3)).toBeNull();
  });
});

describe('the call the caret is in', () => {
  it('counts the argument after ( and after each comma of its own call', () => {
    const cases: [string, string, number, number][] = [
      ['round(|', 'round', 0, 0],
      ['round(a, |', 'round', 1, 1],
      ['round(mean(y), |)', 'round', 1, 1],
      ['round(mean(y|), 2)', 'mean', 0, 0],
      ['round([1, 2, 3], |', 'round', 1, 1],
      ['x = round(\n  a,\n  |', 'round', 1, 1],
    ];
    for (const [marked, fn, index, positional] of cases) {
      const [text, pos] = at(marked);
      const call = callAt(text, pos);
      expect(call?.fn.name, marked).toBe(fn);
      expect(call?.index, marked).toBe(index);
      expect(call?.positional, marked).toBe(positional);
      expect(call?.named, marked).toBeNull();
    }
  });

  it('knows a named argument, and counts positional ones only before it', () => {
    const [text, pos] = at('round(a, digits: |');
    expect(callAt(text, pos)).toMatchObject({ index: 1, named: 'digits', positional: 1 });
    const [t2, p2] = at('f(level: 0.9, |');
    expect(callAt(t2, p2)).toMatchObject({ index: 1, named: null, positional: 0 });
  });

  it('is null outside a call, in a list, or after a member call', () => {
    for (const marked of ['round(2)|', '[1, |', 'x = |', 't.f(|']) {
      const [text, pos] = at(marked);
      expect(callAt(text, pos), marked).toBeNull();
    }
  });

  it('does not count commas inside texts', () => {
    const [text, pos] = at('round("a, b", |');
    expect(callAt(text, pos)?.index).toBe(1);
  });
});

describe('which parameter an argument fills', () => {
  it('takes the named one, else the next positional one, else none', () => {
    expect(parameterOf(round, { fn: { name: 'round', from: 0, to: 5 }, open: 5, index: 0, named: null, positional: 0 })).toBe(0);
    expect(parameterOf(round, { fn: { name: 'round', from: 0, to: 5 }, open: 5, index: 1, named: null, positional: 1 })).toBe(1);
    expect(parameterOf(round, { fn: { name: 'round', from: 0, to: 5 }, open: 5, index: 2, named: null, positional: 2 })).toBe(-1);
    expect(parameterOf(round, { fn: { name: 'round', from: 0, to: 5 }, open: 5, index: 0, named: 'digits', positional: 0 })).toBe(1);
    expect(parameterOf(round, { fn: { name: 'round', from: 0, to: 5 }, open: 5, index: 0, named: 'places', positional: 0 })).toBe(-1);
  });
});

describe('the pieces of a signature', () => {
  it('splits the parameters at commas outside quoted defaults', () => {
    expect(signaturePieces(round)).toEqual({ head: 'round(', params: ['x', 'digits: 0'], tail: ')' });
    expect(signaturePieces(labelled)).toEqual({ head: 'labelled(', params: ['x', 'text: "a, b"', 'level: 0.95'], tail: ')' });
    expect(signaturePieces({ ...round, signature: 'pi()', params: [] })).toEqual({ head: 'pi(', params: [], tail: ')' });
  });
});
