import { describe, expect, it } from 'vitest';
import { pairwiseChart, type PairsInput } from '../../src/charts/index.ts';
import { EXCLUDES, INCLUDES } from '../../src/charts/pairwise.ts';
import { MARKED, MARKED_SHAPE, POINT, POINT_SHAPE } from '../../src/charts/look.ts';
import { pairwise } from '../../src/stats/compare/index.ts';
import { encodingOf, expectSelfContained, expectValidSpec, graftFit, layerOf, plantsFit, valuesOf, obj, type Obj } from './fixtures.ts';

function pairsOf(r: ReturnType<typeof pairwise>): PairsInput {
  const t = r.table;
  return { method: r.method, level: r.level, factor: r.factor, df: r.df, critical: r.critical, a: t.a, b: t.b, estimate: t.estimate, se: t.se, low: t.low, high: t.high, p: t.p };
}

/** Checks a printed figure to half a unit of its last printed digit. */
function printed(actual: unknown, figure: string): void {
  if (typeof actual !== 'number') throw new Error(`expected a number, got ${String(actual)}`);
  const decimals = figure.includes('.') ? figure.split('.')[1]!.length : 0;
  expect(Math.abs(actual - Number(figure)), `${actual} against ${figure}`).toBeLessThanOrEqual(0.5 * 10 ** -decimals);
}

describe("pairwise differences: Dobson's plants, Tukey", () => {
  const { fit } = plantsFit();
  const r = pairwiseChart(pairsOf(pairwise(fit, 'tukey', 0.95)));
  const points = layerOf(r.spec, 'point');
  const values = valuesOf(points);
  it('draws every pair in table order, with its interval', () => {
    expect(values.map((v) => v.pair)).toEqual(['ctrl − trt1', 'ctrl − trt2', 'trt1 − trt2']);
    const trt = values[2]!;
    // source: scipy 1.10.1 stats.tukey_hsd (docs/references.md section 3): trt2 - trt1 = 0.865,
    // interval 0.174 to 1.556; here the pair is trt1 - trt2, so the signs turn over
    printed(trt.estimate, '-0.865');
    printed(trt.low, '-1.556');
    printed(trt.high, '-0.174');
    expect(trt.side).toBe(EXCLUDES);
    const ctrl = values[0]!;
    // source: as above: control - treatment 1 = 0.371, interval -0.320 to 1.062
    printed(ctrl.low, '-0.320');
    printed(ctrl.high, '1.062');
    expect(ctrl.side).toBe(INCLUDES);
    const rule = layerOf(r.spec, 'rule', (l) => (l.data as Obj).values !== undefined && encodingOf(l).x2 !== undefined);
    expect(encodingOf(rule).x).toMatchObject({ field: 'low' });
  });
  it('tells excluding from including intervals by shape and colour, with a zero line', () => {
    const enc = encodingOf(points);
    expect(enc.color).toMatchObject({ field: 'side', scale: { domain: [INCLUDES, EXCLUDES], range: [POINT, MARKED] } });
    expect(enc.shape).toMatchObject({ field: 'side', scale: { domain: [INCLUDES, EXCLUDES], range: [POINT_SHAPE, MARKED_SHAPE] } });
    const zero = layerOf(r.spec, 'rule', (l) => valuesOf(l).length === 1 && valuesOf(l)[0]!.zero === 0);
    expect(encodingOf(zero).x).toMatchObject({ field: 'zero' });
  });
  it('names the method in the title and the numbers in the caption', () => {
    expect(obj(r.spec).title).toEqual({ text: 'Differences of group means, Tukey 95% intervals' });
    const excluding = values.filter((v) => (v.low as number) > 0 || (v.high as number) < 0).length;
    expect(r.caption).toContain(`${excluding} of 3 intervals exclude zero`);
    expect(r.caption).toMatch(/^3 pairs of group means; 95% simultaneous intervals by Tukey's honestly significant difference .* on 27 df \(estimate ± \d\.\d+ standard errors\)/);
    expectValidSpec(r.spec);
    expectSelfContained(r.spec);
  });
});

describe('pairwise differences: the graft blocks, every method', () => {
  const { fit } = graftFit();
  for (const [method, title] of [
    ['tukey', 'Differences of pressure means, Tukey 95% intervals'],
    ['bonferroni', 'Differences of pressure means, Bonferroni 95% intervals'],
    ['lsd', 'Differences of pressure means, unadjusted (least significant difference) 95% intervals'],
  ] as const) {
    it(method, () => {
      const r = pairwiseChart(pairsOf(pairwise(fit, method, 0.95)));
      expect(obj(r.spec).title).toEqual({ text: title });
      expect(valuesOf(layerOf(r.spec, 'point')).length).toBe(6);
      expectValidSpec(r.spec);
    });
  }
});
