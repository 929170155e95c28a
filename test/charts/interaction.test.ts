import { describe, expect, it } from 'vitest';
import { cellMeans, profileChart } from '../../src/charts/index.ts';
import { OKABE_ITO, SHAPES } from '../../src/charts/look.ts';
import { encodingOf, expectSelfContained, expectValidSpec, GRAFT, graftData, graftFit, layerOf, valuesOf, obj, type Obj } from './fixtures.ts';

function near(a: unknown, b: number, tol: number): void {
  if (typeof a !== 'number') throw new Error(`expected a number, got ${String(a)}`);
  expect(Math.abs(a - b), `${a} against ${b}`).toBeLessThanOrEqual(tol);
}

describe('treatments across blocks: the graft data', () => {
  const { fit } = graftFit();
  const d = graftData();
  const na = fit.nonadditivity!;
  const r = profileChart({
    y: d.y,
    response: 'yield_pct',
    across: d.batch,
    lines: d.pressure,
    test: { label: "Tukey's test for nonadditivity", f: na.f, df1: na.df1, df2: na.df2, p: na.p },
    averagedOver: [],
  });
  const values = valuesOf(layerOf(r.spec, 'point'), r.spec);
  it('draws one line per pressure, batches along x, the observations as the cell values', () => {
    expect(values.length).toBe(24);
    for (const v of values) {
      const p = ['8500', '8700', '8900', '9100'].indexOf(v.line as string);
      const b = Number(v.across) - 1;
      expect(v.mean).toBe(GRAFT[p]![b]);
      expect(v.n).toBe(1);
    }
    const line = layerOf(r.spec, 'line');
    expect(encodingOf(line).x).toMatchObject({ field: 'across', type: 'nominal', sort: ['1', '2', '3', '4', '5', '6'], title: 'batch' });
    expect(encodingOf(line).color).toMatchObject({ field: 'line', scale: { domain: ['8500', '8700', '8900', '9100'], range: [...OKABE_ITO] } });
    expect(encodingOf(layerOf(r.spec, 'point')).shape).toMatchObject({ field: 'line', scale: { range: [...SHAPES] } });
  });
  it('reports Tukey’s nonadditivity test beside the picture', () => {
    // source: docs/references.md section 4 (statsmodels 0.13.5): F = 0.02513 on 1 and 14 df, p = 0.8763
    expect(obj(r.spec).title).toEqual({
      text: 'Yield of each pressure across the batch levels',
      subtitle: "Tukey's test for nonadditivity: F = 0.0251 on 1 and 14 df, p = 0.88",
    });
    expect(r.caption).toBe("4 pressure levels across 6 batch levels; one observation per cell; Tukey's test for nonadditivity: F = 0.0251 on 1 and 14 df, p = 0.88; parallel lines mean the effects add.");
    expectValidSpec(r.spec);
    expectSelfContained(r.spec);
  });
});

describe('cell means', () => {
  it('average the observations of each cell', () => {
    // the graft data with batches 1-3 and 4-6 as two levels: by hand from the published values
    const d = graftData();
    const half = { name: 'half', codes: Int32Array.from(d.batch.codes, (c) => (c < 3 ? 0 : 1)), levels: ['first', 'second'] };
    const { mean, n } = cellMeans(d.y, d.pressure, half);
    // cell (line l, across j) at l * 4 + j
    near(mean[0], (90.3 + 89.2 + 98.2) / 3, 1e-12);
    near(mean[4], (93.9 + 87.4 + 97.9) / 3, 1e-12);
    near(mean[3], (82.5 + 89.5 + 85.6) / 3, 1e-12);
    near(mean[7], (87.4 + 78.9 + 90.7) / 3, 1e-12);
    expect(Array.from(n)).toEqual([3, 3, 3, 3, 3, 3, 3, 3]);
    const r = profileChart({ y: d.y, response: 'yield_pct', across: d.pressure, lines: half, test: null, averagedOver: ['batch within half'] });
    expect(r.caption).toBe('2 half levels across 4 pressure levels; 3 observations per cell; averaged over batch within half; parallel lines mean the effects add.');
    expect(obj(r.spec).title).toEqual({ text: 'Mean yield of each half across the pressure levels' });
    expectValidSpec(r.spec);
  });
  it('break a line at an empty cell', () => {
    const d = graftData();
    const keep = Int32Array.from({ length: 24 }, (_, i) => i).filter((i) => i !== 0);
    const y = Float64Array.from(keep, (i) => d.y[i]!);
    const pressure = { ...d.pressure, codes: Int32Array.from(keep, (i) => d.pressure.codes[i]!) };
    const batch = { ...d.batch, codes: Int32Array.from(keep, (i) => d.batch.codes[i]!) };
    const r = profileChart({ y, response: 'yield_pct', across: batch, lines: pressure, test: null, averagedOver: [] });
    const values = valuesOf(layerOf(r.spec, 'point'), r.spec);
    expect(values.find((v) => v.line === '8500' && v.across === '1')).toMatchObject({ mean: null, n: 0 });
    expect(r.caption).toContain('1 empty cell (lines broken there)');
    // vega-lite's default for paths breaks at invalid values; the spec must not turn that off
    expect((layerOf(r.spec, 'line').mark as Obj).invalid).toBeUndefined();
    expectValidSpec(r.spec);
  });
});
