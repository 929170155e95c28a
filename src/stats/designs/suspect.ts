/**
 * Does a factorial's data look like a split plot? One factor is the same on every plot of
 * some unit named in the data (a strip, a main plot, an oven batch), while another factor
 * changes inside those units, and there are more units than levels of the first factor (the
 * units are its replicates). Then the first factor was applied to whole units, and an
 * ordinary factorial tests it against the variation between subplots, an error too small for
 * it. A unit may be named by one column or by two together (strip numbers that restart in
 * every block).
 */
import type { Factor } from './types.ts';

/** What the check found: the whole-plot factor, the factor that varies inside, and the unit. */
export interface SplitSuspicion {
  whole: string;
  sub: string;
  /** The column(s) naming the units, e.g. ["strip"] or ["block", "strip"]. */
  unit: string[];
}

/** Most candidate columns the check looks at (pairs grow with the square). */
const MAX_CANDIDATES = 20;

/** Unit codes from one or two columns (dense codes, first-seen order), and how many. */
function unitCodes(cols: readonly Factor[]): { codes: Int32Array; count: number } {
  const n = cols[0]!.codes.length;
  const index = new Map<number, number>();
  const codes = new Int32Array(n);
  const stride = cols[0]!.levels.length;
  for (let i = 0; i < n; i++) {
    const key = cols.length === 1 ? cols[0]!.codes[i]! : cols[0]!.codes[i]! + stride * cols[1]!.codes[i]!;
    let c = index.get(key);
    if (c === undefined) {
      c = index.size;
      index.set(key, c);
    }
    codes[i] = c;
  }
  return { codes, count: index.size };
}

/** Is `f` constant within every unit? */
function constantWithin(f: Factor, unit: Int32Array, units: number): boolean {
  const seen = new Int32Array(units).fill(-1);
  for (let i = 0; i < unit.length; i++) {
    const u = unit[i]!;
    const c = f.codes[i]!;
    if (seen[u] === -1) seen[u] = c;
    else if (seen[u] !== c) return false;
  }
  return true;
}

/** Does `f` take at least two levels inside some unit? */
function variesWithin(f: Factor, unit: Int32Array, units: number): boolean {
  return !constantWithin(f, unit, units);
}

/**
 * Look for a split-plot structure among `factors` (the factorial's) given the other columns
 * of the table the data came from, as factors. Returns the first suspicion found, or null.
 */
export function splitPlotSuspicion(factors: readonly Factor[], others: readonly Factor[]): SplitSuspicion | null {
  // a column that one of the factors determines (a code or a number for the same levels)
  // would pair with blocks into the factor's own cells, which are not whole plots
  const candidates = others.filter((c) => !factors.some((f) => constantWithin(c, f.codes, f.levels.length))).slice(0, MAX_CANDIDATES);
  const units: Factor[][] = candidates.map((c) => [c]);
  for (let a = 0; a < candidates.length; a++) for (let b = a + 1; b < candidates.length; b++) units.push([candidates[a]!, candidates[b]!]);
  for (const cols of units) {
    const { codes, count } = unitCodes(cols);
    if (count === codes.length) continue; // one plot per unit: a plot label, not a whole plot
    for (const whole of factors) {
      if (count < 2 * whole.levels.length || !constantWithin(whole, codes, count)) continue;
      for (const sub of factors) {
        if (sub !== whole && variesWithin(sub, codes, count)) return { whole: whole.name, sub: sub.name, unit: cols.map((c) => c.name) };
      }
    }
  }
  return null;
}

/** What the reverse check found: the column(s) that group plots as whole plots would be. */
export interface NotSplitSuspicion {
  /** The column(s) naming the groups, e.g. ["strip"] or ["block", "strip"]. */
  unit: string[];
}

/**
 * The reverse check, for a split_plot fit: does a column of the data group the plots exactly
 * as whole plots would be (as many groups as whole plots, each holding one plot of every
 * subplot level), while the whole-plot factor changes inside those groups? Then the
 * whole-plot factor was most likely drawn plot by plot, the data are not a split plot, and
 * whole_error is not an error of anything that was randomized. The fit alone cannot see it:
 * block and whole-plot level still hold every subplot level once. Returns the first such
 * column (alone, or with the block when its labels restart in every block), or null.
 */
export function notSplitPlotSuspicion(whole: Factor, sub: Factor, block: Factor, others: readonly Factor[]): NotSplitSuspicion | null {
  const factors = [whole, sub, block];
  const n = whole.codes.length;
  const b = sub.levels.length;
  const wholePlots = whole.levels.length * block.levels.length;
  if (b < 2 || n !== wholePlots * b) return null;
  const candidates = others.filter((c) => !factors.some((f) => constantWithin(c, f.codes, f.levels.length))).slice(0, MAX_CANDIDATES);
  const units: Factor[][] = [];
  for (const c of candidates) units.push([c], [block, c]);
  for (const cols of units) {
    const { codes, count } = unitCodes(cols);
    if (count !== wholePlots || !holdsEachOnce(sub, codes, count)) continue;
    if (!constantWithin(whole, codes, count)) return { unit: cols.map((c) => c.name) };
  }
  return null;
}

/** Does every unit hold exactly one plot of each level of `f`? */
function holdsEachOnce(f: Factor, unit: Int32Array, units: number): boolean {
  const k = f.levels.length;
  const seen = new Uint8Array(units * k);
  for (let i = 0; i < unit.length; i++) {
    const key = unit[i]! * k + f.codes[i]!;
    if (seen[key] === 1) return false;
    seen[key] = 1;
  }
  // n = units * k plots with no level twice in a unit: every unit holds every level once
  return unit.length === units * k;
}
