/**
 * One rule for the order and the identity of levels, in levels(), group_stats, every fit and
 * every comparison, and an order the user can set (level_order).
 */
import { describe, expect, it } from 'vitest';
import { LEVEL_ORDER_RULE } from '../../src/functions/columns.ts';
import { BUILTINS } from '../../src/functions/index.ts';
import { msg } from '../../src/messages/language.ts';
import { toJson } from '../../src/lang/json.ts';
import { isError, type Value } from '../../src/lang/values.ts';
import { evalFormula } from '../helpers.ts';

const json = (v: Value): unknown => JSON.parse(toJson(v));

// numeric group labels typed in field order (2 before 1)
const TRIAL = ['--- table t', 'g,y,block,d', '2,5.1,1,low', '1,4.2,1,high', '2,5.5,2,low', '1,4.0,2,high', '2,5.9,3,low', '1,4.4,3,high', ''];

describe('the order of levels is one rule everywhere', () => {
  it('levels, group_stats, a fit and a two-group difference agree, and the estimate is first minus second', () => {
    expect(json(evalFormula('levels(t.g)', ...TRIAL))).toEqual(['1', '2']);
    expect(json(evalFormula('group_stats(t.y, t.g).level', ...TRIAL))).toEqual(['1', '2']);
    expect(json(evalFormula('one_way(t.y, t.g).means.level', ...TRIAL))).toEqual(['1', '2']);
    // group 1 mean 4.2, group 2 mean 5.5: first (1) minus second (2)
    const est = evalFormula('two_sample(t.y, t.g).estimate', ...TRIAL) as number;
    expect(est).toBeCloseTo(4.2 - 5.5, 12);
    expect(evalFormula('difference(one_way(t.y, t.g), 1, 2).estimate', ...TRIAL)).toBeCloseTo(4.2 - 5.5, 12);
  });

  it('text levels come in the order they first appear', () => {
    expect(json(evalFormula('levels(t.d)', ...TRIAL))).toEqual(['low', 'high']);
    expect(json(evalFormula('group_stats(t.y, t.d).level', ...TRIAL))).toEqual(['low', 'high']);
    expect(evalFormula('two_sample(t.y, t.d).estimate', ...TRIAL)).toBeCloseTo(5.5 - 4.2, 12);
  });

  it('the rule is stated in the docs of levels and group_stats', () => {
    expect(BUILTINS.get('levels')!.doc).toContain(LEVEL_ORDER_RULE);
    expect(BUILTINS.get('group_stats')!.doc).toContain(LEVEL_ORDER_RULE);
  });
});

describe('level_order', () => {
  it('sets the order for summaries, fits and two-group comparisons (the first is the reference)', () => {
    const o = 'level_order(t.d, ["high", "low"])';
    expect(json(evalFormula(`levels(${o})`, ...TRIAL))).toEqual(['high', 'low']);
    expect(json(evalFormula(`group_stats(t.y, ${o}).level`, ...TRIAL))).toEqual(['high', 'low']);
    expect(json(evalFormula(`blocked(t.y, ${o}, t.block).means.level`, ...TRIAL))).toEqual(['high', 'low']);
    expect(evalFormula(`two_sample(t.y, ${o}).estimate`, ...TRIAL)).toBeCloseTo(4.2 - 5.5, 12);
    expect(json(evalFormula('levels(level_order(t.g, [2, 1]))', ...TRIAL))).toEqual(['2', '1']);
  });
  it('refuses an order that leaves a level out, names one the column lacks, or repeats one', () => {
    const e1 = evalFormula('level_order(t.d, ["low"])', ...TRIAL);
    expect(isError(e1) && e1.message).toBe(`level_order: ${msg.levelNotInOrder('d', ['high'])}`);
    const e2 = evalFormula('level_order(t.d, ["low", "high", "mid"])', ...TRIAL);
    expect(isError(e2) && e2.message).toBe(`level_order: ${msg.orderUnknown('d', ['mid'])}`);
    const e3 = evalFormula('level_order(t.d, ["low", "low", "high"])', ...TRIAL);
    expect(isError(e3) && e3.message).toBe(`level_order: ${msg.orderRepeats('low')}`);
  });
});

describe('the identity of numeric levels', () => {
  it('1, 1.0 and 01 are one level; so are -0 and 0', () => {
    const t = ['--- table t', 'g,y', '1,3', '1.0,4', '01,5', '-0,1', '0,2', '2,7', ''];
    expect(json(evalFormula('levels(t.g)', ...t))).toEqual(['0', '1', '2']);
    expect(json(evalFormula('group_stats(t.y, t.g).n', ...t))).toEqual([2, 3, 1]);
  });
  it('a blocked fit whose blocks are typed 1 and 1.0 sees one block', () => {
    const t = ['--- table t', 'trt,block,y', 'a,1,10', 'b,1.0,12', 'a,2,11', 'b,2.0,14', 'a,03,9', 'b,3,12', ''];
    const fit = evalFormula('blocked(t.y, t.trt, t.block).table.df', ...t);
    if (isError(fit)) throw new Error(fit.message);
    // source: common practice, no source: b - 1 = 2 block df, t - 1 = 1 treatment df, (t-1)(b-1) = 2 error df
    expect(json(fit)).toEqual([1, 2, 2, 5]);
  });
  it('a comparison finds a numeric level however it is written', () => {
    const t = ['--- table t', 'g,y', '1,3', '1.0,4', '2,7', '2,8', ''];
    expect(evalFormula('difference(one_way(t.y, t.g), "1.0", "02").estimate', ...t)).toBeCloseTo(3.5 - 7.5, 12);
  });
});
