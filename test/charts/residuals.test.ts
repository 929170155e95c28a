import { describe, expect, it } from 'vitest';
import { MAX_LABELS, MAX_POINTS, residualsChart } from '../../src/charts/index.ts';
import { BEYOND, WITHIN } from '../../src/charts/layers.ts';
import { MARKED, MARKED_SHAPE, POINT, POINT_SHAPE } from '../../src/charts/look.ts';
import { blocked } from '../../src/stats/designs/index.ts';
import { studentizedFlags } from '../../src/stats/diagnostics/index.ts';
import { encodingOf, expectSelfContained, expectValidSpec, graftData, graftFit, layerOf, residualInput, valuesOf, obj, type Obj } from './fixtures.ts';

// The vascular-graft blocks (docs/references.md section 4) with one plot made wild on purpose:
// row 17 of the table (8900 psi, batch 5, published 88.0) set to 60.0.
const WILD = { row: 17, value: 60.0 };

describe('residuals against fitted values: the graft blocks', () => {
  const { fit, input } = graftFit();
  const r = residualsChart(input, 'fitted', { sd: fit.sd, df: fit.df_error });
  const points = layerOf(r.spec, 'point');
  const values = valuesOf(points);

  it('draws one point per plot, at (fitted, residual), with a dashed zero line', () => {
    expect(values.length).toBe(24);
    values.forEach((v, k) => {
      expect(v.row).toBe(k + 1);
      expect(v.x).toBe(fit.fitted[k]);
      expect(v.residual).toBe(fit.residuals[k]);
      // common practice, no source: fitted plus residual is the observation
      expect((v.fitted as number) + (v.residual as number)).toBeCloseTo(v.y as number, 10);
    });
    const enc = encodingOf(points);
    expect(enc.x).toMatchObject({ field: 'x', type: 'quantitative', title: 'fitted yield (%)' });
    expect(enc.y).toMatchObject({ field: 'residual', type: 'quantitative', title: 'residual of yield (%)' });
    const zero = layerOf(r.spec, 'rule');
    expect(valuesOf(zero)).toEqual([{ zero: 0 }]);
    expect(encodingOf(zero).y).toMatchObject({ field: 'zero', type: 'quantitative' });
  });
  it('marks nothing when nothing is beyond 3, and says so', () => {
    // published data: the largest studentized residual of the graft fit is below 3
    expect(Math.max(...Array.from(fit.studentized_residuals, Math.abs))).toBeLessThan(3);
    expect(values.every((v) => v.flag === WITHIN)).toBe(true);
    expect(encodingOf(points).color).toEqual({ value: POINT });
    expect(r.caption).toBe('24 residuals of yield; none beyond 3 studentized units; error sd 2.707 on 15 df.');
    expect(() => layerOf(r.spec, 'text')).toThrow();
  });
  it('has a title, tooltips with the row and its values, and a valid, self-contained spec', () => {
    expect(obj(r.spec).title).toEqual({ text: 'Residuals against fitted values', subtitle: 'none beyond 3 studentized units' });
    const tips = encodingOf(points).tooltip as Obj[];
    expect(tips.map((t) => t.title)).toEqual(['row', 'pressure', 'batch', 'yield (%)', 'fitted', 'residual', 'studentized']);
    expect(values[16]).toMatchObject({ row: 17, f0: '8900', f1: '5', y: 88.0 });
    expectValidSpec(r.spec);
    expectSelfContained(r.spec);
  });
});

describe('a wild plot is marked by shape and colour and labelled with its row', () => {
  const { fit, input } = graftFit(WILD);
  const flagged = studentizedFlags(fit.studentized_residuals, 3);
  it('is the one residual beyond 3 studentized units (the fixture works)', () => {
    expect(Array.from(flagged.indices)).toEqual([16]);
  });
  for (const against of ['fitted', 'order', { factor: 0 }, { factor: 1 }] as const) {
    it(`against ${JSON.stringify(against)}`, () => {
      const r = residualsChart(input, against, { sd: fit.sd, df: fit.df_error });
      const points = layerOf(r.spec, 'point');
      const values = valuesOf(points);
      expect(values.filter((v) => v.flag === BEYOND).map((v) => v.row)).toEqual([17]);
      const enc = encodingOf(points);
      // shape and colour both follow the flag, with different values for the two classes
      expect(enc.color).toMatchObject({ field: 'flag', scale: { domain: [WITHIN, BEYOND], range: [POINT, MARKED] } });
      expect(enc.shape).toMatchObject({ field: 'flag', scale: { domain: [WITHIN, BEYOND], range: [POINT_SHAPE, MARKED_SHAPE] } });
      expect(POINT).not.toBe(MARKED);
      expect(POINT_SHAPE).not.toBe(MARKED_SHAPE);
      const labels = valuesOf(layerOf(r.spec, 'text'));
      expect(labels.map((l) => l.label)).toEqual(['row 17']);
      expect(r.caption).toContain('1 beyond 3 studentized units (row 17)');
      expect(obj(r.spec).title).toMatchObject({ subtitle: '1 beyond 3 studentized units (row 17)' });
      expectValidSpec(r.spec);
    });
  }
  it('puts rows on the x axis in data order, and levels in level order', () => {
    const order = residualsChart(input, 'order', { sd: fit.sd, df: fit.df_error });
    expect(valuesOf(layerOf(order.spec, 'point')).map((v) => v.x)).toEqual(Array.from({ length: 24 }, (_, i) => i + 1));
    const byBatch = residualsChart(input, { factor: 1 }, { sd: fit.sd, df: fit.df_error });
    const enc = encodingOf(layerOf(byBatch.spec, 'point'));
    expect(enc.x).toMatchObject({ field: 'f1', type: 'nominal', sort: ['1', '2', '3', '4', '5', '6'], title: 'batch' });
    expect(enc.xOffset).toMatchObject({ field: 'jit' });
    expect(obj(byBatch.spec).title).toMatchObject({ text: 'Residuals by batch' });
  });
});

