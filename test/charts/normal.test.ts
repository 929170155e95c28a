import normalQuantileRef from '@stdlib/stats-base-dists-normal-quantile';
import { describe, expect, it } from 'vitest';
import { MAX_POINTS, blomPositions, normalChart, quartileLine } from '../../src/charts/index.ts';
import { BEYOND } from '../../src/charts/layers.ts';
import { TAIL_RANKS } from '../../src/charts/normal.ts';
import { encodingOf, expectSelfContained, expectValidSpec, graftFit, layerOf, PLANTS, plantsFit, valuesOf, obj, type Obj } from './fixtures.ts';
import type { ResidualInput } from '../../src/charts/index.ts';

/** Fails unless |a - b| <= tol. */
function near(a: unknown, b: number, tol: number): void {
  if (typeof a !== 'number') throw new Error(`expected a number, got ${String(a)}`);
  expect(Math.abs(a - b), `${a} against ${b}`).toBeLessThanOrEqual(tol);
}

describe("Blom's plotting positions", () => {
  it('are (i - 3/8) / (n + 1/4), checked by hand for n = 1 and n = 5', () => {
    // source: G. Blom (1958), Statistical Estimates and Transformed Beta-Variables; by hand
    expect(Array.from(blomPositions(1))).toEqual([0.5]);
    const p = blomPositions(5);
    const byHand = [0.625 / 5.25, 1.625 / 5.25, 2.625 / 5.25, 3.625 / 5.25, 4.625 / 5.25];
    byHand.forEach((x, i) => near(p[i], x, 1e-15));
    near(p[0], 0.119047619047619, 1e-15);
    near(p[2], 0.5, 0);
    near(p[4], 0.880952380952381, 1e-15);
  });
});

// Dobson's control plants alone, as residuals about their mean (docs/references.md sections 3, 6):
// the Shapiro-Wilk test does not change with a shift, so W and p are those of the weights.
const CTRL = Float64Array.from(PLANTS.get('ctrl')!);
const ctrlMean = CTRL.reduce((s, x) => s + x, 0) / CTRL.length;
const ctrlInput: ResidualInput = {
  residuals: Float64Array.from(CTRL, (x) => x - ctrlMean),
  fitted: new Float64Array(CTRL.length).fill(ctrlMean),
  studentized: Float64Array.from(CTRL, () => 0),
  y: CTRL,
  rows: null,
  response: 'weight',
  factors: [],
};

describe('normal probability plot of a small sample', () => {
  const r = normalChart(ctrlInput);
  const points = valuesOf(layerOf(r.spec, 'point'));
  it('pairs the sorted residuals with the normal quantiles of the Blom positions', () => {
    expect(points.length).toBe(10);
    const sorted = Array.from(ctrlInput.residuals).sort((a, b) => a - b);
    const p = blomPositions(10);
    points.forEach((d, i) => {
      expect(d.residual).toBe(sorted[i]);
      // source: @stdlib/stats-base-dists-normal-quantile 0.3.1
      near(d.q, normalQuantileRef(p[i]!, 0, 1), 1e-12);
    });
    // the lightest plant (4.17, row 1) is the first point
    expect(points[0]).toMatchObject({ row: 1, y: 4.17 });
  });
  it('draws the reference line through the quartiles', () => {
    // by hand: sorted weights 4.17 4.50 4.53 4.61 5.14 5.17 5.18 5.33 5.58 6.11; quartiles
    // (Hyndman and Fan definition 7) 4.53 + 0.25 * 0.08 = 4.55 and 5.18 + 0.75 * 0.15 = 5.2925;
    // normal quartiles -/+ 0.6744897501960817 (source: @stdlib/stats-base-dists-normal-quantile 0.3.1)
    const z = normalQuantileRef(0.75, 0, 1);
    const slope = (5.2925 - 4.55) / (2 * z);
    const line = quartileLine(Float64Array.from(ctrlInput.residuals).sort());
    near(line.slope, slope, 1e-12);
    near(line.intercept, (4.55 - ctrlMean) + slope * z, 1e-12);
    const ends = valuesOf(layerOf(r.spec, 'line'));
    expect(ends.length).toBe(2);
    near(ends[0]!.q, points[0]!.q as number, 0);
    near(ends[1]!.q, points[9]!.q as number, 0);
    for (const e of ends) near(e.line, line.intercept + line.slope * (e.q as number), 1e-12);
  });
  it('reports the Shapiro-Wilk test in the subtitle and caption', () => {
    // source: scipy 1.10.1 stats.shapiro on the control weights: W = 0.9566815, p = 0.7474745
    // (docs/references.md section 6), printed to 3 decimals and 2 significant digits
    expect(obj(r.spec).title).toEqual({ text: 'Normal probability plot of the residuals', subtitle: 'Shapiro-Wilk W = 0.957, p = 0.75' });
    expect(r.caption).toBe('10 residuals of weight; none beyond 3 studentized units; Shapiro-Wilk W = 0.957, p = 0.75; reference line through the quartiles (slope 0.5504).');
    const enc = encodingOf(layerOf(r.spec, 'point'));
    expect(enc.x).toMatchObject({ field: 'q', title: 'normal quantile (Blom plotting positions)' });
    expect(enc.y).toMatchObject({ field: 'residual', title: 'residual of weight' });
    expectValidSpec(r.spec);
    expectSelfContained(r.spec);
  });
});

