/**
 * The chart built-ins through documents, as a user writes them, on the published data of
 * docs/references.md sections 3 and 4.
 */
import { describe, expect, it } from 'vitest';
import { BEYOND } from '../../src/charts/layers.ts';
import type { Chart, Value } from '../../src/lang/values.ts';
import { expectSelfContained, expectValidSpec, GRAFT, layerOf, PLANTS, valuesOf, obj, type Obj } from '../charts/fixtures.ts';
import { numberText } from '../../src/format/digits.ts';
import { doc, run } from '../helpers.ts';
import { fnMsg } from '../../src/messages/functions.ts';

function chart(v: Value | undefined): Chart {
  if (v === undefined || typeof v !== 'object' || v.kind !== 'chart') throw new Error(`expected a chart, got ${JSON.stringify(v)}`);
  return v;
}
function errorOf(v: Value | undefined): string {
  if (v === undefined || typeof v !== 'object' || v.kind !== 'error') throw new Error(`expected an error, got ${JSON.stringify(v)}`);
  return v.message;
}

// source: Montgomery, vascular-graft example (docs/references.md section 4), in table order:
// pressure by pressure, batches 1 to 6; `skip` leaves a yield empty, `wild` replaces one
function graftTable(opts: { skip?: number; wild?: { row: number; value: string } } = {}): string[] {
  let row = 0;
  const lines = Object.entries({ '8500': GRAFT[0]!, '8700': GRAFT[1]!, '8900': GRAFT[2]!, '9100': GRAFT[3]! }).flatMap(([p, ys]) =>
    ys.map((y, b) => {
      row++;
      const value = opts.skip === row ? '' : opts.wild?.row === row ? opts.wild.value : y.toFixed(1);
      return `${p},${b + 1},${b < 3 ? 'early' : 'late'},${value}`;
    }),
  );
  return ['--- table graft', 'pressure,batch,half,yield_pct', ...lines, ''];
}

describe('the chart built-ins on the graft blocks', () => {
  const { engine, states } = run(
    doc(
      ...graftTable({ wild: { row: 17, value: '60.0' } }),
      '--- formula',
      'fit = blocked(graft.yield_pct, graft.pressure, graft.batch)',
      '--- formula',
      'by_fitted = residuals_chart(fit)',
      '--- formula',
      'by_order = residuals_chart(fit, against: "order")',
      '--- formula',
      'by_pressure = residuals_chart(fit, against: "treatment")',
      '--- formula',
      'by_batch = residuals_chart(fit, against: "block")',
      '--- formula',
      'normal = normal_chart(fit)',
      '--- formula',
      'means = means_chart(fit)',
      '--- formula',
      'pairs = pairwise_chart(pairwise(fit, method: "bonferroni"))',
      '--- formula',
      'profile = interaction_chart(fit)',
      '--- formula',
      'points = scatter(graft.batch, graft.yield_pct, color: graft.pressure)',
      '--- formula',
      'plain = scatter(graft.batch, graft.yield_pct)',
    ),
  );
  const names = ['by_fitted', 'by_order', 'by_pressure', 'by_batch', 'normal', 'means', 'pairs', 'profile', 'points', 'plain'];

  it('gives a chart value for each, valid and self-contained', () => {
    for (const name of names) {
      const c = chart(engine.valueOf(name));
      expectValidSpec(c.spec);
      expectSelfContained(c.spec);
      expect(c.caption.length, name).toBeGreaterThan(5);
    }
    expect(states.every((s) => s.error === null)).toBe(true);
  });
  it('marks the wild plot, row 17, in every residual chart', () => {
    for (const name of ['by_fitted', 'by_order', 'by_pressure', 'by_batch', 'normal']) {
      const c = chart(engine.valueOf(name));
      expect(valuesOf(layerOf(c.spec, 'text')).map((l) => l.label), name).toEqual(['row 17']);
      expect(valuesOf(layerOf(c.spec, 'point')).filter((p) => p.flag === BEYOND).map((p) => p.row)).toEqual([17]);
      expect(c.caption).toContain('1 beyond 3 studentized units (row 17)');
    }
    expect(chart(engine.valueOf('by_batch')).caption).toMatch(/^24 residuals of yield; /);
    expect(obj(chart(engine.valueOf('by_batch')).spec).title).toMatchObject({ text: 'Residuals by batch' });
  });
  it('names the method, the factor and the test', () => {
    expect(obj(chart(engine.valueOf('pairs')).spec).title).toEqual({ text: 'Differences of pressure means, Bonferroni 95% intervals' });
    expect(obj(chart(engine.valueOf('means')).spec).title).toEqual({ text: 'Mean yield by pressure, with 95% intervals' });
    expect(obj(chart(engine.valueOf('profile')).spec).title).toMatchObject({ text: 'Yield of each pressure across the batch levels' });
    expect(chart(engine.valueOf('profile')).caption).toContain("Tukey's test for nonadditivity: F = ");
    expect(chart(engine.valueOf('points')).caption).toBe('24 points; 4 groups of pressure.');
    expect(chart(engine.valueOf('plain')).caption).toBe('24 points.');
  });
});

