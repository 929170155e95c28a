/**
 * Designs and their follow-ups through documents, as a user writes them, against the
 * published values of docs/references.md sections 3 to 6.
 */
import { describe, expect, it } from 'vitest';
import { isRecord, isTable, type RecordValue, type Table, type Value } from '../../src/lang/values.ts';
import { doc, run } from '../helpers.ts';

function rec(v: Value | undefined): RecordValue {
  if (v === undefined || !isRecord(v)) throw new Error(`expected a record, got ${JSON.stringify(v)}`);
  return v;
}
function tab(v: Value | undefined): Table {
  if (v === undefined || !isTable(v)) throw new Error('expected a table');
  return v;
}
function col(t: Table, name: string): ArrayLike<unknown> {
  return t.columns[t.names.indexOf(name)]!.values;
}
/** Checks a printed figure to half a unit of its last printed digit. */
function printed(actual: unknown, figure: string): void {
  if (typeof actual !== 'number') throw new Error(`expected a number, got ${String(actual)}`);
  const decimals = figure.includes('.') ? figure.split('.')[1]!.replace(/e.*$/, '').length : 0;
  const exp = /e(-?\d+)$/.exec(figure);
  const half = 0.5 * 10 ** (-decimals + (exp ? Number(exp[1]) : 0));
  expect(Math.abs(actual - Number(figure)), `${actual} against ${figure}`).toBeLessThanOrEqual(half);
}

// source: Montgomery, Design and Analysis of Experiments, vascular-graft example (from
// memory), confirmed with statsmodels 0.13.5 (docs/references.md section 4)
const GRAFT: Record<string, number[]> = {
  '8500': [90.3, 89.2, 98.2, 93.9, 87.4, 97.9],
  '8700': [92.5, 89.5, 90.6, 94.7, 87.0, 95.8],
  '8900': [85.5, 90.8, 89.6, 86.2, 88.0, 93.4],
  '9100': [82.5, 89.5, 85.6, 87.4, 78.9, 90.7],
};
const graftRows = (skip?: [string, number]): string[] => [
  '--- table graft',
  'pressure,batch,yield',
  ...Object.entries(GRAFT).flatMap(([p, ys]) => ys.map((y, b) => (skip && skip[0] === p && skip[1] === b + 1 ? `${p},${b + 1},` : `${p},${b + 1},${y.toFixed(1)}`))),
  '',
];

describe('randomized complete blocks: the vascular-graft example', () => {
  const { engine } = run(
    doc(
      ...graftRows(),
      '--- formula',
      'fit = blocked(graft.yield, graft.pressure, graft.batch)',
      '--- formula',
      'ranks = friedman(graft.yield, graft.pressure, graft.batch)',
      '--- formula',
      'checks = residual_checks(fit)',
    ),
  );
  const fit = rec(engine.valueOf('fit'));
  const t = tab(fit.fields.get('table'));
  it('gives the published analysis of variance', () => {
    expect(Array.from(col(t, 'source') as string[])).toEqual(['pressure', 'batch', 'error', 'total']);
    expect(Array.from(col(t, 'df') as Float64Array)).toEqual([3, 5, 15, 23]);
    const ss = col(t, 'ss') as Float64Array;
    printed(ss[0], '178.17');
    printed(ss[1], '192.25');
    printed(ss[2], '109.89');
    printed(ss[3], '480.31');
    printed((col(t, 'f') as Float64Array)[0], '8.11');
    printed(fit.fields.get('mse'), '7.32575');
    printed((col(t, 'p') as Float64Array)[0], '0.001916');
    // common practice, no source: (t - 1)(b - 1) error df, N - 1 total df
    expect(fit.fields.get('df_error')).toBe(3 * 5);
  });
  it('gives the relative efficiency after the degrees-of-freedom correction', () => {
    printed(fit.fields.get('relative_efficiency'), '1.8727');
  });
  it("gives Tukey's one-degree-of-freedom test for nonadditivity", () => {
    const na = rec(fit.fields.get('nonadditivity'));
    printed(na.fields.get('ss'), '0.19686');
    printed(na.fields.get('f'), '0.02513');
    printed(na.fields.get('p'), '0.8763');
    expect(rec(rec(engine.valueOf('checks')).fields.get('nonadditivity')).fields.get('f')).toBe(na.fields.get('f'));
  });
  it("gives Friedman's test (scipy 1.10.1, docs/references.md section 6)", () => {
    const f = rec(engine.valueOf('ranks'));
    printed(f.fields.get('statistic'), '6.4576271');
    printed(f.fields.get('p'), '0.0913486');
  });
});

describe('a lost plot: least squares against Yates (docs/references.md section 4; statsmodels 0.13.5)', () => {
  it('fits the graft data without the 8900-psi plot of batch 4', () => {
    const { engine, states } = run(doc(...graftRows(['8900', 4]), '--- formula', 'fit = blocked(graft.yield, graft.pressure, graft.batch)'));
    const fit = rec(engine.valueOf('fit'));
    const t = tab(fit.fields.get('table'));
    const ss = col(t, 'ss') as Float64Array;
    printed(ss[2], '90.6116');
    expect((col(t, 'df') as Float64Array)[2]).toBe(14);
    printed(ss[0], '172.2159');
    printed((col(t, 'f') as Float64Array)[0], '8.869');
    expect(fit.fields.get('balanced')).toBe(false);
    const notes = Array.from((fit.fields.get('notes') as unknown as { values: readonly string[] }).values).join(' ');
    expect(notes).toMatch(/no plot for treatment 8900/);
    expect(states[1]!.warnings.join(' ')).toMatch(/1 row with a missing value was left out/);
  });
});