describe('normal plots of fits', () => {
  it('draws the 30 residuals of the one-way plant fit', () => {
    const { input } = plantsFit();
    const r = normalChart(input);
    expect(valuesOf(layerOf(r.spec, 'point')).length).toBe(30);
    expect(r.caption).toMatch(/^30 residuals of weight; none beyond 3 studentized units; Shapiro-Wilk W = 0\.\d{3}, p = /);
    expectValidSpec(r.spec);
  });
  it('marks and labels the wild graft plot (row 17) at the low end', () => {
    const { input } = graftFit({ row: 17, value: 60 });
    const r = normalChart(input);
    const points = valuesOf(layerOf(r.spec, 'point'));
    expect(points[0]).toMatchObject({ row: 17, flag: BEYOND });
    expect(points.filter((p) => p.flag === BEYOND).length).toBe(1);
    expect(valuesOf(layerOf(r.spec, 'text')).map((l) => l.label)).toEqual(['row 17']);
    expect(r.caption).toContain('1 beyond 3 studentized units (row 17)');
  });
  it('says why there is no Shapiro-Wilk test for fewer than 3 residuals', () => {
    const tiny: ResidualInput = { ...ctrlInput, residuals: Float64Array.of(-1, 1), fitted: Float64Array.of(0, 0), studentized: Float64Array.of(0, 0), y: Float64Array.of(-1, 1) };
    const r = normalChart(tiny);
    expect(r.caption).toContain('Shapiro-Wilk test not made: it covers 3 to 5,000 residuals, this fit has 2');
    expectValidSpec(r.spec);
  });
});

describe('large data: an even sample of ranks, all of both tails and every marked residual', () => {
  const n = 12_345;
  // generation rule: a smooth, heavy-tailed sequence; every 1000th studentized value wild
  const res = Float64Array.from({ length: n }, (_, i) => Math.tan((((i * 7919) % n) / n - 0.5) * 2.5));
  const st = Float64Array.from(res, (x, i) => (i % 1000 === 0 ? 5 : x / 10));
  const input: ResidualInput = { residuals: res, fitted: new Float64Array(n), studentized: st, y: res, rows: null, response: 'y', factors: [] };
  const r = normalChart(input);
  const points = valuesOf(layerOf(r.spec, 'point'));
  it('keeps at most 5,000 points, the extremes and the marked ones among them', () => {
    expect(points.length).toBeLessThanOrEqual(MAX_POINTS);
    const sorted = Array.from(res).sort((a, b) => a - b);
    const drawn = new Set(points.map((p) => p.residual));
    for (let i = 0; i < TAIL_RANKS; i++) {
      expect(drawn.has(sorted[i])).toBe(true);
      expect(drawn.has(sorted[n - 1 - i])).toBe(true);
    }
    const markedRows = points.filter((p) => p.flag === BEYOND).map((p) => p.row as number).sort((a, b) => a - b);
    expect(markedRows).toEqual(Array.from({ length: 13 }, (_, k) => k * 1000 + 1));
    // the quantiles follow the rank of each drawn point
    for (let i = 1; i < points.length; i++) expect(points[i]!.q as number).toBeGreaterThan(points[i - 1]!.q as number);
    expect(r.caption).toMatch(/of 12,345 points drawn \(every \d+(st|nd|rd|th) rank, all 50 at each end and every marked residual\)/);
    expect(r.caption).toContain('Shapiro-Wilk test not made: it covers 3 to 5,000 residuals, this fit has 12,345');
    expectValidSpec(r.spec);
  });
});
