/**
 * The field or bench map of a layout: one rectangle per plot, blocks (or rows of a Latin
 * square) as rows of the map, plots in their order along each row, every plot labelled with
 * its treatment so the map can be taken to the field and read without the colours. Colours
 * are the Okabe-Ito palette (look.ts); past its seven colours they repeat, and the labels
 * carry the distinction (the caption says so).
 */
import { assemble, fullLegend, tip, type Json } from './layers.ts';
import { INK, OKABE_ITO } from './look.ts';
import type { ChartResult } from './types.ts';
import { count, counted } from '../messages/charts.ts';

/** A layout as the map draws it: for each plot, its row and position on the map (1-based) and its treatment. */
export interface LayoutMapInput {
  /** What the rows of the map are ("block", "row") and what the positions are ("plot", "column"). */
  readonly rowName: string;
  readonly positionName: string;
  readonly row: ArrayLike<number>;
  readonly position: ArrayLike<number>;
  /** The treatment of each plot, as text. */
  readonly treatment: readonly string[];
  /** Treatment names in the order of the legend. */
  readonly treatments: readonly string[];
  /** What the layout is ("randomized complete blocks"), and its seed, for the subtitle. */
  readonly design: string;
  readonly seed: number | null;
  /**
   * Colours from another key than the label (a split plot: each plot labelled with its
   * whole-plot and subplot treatments, coloured by the whole-plot one, so that the whole
   * plots stand out as bands): its title, each plot's key, and the keys in legend order.
   */
  readonly colour?: { readonly title: string; readonly of: readonly string[]; readonly domain: readonly string[] };
}

/** Narrowest plot and height of a plot on the map, in pixels. */
const PLOT_WIDTH = 56;
const PLOT_HEIGHT = 34;
/** Room per character of a label at the map's 11 px type (a generous average, so a label is never cut). */
const CHAR_WIDTH = 7;

/** A plot wide enough for its longest label: a technician must read every plot in full. */
function plotWidth(labels: readonly string[]): number {
  let longest = 0;
  for (const l of labels) longest = Math.max(longest, [...l].length);
  return Math.max(PLOT_WIDTH, longest * CHAR_WIDTH + 14);
}

/** The field map; see the module note. */
export function layoutMap(l: LayoutMapInput): ChartResult {
  const n = l.treatment.length;
  const warnings: string[] = [];
  const values: Json[] = [];
  let rows = 0;
  let positions = 0;
  for (let i = 0; i < n; i++) {
    const r = l.row[i]!;
    const p = l.position[i]!;
    rows = Math.max(rows, r);
    positions = Math.max(positions, p);
    values.push(l.colour === undefined ? { r: String(r), p: String(p), t: l.treatment[i]! } : { r: String(r), p: String(p), t: l.treatment[i]!, c: l.colour.of[i]! });
  }
  const rowDomain = Array.from({ length: rows }, (_, i) => String(i + 1));
  const posDomain = Array.from({ length: positions }, (_, i) => String(i + 1));
  const domain = [...(l.colour?.domain ?? l.treatments)];
  const colourTitle = l.colour?.title ?? 'treatment';
  if (domain.length > OKABE_ITO.length) {
    warnings.push(`${count(domain.length)} ${colourTitle === 'treatment' ? 'treatments' : `kinds of ${colourTitle}`} but ${OKABE_ITO.length} colours that colour-blind readers can tell apart: colours repeat; read the labels on the plots.`);
  }
  const x = { field: 'p', type: 'ordinal', sort: posDomain, title: l.positionName, axis: { orient: 'top', labelAngle: 0 } };
  const y = { field: 'r', type: 'ordinal', sort: rowDomain, title: l.rowName, axis: { labelAngle: 0 } };
  const tooltip = [tip('r', l.rowName, false), tip('p', l.positionName, false), tip('t', 'treatment', false), ...(l.colour === undefined ? [] : [tip('c', l.colour.title, false)])];
  const layers: Json[] = [
    {
      mark: { type: 'rect', stroke: '#ffffff', strokeWidth: 2, opacity: 0.5 },
      encoding: {
        x,
        y,
        color: { field: l.colour === undefined ? 't' : 'c', type: 'nominal', title: colourTitle, scale: { domain, range: [...OKABE_ITO] }, legend: fullLegend(domain.length) },
        tooltip,
      },
    },
    {
      mark: { type: 'text', color: INK, fontSize: 11 },
      encoding: { x, y, text: { field: 't', type: 'nominal' }, tooltip },
    },
  ];
  const title = `Field map: ${l.design}`;
  const subtitle = l.seed === null ? null : `seed ${l.seed}; ${l.rowName}s top to bottom, ${l.positionName}s left to right`;
  const coloured = l.colour === undefined ? '' : `, coloured by its ${l.colour.title}`;
  const caption = `${counted(n, 'plot')} in ${counted(rows, l.rowName)} of ${count(positions)} ${l.positionName}s; ${counted(l.treatments.length, 'treatment')}, each plot labelled with its treatment${coloured}${l.seed === null ? '' : `; drawn with seed ${l.seed}`}.`;
  return {
    spec: assemble(title, subtitle, { data: { values }, layer: layers }, { width: { step: plotWidth(l.treatments) }, height: { step: PLOT_HEIGHT } }),
    caption,
    warnings,
  };
}
