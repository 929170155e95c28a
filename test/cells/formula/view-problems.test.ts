import { describe, expect, it } from 'vitest';
import { setFlagsFromString } from 'node:v8';
import { runInNewContext } from 'node:vm';
import { formulaProblems, parseVisible } from '../../../cells/formula/view-problems.ts';
import { staticPieces } from '../../../cells/formula/view-static.ts';
import { textChange } from '../../../cells/formula/view-sync.ts';
import type { CellViewState } from '../../../cells/view-api.ts';
import { errorValue } from '../../../src/lang/values.ts';

function failed(message: string, from: number, to: number, upstream: string | null = null): CellViewState {
  const e = errorValue(message, from, to, upstream);
  return { status: upstream === null ? 'error' : 'upstream', value: e, parts: null, warnings: [], error: e, progress: null };
}

describe('formulaProblems', () => {
  it('shows the parse error under its characters, from the text as typed', () => {
    const text = 'x = 2 +* 3';
    const [p] = formulaProblems(text, null, null);
    expect(p).toMatchObject({ from: 7, to: 8, source: 'parse' });
    expect(p!.message).toMatch(/\*/);
  });

  it('shows no problem for a formula still empty, with or without its name', () => {
    expect(formulaProblems('', null, null)).toEqual([]);
    expect(formulaProblems('value1 = ', null, null)).toEqual([]);
    expect(parseVisible('value1 = ').name).toBe('value1');
    expect(formulaProblems('value1 = 1 +', null, null)).toHaveLength(1);
  });

  it('prefers the parse error over an older evaluation error', () => {
    const text = 'x = (1 + ';
    const problems = formulaProblems(text, failed('There is no name "y".', 4, 5), text);
    expect(problems).toHaveLength(1);
    expect(problems[0]!.source).toBe('parse');
  });

  it('shows the evaluation error when the text reads and is the one evaluated', () => {
    const text = 'x = mean(yeild)';
    const state = failed('There is no name "yeild"; did you mean "yield"?', 9, 14);
    expect(formulaProblems(text, state, text)).toEqual([{ from: 9, to: 14, message: state.error!.message, source: 'evaluation' }]);
    // after more typing, the old offsets mean nothing: not shown until the new result
    expect(formulaProblems(text + ' ', state, text)).toEqual([]);
  });

  it('marks an upstream failure apart', () => {
    const text = 'y = fit.mse';
    const [p] = formulaProblems(text, failed('reads fit, which has an error', 4, 7, 'fit'), text);
    expect(p!.source).toBe('upstream');
  });

  it('clamps ranges to the text', () => {
    const text = 'x = y';
    const [p] = formulaProblems(text, failed('bad', 3, 99), text);
    expect(p).toMatchObject({ from: 3, to: 5 });
  });

  it('says nothing about a blank cell, and nothing when all is well', () => {
    expect(formulaProblems('  \n', null, null)).toEqual([]);
    const ok: CellViewState = { status: 'ok', value: 3, parts: null, warnings: [], error: null, progress: null };
    expect(formulaProblems('x = 3', ok, 'x = 3')).toEqual([]);
  });

  it('reads the name a formula defines', () => {
    expect(parseVisible('gain = 1 + 2').name).toBe('gain');
    expect(parseVisible('1 + 2').name).toBeNull();
  });
});

describe('staticPieces', () => {
  const none = new Set<string>();
  it('splits the coloured text where a problem starts and ends', () => {
    const pieces = staticPieces('x = abc + 1', none, { from: 5, to: 7 });
    expect(pieces.map((p) => p.text).join('')).toBe('x = abc + 1');
    expect(pieces.filter((p) => p.marked).map((p) => p.text)).toEqual(['bc']);
    expect(pieces.find((p) => p.text === 'a')!.cls).toBe('cellName');
  });

  it('marks a point problem at the end with a space', () => {
    const pieces = staticPieces('x = (1 +', none, { from: 8, to: 8 });
    expect(pieces[pieces.length - 1]).toEqual({ text: ' ', cls: null, marked: true });
  });

  it('marks a point problem inside the text on its character', () => {
    const pieces = staticPieces('x = 12', none, { from: 4, to: 4 });
    expect(pieces.filter((p) => p.marked).map((p) => p.text)).toEqual(['1']);
    expect(pieces.map((p) => p.text).join('')).toBe('x = 12');
  });
});

describe('textChange', () => {
  it('keeps the common start and end', () => {
    expect(textChange('x = mean(a)', 'x = mean(b)')).toEqual({ from: 9, to: 10, insert: 'b' });
    expect(textChange('abc', 'abc')).toEqual({ from: 3, to: 3, insert: '' });
    expect(textChange('', 'new')).toEqual({ from: 0, to: 0, insert: 'new' });
    expect(textChange('aaa', 'aa')).toEqual({ from: 2, to: 3, insert: '' });
  });
  it('applied to the old text gives the new one', () => {
    const pairs: [string, string][] = [['hello world', 'help world'], ['a\nb\nc', 'a\nc'], ['xyz', 'zyx'], ['aa', 'aaaa']];
    for (const [a, b] of pairs) {
      const c = textChange(a, b);
      expect(a.slice(0, c.from) + c.insert + a.slice(c.to)).toBe(b);
    }
  });
});

describe('parsed formula texts kept', () => {
  it('do not keep every version of a long formula being typed into', () => {
    // a formula of about 40,000 characters, typed at its end 200 times: each version is a
    // text of its own, and keeping them all held about 20 MB
    const base = `x = c(${Array.from({ length: 13_000 }, (_, i) => String(i % 97)).join(', ')}`;
    expect(base.length).toBeGreaterThan(40_000);
    const before = heapAfterCollection();
    for (let k = 0; k < 200; k++) parseVisible(`${base}, ${'1'.repeat(k % 7)}${k})`);
    const grownMb = (heapAfterCollection() - before) / 1e6;
    expect(grownMb).toBeLessThan(5);
    // and what is kept is still found
    const text = `${base}, 199)`;
    expect(parseVisible(text)).toBe(parseVisible(text));
  });
});

/** The heap in use after a full collection (V8's own, reached through its flags). */
function heapAfterCollection(): number {
  setFlagsFromString('--expose_gc');
  const gc = runInNewContext('gc') as () => void;
  gc();
  gc();
  return process.memoryUsage().heapUsed;
}
