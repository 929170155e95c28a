import { describe, expect, it } from 'vitest';
import { analyseFormula, emptyFormula } from '../../../cells/formula/model.ts';
import type { EvalEnv } from '../../../src/lang/evaluate.ts';
import { MISSING } from '../../../src/lang/values.ts';

describe('an empty formula', () => {
  it('is a cell with no text, or NAME = with nothing after it but blanks and comments', () => {
    expect(emptyFormula('')).toEqual({ name: null });
    expect(emptyFormula('  \n\n')).toEqual({ name: null });
    expect(emptyFormula('# to do')).toEqual({ name: null });
    expect(emptyFormula('value1 = \n\n')).toEqual({ name: { text: 'value1', from: 0, to: 6 } });
    expect(emptyFormula('  total =   # later\n')).toEqual({ name: { text: 'total', from: 2, to: 7 } });
  });

  it('is not a formula with anything after =, a comparison, or a stray word', () => {
    for (const text of ['x = 1', 'x == ', 'x', '= 1', 'x = (', '1 =', 'x = "', 'not =']) expect(emptyFormula(text), text).toBeNull();
  });

  it('defines its name, reads nothing and evaluates to missing, with no problem', () => {
    const a = analyseFormula({ id: 'c1', marker: 'formula', eol: '\n', body: 'value1 = \n\n' });
    expect(a.problem).toBeNull();
    expect(a.defines).toEqual({ name: 'value1', from: 0, to: 6 });
    expect(a.reads).toEqual([]);
    // an empty formula reads nothing from its environment
    expect(a.evaluate({} as EvalEnv).value).toBe(MISSING);
  });

  it('leaves every other unfinished formula an error', () => {
    const a = analyseFormula({ id: 'c1', marker: 'formula', eol: '\n', body: 'x = 1 +\n\n' });
    expect(a.problem).not.toBeNull();
    expect(a.defines?.name).toBe('x');
  });
});
