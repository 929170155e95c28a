/**
 * Randomized layouts: complete blocks, a completely randomized plan, a Latin square. Each
 * returns plain arrays (plot keys and treatment indices) and the facts of the draw; the
 * built-ins turn them into tables.
 *
 * Order of draws (fixed forever, because plans are re-drawn from their seed):
 * - blocks: one shuffle of the treatments per block, block 1 first;
 * - completely randomized: one shuffle of all plots (treatment 1 repeated r times, then
 *   treatment 2, ...);
 * - split plot: block by block, block 1 first: one shuffle of the whole-plot treatments over
 *   the block's whole plots, then, whole plot by whole plot in their order in the block, one
 *   shuffle of the subplot treatments over its subplots (the two-stage randomization of a
 *   split plot in randomized complete blocks: whole-plot levels at random within each block,
 *   subplot levels at random within each whole plot, independently);
 * - Latin square: the cyclic standard square L(i, j) = (i + j) mod k; then a shuffle of its
 *   rows, then of its columns, then of the symbols (Fisher and Yates 1938, the randomization
 *   of a standard square: for k <= 3 this reaches every Latin square of that size; for
 *   larger k it draws uniformly from the squares obtained from the cyclic one by permuting
 *   rows, columns and symbols, which is what a randomized Latin square needs).
 */
import { Draws, permutation, shuffle } from './draws.ts';
import { PlanningError } from './errors.ts';
import { planningMsg as m } from '../../messages/planning.ts';

/** The most plots a plan may have. */
export const MAX_PLOTS = 1_000_000;

/** Checks treatment names: at least two, none empty, none twice. */
export function checkTreatments(names: readonly string[]): void {
  if (names.length < 2) throw new PlanningError(m.fewTreatments(names.length));
  const seen = new Set<string>();
  names.forEach((n, i) => {
    if (n.trim() === '') throw new PlanningError(m.emptyTreatment(i));
    if (seen.has(n)) throw new PlanningError(m.duplicateTreatment(n));
    seen.add(n);
  });
}

/** Checks a count (blocks, replicates): whole and at least `least`. */
export function checkCount(what: string, v: number, least = 1): number {
  if (!Number.isInteger(v) || v < least) throw new PlanningError(m.countNotWhole(what, v, least));
  return v;
}

function checkPlots(plots: number): void {
  if (!(plots <= MAX_PLOTS)) throw new PlanningError(m.tooManyPlots(plots));
}

/** A blocked layout: for plot i, its block (1-based), plot within the block (1-based) and treatment index. */
export interface BlockLayout {
  readonly block: Int32Array;
  readonly plot: Int32Array;
  readonly treatment: Int32Array;
}

/** Every treatment once in each of `blocks` blocks, in a random order within each block. */
export function drawBlocks(treatments: readonly string[], blocks: number, seed: number): BlockLayout {
  checkTreatments(treatments);
  checkCount('blocks', blocks);
  const k = treatments.length;
  checkPlots(k * blocks);
  const draws = new Draws(seed);
  const n = k * blocks;
  const block = new Int32Array(n);
  const plot = new Int32Array(n);
  const treatment = new Int32Array(n);
  for (let b = 0; b < blocks; b++) {
    const order = permutation(k, draws);
    for (let p = 0; p < k; p++) {
      const i = b * k + p;
      block[i] = b + 1;
      plot[i] = p + 1;
      treatment[i] = order[p]!;
    }
  }
  return { block, plot, treatment };
}

/** A completely randomized layout: for plot i (1-based), its treatment index. */
export interface PlainLayout {
  readonly plot: Int32Array;
  readonly treatment: Int32Array;
}

/** Each treatment on `replicates` plots, all plots in one random order. */
export function drawCompletelyRandom(treatments: readonly string[], replicates: number, seed: number): PlainLayout {
  checkTreatments(treatments);
  checkCount('replicates', replicates);
  const k = treatments.length;
  checkPlots(k * replicates);
  const draws = new Draws(seed);
  const all: number[] = [];
  for (let t = 0; t < k; t++) for (let r = 0; r < replicates; r++) all.push(t);
  shuffle(all, draws);
  return { plot: Int32Array.from(all, (_, i) => i + 1), treatment: Int32Array.from(all) };
}

/**
 * A split-plot layout, plot by plot along each block: its block, its plot within the block
 * (1 to wholes x subs, along the block), its whole plot within the block, and the indices of
 * its whole-plot and subplot treatments.
 */
export interface SplitLayout {
  readonly block: Int32Array;
  readonly plot: Int32Array;
  readonly wholePlot: Int32Array;
  readonly whole: Int32Array;
  readonly sub: Int32Array;
}

/**
 * A split plot in `blocks` randomized complete blocks: each block holds one whole plot of
 * every whole-plot treatment, in a random order, and each whole plot one subplot of every
 * subplot treatment, in a random order of its own.
 */
export function drawSplitPlot(wholes: readonly string[], subs: readonly string[], blocks: number, seed: number): SplitLayout {
  for (const [which, names] of [['whole-plot', wholes], ['subplot', subs]] as const) {
    try {
      checkTreatments(names);
    } catch (err) {
      if (err instanceof PlanningError) throw new PlanningError(m.ofFactor(which, err.message));
      throw err;
    }
  }
  checkCount('blocks', blocks);
  const w = wholes.length;
  const k = subs.length;
  checkPlots(w * k * blocks);
  const draws = new Draws(seed);
  const n = w * k * blocks;
  const block = new Int32Array(n);
  const plot = new Int32Array(n);
  const wholePlot = new Int32Array(n);
  const whole = new Int32Array(n);
  const sub = new Int32Array(n);
  for (let b = 0; b < blocks; b++) {
    const wholeOrder = permutation(w, draws);
    for (let wp = 0; wp < w; wp++) {
      const subOrder = permutation(k, draws);
      for (let s = 0; s < k; s++) {
        const i = (b * w + wp) * k + s;
        block[i] = b + 1;
        plot[i] = wp * k + s + 1;
        wholePlot[i] = wp + 1;
        whole[i] = wholeOrder[wp]!;
        sub[i] = subOrder[s]!;
      }
    }
  }
  return { block, plot, wholePlot, whole, sub };
}

/** A Latin square layout: for plot i, its row and column (1-based, row by row) and treatment index. */
export interface SquareLayout {
  readonly row: Int32Array;
  readonly column: Int32Array;
  readonly treatment: Int32Array;
}

/** A randomized Latin square: rows, columns and symbols of the cyclic square each shuffled. */
export function drawLatin(treatments: readonly string[], seed: number): SquareLayout {
  checkTreatments(treatments);
  const k = treatments.length;
  checkPlots(k * k);
  const draws = new Draws(seed);
  const rows = permutation(k, draws);
  const cols = permutation(k, draws);
  const symbols = permutation(k, draws);
  const n = k * k;
  const row = new Int32Array(n);
  const column = new Int32Array(n);
  const treatment = new Int32Array(n);
  for (let r = 0; r < k; r++) {
    for (let c = 0; c < k; c++) {
      const i = r * k + c;
      row[i] = r + 1;
      column[i] = c + 1;
      treatment[i] = symbols[(rows[r]! + cols[c]!) % k]!;
    }
  }
  return { row, column, treatment };
}
