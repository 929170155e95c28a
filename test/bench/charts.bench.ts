/**
 * Benchmarks of the charts (run with `npx vitest bench --run test/bench/charts.bench.ts`):
 * 100,000 residuals of a blocked fit (50 treatments x 2,000 blocks), past the 5,000-point
 * threshold, so every chart is binned or sampled. Measured: building the spec from the fit's
 * arrays, and drawing that spec to SVG in Node (vega-lite compile, vega parse, headless
 * render). The fit and its data are made outside the timed functions.
 */
import { cpus } from 'node:os';
import { bench, describe } from 'vitest';
import { normalChart, profileChart, residualsChart, scatterChart, type ChartResult, type ResidualInput } from '../../src/charts/index.ts';
import { renderSvg } from '../../src/charts/render.ts';
import { blocked, type Factor } from '../../src/stats/designs/index.ts';

console.log(`machine: ${cpus()[0]?.model ?? 'unknown CPU'} (${cpus().length} cores), Node ${process.version}`);

let state = 2026;
function uniform(): number {
  state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
  return (state + 0.5) / 4294967296;
}
function gauss(): number {
  return Math.sqrt(-2 * Math.log(uniform())) * Math.cos(2 * Math.PI * uniform());
}

const T = 50;
const B = 2000;
const N = T * B;
const y = new Float64Array(N);
const treatment: Factor = { name: 'variety', codes: new Int32Array(N), levels: Array.from({ length: T }, (_, k) => `v${k + 1}`) };
const block: Factor = { name: 'field', codes: new Int32Array(N), levels: Array.from({ length: B }, (_, k) => `f${k + 1}`) };
for (let j = 0, i = 0; j < B; j++) {
  for (let k = 0; k < T; k++, i++) {
    treatment.codes[i] = k;
    block.codes[i] = j;
    y[i] = 100 + 0.1 * k + (j % 7) + 2 * gauss();
  }
}
for (const i of [17, 5000, 77_777]) y[i] = y[i]! + 15;
const fit = blocked(y, treatment, block);
const input: ResidualInput = { residuals: fit.residuals, fitted: fit.fitted, studentized: fit.studentized_residuals, y, rows: null, response: 'yield_kg', factors: [treatment, block] };
const error = { sd: fit.sd, df: fit.df_error };

const builders: [string, () => ChartResult][] = [
  ['residuals against fitted (2-D bins)', () => residualsChart(input, 'fitted', error)],
  ['residuals by treatment (bins within 50 levels)', () => residualsChart(input, { factor: 0 }, error)],
  ['normal plot (even sample of ranks)', () => normalChart(input)],
  ['profile, 50 lines across 2,000 blocks (sampled to 5,000 cells)', () => profileChart({ y, response: 'yield_kg', across: block, lines: treatment, test: null, averagedOver: [] })],
  ['scatter, no groups (2-D bins)', () => scatterChart({ x: fit.fitted, y, rows: null, xName: 'fitted', yName: 'yield_kg', group: null, dropped: 0 })],
];

describe(`build the spec from ${N.toLocaleString('en-US')} residuals`, () => {
  for (const [name, build] of builders) bench(name, () => void build(), { iterations: 20 });
});

describe('draw the spec to SVG in Node', () => {
  for (const [name, build] of builders) {
    const spec = build().spec;
    bench(name, async () => {
      const { warnings } = await renderSvg(spec);
      if (warnings.length > 0) throw new Error(`vega warned: ${warnings.join('; ')}`);
    }, { iterations: 10 });
  }
});