describe('rows left out by the fit', () => {
  it('label the wild plot with its row of the table, not its place among the rows used', () => {
    const { engine, states } = run(
      doc(...graftTable({ skip: 3, wild: { row: 17, value: '60.0' } }), '--- formula', 'fit = blocked(graft.yield_pct, graft.pressure, graft.batch)', '--- formula', 'c = residuals_chart(fit, against: "order")'),
    );
    const c = chart(engine.valueOf('c'));
    expect(valuesOf(layerOf(c.spec, 'text')).map((l) => l.label)).toEqual(['row 17']);
    const rows = valuesOf(layerOf(c.spec, 'point')).map((p) => p.row);
    expect(rows).not.toContain(3);
    expect(rows.length).toBe(23);
    expect(c.caption).toMatch(/^23 residuals of yield; 1 beyond 3 studentized units \(row 17\)/);
    expect(states[1]!.warnings).toContain(fnMsg.rowsLeftOut(1));
  });
  it('are counted by scatter, with a warning on the cell', () => {
    const { engine, states } = run(doc(...graftTable({ skip: 3 }), '--- formula', 'c = scatter(graft.batch, graft.yield_pct)'));
    const c = chart(engine.valueOf('c'));
    expect(c.caption).toBe('23 points; 1 row with a missing value left out.');
    expect(valuesOf(obj(c.spec)).map((p) => p.row)).not.toContain(3);
    expect(states[1]!.warnings).toContain(fnMsg.rowsLeftOut(1));
  });
});

describe("one-way: Dobson's plants", () => {
  const rows = ['--- table plants', 'group,weight', ...[...PLANTS].flatMap(([g, ws]) => ws.map((w) => `${g},${w.toFixed(2)}`)), ''];
  const { engine } = run(
    doc(
      ...rows,
      '--- formula',
      'fit = one_way(plants.weight, plants.group)',
      '--- formula',
      'pairs = pairwise_chart(pairwise(fit))',
      '--- formula',
      'no_blocks = residuals_chart(fit, against: "block")',
      '--- formula',
      'no_profile = interaction_chart(fit)',
      '--- formula',
      'not_pairs = pairwise_chart(fit)',
      '--- formula',
      'bad_against = residuals_chart(fit, against: "plot")',
    ),
  );
  it('draws the Tukey intervals', () => {
    const c = chart(engine.valueOf('pairs'));
    const v = valuesOf(layerOf(c.spec, 'point'));
    // source: scipy 1.10.1 stats.tukey_hsd (docs/references.md section 3): trt2 - trt1 interval
    // 0.174 to 1.556 excludes zero; control - treatment 1, -0.320 to 1.062, does not
    expect(v.find((p) => p.pair === 'trt1 − trt2')!.side).toBe('interval excludes 0');
    expect(v.find((p) => p.pair === 'ctrl − trt1')!.side).toBe('interval includes 0');
    expect(obj(c.spec).title).toEqual({ text: 'Differences of group means, Tukey 95% intervals' });
  });
  it('says in plain words what a one-way fit cannot draw', () => {
    expect(errorOf(engine.valueOf('no_blocks'))).toBe(`residuals_chart: ${fnMsg.noBlocksToPlot('completely randomized (one-way)')}`);
    expect(errorOf(engine.valueOf('no_profile'))).toMatch(/^interaction_chart: an interaction chart needs a fit with two or more factors; this fit \(.*\) has one\. means_chart\(fit\) draws its means\.$/);
    expect(errorOf(engine.valueOf('not_pairs'))).toMatch(/pairwise_chart.*pairs.*the result of pairwise/);
    expect(errorOf(engine.valueOf('bad_against'))).toMatch(/residuals_chart.*against.*"fitted", "order", "treatment", "block"/);
  });
});

