/**
 * Furrow's charts: vega-lite specifications built from plain numbers, with no DOM.
 *
 * ```
 * fit record --src/functions/charts.ts--> plain inputs (typed arrays, level codes, names)
 *   --builder (residuals, normal, means, pairwise, interaction, scatter)-->
 *   { spec: vega-lite with inline data and the look of look.ts, caption, warnings }
 *   --page: <furrow-chart> (vega-embed, locked)   --Node: render.ts (SVG, locked)
 * ```
 *
 * Every spec is built here and only here: data inline as `data.values`, field names of our
 * own, no `usermeta`, no URLs, no `href`. Past {@link MAX_POINTS} points a chart bins or
 * samples and says so in its caption (large.ts).
 *
 * This index loads no vega code, so the worker can build specs without it. Drawing lives in
 * render.ts (import it directly: it loads vega and vega-lite) and the locks in safety.ts.
 */
export type { ChartResult, ChartSpec, FactorInput, ResidualInput } from './types.ts';
export { residualsChart, type ErrorTerm, type ResidualAxis } from './residuals.ts';
export { blomPositions, normalChart, quartileLine, type QuartileLine } from './normal.ts';
export { MAX_MEANS_LEVELS, meansChart, type MeansInput } from './means.ts';
export { MAX_PAIRS, pairwiseChart, type PairsInput } from './pairwise.ts';
export { cellMeans, profileChart, type ProfileInput, type ProfileTest } from './interaction.ts';
export { scatterChart, type ScatterInput } from './scatter.ts';
export { MAX_POINTS, MAX_LABELS, MAX_MARKED, MANY_LEVELS } from './large.ts';
export { CUT } from './layers.ts';
export { axisTitle, readName, UNIT_SUFFIXES } from './titles.ts';
export { layoutMap, type LayoutMapInput } from './layout.ts';
export { powerCurve, type PowerCurveInput } from './power.ts';
