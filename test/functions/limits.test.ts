import { describe, expect, it } from 'vitest';
import { isError } from '../../src/lang/values.ts';
import { doc, run } from '../helpers.ts';
import { fnMsg } from '../../src/messages/functions.ts';

describe('limits are said in plain words, never returned as NaN', () => {
  it('the studentized range beyond 200 groups', () => {
    const rows = ['--- table t', 'g,y'];
    for (let g = 0; g < 210; g++) rows.push(`${g},${(g % 7) / 10}`, `${g},${(g % 5) / 10 + 0.05}`);
    const { engine } = run(doc(...rows, '', '--- formula', 'fit = one_way(t.y, t.g)', '--- formula', 'p = pairwise(fit)', '--- formula', 'b = pairwise(fit, method: "bonferroni")', '--- formula', 'q = range_critical(0.95, 250, 20)'));
    const p = engine.valueOf('p')!;
    expect(isError(p) && p.message).toBe(`pairwise: ${fnMsg.tukeyTooManyMeans(200, 210)}`);
    expect(isError(engine.valueOf('b')!)).toBe(false);
    const q = engine.valueOf('q')!;
    expect(isError(q) && q.message).toBe(`range_critical: ${fnMsg.tooManyGroups(200, 250)}`);
  });
});

describe('a design too broken to estimate is an error in plain words', () => {
  it('a treatment whose every measurement is missing', () => {
    const { engine } = run(doc('--- table u', 'trt,blk,y', 'a,1,1', 'b,1,2', 'c,1,', 'a,2,2', 'b,2,3', 'c,2,', '', '--- formula', 'fit = blocked(u.y, u.trt, u.blk)'));
    const v = engine.valueOf('fit')!;
    expect(isError(v) && v.message).toMatch(/trt "c" has no measurement left/);
  });
  it('a block with one plot', () => {
    const { engine } = run(doc('--- table t', 'trt,blk,y', 'a,1,1', 'b,1,2', 'c,1,3', 'a,2,2', 'b,2,3', 'c,2,', 'a,3,1.5', 'b,3,', 'c,3,', '', '--- formula', 'fit = blocked(t.y, t.trt, t.blk)'));
    const v = engine.valueOf('fit')!;
    expect(isError(v) && v.message).toMatch(/block "3" has only one plot/);
  });
});