// source: Dobson (1983), An Introduction to Statistical Modelling, plant weights (from
// memory), confirmed with scipy 1.10.1 (docs/references.md section 3)
const PLANTS: Record<string, number[]> = {
  ctrl: [4.17, 5.58, 5.18, 6.11, 4.5, 4.61, 5.17, 4.53, 5.33, 5.14],
  trt1: [4.81, 4.17, 4.41, 3.59, 5.87, 3.83, 6.03, 4.89, 4.32, 4.69],
  trt2: [6.31, 5.12, 5.54, 5.5, 5.37, 5.29, 4.92, 6.15, 5.8, 5.26],
};

describe("one-way: Dobson's plant weights", () => {
  const rows = ['--- table plants', 'group,weight', ...Object.entries(PLANTS).flatMap(([g, ws]) => ws.map((w) => `${g},${w.toFixed(2)}`)), ''];
  const { engine } = run(
    doc(
      ...rows,
      '--- formula',
      'fit = one_way(plants.weight, plants.group)',
      '--- formula',
      'pairs = pairwise(fit, method: "tukey")',
      '--- formula',
      'kw = kruskal_wallis(plants.weight, plants.group)',
      '--- formula',
      'checks = residual_checks(fit)',
    ),
  );
  it('gives the published analysis of variance', () => {
    const t = tab(rec(engine.valueOf('fit')).fields.get('table'));
    const ss = col(t, 'ss') as Float64Array;
    printed(ss[0], '3.76634');
    printed(ss[1], '10.49209');
    printed((col(t, 'f') as Float64Array)[0], '4.846088');
    printed((col(t, 'p') as Float64Array)[0], '0.0159100');
  });
  it('gives the published Tukey intervals', () => {
    const t = tab(rec(engine.valueOf('pairs')).fields.get('table'));
    const a = col(t, 'a') as string[];
    const b = col(t, 'b') as string[];
    const find = (x: string, y: string): number => {
      for (let i = 0; i < a.length; i++) if (a[i] === x && b[i] === y) return i;
      throw new Error(`no pair ${x} ${y}`);
    };
    const est = col(t, 'estimate') as Float64Array;
    const low = col(t, 'low') as Float64Array;
    const high = col(t, 'high') as Float64Array;
    const p = col(t, 'p') as Float64Array;
    // pairs are first level minus second, in level order: trt1 - trt2 is the negative of the published trt2 - trt1
    const i = find('trt1', 'trt2');
    printed(-est[i]!, '0.865');
    printed(-high[i]!, '0.174');
    printed(-low[i]!, '1.556');
    printed(p[i], '0.012');
    const j = find('ctrl', 'trt1');
    printed(est[j], '0.371');
    printed(low[j], '-0.320');
    printed(high[j], '1.062');
    printed(p[j], '0.391');
  });
  it('gives the Kruskal-Wallis test (scipy 1.10.1)', () => {
    const kw = rec(engine.valueOf('kw'));
    printed(kw.fields.get('statistic'), '7.9882287');
    printed(kw.fields.get('p'), '0.0184238');
  });
  it('gives the Brown-Forsythe test of equal spread (scipy 1.10.1, levene center=median)', () => {
    const bf = rec(rec(engine.valueOf('checks')).fields.get('brown_forsythe'));
    printed(bf.fields.get('f'), '1.1191857');
    printed(bf.fields.get('p'), '0.3412266');
  });
});

describe('handbook table values through the distribution built-ins (docs/references.md section 5, scipy 1.10.1)', () => {
  const cases: [string, string][] = [
    ['t_critical(0.95, 18)', '2.100922'],
    ['t_critical(0.95, 9)', '2.262157'],
    ['normal_quantile(0.975)', '1.959964'],
    ['f_critical(0.95, 1, 18)', '4.413873'],
    ['f_critical(0.95, 3, 15)', '3.287382'],
    ['f_critical(0.99, 2, 27)', '5.488118'],
    ['range_critical(0.95, 3, 12)', '3.772929'],
    ['range_critical(0.95, 4, 20)', '3.958294'],
    ['range_critical(0.95, 10, 60)', '4.646324'],
    ['range_critical(0.95, 2, 2)', '6.084870'],
    ['range_critical(0.99, 20, 2)', '37.943462'],
    ['t_pvalue(40, 10) / 2', '1.1404289e-12'],
    ['f_pvalue(100, 3, 20)', '3.2682418e-12'],
    ['chi2_pvalue(3.841459, 1)', '0.0500000'],
  ];
  const { engine } = run(doc(...cases.flatMap(([e], i) => ['--- formula', `v${i} = ${e}`])));
  for (const [e, figure] of cases) {
    it(`${e} = ${figure}`, () => printed(engine.valueOf(`v${cases.findIndex((c) => c[0] === e)}`), figure));
  }
});
