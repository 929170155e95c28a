import { describe, expect, it } from 'vitest';
import { isError } from '../../src/lang/values.ts';
import { doc, run } from '../helpers.ts';

describe('limits are said in plain words, never returned as NaN', () => {
  it('the studentized range beyond 200 groups', () => {
    const rows = ['--- table t', 'g,y'];
    for (let g = 0; g < 210; g++) rows.push(`${g},${(g % 7) / 10}`, `${g},${(g % 5) / 10 + 0.05}`);
    const { engine } = run(doc(...rows, '', '--- formula', 'fit = one_way(t.y, t.g)', '--- formula', 'p = pairwise(fit)', '--- formula', 'b = pairwise(fit, method: "bonferroni")', '--- formula', 'q = range_critical(0.95, 250, 20)'));
    const p = engine.valueOf('p')!;
    expect(isError(p) && p.message).toMatch(/up to 200 means; this fit has 210. Use method: "bonferroni"/);
    expect(isError(engine.valueOf('b')!)).toBe(false);
    const q = engine.valueOf('q')!;
    expect(isError(q) && q.message).toMatch(/up to 200 groups, and 250 were asked for/);
  });
});
