/**
 * Planning built-ins (docs/language.md section 7): seeded layouts and their map, the comparison
 * of data with their layout, power and size. The numbers come from src/stats/planning; this
 * file turns them into tables, records and charts.
 *
 * A layout is a table with the contract's JSON shape (an object of column name to array);
 * how it was drawn (design, seed, generator, algorithm) rides along in the table's `drawn`
 * record, read with layout_details and stated under the map.
 */
import { UsageError } from '../lang/errors.ts';
import {
  MISSING,
  isMissing,
  isMissingAt,
  numberColumn,
  record,
  table,
  tableColumn,
  textColumn,
  type Chart,
  type Column,
  type RecordValue,
  type Table,
  type Value,
} from '../lang/values.ts';
import { MAX_POINTS, layoutMap, powerCurve, type ChartResult } from '../charts/index.ts';
import {
  ALGORITHM,
  GENERATOR,
  blockedCurve,
  blockedPower,
  blocksForPower,
  checkSeed,
  compareWithLayout,
  drawBlocks,
  drawCompletelyRandom,
  drawLatin,
  drawSplitPlot,
  replicatesForPower,
  twoGroupCurve,
  twoGroupPower,
  type BlockedPower,
  type KeyedPlots,
  type TwoGroupPower,
} from '../stats/planning/index.ts';
import { planningMsg as m } from '../messages/planning.ts';
import { guarded } from './records.ts';
import type { Builtin, CallContext, Param } from '../lang/builtins.ts';

// ---- layouts ---------------------------------------------------------------------------

const TREATMENTS: Param = { name: 'treatments', type: 'levels', doc: 'The treatment names, such as ["early", "late", "none"]; at least two, each once.' };
const SEED: Param = {
  name: 'seed',
  type: 'number',
  doc: 'A whole number from 0 to 4294967295 that fixes the draw: the same seed gives the same layout on every machine and in every later version. Write it in the document.',
};

/** Treatment names as texts, and the column type they came in. */
function treatmentNames(c: Column): { names: string[]; numeric: boolean } {
  const names: string[] = [];
  for (let i = 0; i < c.values.length; i++) {
    if (isMissingAt(c, i)) throw new UsageError(`${m.emptyTreatment(i)}.`);
    names.push(String(c.values[i]));
  }
  return { names, numeric: c.type === 'number' };
}

/** The treatment column of a layout, in the type the names came in. */
function treatmentColumn(names: readonly string[], numeric: boolean, codes: Int32Array, name = 'treatment'): Column {
  if (numeric) return numberColumn(Float64Array.from(codes, (t) => Number(names[t])), null, name);
  return textColumn(Array.from(codes, (t) => names[t]!), null, name);
}

const whole = (name: string, a: Int32Array): Column => numberColumn(Float64Array.from(a), null, name);

/** How a layout was drawn, as its `drawn` record. */
function drawnRecord(fn: string, design: string, seed: number, names: readonly string[], size: readonly [string, Value][], plots: number): RecordValue {
  return record(
    [
      ['design', design],
      ['drawn_by', fn],
      ['seed', seed],
      ['treatments', textColumn([...names])],
      ...size,
      ['plots', plots],
      ['generator', GENERATOR],
      ['algorithm', ALGORITHM],
    ],
    'layout',
  );
}

function withDrawn(t: Table, drawn: RecordValue): Table {
  return { ...t, drawn };
}

/** The number given for an optional count, or null when it was left out. */
function optionalNumber(v: Value | undefined): number | null {
  return v === undefined || isMissing(v) ? null : (v as number);
}

/** The key columns and map axes of a layout table. */
interface LayoutShape {
  readonly keys: readonly string[];
  readonly rowName: string;
  readonly positionName: string;
  /** Map row and position of plot i (1-based). */
  readonly row: (i: number) => number;
  readonly position: (i: number) => number;
}

const PLOTS_PER_MAP_ROW = 10;

function numbersOf(c: Column | undefined): Float64Array | null {
  return c !== undefined && c.type === 'number' && c.missing === null ? c.values : null;
}

