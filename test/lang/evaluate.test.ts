import { describe, expect, it } from 'vitest';
import { toJson } from '../../src/lang/json.ts';
import { isError, type ErrorValue, type Value } from '../../src/lang/values.ts';
import { doc, evalFormula, run } from '../helpers.ts';
import { msg } from '../../src/messages/language.ts';
import { fnMsg } from '../../src/messages/functions.ts';

const PLOTS = ['--- table p', 'block,trt,y,ok', '1,a,10,true', '1,b,12,false', '2,a,,true', '2,b,15,true', ''];

const json = (v: Value): unknown => JSON.parse(toJson(v));
function err(v: Value): ErrorValue {
  if (!isError(v)) throw new Error(`expected an error, got ${toJson(v)}`);
  return v;
}

describe('round', () => {
  it('rounds half away from zero on the decimal text, at any number of digits', () => {
    expect(evalFormula('round(2.675, 2)')).toBe(2.68);
    expect(evalFormula('round(-2.5)')).toBe(-3);
    // more than 15 digits either way still rounds (it was left unchanged)
    expect(evalFormula('round(1.23456e-20, 22)')).toBe(1.23e-20);
    expect(evalFormula('round(0.000000000000000001234567, 20)')).toBe(1.23e-18);
    expect(evalFormula('round(123456789012345678901234567890, -20)')).toBe(1.23456789e29);
    expect(evalFormula('round(5, -1)')).toBe(10);
    expect(evalFormula('round(4.9, -400)')).toBe(0);
    expect(evalFormula('round(1.5, 400)')).toBe(1.5);
  });
  it('a sum with an infinite term is infinite', () => {
    expect(evalFormula('sum([1, 1e999])')).toBe(Infinity);
  });
});

describe('arithmetic and broadcasting', () => {
  it('computes on numbers with IEEE doubles', () => {
    expect(evalFormula('1 + 2 * 3')).toBe(7);
    expect(evalFormula('-2 ^ 2')).toBe(-4);
    expect(evalFormula('2 ^ 3 ^ 2')).toBe(512);
    expect(evalFormula('7 / 2 - 1')).toBe(2.5);
    expect(Number.isNaN(evalFormula('0 / 0') as number)).toBe(true);
    expect(evalFormula('1 / 0')).toBe(Infinity);
  });
  it('spreads a number over a column and keeps missing values missing', () => {
    expect(json(evalFormula('p.y * 2', ...PLOTS))).toEqual([20, 24, null, 30]);
    expect(json(evalFormula('100 - p.y', ...PLOTS))).toEqual([90, 88, null, 85]);
    expect(json(evalFormula('p.y + p.block', ...PLOTS))).toEqual([11, 13, null, 17]);
  });
  it('compares element by element', () => {
    expect(json(evalFormula('p.y > 11', ...PLOTS))).toEqual([false, true, null, true]);
    expect(json(evalFormula('p.trt == "a"', ...PLOTS))).toEqual([true, false, true, false]);
    expect(evalFormula('"a" < "b"')).toBe(true);
  });
  it('uses three-valued logic with missing values', () => {
    expect(json(evalFormula('p.y > 11 and p.ok', ...PLOTS))).toEqual([false, false, null, true]);
    expect(json(evalFormula('p.y > 11 or p.ok', ...PLOTS))).toEqual([true, true, true, true]);
    expect(json(evalFormula('not p.ok', ...PLOTS))).toEqual([false, true, false, false]);
  });
  it('refuses columns of different lengths, naming both lengths', () => {
    const e = err(evalFormula('p.y + [1, 2, 3]', ...PLOTS));
    expect(e.message).toMatch(/different lengths \(4 and 3\)/);
  });
  it('refuses text where a number is needed', () => {
    expect(err(evalFormula('p.trt * 2', ...PLOTS)).message).toBe(msg.operatorTypes('*', 'a column of texts', 'a number'));
    expect(err(evalFormula('"a" + 1')).message).toBe(msg.operatorTypes('+', 'a text', 'a number'));
    expect(err(evalFormula('-"a"')).message).toBe(msg.operatorType('-', 'a text'));
    expect(err(evalFormula('1 == "1"')).message).toBe(msg.compareTypes('a number', 'a text'));
  });
});