describe('a factorial fit', () => {
  const { engine } = run(
    doc(
      ...graftTable(),
      '--- formula',
      'fit = factorial(graft.yield_pct, [graft.pressure, graft.half])',
      '--- formula',
      'profile = interaction_chart(fit)',
      '--- formula',
      'res = residuals_chart(fit)',
      '--- formula',
      'saturated = factorial(graft.yield_pct, [graft.pressure, graft.batch])',
      '--- formula',
      'nothing = residuals_chart(saturated)',
    ),
  );
  it('draws cell means of the second factor across the first, with the interaction test of the fit', () => {
    const c = chart(engine.valueOf('profile'));
    const v = valuesOf(layerOf(c.spec, 'point'), c.spec);
    expect(v.length).toBe(8);
    // by hand from the published data: 8500 psi, batches 1-3
    const early8500 = v.find((p) => p.across === '8500' && p.line === 'early')!;
    expect(Math.abs((early8500.mean as number) - (90.3 + 89.2 + 98.2) / 3)).toBeLessThan(1e-9);
    expect(early8500.n).toBe(3);
    const fit = engine.valueOf('fit') as { fields: ReadonlyMap<string, Value> };
    const table = fit.fields.get('table') as unknown as { names: string[]; columns: { values: ArrayLike<unknown> }[] };
    const source = Array.from(table.columns[0]!.values as string[]);
    const i = source.indexOf('pressure:half');
    expect(i).toBeGreaterThan(0);
    const f = (table.columns[table.names.indexOf('f')]!.values as Float64Array)[i]!;
    expect(obj(c.spec).title).toMatchObject({ text: 'Mean yield of each half across the pressure levels' });
    expect((obj(c.spec).title as Obj).subtitle).toMatch(new RegExp(`^pressure:half interaction: F = ${numberText(f, 'statistic').replace('.', '\\.')} on 3 and 16 df, p = `));
    expect(c.caption).toContain('3 observations per cell');
    expectValidSpec(c.spec);
    expectValidSpec(chart(engine.valueOf('res')).spec);
  });
  it('has no residuals to draw when the fit is saturated', () => {
    expect(engine.valueOf('saturated')).toMatchObject({ kind: 'record', tag: 'fit' });
    expect(errorOf(engine.valueOf('nothing'))).toMatch(/^residuals_chart: this fit \(.*\) leaves no degrees of freedom for error, so its residuals are all zero and there is nothing to plot/);
  });
});

describe('a Latin square', () => {
  // layout rule: the graft numbers of batches 1-4 as a 4 x 4 square (rows = pressures,
  // columns = batches), with treatment (r + c) mod 4; not a published analysis, only the
  // shape of the chart is checked
  const letters = ['A', 'B', 'C', 'D'];
  const lines = GRAFT.flatMap((ys, r) => ys.slice(0, 4).map((y, c) => `${r + 1},${c + 1},${letters[(r + c) % 4]},${y.toFixed(1)}`));
  const { engine } = run(
    doc('--- table sq', 'row,column,method,yield_pct', ...lines, '', '--- formula', 'fit = latin_square(sq.yield_pct, sq.method, sq.row, sq.column)', '--- formula', 'p = interaction_chart(fit)', '--- formula', 'b = residuals_chart(fit, against: "block")'),
  );
  it('draws each treatment across the rows, one plot per cell', () => {
    const c = chart(engine.valueOf('p'));
    const v = valuesOf(layerOf(c.spec, 'point'), c.spec);
    expect(v.length).toBe(16);
    expect(v.every((p) => p.n === 1)).toBe(true);
    expect(obj(c.spec).title).toMatchObject({ text: 'Yield of each method across the row levels' });
    expectValidSpec(c.spec);
  });
  it('has no blocks to draw residuals against', () => {
    expect(errorOf(engine.valueOf('b'))).toMatch(/^residuals_chart: against: "block" needs a fit with blocks \(from blocked\); this .* fit has none\./);
  });
});

describe('chart warnings reach the cell', () => {
  it('more groups than colours', () => {
    const { states } = run(doc(...graftTable(), '--- formula', 'c = scatter(graft.batch, graft.yield_pct, color: graft.yield_pct)'));
    expect(states[1]!.warnings.join(' ')).toMatch(/colours that colour-blind readers can tell apart/);
  });
});
