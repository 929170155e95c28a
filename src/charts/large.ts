/**
 * Large data: when a chart would draw more than {@link MAX_POINTS} marks, it draws counts in
 * bins or an even sample instead, and its caption says so. Binning is done here, on typed
 * arrays in one pass, so that a spec carries a few hundred cells and not 100,000 rows (the
 * spec travels through the worker, is compared on every evaluation and sits in the report).
 */
import * as pm from '../stats/math/portable.ts';

/** Past this many points a chart bins or samples (common practice, no source: one mark per pixel column or so). */
export const MAX_POINTS = 5000;
/** At most this many marked points (the most extreme) get a row label; the caption counts the rest. */
export const MAX_LABELS = 10;
/** At most this many marked points are drawn one by one over a binned view. */
export const MAX_MARKED = 1000;
/** Past this many levels a factor's axis shows level positions (1, 2, ...) rather than names. */
export const MANY_LEVELS = 60;
/** Bins of a two-dimensional binned view, across and up (at most). */
export const GRID_ACROSS = 48;
export const GRID_UP = 36;

/** Equal bins with a round width: bin j covers [start + j step, start + (j + 1) step). */
export interface Bins {
  readonly start: number;
  readonly step: number;
  readonly count: number;
}

/**
 * Bins of a round width (1, 2, 2.5 or 5 times a power of ten) covering [min, max] in at most
 * `most` bins. A single value gets one bin of width 1 centred on it.
 */
export function roundBins(min: number, max: number, most: number): Bins {
  if (!(max > min)) {
    const step = min === 0 ? 1 : pm.pow(10, Math.floor(pm.log10(Math.abs(min))));
    return { start: min - step / 2, step, count: 1 };
  }
  const raw = (max - min) / most;
  const e0 = Math.floor(pm.log10(raw));
  // the smallest round width whose bins, started at a multiple of it, fit in `most`
  for (let e = e0; e <= e0 + 2; e++) {
    for (const m of [1, 2, 2.5, 5]) {
      const step = m * pm.pow(10, e);
      const start = Math.floor(min / step) * step;
      const count = Math.floor((max - start) / step) + 1;
      if (count <= most) return { start, step, count };
    }
  }
  const step = pm.pow(10, e0 + 3);
  const start = Math.floor(min / step) * step;
  return { start, step, count: Math.floor((max - start) / step) + 1 };
}

/** The bin of a value (clamped into range). */
export function binOf(b: Bins, v: number): number {
  const j = Math.floor((v - b.start) / b.step);
  return j < 0 ? 0 : j >= b.count ? b.count - 1 : j;
}

/** The smallest and largest finite value of an array (NaN, NaN when there is none). */
export function finiteRange(x: Float64Array): { min: number; max: number } {
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < x.length; i++) {
    const v = x[i]!;
    if (v < min) min = v;
    if (v > max) max = v;
  }
  return min <= max ? { min, max } : { min: NaN, max: NaN };
}

/** One non-empty cell of a two-dimensional binned view. */
export interface Cell2 {
  readonly x0: number;
  readonly x1: number;
  readonly y0: number;
  readonly y1: number;
  readonly n: number;
}

/** Counts of (x, y) pairs in a grid of round bins; only cells with points are returned. */
export function bin2d(x: Float64Array, y: Float64Array, across = GRID_ACROSS, up = GRID_UP): { cells: Cell2[]; bx: Bins; by: Bins } {
  const rx = finiteRange(x);
  const ry = finiteRange(y);
  const bx = roundBins(rx.min, rx.max, across);
  const by = roundBins(ry.min, ry.max, up);
  const counts = new Int32Array(bx.count * by.count);
  for (let i = 0; i < x.length; i++) {
    const a = x[i]!;
    const b = y[i]!;
    if (!Number.isFinite(a) || !Number.isFinite(b)) continue;
    counts[binOf(by, b) * bx.count + binOf(bx, a)]!++;
  }
  const cells: Cell2[] = [];
  for (let j = 0; j < by.count; j++) {
    for (let i = 0; i < bx.count; i++) {
      const n = counts[j * bx.count + i]!;
      if (n > 0) cells.push({ x0: bx.start + i * bx.step, x1: bx.start + (i + 1) * bx.step, y0: by.start + j * by.step, y1: by.start + (j + 1) * by.step, n });
    }
  }
  return { cells, bx, by };
}

/** One non-empty cell of a per-level binned strip. */
export interface LevelCell {
  readonly level: string;
  readonly y0: number;
  readonly y1: number;
  readonly n: number;
}

/** Counts of y in round bins within each level of a factor. */
export function binByLevel(codes: Int32Array, levels: readonly string[], y: Float64Array, up = GRID_UP): { cells: LevelCell[]; by: Bins } {
  const by = roundBins(finiteRange(y).min, finiteRange(y).max, up);
  const counts = new Int32Array(levels.length * by.count);
  for (let i = 0; i < y.length; i++) {
    const v = y[i]!;
    if (!Number.isFinite(v)) continue;
    counts[codes[i]! * by.count + binOf(by, v)]!++;
  }
  const cells: LevelCell[] = [];
  for (let k = 0; k < levels.length; k++) {
    for (let j = 0; j < by.count; j++) {
      const n = counts[k * by.count + j]!;
      if (n > 0) cells.push({ level: levels[k]!, y0: by.start + j * by.step, y1: by.start + (j + 1) * by.step, n });
    }
  }
  return { cells, by };
}

/**
 * An even, deterministic sample of positions 0..n-1: every `stride`-th one, from the first,
 * with stride the smallest that keeps at most `most`; then the `extra` positions added
 * (ascending, no repeats).
 */
export function evenSample(n: number, most: number, extra: ArrayLike<number> = []): { at: Int32Array; stride: number } {
  const stride = Math.max(1, Math.ceil(n / most));
  const keep = new Uint8Array(n);
  for (let i = 0; i < n; i += stride) keep[i] = 1;
  for (let j = 0; j < extra.length; j++) keep[extra[j]!] = 1;
  let m = 0;
  for (let i = 0; i < n; i++) m += keep[i]!;
  const at = new Int32Array(m);
  for (let i = 0, j = 0; i < n; i++) if (keep[i] === 1) at[j++] = i;
  return { at, stride };
}

/**
 * A spread of offsets in (-0.35, 0.35) for points that share a category, so that equal
 * values do not hide one another: the k-th point of its level gets the fractional part of
 * k times the golden ratio (a low-discrepancy sequence: deterministic, evenly spread).
 */
export function jitter(codes: Int32Array, levels: number): Float64Array {
  const seen = new Int32Array(levels);
  const out = new Float64Array(codes.length);
  const phi = (Math.sqrt(5) - 1) / 2;
  for (let i = 0; i < codes.length; i++) {
    const k = seen[codes[i]!]!++;
    const u = (0.5 + k * phi) % 1; // the first point of a level sits in the middle
    out[i] = (u - 0.5) * 0.7;
  }
  return out;
}
