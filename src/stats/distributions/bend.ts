/**
 * A tabulated upper bound of a function's values over intervals, for choosing quadrature
 * panel widths: the function is sampled at three points of each grid cell, and a sparse
 * table of maxima answers "largest value on [x1, x2]" in constant time.
 */

/** Maxima of a function over a regular grid of cells on [0, xMax]. */
export interface IntervalMax {
  readonly step: number;
  readonly cells: number;
  /** levels[j][i] = max over cells i .. i + 2^j - 1. */
  readonly levels: readonly Float64Array[];
}

/** Tabulates max(0, f) on cells of width `step` covering [0, xMax]. */
export function buildIntervalMax(f: (x: number) => number, xMax: number, step: number): IntervalMax {
  const cells = Math.ceil(xMax / step);
  const base = new Float64Array(cells);
  for (let i = 0; i < cells; i++) {
    let m = 0;
    for (const t of [0, 0.5, 1]) {
      const v = f((i + t) * step);
      if (v > m) m = v;
      // A value that cannot be computed must not shrink the bound.
      if (Number.isNaN(v)) m = Infinity;
    }
    base[i] = m;
  }
  const levels: Float64Array[] = [base];
  for (let span = 2; span <= cells; span *= 2) {
    const prev = levels[levels.length - 1] as Float64Array;
    const half = span / 2;
    const next = new Float64Array(cells - span + 1);
    for (let i = 0; i < next.length; i++) {
      next[i] = Math.max(prev[i] as number, prev[i + half] as number);
    }
    levels.push(next);
  }
  return { step, cells, levels };
}

/**
 * Largest tabulated value on [x1, x2] (x1 <= x2), widened by one cell on each side; beyond
 * the grid the last cell's value is used.
 */
export function intervalMax(t: IntervalMax, x1: number, x2: number): number {
  const last = t.cells - 1;
  let i = Math.floor(x1 / t.step) - 1;
  let j = Math.floor(x2 / t.step) + 1;
  if (i < 0) i = 0;
  if (j > last) j = last;
  if (i > last) i = last;
  if (j < i) j = i;
  const n = j - i + 1;
  const level = 31 - Math.clz32(n);
  const row = t.levels[level] as Float64Array;
  return Math.max(row[i] as number, row[j - (1 << level) + 1] as number);
}