describe('indexing, filtering and members', () => {
  it('counts positions from 1', () => {
    expect(evalFormula('p.y[2]', ...PLOTS)).toBe(12);
    expect(json(evalFormula('p.y[3]', ...PLOTS))).toBeNull();
    expect(json(evalFormula('p.y[[4, 1]]', ...PLOTS))).toEqual([15, 10]);
    expect(err(evalFormula('p.y[5]', ...PLOTS)).message).toMatch(/outside this column, which has 4 elements/);
    expect(err(evalFormula('p.y[1.5]', ...PLOTS)).message).toMatch(/whole numbers/);
  });
  it('filters with a boolean column of the same length', () => {
    expect(json(evalFormula('p.y[p.trt == "b"]', ...PLOTS))).toEqual([12, 15]);
    expect(json(evalFormula('p[p.block == 2].trt', ...PLOTS))).toEqual(['a', 'b']);
    expect(err(evalFormula('p.y[[true, false]]', ...PLOTS)).message).toMatch(/same length/);
  });
  it('reaches columns by name, plain or not', () => {
    const t = ['--- table q', 'yield (kg),x', '1,2', ''];
    expect(json(evalFormula('q["yield (kg)"]', ...t))).toEqual([1]);
    const e = err(evalFormula('q.yeld', ...t));
    expect(e.message).toMatch(/has no column "yeld"/);
  });
  it('suggests a close column name', () => {
    expect(err(evalFormula('p.blok', ...PLOTS)).message).toMatch(/Did you mean block\?/);
  });
});

describe('calls', () => {
  it('takes positional then named arguments and fills defaults', () => {
    expect(evalFormula('round(3.14159, digits: 2)')).toBe(3.14);
    expect(evalFormula('round(3.14159, 3)')).toBe(3.142);
    expect(evalFormula('round(2.5)')).toBe(3);
  });
  it('names the function, the argument and what was expected', () => {
    expect(err(evalFormula('round(1, 2, 3)')).message).toBe(msg.tooManyArguments('round', 2, 3, ['x', 'digits']));
    expect(err(evalFormula('round(1, digit: 2)')).message).toBe(msg.unknownArgument('round', 'digit', ['x', 'digits'], 'digits'));
    expect(err(evalFormula('round(digits: 2)')).message).toMatch(/round needs the argument "x"/);
    expect(err(evalFormula('mean(p.trt)', ...PLOTS)).message).toMatch(/mean: x must be a column of numbers, but the column "trt" holds text: row 1 is "a"/);
    expect(err(evalFormula('round(1, digits: "two")')).message).toMatch(/digits must be a whole number, but it is a text/);
    expect(err(evalFormula('meen(p.y)', ...PLOTS)).message).toBe(msg.unknownFunction('meen', 'mean'));
    expect(err(evalFormula('p(1)', ...PLOTS)).message).toBe(msg.notAFunction('p'));
    expect(err(evalFormula('mean')).message).toMatch(/is a built-in function: call it/);
  });
  it('points at the argument at fault', () => {
    const { engine } = run(doc(...PLOTS, '--- formula', 'x = round(1, digits: "two")'));
    const e = err(engine.valueOf('x')!);
    expect([e.from, e.to]).toEqual([21, 26]);
  });
});

describe('lists', () => {
  it('makes columns of one kind', () => {
    expect(json(evalFormula('[1, 2, 3]'))).toEqual([1, 2, 3]);
    expect(json(evalFormula('["a", "b"]'))).toEqual(['a', 'b']);
    expect(err(evalFormula('[1, "a"]')).message).toMatch(/one kind/);
  });
  it('makes a table of a list of columns', () => {
    expect(json(evalFormula('[p.block, p.trt]', ...PLOTS))).toEqual({ block: [1, 1, 2, 2], trt: ['a', 'b', 'a', 'b'] });
  });
});

describe('summaries and maths', () => {
  it('leave missing values out and say so', () => {
    const { engine, states } = run(doc(...PLOTS, '--- formula', 'm = mean(p.y)'));
    expect(engine.valueOf('m')).toBeCloseTo(37 / 3, 14);
    expect(states[1]!.warnings[0]).toBe(fnMsg.rowsLeftOut(1));
  });
  it('apply element by element', () => {
    expect(json(evalFormula('sqrt([4, 9])'))).toEqual([2, 3]);
    expect(json(evalFormula('abs(p.y - 12)', ...PLOTS))).toEqual([2, 0, null, 3]);
  });
});

describe('suggestions', () => {
  it('offer a name that the misspelt one begins', () => {
    const PLOTS2 = ['--- table q', 'shear_mpa,batch', '1,2', ''];
    expect(err(evalFormula('mean(q.shear)', ...PLOTS2)).message).toMatch(/Did you mean shear_mpa\?/);
    expect(err(evalFormula('mean(q.sh)', ...PLOTS2)).message).not.toMatch(/Did you mean/);
  });
});
