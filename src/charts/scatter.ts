/**
 * A plain scatter of two number columns, optionally coloured (and shaped) by the levels of a
 * third. Past {@link MAX_POINTS} points: without groups, counts in a two-dimensional grid of
 * bins; with groups, an even sample of the rows (every k-th), since binned colours would mix.
 */
import { MAX_POINTS, bin2d, evenSample } from './large.ts';
import { assemble, fullLegend, measuredTip, num, tip, type Json } from './layers.ts';
import { COUNT_RANGE, OKABE_ITO, POINT, POINT_SHAPE, SHAPES } from './look.ts';
import { axisTitle, readName } from './titles.ts';
import type { ChartResult, FactorInput } from './types.ts';
import { capital, count, counted, ordinal } from '../messages/charts.ts';

/** The data of a scatter: complete pairs, with the data row each came from. */
export interface ScatterInput {
  readonly x: Float64Array;
  readonly y: Float64Array;
  /** 0-based data row of each pair (null: pair i is row i). */
  readonly rows: Int32Array | null;
  readonly xName: string;
  readonly yName: string;
  /** Groups to colour by, at the same positions, or null. */
  readonly group: FactorInput | null;
  /** Rows left out before this (missing values), for the caption. */
  readonly dropped: number;
}

/** The scatter chart; see the module note. */
export function scatterChart(s: ScatterInput): ChartResult {
  const n = s.x.length;
  const warnings: string[] = [];
  const xTitle = axisTitle(s.xName);
  const yTitle = axisTitle(s.yName);
  const title = `${capital(readName(s.yName).label)} against ${readName(s.xName).label}`;
  const parts = [counted(n, 'point')];
  if (s.group !== null) parts.push(`${counted(s.group.levels.length, 'group')} of ${readName(s.group.name).label}`);
  if (s.dropped > 0) parts.push(`${counted(s.dropped, 'row')} with a missing value left out`);
  const row = (k: number) => (s.rows === null ? k : s.rows[k]!) + 1;
  const xEnc = { field: 'x', type: 'quantitative', title: xTitle, scale: { zero: false } };
  const yEnc = { field: 'y', type: 'quantitative', title: yTitle, scale: { zero: false } };

  let body: Json;
  if (n > MAX_POINTS && s.group === null) {
    const { cells, bx, by } = bin2d(s.x, s.y);
    body = {
      data: { values: cells },
      mark: { type: 'rect' },
      encoding: {
        x: { field: 'x0', type: 'quantitative', title: xTitle, scale: { zero: false } },
        x2: { field: 'x1' },
        y: { field: 'y0', type: 'quantitative', title: yTitle, scale: { zero: false } },
        y2: { field: 'y1' },
        color: { field: 'n', type: 'quantitative', title: 'points per cell', scale: { type: 'log', range: [...COUNT_RANGE] } },
        tooltip: [tip('x0', `${xTitle} from`), tip('x1', 'to'), tip('y0', `${yTitle} from`), tip('y1', 'to'), tip('n', 'points')],
      },
    };
    parts.push(`drawn as counts in a ${bx.count} by ${by.count} grid (more than ${count(MAX_POINTS)} points)`);
  } else {
    let at: Int32Array | null = null;
    if (n > MAX_POINTS) {
      const sample = evenSample(n, MAX_POINTS);
      at = sample.at;
      parts.push(`a sample of ${count(at.length)} drawn (every ${ordinal(sample.stride)} row; more than ${count(MAX_POINTS)} points)`);
    }
    const m = at === null ? n : at.length;
    const g = s.group;
    const values: Json[] = new Array<Json>(m);
    for (let j = 0; j < m; j++) {
      const k = at === null ? j : at[j]!;
      const d: Json = { row: row(k), x: num(s.x[k]!), y: num(s.y[k]!) };
      if (g !== null) d.g = g.levels[g.codes[k]!] ?? '';
      values[j] = d;
    }
    const tooltip = [tip('row', 'row'), measuredTip('x', xTitle), measuredTip('y', yTitle)];
    let look: Json = { color: { value: POINT }, shape: { value: POINT_SHAPE } };
    if (g !== null) {
      const domain = [...g.levels];
      const legend = axisTitle(g.name);
      look = {
        color: { field: 'g', type: 'nominal', title: legend, scale: { domain, range: [...OKABE_ITO] }, legend: fullLegend(domain.length) },
        shape: { field: 'g', type: 'nominal', title: legend, scale: { domain, range: [...SHAPES] }, legend: fullLegend(domain.length) },
      };
      tooltip.push(tip('g', legend, false));
      if (domain.length > OKABE_ITO.length) {
        warnings.push(`${count(domain.length)} groups but ${OKABE_ITO.length} colours that colour-blind readers can tell apart: colours and shapes repeat.`);
      }
    }
    body = { data: { values }, mark: { type: 'point' }, encoding: { x: xEnc, y: yEnc, ...look, tooltip } };
  }
  return { spec: assemble(title, null, body), caption: `${parts.join('; ')}.`, warnings };
}
