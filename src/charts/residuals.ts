/**
 * Residuals against fitted values, data order, or the levels of a factor, with a zero line.
 * Residuals whose studentized value lies beyond {@link CUT} are drawn in another colour and
 * shape and labelled with their row of the table, so the reader can find the plot.
 *
 * Past {@link MAX_POINTS} residuals the chart draws counts in bins (a two-dimensional grid,
 * or bins within each level) and draws the marked residuals one by one over them.
 */
import { normalUpper } from '../stats/distributions/index.ts';
import { MANY_LEVELS, MAX_LABELS, MAX_MARKED, MAX_POINTS, bin2d, binByLevel, jitter } from './large.ts';
import { BEYOND, CUT, WITHIN, assemble, flagEncoding, labelLayer, markedPointMark, measuredTip, num, tip, zeroRule, type Json } from './layers.ts';
import { COUNT_RANGE } from './look.ts';
import { axisTitle, derivedTitle, readName } from './titles.ts';
import type { ChartResult, FactorInput, ResidualInput } from './types.ts';
import { count, counted, fig, flaggedWords } from '../messages/charts.ts';

/** What the residuals are drawn against: fitted values, data order, or factor `factor` of the input (0 = treatment). */
export type ResidualAxis = 'fitted' | 'order' | { readonly factor: number };

/** Facts about a fit that the caption states. */
export interface ErrorTerm {
  /** Error standard deviation and its degrees of freedom. */
  readonly sd: number;
  readonly df: number;
}

/** Positions (into the fit's rows) of studentized residuals beyond the cut-off, and their 1-based data rows. */
export function marked(input: ResidualInput): { at: number[]; rows: number[] } {
  const at: number[] = [];
  const rows: number[] = [];
  const st = input.studentized;
  for (let k = 0; k < st.length; k++) {
    if (Math.abs(st[k]!) > CUT) {
      at.push(k);
      rows.push(dataRow(input, k));
    }
  }
  return { at, rows };
}

/**
 * The marked positions to label: the {@link MAX_LABELS} largest in studentized size (ties in
 * data order), since labels of the most extreme points are the ones worth finding.
 */
export function toLabel(input: ResidualInput, at: readonly number[]): number[] {
  const st = input.studentized;
  return [...at].sort((a, b) => Math.abs(st[b]!) - Math.abs(st[a]!) || a - b).slice(0, MAX_LABELS);
}

/**
 * How many residuals beyond the cut-off normal errors give by chance alone, in words, once
 * that is at least one: with 100,000 residuals about 270 lie beyond 3 even when all is well.
 */
export function chanceWords(n: number): string | null {
  const expected = n * 2 * normalUpper(CUT);
  return expected < 1 ? null : `about ${count(Math.round(expected))} expected by chance alone with normal errors`;
}

/** The 1-based row of the table that fit row k came from. */
export function dataRow(input: { readonly rows: Int32Array | null }, k: number): number {
  return (input.rows === null ? k : input.rows[k]!) + 1;
}

/** The values of one residual for a datum: row, measured, fitted, residual, studentized, levels. */
export function residualDatum(input: ResidualInput, k: number, isMarked: boolean): Json {
  const d: Json = {
    row: dataRow(input, k),
    y: num(input.y[k]!),
    fitted: num(input.fitted[k]!),
    residual: num(input.residuals[k]!),
    st: num(input.studentized[k]!),
    flag: isMarked ? BEYOND : WITHIN,
  };
  input.factors.forEach((f, j) => {
    d[`f${j}`] = f.levels[f.codes[k]!] ?? '';
  });
  return d;
}

/** Tooltip entries for a residual datum. */
export function residualTips(input: ResidualInput): Json[] {
  return [
    tip('row', 'row'),
    ...input.factors.map((f, j) => tip(`f${j}`, axisTitle(f.name), false)),
    measuredTip('y', axisTitle(input.response)),
    measuredTip('fitted', 'fitted'),
    tip('residual', 'residual'),
    tip('st', 'studentized'),
  ];
}