describe('labels name the row of the table when rows were left out', () => {
  // the graft data without row 3 (as if that plot were lost) and with the wild row 17
  const d = graftData(WILD);
  const keep = Int32Array.from({ length: 24 }, (_, i) => i).filter((i) => i !== 2);
  const y = Float64Array.from(keep, (i) => d.y[i]!);
  const pressure = { ...d.pressure, codes: Int32Array.from(keep, (i) => d.pressure.codes[i]!) };
  const batch = { ...d.batch, codes: Int32Array.from(keep, (i) => d.batch.codes[i]!) };
  const fit = blocked(y, pressure, batch);
  const input = residualInput(fit, y, [pressure, batch], 'yield_pct', keep);
  it('labels fit position 15 as row 17', () => {
    expect(Array.from(studentizedFlags(fit.studentized_residuals, 3).indices)).toEqual([15]);
    const r = residualsChart(input, 'order', { sd: fit.sd, df: fit.df_error });
    expect(valuesOf(layerOf(r.spec, 'text')).map((l) => l.label)).toEqual(['row 17']);
    const values = valuesOf(layerOf(r.spec, 'point'));
    expect(values.map((v) => v.row)).toEqual(Array.from(keep, (i) => i + 1));
    expect(values.some((v) => v.row === 3)).toBe(false);
    expect(r.caption).toContain('23 residuals');
    expect(r.caption).toContain('(row 17)');
  });
});

describe('large data: counts in bins, marked residuals one by one', () => {
  // generation rule: 120 treatments x 50 blocks, residual pattern from a fixed sequence
  const T = 120;
  const B = 50;
  const n = T * B;
  const y = new Float64Array(n);
  const t = { name: 'line', codes: new Int32Array(n), levels: Array.from({ length: T }, (_, k) => `L${k + 1}`) };
  const b = { name: 'site', codes: new Int32Array(n), levels: Array.from({ length: B }, (_, k) => `S${k + 1}`) };
  for (let j = 0, i = 0; j < B; j++) {
    for (let k = 0; k < T; k++, i++) {
      t.codes[i] = k;
      b.codes[i] = j;
      y[i] = 50 + k * 0.01 + j * 0.2 + Math.sin(i * 12.9898) * 2;
    }
  }
  const wild = [100, 2500, 4000];
  for (const i of wild) y[i] = y[i]! + 25;
  const fit = blocked(y, t, b);
  const input = residualInput(fit, y, [t, b], 'yield_kg', null);
  const flagged = Array.from(studentizedFlags(fit.studentized_residuals, 3).indices);

  it(`bins ${n} > ${MAX_POINTS} residuals against fitted values`, () => {
    expect(n).toBeGreaterThan(MAX_POINTS);
    const r = residualsChart(input, 'fitted', { sd: fit.sd, df: fit.df_error });
    const rect = layerOf(r.spec, 'rect');
    const cells = valuesOf(rect);
    expect(cells.reduce((s, c) => s + (c.n as number), 0)).toBe(n);
    expect(encodingOf(rect).color).toMatchObject({ field: 'n', type: 'quantitative', scale: { type: 'log' } });
    const marked = valuesOf(layerOf(r.spec, 'point'));
    expect(marked.map((v) => v.row)).toEqual(flagged.map((k) => k + 1));
    for (const i of wild) expect(flagged).toContain(i);
    expect(r.caption).toMatch(/drawn as counts in a \d+ by \d+ grid \(more than 5,000 points\)/);
    expect(JSON.stringify(r.spec).length).toBeLessThan(200_000);
    expectValidSpec(r.spec);
    expectSelfContained(r.spec);
  });
  it('bins within levels when drawn by a factor, and uses level numbers past 60 levels', () => {
    const bySite = residualsChart(input, { factor: 1 }, { sd: fit.sd, df: fit.df_error });
    const rect = layerOf(bySite.spec, 'rect');
    expect(encodingOf(rect).x).toMatchObject({ field: 'f1', type: 'nominal' });
    expect(valuesOf(rect).reduce((s, c) => s + (c.n as number), 0)).toBe(n);
    expect(bySite.caption).toContain('within each level');
    expectValidSpec(bySite.spec);
    const byLine = residualsChart(input, { factor: 0 }, { sd: fit.sd, df: fit.df_error });
    expect(encodingOf(layerOf(byLine.spec, 'rect')).x).toMatchObject({ field: 'x0', type: 'quantitative', title: 'line (level number, 1 to 120)' });
    expect(byLine.caption).toContain('line shown by level number (120 levels)');
    expectValidSpec(byLine.spec);
  });
  it(`labels at most ${MAX_LABELS}, the most extreme first, and says so`, () => {
    const many = { ...input, studentized: Float64Array.from(input.studentized, (s, i) => (i % 300 === 0 ? 4 + i / n : s)) };
    const r = residualsChart(many, 'fitted', { sd: fit.sd, df: fit.df_error });
    const labels = valuesOf(layerOf(r.spec, 'text'));
    expect(labels.length).toBe(MAX_LABELS);
    const st = labels.map((l) => Math.abs(l.st as number));
    for (let i = 1; i < st.length; i++) expect(st[i]!).toBeLessThanOrEqual(st[i - 1]!);
    expect(r.warnings.join(' ')).toMatch(/the 10 largest are labelled/);
  });
});
