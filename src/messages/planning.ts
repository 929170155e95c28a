/**
 * Every message the planning code shows to a person, in one place (errors on a cell, the
 * words a power record uses to say what it assumed, the design warning on a fit).
 */

import { countText, numberText } from '../format/digits.ts';
const q = (s: string): string => `"${s}"`;

/** Plain-words messages of planning. */
export const planningMsg = {
  fewTreatments: (k: number) => `a plan needs at least 2 treatments; ${k === 0 ? 'none was' : 'only 1 was'} given`,
  duplicateTreatment: (name: string) => `treatment ${q(name)} is named twice; give every treatment its own name`,
  emptyTreatment: (at: number) => `treatment ${at + 1} is empty; give every treatment a name`,
  seedNotWhole: (seed: number) =>
    `the seed must be a whole number from 0 to 4294967295 (got ${seed}); write the seed down in the document so the layout can be drawn again`,
  countNotWhole: (what: string, v: number, least: number) => `${what} must be a whole number of at least ${least} (got ${v})`,
  tooManyPlots: (plots: number) =>
    `this plan would need ${plots > 1e15 ? 'more than 10^15' : countText(plots)} plots, more than the limit of 1,000,000`,
  sdNotPositive: (sd: number) => `the standard deviation must be greater than zero (got ${sd})`,
  deltaZero: () => `the difference to detect (delta) must not be zero: there is no plan that detects a difference of zero`,
  deltaNotFinite: (d: number) => `the difference to detect (delta) must be a finite number (got ${d})`,
  outsideUnit: (what: string, v: number) => `${what} must lie strictly between 0 and 1 (got ${v})`,
  powerBelowLevel: (power: number, level: number) =>
    `a power of ${power} is no more than the false-alarm rate ${numberText(1 - level, 'plain')} of a test at level ${level}: any plan has at least that power; ask for more`,
  /** What a two-group power assumes, in words. */
  assumesTwoGroups: (level: number) =>
    `two independent groups of equal size, normal errors with a common standard deviation, and a two-sided t test at level ${level} (pooled variance, 2n - 2 df); power from the noncentral t distribution`,
  /** What a blocked power assumes, in words. */
  assumesBlocked: (k: number, level: number) =>
    `a randomized complete block design, ${k} treatments each once in every block, normal errors with a common standard deviation and no block-by-treatment interaction; the analysis-of-variance F test at level ${level}; two treatments differ by delta and the other ${k - 2} sit midway between them (the least favourable case for a given largest difference), so the noncentrality is blocks x delta^2 / (2 sd^2)`,
  /** The design warning on a fit that ignores a complete-block or pairing column. */
  ignoredBlocks: (table: string, column: string, treatment: string, fn: string, better: string) =>
    `${table === '' ? 'The data have' : `Table ${q(table)} has`} a column ${q(column)} in which every ${treatment} appears exactly once per level (complete blocks, or pairs). ${fn} ignores it and treats the plots as independent; ${better} would use it.`,
  /**
   * The design warning on a factorial whose data name whole plots (`unit`, the column or the
   * two columns together that name them) on which `whole` is constant while `sub` varies.
   */
  splitPlotSuspected: (whole: string, sub: string, unit: readonly string[]) =>
    `${q(whole)} is the same on every plot of each ${unit.map(q).join(' and ')} while ${q(sub)} changes within it: this looks like a split plot, with ${whole} on whole plots. factorial tests ${whole} against the error between subplots, which is the wrong error for a factor applied to whole plots, so its F and p overstate the evidence. Use split_plot(y, ${whole}, ${sub}, block).`,
  /**
   * The design warning on a split_plot whose data name groups of plots shaped like whole
   * plots (`unit`) inside which the whole-plot factor changes.
   */
  notSplitPlot: (whole: string, sub: string, unit: readonly string[]) =>
    `Each ${unit.map(q).join(' and ')} holds one plot of every ${sub}, as a whole plot would, but ${q(whole)} changes inside it: if ${whole} was drawn plot by plot rather than for whole plots, these data are not a split plot, whole_error is not the error of anything that was randomized, and split_plot understates the evidence for ${whole}. Check the field plan; for a trial randomized plot by plot, use an analysis of the factorial instead.`,
  layoutNoKeys: () =>
    `the layout must have columns block and plot, row and column, or plot, with a treatment column (as random_layout, latin_layout and split_plot_layout make)`,
  dataLacks: (column: string) => `the data have no column ${q(column)} to match the layout on`,
  repeatedKey: (inData: boolean, plot: string, firstRow: number, row: number) =>
    `${inData ? 'the data hold' : 'the layout holds'} ${plot} more than once (rows ${firstRow} and ${row}), so it cannot be matched plot for plot; ${inData ? 'a plot is measured once: correct or remove the repeated row' : 'a layout has each plot once'}`,
  /** A problem with one factor's treatments of a split plot (`which`: "whole-plot", "subplot"). */
  ofFactor: (which: string, problem: string) => `the ${which} treatments: ${problem}`,
  /** A split plot drawn in one block: nothing to test the whole-plot treatments against. */
  splitOneBlock: () =>
    'with one block the whole-plot treatments have no replicate: split_plot will have no whole_error to test them against (no F, no p). Draw at least two blocks',
  /** Two pairs of a split plot would share a label (a name holds the separator). */
  splitLabelsClash: (label: string) =>
    `two pairs of treatments would both be labelled ${q(label)}, so the map and layout_check could not tell them apart; rename a treatment so that it does not hold " / "`,
  /** The label of a split-plot plot: its whole-plot and subplot treatments. */
  splitPlotLabel: (whole: string, sub: string) => `${whole} / ${sub}`,
  bothCounts: () => 'give either blocks (a randomized complete block plan) or replicates (a completely randomized plan), not both',
  noCount: () => 'give blocks: for a randomized complete block plan, or replicates: for a completely randomized plan',
  notAPowerRecord: () => 'plan must be the result of power_two_sample, replicates_for_power, power_blocked or blocks_for_power',
  mapTooLarge: (plots: number, limit: number, part: string) =>
    `a map of ${plots} plots is too large to read; the limit is ${limit}. Draw it in parts, for example layout_chart(${part})`,
  notALayout: () => `this table was not drawn by random_layout, latin_layout or split_plot_layout, so there is no record of how it was drawn`,
  // run sheets
  measurementUnnamed: () => 'a measurement column needs a name.',
  measurementTaken: (name: string) => `the layout already has a column ${q(name)}; name the measurement column differently.`,
  // the comparison of data with a layout (`plot` names a plot, as "block 2, plot 3")
  layoutHolds: (plots: number) => `All ${plots} plots of the layout are in the data with the treatment drawn for them.`,
  plotDiffers: (plot: string, inData: string | null, inLayout: string) =>
    `${plot} has ${inData ?? 'no treatment'} in the data but ${inLayout} in the layout`,
  plotsMissingFromData: (k: number, shown: readonly string[]) =>
    `${k} plot${k === 1 ? '' : 's'} of the layout missing from the data (${shown.join('; ')}${k > shown.length ? '; …' : ''})`,
  plotsNotInLayout: (k: number, shown: readonly string[]) =>
    `${k} plot${k === 1 ? '' : 's'} in the data not in the layout (${shown.join('; ')}${k > shown.length ? '; …' : ''})`,
  differences: (parts: readonly string[]) => `${parts.join('; ')}.`,
  // the power curve: its size axis and what it assumes
  perGroup: () => 'plots per group',
  blocks: () => 'blocks',
  curveTwoGroups: (delta: number, sd: number, level: number) => `two groups, delta ${delta}, sd ${sd}, two-sided t test at level ${level}`,
  curveBlocked: (treatments: number, delta: number, sd: number, level: number) =>
    `${treatments} treatments in complete blocks, two of them delta ${delta} apart and the rest midway, sd ${sd}, F test at level ${level}`,
};
