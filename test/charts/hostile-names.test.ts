/**
 * Column names and levels that vega-lite would write unescaped into its expressions: every
 * chart still draws (in Node, through the locked renderer), and too many levels or pairs end
 * in a plain error instead of a compiler that runs out of stack.
 */
import { describe, expect, it } from 'vitest';
import { renderSvg } from '../../src/charts/render.ts';
import { MAX_MEANS_LEVELS, MAX_PAIRS } from '../../src/charts/index.ts';
import { msg } from '../../src/messages/language.ts';
import { isError, type Chart } from '../../src/lang/values.ts';
import { doc, run, valueOf } from '../helpers.ts';

const csv = (s: string): string => `"${s.replace(/"/g, '""')}"`;
const text = (s: string): string => JSON.stringify(s);

const NAMES = ['tr\\eat', 'tr\u2028eat', 'x\\', 'tr"]+alert(1)+["eat', 'a\\"b', 'p\u2029q'];

describe('names that reach vega expressions', () => {
  for (const name of NAMES) {
    it(`every chart draws with a factor called ${JSON.stringify(name)}`, async () => {
      const a = `${name}1`;
      const b = `${name}2`;
      const rows = [[a, 1, 1], [b, 2, 1], [a, 3, 2], [b, 5, 2], [a, 2, 3], [b, 4, 3]].map(([g, y, k]) => `${csv(String(g))},${y},${k}`);
      const { engine } = run(
        doc(
          '--- table t',
          `${csv(name)},y,b`,
          ...rows,
          '',
          '--- formula',
          `fit = blocked(t.y, t[${text(name)}], t.b)`,
          ...['means_chart(fit)', 'residuals_chart(fit, against: "treatment")', 'pairwise_chart(pairwise(fit))', 'interaction_chart(fit)', 'normal_chart(fit)', `scatter(t.y, t.b, color: t[${text(name)}])`].flatMap((f, i) => ['--- formula', `c${i} = ${f}`]),
        ),
      );
      for (let i = 0; i < 6; i++) {
        const v = valueOf(engine, `c${i}`);
        if (isError(v)) throw new Error(`c${i}: ${v.message}`);
        const r = await renderSvg((v as Chart).spec);
        expect(r.svg.startsWith('<svg')).toBe(true);
      }
    });
  }
});

describe('charts with too many levels', () => {
  function oneWayDoc(levels: number): string {
    const rows: string[] = [];
    for (let i = 0; i < levels; i++) rows.push(`L${i},${i % 7}`, `L${i},${(i * 3) % 11}`);
    return doc('--- table t', 'g,y', ...rows, '', '--- formula', 'fit = one_way(t.y, t.g)', '--- formula', 'm = means_chart(fit)', '--- formula', 'p = pairwise_chart(pairwise(fit, method: "lsd"))');
  }
  it('a means chart of more levels than it draws is a plain error', () => {
    const { engine } = run(oneWayDoc(MAX_MEANS_LEVELS + 1));
    const m = valueOf(engine, 'm');
    expect(isError(m) && m.message).toBe(`means_chart: ${msg.tooManyLevelsToDraw(MAX_MEANS_LEVELS + 1, MAX_MEANS_LEVELS)}`);
  });
  it('a pairwise chart of more pairs than it draws is a plain error; fewer draw', () => {
    const k = 64; // 2,016 pairs
    expect((k * (k - 1)) / 2).toBeGreaterThan(MAX_PAIRS);
    const { engine } = run(oneWayDoc(k));
    const p = valueOf(engine, 'p');
    expect(isError(p) && p.message).toBe(`pairwise_chart: ${msg.tooManyPairsToDraw((k * (k - 1)) / 2, MAX_PAIRS)}`);
    const { engine: small } = run(oneWayDoc(20));
    expect(isError(valueOf(small, 'p'))).toBe(false);
  });
  it('at the limits both still draw (the compiler does not run out of stack)', async () => {
    // means_chart at MAX_MEANS_LEVELS levels; pairwise_chart at 63 levels, the most whose
    // 1,953 pairs stay within MAX_PAIRS
    const { engine } = run(oneWayDoc(MAX_MEANS_LEVELS));
    const m = valueOf(engine, 'm');
    if (isError(m)) throw new Error(m.message);
    expect((await renderSvg((m as Chart).spec)).svg.startsWith('<svg')).toBe(true);
    expect((63 * 62) / 2).toBeLessThanOrEqual(MAX_PAIRS);
    const { engine: e63 } = run(oneWayDoc(63));
    const p = valueOf(e63, 'p');
    if (isError(p)) throw new Error(p.message);
    expect((await renderSvg((p as Chart).spec)).svg.startsWith('<svg')).toBe(true);
  }, 60_000);
});
