/**
 * Every chart the builders make, on published data and on large generated data: valid
 * against vega-lite's own JSON schema, with no key that could reach outside, and drawn to
 * SVG in Node without a single warning from vega-lite or vega.
 */
import Ajv from 'ajv';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import {
  meansChart,
  normalChart,
  pairwiseChart,
  profileChart,
  residualsChart,
  scatterChart,
  type ChartResult,
} from '../../src/charts/index.ts';
import { renderSvg } from '../../src/charts/render.ts';
import { pairwise } from '../../src/stats/compare/index.ts';
import { blocked } from '../../src/stats/designs/index.ts';
import { expectSelfContained, expectValidSpec, graftData, graftFit, plantsFit, residualInput } from './fixtures.ts';

function charts(): [string, ChartResult][] {
  const out: [string, ChartResult][] = [];
  for (const [name, { fit, input }] of [
    ['graft', graftFit()],
    ['graft, wild row 17', graftFit({ row: 17, value: 60 })],
    ['plants', plantsFit()],
  ] as const) {
    const err = { sd: fit.sd, df: fit.df_error };
    out.push([`${name}: residuals against fitted`, residualsChart(input, 'fitted', err)]);
    out.push([`${name}: residuals in order`, residualsChart(input, 'order', err)]);
    out.push([`${name}: residuals by treatment`, residualsChart(input, { factor: 0 }, err)]);
    if (input.factors.length > 1) out.push([`${name}: residuals by block`, residualsChart(input, { factor: 1 }, err)]);
    out.push([`${name}: normal plot`, normalChart(input)]);
    const m = fit.means;
    out.push([`${name}: means`, meansChart({ factor: fit.treatment, response: input.response, levels: m.level, n: m.n, mean: m.mean, se: m.se, low: m.low, high: m.high, level: fit.level, dfError: fit.df_error, leastSquares: !fit.balanced })]);
    for (const method of ['tukey', 'bonferroni', 'lsd']) {
      const p = pairwise(fit, method, 0.95);
      const t = p.table;
      out.push([`${name}: pairwise ${method}`, pairwiseChart({ method: p.method, level: p.level, factor: p.factor, df: p.df, critical: p.critical, a: t.a, b: t.b, estimate: t.estimate, se: t.se, low: t.low, high: t.high, p: t.p })]);
    }
  }
  const d = graftData();
  const na = graftFit().fit.nonadditivity!;
  out.push(['graft: profile', profileChart({ y: d.y, response: 'yield_pct', across: d.batch, lines: d.pressure, test: { label: "Tukey's test for nonadditivity", ...na }, averagedOver: [] })]);
  out.push(['graft: scatter', scatterChart({ x: Float64Array.from(d.batch.codes, (c) => c + 1), y: d.y, rows: null, xName: 'batch', yName: 'yield_pct', group: d.pressure, dropped: 0 })]);

  // large: 40 treatments x 250 blocks = 10,000 plots (generation rule below)
  const T = 40;
  const B = 250;
  const n = T * B;
  const y = new Float64Array(n);
  const tr = { name: 'variety', codes: new Int32Array(n), levels: Array.from({ length: T }, (_, k) => `v${k + 1}`) };
  const bl = { name: 'field', codes: new Int32Array(n), levels: Array.from({ length: B }, (_, k) => `f${k + 1}`) };
  for (let j = 0, i = 0; j < B; j++) {
    for (let k = 0; k < T; k++, i++) {
      tr.codes[i] = k;
      bl.codes[i] = j;
      y[i] = 20 + k * 0.05 + (j % 9) * 0.3 + Math.sin(i * 0.7071) * 1.5 + (i % 1234 === 0 ? 12 : 0);
    }
  }
  const big = blocked(y, tr, bl);
  const bigInput = residualInput(big, y, [tr, bl], 'yield_kg', null);
  const err = { sd: big.sd, df: big.df_error };
  out.push(['large: residuals against fitted', residualsChart(bigInput, 'fitted', err)]);
  out.push(['large: residuals by variety', residualsChart(bigInput, { factor: 0 }, err)]);
  out.push(['large: residuals by field', residualsChart(bigInput, { factor: 1 }, err)]);
  out.push(['large: normal plot', normalChart(bigInput)]);
  out.push(['large: profile', profileChart({ y, response: 'yield_kg', across: bl, lines: tr, test: null, averagedOver: [] })]);
  out.push(['large: scatter', scatterChart({ x: big.fitted, y, rows: null, xName: 'fitted', yName: 'yield_kg', group: null, dropped: 0 })]);
  out.push(['large: scatter in groups', scatterChart({ x: big.fitted, y, rows: null, xName: 'fitted', yName: 'yield_kg', group: tr, dropped: 0 })]);
  return out;
}

describe('the schema check can fail', () => {
  it('rejects what vega-lite does not accept', () => {
    const ajv = new Ajv({ strict: false, validateFormats: false });
    const validate = ajv.compile(JSON.parse(readFileSync('node_modules/vega-lite/build/vega-lite-schema.json', 'utf8')) as object);
    expect(validate({ mark: 'point', data: { values: [] } })).toBe(true);
    expect(validate({ mark: 'blob', data: { values: [] } })).toBe(false);
    expect(validate({ mark: 'point', encoding: { x: { field: 'a', type: 'amount' } } })).toBe(false);
    expect(() => expectValidSpec({ mark: 'point', encoding: { x: { field: 'a', type: 'amount' } } })).toThrow();
  });
});

describe('every chart', () => {
  for (const [name, r] of charts()) {
    it(`${name}: valid, self-contained, drawn without warnings`, async () => {
      expectValidSpec(r.spec);
      expectSelfContained(r.spec);
      const { svg, warnings } = await renderSvg(r.spec);
      expect(warnings).toEqual([]);
      expect(svg.startsWith('<svg')).toBe(true);
      // something was drawn: symbols, rectangles or paths in the marks
      expect(svg).toMatch(/class="mark-(symbol|rect|line)/);
      expect(r.caption.length).toBeGreaterThan(10);
      expect(r.caption.endsWith('.')).toBe(true);
    });
  }
});
