import tQuantile from '@stdlib/stats-base-dists-t-quantile';
import { describe, expect, it } from 'vitest';
import { meansChart, type MeansInput } from '../../src/charts/index.ts';
import type { DesignFit } from '../../src/stats/designs/index.ts';
import { encodingOf, expectSelfContained, expectValidSpec, graftFit, layerOf, plantsFit, valuesOf, obj, type Obj } from './fixtures.ts';

function near(a: unknown, b: number, tol: number): void {
  if (typeof a !== 'number') throw new Error(`expected a number, got ${String(a)}`);
  expect(Math.abs(a - b), `${a} against ${b}`).toBeLessThanOrEqual(tol);
}

function meansOf(fit: DesignFit, response: string): MeansInput {
  const m = fit.means;
  return { factor: fit.treatment, response, levels: m.level, n: m.n, mean: m.mean, se: m.se, low: m.low, high: m.high, level: fit.level, dfError: fit.df_error, leastSquares: !fit.balanced };
}

describe('treatment means with intervals: the graft blocks', () => {
  const { fit } = graftFit();
  const r = meansChart(meansOf(fit, 'yield_pct'));
  const values = valuesOf(layerOf(r.spec, 'point'), r.spec);
  it('orders the pressures by mean, highest first', () => {
    // by hand from the published data (docs/references.md section 4): row sums 556.9, 550.1,
    // 533.5, 514.6 over 6 batches
    expect(values.map((v) => v.level)).toEqual(['8500', '8700', '8900', '9100']);
    [556.9, 550.1, 533.5, 514.6].forEach((s, i) => near(values[i]!.mean, s / 6, 1e-9));
    expect(encodingOf(layerOf(r.spec, 'point')).y).toMatchObject({ field: 'level', type: 'nominal', sort: ['8500', '8700', '8900', '9100'], title: 'pressure' });
  });
  it('draws each interval as mean -/+ t(0.975, 15) sqrt(MSE / 6)', () => {
    // source: MSE 7.32575 on 15 df, statsmodels 0.13.5 (docs/references.md section 4);
    // t quantile from @stdlib/stats-base-dists-t-quantile 0.2.3
    const half = tQuantile(0.975, 15) * Math.sqrt(7.32575 / 6);
    for (const v of values) {
      near(v.low, (v.mean as number) - half, 1e-5);
      near(v.high, (v.mean as number) + half, 1e-5);
    }
    const rule = layerOf(r.spec, 'rule');
    expect(encodingOf(rule).x).toMatchObject({ field: 'low' });
    expect(encodingOf(rule).x2).toEqual({ field: 'high' });
  });
  it('says what it draws', () => {
    expect(obj(r.spec).title).toEqual({ text: 'Mean yield by pressure, with 95% intervals' });
    expect(r.caption).toBe('4 pressure means of yield from 24 observations; 95% intervals from the error mean square on 15 df; highest 8500 (92.82), lowest 9100 (85.77).');
    expect(encodingOf(layerOf(r.spec, 'point')).x).toMatchObject({ title: 'mean yield (%)' });
    expectValidSpec(r.spec);
    expectSelfContained(r.spec);
  });
});

describe("Dobson's plant means", () => {
  it('orders trt2, ctrl, trt1', () => {
    const { fit } = plantsFit();
    const r = meansChart(meansOf(fit, 'weight'));
    // by hand from the published weights (docs/references.md section 3): sums 55.26, 50.32, 46.61
    const v = valuesOf(layerOf(r.spec, 'point'), r.spec);
    expect(v.map((x) => x.level)).toEqual(['trt2', 'ctrl', 'trt1']);
    near(v[0]!.mean, 5.526, 1e-12);
    near(v[1]!.mean, 5.032, 1e-12);
    near(v[2]!.mean, 4.661, 1e-12);
    expectValidSpec(r.spec);
  });
  it('draws no intervals and says why when the fit has none', () => {
    const { fit } = plantsFit();
    const m = meansOf(fit, 'weight');
    const r = meansChart({ ...m, low: [NaN, NaN, NaN], high: [NaN, NaN, NaN] });
    expect(() => layerOf(r.spec, 'rule')).toThrow();
    expect(r.caption).toContain('no intervals: the fit has no error term');
    expect(obj(r.spec).title).toEqual({ text: 'Mean weight by group' });
    expectValidSpec(r.spec);
  });
});
