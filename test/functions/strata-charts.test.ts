/**
 * Charts of split plots, series across sites and covariate fits, through documents.
 */
import { describe, expect, it } from 'vitest';
import type { Chart, RecordValue, Table, Value } from '../../src/lang/values.ts';
import { expectSelfContained, expectValidSpec, layerOf, obj, valuesOf } from '../charts/fixtures.ts';
import { doc, run } from '../helpers.ts';

/** A column of a table field of a record, as an array. */
function column(r: Value | undefined, field: string, name: string): unknown[] {
  const t = (r as RecordValue).fields.get(field) as Table;
  const i = t.names.indexOf(name);
  if (i < 0) throw new Error(`no column ${name} in ${field}`);
  return Array.from(t.columns[i]!.values as ArrayLike<unknown>);
}

function chart(v: Value | undefined): Chart {
  if (v === undefined || typeof v !== 'object' || v.kind !== 'chart') throw new Error(`expected a chart, got ${JSON.stringify(v)}`);
  return v;
}

// invented data for the charts' shape only (the statistics are checked in test/reference);
// the whole plots differ by more than blocks and water, so whole_error is not zero
const splitRows = ['--- table f', 'block,water,variety,yield'];
for (let k = 1; k <= 3; k++) for (const w of ['dry', 'wet']) for (const [j, v] of ['a', 'b', 'c'].entries()) splitRows.push(`${k},${w},${v},${10 + k + (w === 'wet' ? 3 + ((k * 5) % 3) / 4 : 0) + j * (w === 'wet' ? 2 : 0.5) + ((k * 7 + j * 3) % 5) / 10}`);
const siteRows = ['--- table s', 'site,block,variety,yield'];
for (const [u, site] of ['north', 'south'].entries()) for (let k = 1; k <= 3; k++) for (const [i, v] of ['a', 'b', 'c'].entries()) siteRows.push(`${site},${k},${v},${20 + 5 * u + k + (u === 0 ? i : 2 - i) + ((k * 5 + i * 3 + u) % 4) / 10}`);

describe('profile and means charts for the designs with strata', () => {
  const { engine } = run(
    doc(
      ...splitRows,
      '',
      ...siteRows,
      '',
      '--- formula',
      'sp = split_plot(f.yield, f.water, f.variety, f.block)',
      '--- formula',
      'sp_chart = interaction_chart(sp)',
      '--- formula',
      'sp_means = means_chart(sp)',
      '--- formula',
      'series = across_sites(s.yield, s.variety, s.block, s.site)',
      '--- formula',
      'series_chart = interaction_chart(series)',
      '--- formula',
      'cov = blocked(f.yield, f.variety, f.block, covariate: f.block * 1.5 + f.yield / 10)',
      '--- formula',
      'cov_chart = means_chart(cov)',
    ),
  );
  it('draws each whole-plot level across the subplot levels, with the interaction test', () => {
    const c = chart(engine.valueOf('sp_chart'));
    expectValidSpec(c.spec);
    expectSelfContained(c.spec);
    expect(c.caption).toMatch(/^2 water levels across 3 variety levels; 3 observations per cell; averaged over block; water:variety interaction: F = /);
    const drawn = valuesOf(obj(c.spec), c.spec);
    expect(drawn.length).toBe(6);
    // each point is the fit's cell mean of that whole-plot and subplot level
    const sp = engine.valueOf('sp');
    const water = column(sp, 'cell_means', 'water');
    const variety = column(sp, 'cell_means', 'variety');
    const mean = column(sp, 'cell_means', 'mean') as number[];
    for (const d of drawn) {
      const k = water.findIndex((w, i) => w === d.line && variety[i] === d.across);
      expect(k, `${String(d.line)} ${String(d.across)}`).toBeGreaterThanOrEqual(0);
      expect(Math.abs((d.mean as number) - mean[k]!)).toBeLessThan(1e-12);
    }
  });
  it('states the whole-plot error behind the whole-plot means', () => {
    const c = chart(engine.valueOf('sp_means'));
    expect(c.caption).toMatch(/intervals from the whole-plot error mean square on 2 df/);
  });
  it('draws each variety across the sites, with the variety-by-site test', () => {
    const c = chart(engine.valueOf('series_chart'));
    expectValidSpec(c.spec);
    expect(c.caption).toMatch(/^3 variety levels across 2 site levels; 3 observations per cell; averaged over block; variety:site interaction: F = /);
    // each point is the fit's mean of that variety at that site
    const drawn = valuesOf(obj(c.spec), c.spec);
    const series = engine.valueOf('series');
    const variety = column(series, 'site_means', 'treatment');
    const site = column(series, 'site_means', 'site');
    const mean = column(series, 'site_means', 'mean') as number[];
    expect(drawn.length).toBe(6);
    for (const d of drawn) {
      const k = variety.findIndex((v, i) => v === d.line && site[i] === d.across);
      expect(k, `${String(d.line)} ${String(d.across)}`).toBeGreaterThanOrEqual(0);
      expect(Math.abs((d.mean as number) - mean[k]!)).toBeLessThan(1e-12);
    }
  });
  it('shows adjusted means for a covariate fit', () => {
    const c = chart(engine.valueOf('cov_chart'));
    expect(c.caption).toMatch(/adjusted means? of yield/);
    expect(c.caption).toMatch(/adjusted to the mean/);
    // the points are the fit's adjusted means, not the plain ones
    const cov = engine.valueOf('cov');
    const levels = column(cov, 'means', 'level');
    const adjusted = column(cov, 'means', 'mean') as number[];
    const plain = column(cov, 'unadjusted_means', 'mean') as number[];
    const drawn = valuesOf(layerOf(c.spec, 'point'), c.spec);
    expect(drawn.length).toBe(3);
    let moved = 0;
    for (const d of drawn) {
      const k = levels.indexOf(d.level);
      expect(Math.abs((d.mean as number) - adjusted[k]!)).toBeLessThan(1e-12);
      moved = Math.max(moved, Math.abs(adjusted[k]! - plain[k]!));
    }
    // the adjustment moved the means here, so drawing the plain means would fail above
    expect(moved).toBeGreaterThan(1e-3);
  });
});