/** Which kind of layout a table is, from its columns. */
function layoutShape(t: Table): LayoutShape {
  const block = numbersOf(tableColumn(t, 'block'));
  const plot = numbersOf(tableColumn(t, 'plot'));
  const row = numbersOf(tableColumn(t, 'row'));
  const column = numbersOf(tableColumn(t, 'column'));
  if (tableColumn(t, 'treatment') === undefined) throw new UsageError(`${m.layoutNoKeys()}.`);
  if (block !== null && plot !== null) return { keys: ['block', 'plot'], rowName: 'block', positionName: 'plot', row: (i) => block[i]!, position: (i) => plot[i]! };
  if (row !== null && column !== null) return { keys: ['row', 'column'], rowName: 'row', positionName: 'column', row: (i) => row[i]!, position: (i) => column[i]! };
  if (plot !== null) {
    return {
      keys: ['plot'],
      rowName: 'row',
      positionName: 'plot',
      row: (i) => Math.floor((plot[i]! - 1) / PLOTS_PER_MAP_ROW) + 1,
      position: (i) => ((plot[i]! - 1) % PLOTS_PER_MAP_ROW) + 1,
    };
  }
  throw new UsageError(`${m.layoutNoKeys()}.`);
}

/**
 * The colours of a split-plot layout's map (columns whole_plot, whole and sub): each plot by
 * its whole-plot treatment. Undefined for other layouts, coloured by their treatment.
 */
function wholePlotColour(t: Table): { title: string; of: string[]; domain: string[] } | undefined {
  const wc = tableColumn(t, 'whole');
  if (wc === undefined || tableColumn(t, 'whole_plot') === undefined || tableColumn(t, 'sub') === undefined) return undefined;
  const of = Array.from({ length: t.rows }, (_, i) => fieldText(wc, i) ?? '');
  const listed = t.drawn?.fields.get('whole_treatments');
  const domain = listed !== undefined && typeof listed === 'object' && listed.kind === 'column' ? (listed.values as readonly unknown[]).map(String) : [...new Set(of)];
  return { title: 'whole-plot treatment', of, domain };
}

/** A field of a column as the text a plot is matched on (null when empty). */
function fieldText(c: Column, i: number): string | null {
  return isMissingAt(c, i) ? null : String(c.values[i]);
}

function keyedPlots(t: Table, keys: readonly string[], treatment: string, side: 'data' | 'layout'): KeyedPlots {
  const cols = keys.map((k) => {
    const c = tableColumn(t, k);
    if (c === undefined) throw new UsageError(side === 'data' ? `${m.dataLacks(k)}.` : `${m.layoutNoKeys()}.`);
    return c;
  });
  const tc = tableColumn(t, treatment);
  if (tc === undefined) throw new UsageError(side === 'data' ? `${m.dataLacks(treatment)}.` : `${m.layoutNoKeys()}.`);
  const out: string[][] = [];
  const tr: (string | null)[] = [];
  for (let i = 0; i < t.rows; i++) {
    out.push(cols.map((c) => fieldText(c, i) ?? ''));
    tr.push(fieldText(tc, i));
  }
  return { keys: out, treatment: tr };
}

function chartValue(r: ChartResult, ctx: CallContext): Chart {
  for (const w of r.warnings) ctx.warn(w);
  return { kind: 'chart', spec: r.spec, caption: r.caption };
}

// ---- power -----------------------------------------------------------------------------

const DELTA: Param = { name: 'delta', type: 'number', doc: 'The smallest difference between two treatment means worth detecting, in the units of the measurements.' };
const SD: Param = { name: 'sd', type: 'number', doc: 'The standard deviation of a plot about its treatment mean (for blocks: within blocks), for example an earlier trial’s `fit.sd`.' };
const LEVEL: Param = { name: 'level', type: 'number', default: 0.95, doc: 'Confidence level of the test (0.95: a 5% false-alarm rate).' };
const POWER: Param = { name: 'power', type: 'number', default: 0.8, doc: 'The chance of detecting a difference of delta that the plan must reach.' };
const K: Param = { name: 'treatments', type: 'number', doc: 'How many treatments the trial compares (at least 2).' };

