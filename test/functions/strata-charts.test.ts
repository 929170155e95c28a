/**
 * Charts of split plots, series across sites and covariate fits, through documents.
 */
import { describe, expect, it } from 'vitest';
import type { Chart, Value } from '../../src/lang/values.ts';
import { expectSelfContained, expectValidSpec, obj, valuesOf } from '../charts/fixtures.ts';
import { doc, run } from '../helpers.ts';

function chart(v: Value | undefined): Chart {
  if (v === undefined || typeof v !== 'object' || v.kind !== 'chart') throw new Error(`expected a chart, got ${JSON.stringify(v)}`);
  return v;
}

// invented data for the charts' shape only (the statistics are checked in test/reference)
const splitRows = ['--- table f', 'block,water,variety,yield'];
for (let k = 1; k <= 3; k++) for (const w of ['dry', 'wet']) for (const [j, v] of ['a', 'b', 'c'].entries()) splitRows.push(`${k},${w},${v},${10 + k + (w === 'wet' ? 3 : 0) + j * (w === 'wet' ? 2 : 0.5) + ((k * 7 + j * 3) % 5) / 10}`);
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
    expect(valuesOf(obj(c.spec), c.spec).length).toBe(6);
  });
  it('states the whole-plot error behind the whole-plot means', () => {
    const c = chart(engine.valueOf('sp_means'));
    expect(c.caption).toMatch(/intervals from the whole-plot error mean square on 2 df/);
  });
  it('draws each variety across the sites, with the variety-by-site test', () => {
    const c = chart(engine.valueOf('series_chart'));
    expectValidSpec(c.spec);
    expect(c.caption).toMatch(/^3 variety levels across 2 site levels; 3 observations per cell; averaged over block; variety:site interaction: F = /);
  });
  it('shows adjusted means for a covariate fit', () => {
    const c = chart(engine.valueOf('cov_chart'));
    expect(c.caption).toMatch(/adjusted means? of yield/);
    expect(c.caption).toMatch(/adjusted to the mean/);
  });
});
