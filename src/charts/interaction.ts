/**
 * Profiles of cell means: the mean response in each cell of two factors, one line per level
 * of one factor across the levels of the other. Lines that run parallel say the two effects
 * add; lines that cross or fan out say they do not (an interaction, or in a blocked trial,
 * treatments that rank differently from block to block).
 *
 * Lines take the Okabe-Ito colours and a shape each; an empty cell breaks its line rather
 * than joining across it. Past {@link MAX_POINTS} cells, an even sample of the across
 * factor's levels is drawn and the caption says so.
 */
import { MANY_LEVELS, MAX_POINTS, evenSample } from './large.ts';
import { assemble, fullLegend, measuredTip, num, tip, type Json } from './layers.ts';
import { OKABE_ITO, SHAPES } from './look.ts';
import { axisTitle, readName } from './titles.ts';
import type { ChartResult, FactorInput } from './types.ts';
import { capital, count, counted, fig, ordinal, pText } from '../messages/charts.ts';

/** A test that the chart's caption reports beside the picture. */
export interface ProfileTest {
  /** What was tested, as the caption names it ("Tukey's test for nonadditivity"). */
  readonly label: string;
  readonly f: number;
  readonly df1: number;
  readonly df2: number;
  readonly p: number;
}

/** The data of a profile chart. */
export interface ProfileInput {
  /** Measured values, one per observation, with both factors' codes at the same positions. */
  readonly y: Float64Array;
  readonly response: string;
  /** The factor along the x axis, and the factor with one line per level. */
  readonly across: FactorInput;
  readonly lines: FactorInput;
  /** The test of the two factors' joint effect, when the fit has one. */
  readonly test: ProfileTest | null;
  /** Other factors the cell means are averaged over (named in the caption). */
  readonly averagedOver: readonly string[];
}

/** Cell means and counts, line level major: cell (l, j) at l * across + j. */
export function cellMeans(y: Float64Array, across: FactorInput, lines: FactorInput): { mean: Float64Array; n: Int32Array } {
  const ka = across.levels.length;
  const cells = ka * lines.levels.length;
  const sum = new Float64Array(cells);
  const n = new Int32Array(cells);
  for (let i = 0; i < y.length; i++) {
    const c = lines.codes[i]! * ka + across.codes[i]!;
    sum[c] = sum[c]! + y[i]!;
    n[c]!++;
  }
  const mean = new Float64Array(cells);
  for (let c = 0; c < cells; c++) mean[c] = n[c]! > 0 ? sum[c]! / n[c]! : NaN;
  return { mean, n };
}

/** The profile chart; see the module note. */
export function profileChart(input: ProfileInput): ChartResult {
  const { across, lines } = input;
  const ka = across.levels.length;
  const kl = lines.levels.length;
  const warnings: string[] = [];
  const { mean, n } = cellMeans(input.y, across, lines);

  // which levels of the across factor to draw
  let shownAcross: Int32Array = Int32Array.from({ length: ka }, (_, j) => j);
  let sampleWords = '';
  if (ka * kl > MAX_POINTS) {
    const s = evenSample(ka, Math.max(1, Math.floor(MAX_POINTS / kl)));
    shownAcross = s.at;
    sampleWords = `${count(shownAcross.length)} of ${count(ka)} ${readName(across.name).label} levels drawn (every ${ordinal(s.stride)}), to keep to ${count(MAX_POINTS)} cells`;
  }
  const positional = shownAcross.length > MANY_LEVELS;

  const values: Json[] = [];
  let empty = 0;
  let minN = Infinity;
  let maxN = 0;
  for (let l = 0; l < kl; l++) {
    for (const j of shownAcross) {
      const c = l * ka + j;
      const cn = n[c]!;
      if (cn === 0) empty++;
      else {
        minN = Math.min(minN, cn);
        maxN = Math.max(maxN, cn);
      }
      values.push({ across: across.levels[j]!, position: j + 1, line: lines.levels[l]!, mean: num(mean[c]!), n: cn });
    }
  }
  if (kl > OKABE_ITO.length) {
    warnings.push(`${count(kl)} lines but ${OKABE_ITO.length} colours that colour-blind readers can tell apart: colours and shapes repeat, so read the lines by their tooltips.`);
  }

  const acrossTitle = positional ? `${readName(across.name).label} (level number, 1 to ${count(ka)})` : axisTitle(across.name);
  const x: Json = positional
    ? { field: 'position', type: 'quantitative', title: acrossTitle, scale: { zero: false } }
    : { field: 'across', type: 'nominal', sort: Array.from(shownAcross, (j) => across.levels[j]!), title: acrossTitle, axis: { labelAngle: shownAcross.length > 8 ? -45 : 0 } };
  const oneEach = maxN === 1;
  const yTitle = oneEach ? axisTitle(input.response) : `mean ${axisTitle(input.response)}`;
  const y = { field: 'mean', type: 'quantitative', title: yTitle, scale: { zero: false } };
  const lineDomain = [...lines.levels];
  const legend = fullLegend(kl);
  const color = { field: 'line', type: 'nominal', sort: lineDomain, title: axisTitle(lines.name), scale: { domain: lineDomain, range: [...OKABE_ITO] }, legend };
  const shape = { field: 'line', type: 'nominal', sort: lineDomain, title: axisTitle(lines.name), scale: { domain: lineDomain, range: [...SHAPES] }, legend };
  const tooltip = [tip('line', axisTitle(lines.name), false), tip('across', axisTitle(across.name), false), oneEach ? measuredTip('mean', 'value') : tip('mean', 'mean'), tip('n', 'observations')];
  const layers: Json[] = [
    { mark: { type: 'line', strokeWidth: 1.5, opacity: 0.9 }, encoding: { x, y, color, detail: { field: 'line', type: 'nominal' } } },
    { mark: { type: 'point', size: 44, opacity: 1 }, encoding: { x, y, color, shape, tooltip } },
  ];

  const acrossLabel = readName(across.name).label;
  const linesLabel = readName(lines.name).label;
  const response = readName(input.response).label;
  const title = oneEach ? `${capital(response)} of each ${linesLabel} across the ${acrossLabel} levels` : `Mean ${response} of each ${linesLabel} across the ${acrossLabel} levels`;
  const testWords = input.test === null ? null : `${input.test.label}: F = ${fig(input.test.f, 'statistic')} on ${fmtDf(input.test.df1)} and ${fmtDf(input.test.df2)} df, ${pText(input.test.p)}`;
  const parts = [`${counted(kl, linesLabel + ' level')} across ${counted(ka, acrossLabel + ' level')}`];
  if (oneEach) parts.push('one observation per cell');
  else if (Number.isFinite(minN)) parts.push(minN === maxN ? `${count(minN)} observations per cell` : `${count(minN)} to ${count(maxN)} observations per cell`);
  if (empty > 0) parts.push(`${counted(empty, 'empty cell')} (lines broken there)`);
  if (input.averagedOver.length > 0) parts.push(`averaged over ${input.averagedOver.join(', ')}`);
  if (testWords !== null) parts.push(testWords);
  parts.push('parallel lines mean the effects add');
  if (sampleWords !== '') parts.push(sampleWords);
  return {
    spec: assemble(title, testWords, { data: { values }, layer: layers }),
    caption: `${parts.join('; ')}.`,
    warnings,
  };
}

function fmtDf(df: number): string {
  return Number.isInteger(df) ? count(df) : fig(df, 'df');
}