/** What a power record keeps for power_chart. */
interface PowerInternal {
  readonly kind: 'two groups' | 'blocked';
  readonly delta: number;
  readonly sd: number;
  readonly level: number;
  readonly treatments: number;
  readonly chosen: number;
  readonly power: number;
  readonly target: number | null;
}

function twoGroupRecord(r: TwoGroupPower, delta: number, sd: number, level: number, target: number | null): RecordValue {
  const fields: [string, Value][] = [
    ['power', r.power],
    ['n', r.n],
    ['plots', 2 * r.n],
    ['delta', delta],
    ['sd', sd],
    ['level', level],
  ];
  if (target !== null) fields.push(['target', target]);
  fields.push(['df', r.df], ['noncentrality', r.noncentrality], ['critical_t', r.critical], ['assumes', m.assumesTwoGroups(level)]);
  const internal: PowerInternal = { kind: 'two groups', delta, sd, level, treatments: 2, chosen: r.n, power: r.power, target };
  return record(fields, 'power', internal);
}

function blockedRecord(r: BlockedPower, delta: number, sd: number, level: number, target: number | null): RecordValue {
  const fields: [string, Value][] = [
    ['power', r.power],
    ['blocks', r.blocks],
    ['treatments', r.treatments],
    ['plots', r.blocks * r.treatments],
    ['delta', delta],
    ['sd', sd],
    ['level', level],
  ];
  if (target !== null) fields.push(['target', target]);
  fields.push(
    ['df_treatment', r.df_treatment],
    ['df_error', r.df_error],
    ['noncentrality', r.noncentrality],
    ['critical_f', r.critical],
    ['assumes', m.assumesBlocked(r.treatments, level)],
  );
  const internal: PowerInternal = { kind: 'blocked', delta, sd, level, treatments: r.treatments, chosen: r.blocks, power: r.power, target };
  return record(fields, 'power', internal);
}

const num = (a: ReadonlyMap<string, Value>, k: string): number => a.get(k) as number;