/** Residuals against fitted values, data order or a factor; see the module note. */
export function residualsChart(input: ResidualInput, against: ResidualAxis, error: ErrorTerm): ChartResult {
  const n = input.residuals.length;
  const warnings: string[] = [];
  const { at, rows } = marked(input);
  const isMarked = new Uint8Array(n);
  for (const k of at) isMarked[k] = 1;
  const yTitle = derivedTitle('residual of', input.response);
  const response = readName(input.response).label;

  let factor: FactorInput | null = null;
  let factorIndex = -1;
  if (typeof against === 'object') {
    factor = input.factors[against.factor] ?? null;
    factorIndex = against.factor;
    if (factor === null) throw new RangeError(`no factor ${against.factor} in this fit`);
  }
  const nominal = factor !== null && factor.levels.length <= MANY_LEVELS;

  // x of every residual on a continuous axis (fitted, row, or level position)
  let xs: Float64Array | null = null;
  let xTitle: string;
  let title: string;
  if (against === 'fitted') {
    xs = input.fitted;
    xTitle = derivedTitle('fitted', input.response);
    title = 'Residuals against fitted values';
  } else if (against === 'order') {
    xs = Float64Array.from({ length: n }, (_, k) => dataRow(input, k));
    xTitle = 'row of the table (data order)';
    title = 'Residuals in data order';
  } else {
    const f = factor!;
    title = `Residuals by ${readName(f.name).label}`;
    if (nominal) xTitle = axisTitle(f.name);
    else {
      xTitle = `${readName(f.name).label} (level number, 1 to ${f.levels.length})`;
      const jit = jitter(f.codes, f.levels.length);
      xs = Float64Array.from({ length: n }, (_, k) => f.codes[k]! + 1 + jit[k]!);
    }
  }

  const zero = zeroRule('y', yTitle);
  const xNominal = (f: FactorInput): Json => ({ field: `f${factorIndex}`, type: 'nominal', sort: [...f.levels], title: xTitle, axis: { labelAngle: f.levels.length > 8 ? -45 : 0 } });
  const xEnc: Json = nominal ? xNominal(factor!) : { field: 'x', type: 'quantitative', title: xTitle, scale: { zero: false } };
  const yEnc: Json = { field: 'residual', type: 'quantitative', title: yTitle };
  const offset: Json = nominal ? { xOffset: { field: 'jit', type: 'quantitative', scale: { domain: [-0.75, 0.75] } } } : {};
  const jit = nominal ? jitter(factor!.codes, factor!.levels.length) : null;
  const withX = (k: number, d: Json): Json => {
    if (jit !== null) d.jit = jit[k]!;
    else d.x = num(xs![k]!);
    return d;
  };
  const labelled = toLabel(input, at).map((k) => withX(k, { ...residualDatum(input, k, true), label: `row ${dataRow(input, k)}` }));
  if (at.length > MAX_LABELS) warnings.push(`${count(at.length)} residuals lie beyond ${CUT} studentized units; the ${MAX_LABELS} largest are labelled with their rows.`);

  let layers: Json[];
  let binnedWords = '';
  if (n <= MAX_POINTS) {
    const values = Array.from({ length: n }, (_, k) => withX(k, residualDatum(input, k, isMarked[k] === 1)));
    layers = [
      zero,
      {
        data: { values },
        mark: { type: 'point' },
        encoding: { x: xEnc, y: yEnc, ...offset, ...flagEncoding(at.length > 0), tooltip: residualTips(input) },
      },
    ];
  } else {
    const countColor = { field: 'n', type: 'quantitative', title: 'residuals per cell', scale: { type: 'log', range: [...COUNT_RANGE] } };
    let binLayer: Json;
    if (nominal) {
      const f = factor!;
      const { cells, by } = binByLevel(f.codes, f.levels, input.residuals);
      binLayer = {
        // the level under the same field as the marked points', so the two layers share one x scale
        data: { values: cells.map((c) => ({ [`f${factorIndex}`]: c.level, y0: c.y0, y1: c.y1, n: c.n })) },
        mark: { type: 'rect' },
        encoding: {
          x: xEnc,
          y: { field: 'y0', type: 'quantitative', title: yTitle },
          y2: { field: 'y1' },
          color: countColor,
          tooltip: [tip(`f${factorIndex}`, axisTitle(f.name), false), tip('y0', 'residual from'), tip('y1', 'residual to'), tip('n', 'residuals')],
        },
      };
      binnedWords = `drawn as counts in bins ${fig(by.step)} wide within each level (more than ${count(MAX_POINTS)} points)`;
    } else {
      const { cells, bx, by } = bin2d(xs!, input.residuals);
      binLayer = {
        data: { values: cells },
        mark: { type: 'rect' },
        encoding: {
          x: { field: 'x0', type: 'quantitative', title: xTitle, scale: { zero: false } },
          x2: { field: 'x1' },
          y: { field: 'y0', type: 'quantitative', title: yTitle },
          y2: { field: 'y1' },
          color: countColor,
          tooltip: [tip('x0', `${xTitle} from`), tip('x1', 'to'), tip('y0', 'residual from'), tip('y1', 'to'), tip('n', 'residuals')],
        },
      };
      binnedWords = `drawn as counts in a ${bx.count} by ${by.count} grid (more than ${count(MAX_POINTS)} points)`;
    }
    const shown = at.slice(0, MAX_MARKED).map((k) => withX(k, residualDatum(input, k, true)));
    if (at.length > MAX_MARKED) warnings.push(`only the first ${count(MAX_MARKED)} of ${count(at.length)} marked residuals are drawn one by one.`);
    layers = [binLayer, zero];
    if (shown.length > 0) {
      layers.push({ data: { values: shown }, mark: markedPointMark(), encoding: { x: xEnc, y: yEnc, ...offset, tooltip: residualTips(input) } });
    }
  }
  if (labelled.length > 0) layers.push(labelLayer(labelled, { x: xEnc, y: yEnc, ...offset }));

  const missingSt = countNaN(input.studentized);
  if (missingSt > 0) warnings.push(`${counted(missingSt, 'residual')} ha${missingSt === 1 ? 's' : 've'} no studentized value (a plot that fixes its own fitted value) and cannot be marked.`);

  const chance = chanceWords(n);
  const parts = [`${counted(n, 'residual')} of ${response}`, flaggedWords(rows, CUT) + (chance === null ? '' : `, ${chance}`), `error sd ${fig(error.sd)} on ${count(error.df)} df`];
  if (binnedWords !== '') parts.push(binnedWords);
  if (factor !== null && !nominal) parts.push(`${factor.name} shown by level number (${count(factor.levels.length)} levels)`);
  return {
    spec: assemble(title, flaggedWords(rows, CUT), { layer: layers }),
    caption: `${parts.join('; ')}.`,
    warnings,
  };
}

function countNaN(x: Float64Array): number {
  let m = 0;
  for (let i = 0; i < x.length; i++) if (Number.isNaN(x[i]!)) m++;
  return m;
}
