/**
 * The look of every chart, in one place: the page's fonts, ink on white, light rules, no
 * frame around the plotting area, titles set left like a paragraph heading. Builders take
 * colours, shapes and sizes from here and never name a colour of their own.
 */
import type { Config } from 'vega-lite';

/**
 * The colour-blind-safe qualitative palette of Okabe and Ito, in the order we use it.
 * source: M. Okabe, K. Ito (2008), "Color Universal Design (CUD): how to make figures and
 * presentations that are friendly to colorblind people" (J*Fly), its eight colours (hex
 * values from memory). Yellow (#F0E442) comes last because it is faint on white, and
 * black is left out because it is the ink of text and rules.
 */
export const OKABE_ITO = ['#0072B2', '#E69F00', '#009E73', '#D55E00', '#CC79A7', '#56B4E9', '#F0E442'] as const;

/** The colour of ordinary points and lines (Okabe-Ito blue). */
export const POINT = OKABE_ITO[0];
/** The colour of points marked for a second look (Okabe-Ito vermillion). */
export const MARKED = OKABE_ITO[3];

/**
 * Shapes that go with the palette, so that no distinction rests on colour alone (vega's
 * symbol names).
 */
export const SHAPES = ['circle', 'square', 'triangle-up', 'diamond', 'cross', 'triangle-down', 'triangle-right'] as const;
/** The shape of an ordinary point and of a marked one. */
export const POINT_SHAPE = 'circle';
export const MARKED_SHAPE = 'triangle-up';

/** Ink and rule colours: the page's own (src/views/theme.ts; engine code cannot import it). */
export const INK = '#1d2125';
export const INK_SOFT = '#4a5058';
export const MUTED = '#7a7f87';
export const RULE = '#e4e1d8';
export const RULE_STRONG = '#c9c4b6';
const SHEET = '#ffffff';

/**
 * A light-to-dark blue ramp for counts in binned views: one hue, so that it reads by
 * lightness alone, with its light end dark enough to see a single point on white.
 */
export const COUNT_RANGE = ['#cfdeeb', '#00446b'] as const;

/** The page's font stacks (src/views/theme.ts: --font-ui and --font-text). */
export const FONT_UI = 'system-ui, -apple-system, "Segoe UI", Roboto, "Helvetica Neue", Arial, sans-serif';
export const FONT_TEXT = '"Iowan Old Style", "Palatino Linotype", Palatino, "Book Antiqua", Georgia, serif';

/** Plotting area of a chart with continuous axes, in pixels. */
export const WIDTH = 460;
export const HEIGHT = 280;
/** Height given to each row of a chart with one row per level or pair. */
export const ROW_STEP = 22;


/** The vega-lite config every chart carries. */
export const CONFIG: Config = {
  background: SHEET,
  padding: 8,
  font: FONT_UI,
  view: { stroke: null, continuousWidth: WIDTH, continuousHeight: HEIGHT },
  title: {
    font: FONT_TEXT,
    fontSize: 15,
    fontWeight: 'normal',
    color: INK,
    anchor: 'start',
    offset: 10,
    subtitleFont: FONT_UI,
    subtitleFontSize: 11,
    subtitleColor: INK_SOFT,
    subtitlePadding: 4,
  },
  axis: {
    labelFont: FONT_UI,
    titleFont: FONT_UI,
    labelFontSize: 11,
    titleFontSize: 11.5,
    titleFontWeight: 'normal',
    titleColor: INK_SOFT,
    labelColor: INK_SOFT,
    domainColor: RULE_STRONG,
    tickColor: RULE_STRONG,
    gridColor: RULE,
    gridOpacity: 0.7,
    tickSize: 4,
    labelPadding: 4,
    titlePadding: 8,
  },
  // a little room beyond the data, so that no point sits on an axis line
  scale: { continuousPadding: 10 },
  axisBand: { grid: false },
  axisPoint: { grid: false },
  legend: {
    labelFont: FONT_UI,
    titleFont: FONT_UI,
    labelFontSize: 11,
    titleFontSize: 11,
    titleFontWeight: 'normal',
    titleColor: INK_SOFT,
    labelColor: INK_SOFT,
    orient: 'bottom',
    direction: 'horizontal',
    symbolStrokeWidth: 1.5,
    symbolOpacity: 1,
    labelLimit: 320,
  },
  point: { filled: true, size: 38, opacity: 0.85 },
  line: { strokeWidth: 1.5 },
  rule: { color: MUTED, strokeWidth: 1 },
  text: { font: FONT_UI, fontSize: 10, color: INK_SOFT },
  range: { category: [...OKABE_ITO] },
};