export const PLANNING: readonly Builtin[] = [
  {
    name: 'random_layout',
    category: 'planning',
    params: [
      TREATMENTS,
      SEED,
      { name: 'blocks', type: 'number', default: MISSING, doc: 'How many complete blocks: every treatment once in each, in a random order within each block.' },
      { name: 'replicates', type: 'number', default: MISSING, doc: 'Without blocks: how many plots of each treatment, all plots in one random order (a completely randomized plan).' },
    ],
    returns: 'a table: block, plot, treatment (or plot, treatment without blocks)',
    doc: 'Draws a randomized layout from a seed. With `blocks`, a randomized complete block plan: in each block the treatments are shuffled anew (plots numbered 1, 2, … within each block). With `replicates` instead, a completely randomized plan: all plots shuffled together. The shuffle is Fisher and Yates’s, with every position drawn without modulo bias from the xoroshiro128+ generator, its state filled from the seed by SplitMix64; the generator, the algorithm and the seed are kept with the layout (see layout_details), and the same seed gives the same layout on every machine and in every later version. At most 1,000,000 plots.',
    example: 'random_layout(["early", "mid", "late"], seed: 2026, blocks: 6)',
    run: (a) => {
      const { names, numeric } = treatmentNames(a.get('treatments') as Column);
      const seed = guarded(() => checkSeed(num(a, 'seed')));
      const blocks = optionalNumber(a.get('blocks'));
      const replicates = optionalNumber(a.get('replicates'));
      if (blocks !== null && replicates !== null) throw new UsageError(`${m.bothCounts()}.`);
      if (blocks === null && replicates === null) throw new UsageError(`${m.noCount()}.`);
      if (blocks !== null) {
        const l = guarded(() => drawBlocks(names, blocks, seed));
        const t = table(['block', 'plot', 'treatment'], [whole('block', l.block), whole('plot', l.plot), treatmentColumn(names, numeric, l.treatment)]);
        return withDrawn(t, drawnRecord('random_layout', 'randomized complete blocks', seed, names, [['blocks', blocks]], t.rows));
      }
      const l = guarded(() => drawCompletelyRandom(names, replicates!, seed));
      const t = table(['plot', 'treatment'], [whole('plot', l.plot), treatmentColumn(names, numeric, l.treatment)]);
      return withDrawn(t, drawnRecord('random_layout', 'completely randomized', seed, names, [['replicates', replicates!]], t.rows));
    },
  },
  {
    name: 'latin_layout',
    category: 'planning',
    params: [TREATMENTS, SEED],
    returns: 'a table: row, column, treatment',
    doc: 'Draws a randomized Latin square from a seed: the cyclic square of the treatments with its rows, its columns and its treatment symbols each shuffled (Fisher and Yates’s randomization of a standard square), so every treatment appears once in every row and once in every column. Same generator, algorithm and guarantee as random_layout. At most 1,000 treatments.',
    example: 'latin_layout(["A", "B", "C", "D"], seed: 11)',
    run: (a) => {
      const { names, numeric } = treatmentNames(a.get('treatments') as Column);
      const seed = guarded(() => checkSeed(num(a, 'seed')));
      const l = guarded(() => drawLatin(names, seed));
      const t = table(['row', 'column', 'treatment'], [whole('row', l.row), whole('column', l.column), treatmentColumn(names, numeric, l.treatment)]);
      return withDrawn(t, drawnRecord('latin_layout', 'Latin square', seed, names, [['size', names.length]], t.rows));
    },
  },
  {
    name: 'split_plot_layout',
    category: 'planning',
    params: [
      { name: 'whole', type: 'levels', doc: 'The whole-plot treatments (the factor that is hard to change, applied to whole plots), such as ["dry", "irrigated"]; at least two, each once.' },
      { name: 'sub', type: 'levels', doc: 'The subplot treatments, randomized anew inside every whole plot; at least two, each once.' },
      SEED,
      { name: 'blocks', type: 'number', doc: 'How many complete blocks: each holds one whole plot of every whole-plot treatment.' },
    ],
    returns: 'a table: block, whole_plot, plot, whole, sub, treatment',
    doc: 'Draws a split plot in randomized complete blocks from a seed: in each block the whole-plot treatments are shuffled over the whole plots, and in each whole plot the subplot treatments are shuffled over its subplots, each whole plot with an order of its own. `plot` numbers the subplots along the block (whole plot 1 first), `whole_plot` the whole plots within the block, and `treatment` names each plot’s pair as whole / sub for the map, the run sheet and layout_check. Analyse the measurements with split_plot(y, data.whole, data.sub, data.block). Same generator, algorithm and guarantee as random_layout; at most 1,000,000 plots.',
    example: 'split_plot_layout(["dry", "irrigated"], ["A", "B", "C"], seed: 7, blocks: 4)',
    run: (a, ctx) => {
      const wholes = treatmentNames(a.get('whole') as Column);
      const subs = treatmentNames(a.get('sub') as Column);
      const seed = guarded(() => checkSeed(num(a, 'seed')));
      const blocks = num(a, 'blocks');
      const pairs = wholes.names.flatMap((w) => subs.names.map((s) => m.splitPlotLabel(w, s)));
      // before drawing; a name given twice is said as such by the draw's own checks
      const distinct = (xs: readonly string[]): boolean => new Set(xs).size === xs.length;
      if (distinct(wholes.names) && distinct(subs.names)) {
        const seen = new Set<string>();
        for (const p of pairs) {
          if (seen.has(p)) throw new UsageError(`${m.splitLabelsClash(p)}.`);
          seen.add(p);
        }
      }
      const l = guarded(() => drawSplitPlot(wholes.names, subs.names, blocks, seed));
      if (blocks === 1) ctx.warn(`${m.splitOneBlock()}.`);
      const label = Array.from(l.whole, (w, i) => m.splitPlotLabel(wholes.names[w]!, subs.names[l.sub[i]!]!));
      const t = table(
        ['block', 'whole_plot', 'plot', 'whole', 'sub', 'treatment'],
        [
          whole('block', l.block),
          whole('whole_plot', l.wholePlot),
          whole('plot', l.plot),
          treatmentColumn(wholes.names, wholes.numeric, l.whole, 'whole'),
          treatmentColumn(subs.names, subs.numeric, l.sub, 'sub'),
          textColumn(label, null, 'treatment'),
        ],
      );
      const sizes: [string, Value][] = [
        ['whole_treatments', textColumn([...wholes.names])],
        ['sub_treatments', textColumn([...subs.names])],
        ['blocks', blocks],
      ];
      return withDrawn(t, drawnRecord('split_plot_layout', 'split plot in randomized complete blocks', seed, pairs, sizes, t.rows));
    },
  },
  {
    name: 'layout_details',
    category: 'planning',
    params: [{ name: 'layout', type: 'table', doc: 'A layout made by random_layout, latin_layout or split_plot_layout.' }],
    returns: 'a record: design drawn_by seed treatments blocks (or replicates, size) plots generator algorithm; for a split plot also whole_treatments sub_treatments',
    doc: 'How a layout was drawn: its design, the function and seed that drew it, its treatments and size, and the generator and shuffle used, so a reviewer can draw it again. A table that was not drawn by a layout function (or was filtered since) has no such record.',
    example: 'layout_details(plan)',
    run: (a) => {
      const t = a.get('layout') as Table;
      if (t.drawn === undefined) throw new UsageError(`${m.notALayout()}.`);
      return t.drawn;
    },
  },
  {
    name: 'layout_chart',
    category: 'planning',
    params: [{ name: 'layout', type: 'table', doc: 'A layout: columns block, plot, treatment; row, column, treatment; or plot, treatment.' }],
    returns: 'a chart',
    doc: 'The field or bench map of a layout: blocks (or the rows of a Latin square) as rows, plots in their order along each row, each plot coloured and labelled with its treatment, so the map reads in black and white too. Colours are Okabe and Ito’s palette for colour-blind readers; past seven treatments they repeat and the labels tell plots apart. A completely randomized plan is drawn ten plots to a row.',
    example: 'layout_chart(plan)',
    run: (a, ctx) => {
      const t = a.get('layout') as Table;
      const shape = layoutShape(t);
      if (t.rows > MAX_POINTS) {
        const part = shape.keys[0] === 'plot' ? 'plan[plan.plot <= 500]' : `plan[plan.${shape.keys[0]} <= 20]`;
        throw new UsageError(`${m.mapTooLarge(t.rows, MAX_POINTS, part)}.`);
      }
      const tc = tableColumn(t, 'treatment')!;
      const treatment: string[] = [];
      const seen = new Set<string>();
      for (let i = 0; i < t.rows; i++) {
        const s = fieldText(tc, i) ?? '';
        treatment.push(s);
        seen.add(s);
      }
      const drawn = t.drawn;
      const listed = drawn?.fields.get('treatments');
      const treatments = listed !== undefined && typeof listed === 'object' && listed.kind === 'column' ? (listed.values as readonly unknown[]).map(String) : [...seen];
      const design = drawn === undefined ? (shape.keys[0] === 'block' ? 'blocks' : shape.keys[0] === 'row' ? 'rows and columns' : 'plots') : String(drawn.fields.get('design'));
      const seed = drawn === undefined ? null : (drawn.fields.get('seed') as number);
      const row = Array.from({ length: t.rows }, (_, i) => shape.row(i));
      const position = Array.from({ length: t.rows }, (_, i) => shape.position(i));
      return chartValue(layoutMap({ rowName: shape.rowName, positionName: shape.positionName, row, position, treatment, treatments, design, seed, colour: wholePlotColour(t) }), ctx);
    },
  },
  {
    name: 'layout_check',
    category: 'planning',
    params: [
      { name: 'data', type: 'table', doc: 'The measured data, with the layout’s key columns (block and plot, row and column, or plot) and a treatment column.' },
      { name: 'layout', type: 'table', doc: 'The layout the data came from.' },
      { name: 'treatment', type: 'text', default: 'treatment', doc: 'The name of the data’s treatment column.' },
    ],
    returns: 'a record: holds plots matched differ missing extra summary',
    doc: 'Compares measured data with the layout they came from, plot by plot, matched on block and plot (or row and column, or plot): `differ` lists every plot whose treatment in the data is not the one drawn, `missing` every plot of the layout absent from the data, `extra` every plot of the data not in the layout. `holds` is true when all three are empty, so `claim(check.holds, "…")` states that the data follow their plan. A plot whose measurement is empty still counts as present: it stands in the field.',
    example: 'layout_check(harvest, plan, treatment: "variety")',
    run: (a) => {
      const data = a.get('data') as Table;
      const layout = a.get('layout') as Table;
      const shape = layoutShape(layout);
      const tName = a.get('treatment') as string;
      const lp = keyedPlots(layout, shape.keys, 'treatment', 'layout');
      const dp = keyedPlots(data, shape.keys, tName, 'data');
      const d = guarded(() => compareWithLayout(lp, dp, shape.keys));
      const keyCols = (rows: readonly number[], side: KeyedPlots): [string, Column][] =>
        shape.keys.map((k, j) => [k, textColumn(rows.map((r) => side.keys[r]![j]!), null, k)]);
      const text = (xs: readonly (string | null)[]): Column => {
        const miss = Uint8Array.from(xs, (x) => (x === null ? 1 : 0));
        return textColumn(xs.map((x) => x ?? ''), miss);
      };
      const differ = table(
        [...shape.keys, 'in_layout', 'in_data'],
        [...keyCols(d.differ.map((x) => x.layoutRow), lp).map((e) => e[1]), text(d.differ.map((x) => lp.treatment[x.layoutRow]!)), text(d.differ.map((x) => dp.treatment[x.dataRow]!))],
      );
      const missing = table([...shape.keys, 'treatment'], [...keyCols(d.missing, lp).map((e) => e[1]), text(d.missing.map((r) => lp.treatment[r]!))]);
      const extra = table([...shape.keys, 'treatment'], [...keyCols(d.extra, dp).map((e) => e[1]), text(d.extra.map((r) => dp.treatment[r]!))]);
      const holds = d.differ.length === 0 && d.missing.length === 0 && d.extra.length === 0;
      const plot = (side: KeyedPlots, r: number) => shape.keys.map((k, j) => `${k} ${side.keys[r]![j]}`).join(', ');
      const parts: string[] = [];
      for (const x of d.differ) parts.push(m.plotDiffers(plot(lp, x.layoutRow), dp.treatment[x.dataRow] ?? null, lp.treatment[x.layoutRow]!));
      if (d.missing.length > 0) parts.push(m.plotsMissingFromData(d.missing.length, d.missing.slice(0, 5).map((r) => plot(lp, r))));
      if (d.extra.length > 0) parts.push(m.plotsNotInLayout(d.extra.length, d.extra.slice(0, 5).map((r) => plot(dp, r))));
      const summary = holds ? m.layoutHolds(lp.keys.length) : m.differences(parts);
      return record(
        [
          ['holds', holds],
          ['plots', lp.keys.length],
          ['matched', d.matched],
          ['differ', differ],
          ['missing', missing],
          ['extra', extra],
          ['summary', summary],
        ],
        'layout_check',
      );
    },
  },
  {
    name: 'power_two_sample',
    category: 'planning',
    params: [DELTA, SD, { name: 'n', type: 'number', doc: 'Plots per group (at least 2).' }, LEVEL],
    returns: 'a power record: power n plots delta sd level df noncentrality critical_t assumes',
    doc: 'The power of the two-sided two-sample t test (pooled variance) to detect a difference of delta between two groups of n plots each, when the plots scatter with standard deviation sd: the chance that the test at `level` rejects, from the noncentral t distribution on 2n - 2 df with noncentrality delta / (sd √(2/n)). The record says what it assumed.',
    example: 'power_two_sample(1.5, 2.0, 12)',
    run: (a) => {
      const [delta, sd, n, level] = [num(a, 'delta'), num(a, 'sd'), num(a, 'n'), num(a, 'level')];
      return twoGroupRecord(guarded(() => twoGroupPower(delta, sd, n, level)), delta, sd, level, null);
    },
  },
  {
    name: 'replicates_for_power',
    category: 'planning',
    params: [DELTA, SD, POWER, LEVEL],
    returns: 'a power record: power n plots delta sd level target df noncentrality critical_t assumes',
    doc: 'The smallest number of plots per group for which the two-sided two-sample t test at `level` detects a difference of delta with at least the power asked for (plots scattering with standard deviation sd). `power` in the record is the power that number reaches.',
    example: 'replicates_for_power(1.5, 2.0, power: 0.9)',
    run: (a) => {
      const [delta, sd, power, level] = [num(a, 'delta'), num(a, 'sd'), num(a, 'power'), num(a, 'level')];
      return twoGroupRecord(guarded(() => replicatesForPower(delta, sd, power, level)), delta, sd, level, power);
    },
  },
  {
    name: 'power_blocked',
    category: 'planning',
    params: [DELTA, SD, K, { name: 'blocks', type: 'number', doc: 'How many complete blocks (at least 2).' }, LEVEL],
    returns: 'a power record: power blocks treatments plots delta sd level df_treatment df_error noncentrality critical_f assumes',
    doc: 'The power of the analysis-of-variance F test for treatments in a randomized complete block design when two treatments differ by delta and the others sit midway between them: the least favourable arrangement for a given largest difference, so the power is the least one can count on. From the noncentral F distribution on k - 1 and (k - 1)(b - 1) df with noncentrality b delta² / (2 sd²), where sd is the within-block standard deviation. The record says what it assumed.',
    example: 'power_blocked(1.5, 2.0, 4, 8)',
    run: (a) => {
      const [delta, sd, k, b, level] = [num(a, 'delta'), num(a, 'sd'), num(a, 'treatments'), num(a, 'blocks'), num(a, 'level')];
      return blockedRecord(guarded(() => blockedPower(delta, sd, k, b, level)), delta, sd, level, null);
    },
  },
  {
    name: 'blocks_for_power',
    category: 'planning',
    params: [DELTA, SD, K, POWER, LEVEL],
    returns: 'a power record: power blocks treatments plots delta sd level target df_treatment df_error noncentrality critical_f assumes',
    doc: 'The smallest number of complete blocks for which the blocked analysis-of-variance F test at `level` reaches the power asked for, in the least favourable case of power_blocked (two treatments delta apart, the rest midway). `power` in the record is the power that number reaches.',
    example: 'blocks_for_power(1.5, 2.0, 4, power: 0.8)',
    run: (a) => {
      const [delta, sd, k, power, level] = [num(a, 'delta'), num(a, 'sd'), num(a, 'treatments'), num(a, 'power'), num(a, 'level')];
      return blockedRecord(guarded(() => blocksForPower(delta, sd, k, power, level)), delta, sd, level, power);
    },
  },
  {
    name: 'power_chart',
    category: 'planning',
    params: [{ name: 'plan', type: 'record', doc: 'A power record: the result of power_two_sample, replicates_for_power, power_blocked or blocks_for_power.' }],
    returns: 'a chart',
    doc: 'Power against the size of the trial (plots per group, or blocks), from 2 to about twice the plan’s size, with the plan marked and the power asked for drawn as a dashed line; the subtitle says what the curve assumes (delta, sd, level, treatments).',
    example: 'power_chart(blocks_for_power(1.5, 2.0, 4))',
    run: (a, ctx) => {
      const plan = a.get('plan') as RecordValue;
      if (plan.tag !== 'power' || plan.internal === undefined) {
        throw new UsageError(`${m.notAPowerRecord()}.`);
      }
      const p = plan.internal as PowerInternal;
      const last = Math.min(Math.max(2 * p.chosen, p.chosen + 6, 10), p.chosen + 200);
      const sizes = Array.from({ length: last - 1 }, (_, i) => i + 2);
      const power = p.kind === 'two groups' ? twoGroupCurve(p.delta, p.sd, p.level, sizes) : blockedCurve(p.delta, p.sd, p.treatments, p.level, sizes);
      const sizeName = p.kind === 'two groups' ? m.perGroup() : m.blocks();
      const assumes =
        p.kind === 'two groups'
          ? m.curveTwoGroups(p.delta, p.sd, p.level)
          : m.curveBlocked(p.treatments, p.delta, p.sd, p.level);
      return chartValue(powerCurve({ sizeName, sizes, power, chosen: p.chosen, chosenPower: p.power, target: p.target, assumes }), ctx);
    },
  },
];
