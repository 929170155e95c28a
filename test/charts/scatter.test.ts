import { describe, expect, it } from 'vitest';
import { MAX_POINTS, scatterChart } from '../../src/charts/index.ts';
import { OKABE_ITO, POINT } from '../../src/charts/look.ts';
import { encodingOf, expectSelfContained, expectValidSpec, graftData, valuesOf, obj, type Obj } from './fixtures.ts';

describe('scatter', () => {
  const d = graftData();
  const batchNo = Float64Array.from(d.batch.codes, (c) => c + 1);
  it('draws one point per row, coloured and shaped by group', () => {
    const r = scatterChart({ x: batchNo, y: d.y, rows: null, xName: 'batch', yName: 'yield_pct', group: d.pressure, dropped: 0 });
    const spec = obj(r.spec);
    const values = valuesOf(spec);
    expect(values.length).toBe(24);
    expect(values[16]).toEqual({ row: 17, x: 5, y: 88.0, g: '8900' });
    const enc = encodingOf(spec);
    expect(enc.x).toMatchObject({ field: 'x', title: 'batch' });
    expect(enc.y).toMatchObject({ field: 'y', title: 'yield (%)' });
    expect(enc.color).toMatchObject({ field: 'g', title: 'pressure', scale: { domain: ['8500', '8700', '8900', '9100'], range: [...OKABE_ITO] } });
    expect(enc.shape).toMatchObject({ field: 'g' });
    expect((enc.tooltip as Obj[]).map((t) => t.field)).toEqual(['row', 'x', 'y', 'g']);
    expect(spec.title).toEqual({ text: 'Yield against batch' });
    expect(r.caption).toBe('24 points; 4 groups of pressure.');
    expectValidSpec(r.spec);
    expectSelfContained(r.spec);
  });
  it('uses one colour without groups, and names left-out rows', () => {
    const rows = Int32Array.from({ length: 23 }, (_, i) => (i < 2 ? i : i + 1));
    const r = scatterChart({ x: Float64Array.from(rows, (i) => batchNo[i]!), y: Float64Array.from(rows, (i) => d.y[i]!), rows, xName: 'batch', yName: 'yield_pct', group: null, dropped: 1 });
    const values = valuesOf(obj(r.spec));
    expect(values.map((v) => v.row)).toEqual(Array.from(rows, (i) => i + 1));
    expect(encodingOf(obj(r.spec)).color).toEqual({ value: POINT });
    expect(r.caption).toBe('23 points; 1 row with a missing value left out.');
    expectValidSpec(r.spec);
  });
  it('warns when there are more groups than colours', () => {
    const g = { name: 'plot', codes: Int32Array.from({ length: 24 }, (_, i) => i), levels: Array.from({ length: 24 }, (_, i) => `p${i + 1}`) };
    const r = scatterChart({ x: batchNo, y: d.y, rows: null, xName: 'batch', yName: 'yield_pct', group: g, dropped: 0 });
    expect(r.warnings.join(' ')).toMatch(/24 groups but 7 colours/);
  });
  it(`bins past ${MAX_POINTS} points without groups, samples evenly with them`, () => {
    const n = 20_000;
    const x = Float64Array.from({ length: n }, (_, i) => (i % 997) / 10);
    const y = Float64Array.from({ length: n }, (_, i) => x[i]! * 0.5 + Math.sin(i) * 3);
    const binned = scatterChart({ x, y, rows: null, xName: 'x', yName: 'y', group: null, dropped: 0 });
    const cells = valuesOf(obj(binned.spec));
    expect(obj(binned.spec).mark).toEqual({ type: 'rect' });
    expect(cells.reduce((s, c) => s + (c.n as number), 0)).toBe(n);
    expect(binned.caption).toMatch(/^20,000 points; drawn as counts in a \d+ by \d+ grid \(more than 5,000 points\)\.$/);
    expectValidSpec(binned.spec);
    const g = { name: 'site', codes: Int32Array.from({ length: n }, (_, i) => i % 3), levels: ['a', 'b', 'c'] };
    const sampled = scatterChart({ x, y, rows: null, xName: 'x', yName: 'y', group: g, dropped: 0 });
    const points = valuesOf(obj(sampled.spec));
    expect(points.length).toBe(5000);
    expect(points.slice(0, 3).map((p) => p.row)).toEqual([1, 5, 9]);
    expect(sampled.caption).toContain('a sample of 5,000 drawn (every 4th row; more than 5,000 points)');
    expectValidSpec(sampled.spec);
  });
});
