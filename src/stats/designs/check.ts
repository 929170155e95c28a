/**
 * Input checks and small helpers shared by the design analyses.
 */
import { DesignError } from './errors.ts';
import { designMsg } from '../../messages/designs.ts';
import type { DesignOptions, Factor } from './types.ts';

/** Options with defaults filled in. */
export interface ResolvedOptions {
  offset: number;
  level: number;
  dropped: number;
}

/** Fill defaults and check the options. */
export function resolveOptions(options: DesignOptions | undefined): ResolvedOptions {
  const offset = options?.offset ?? 0;
  const level = options?.level ?? 0.95;
  const dropped = options?.dropped ?? 0;
  if (!(level > 0 && level < 1)) throw new DesignError(designMsg.badLevel(level));
  if (!Number.isFinite(offset)) throw new DesignError(designMsg.badOffset());
  return { offset, level, dropped };
}

/** The response must be non-empty and finite. */
export function checkResponse(y: Float64Array): void {
  if (y.length === 0) throw new DesignError(designMsg.noData());
  for (let i = 0; i < y.length; i++) {
    const v = y[i]!;
    if (v - v !== 0) throw new DesignError(designMsg.notFinite(i));
  }
}

/** The factor must match the response in length, with codes in range and >= 2 levels. */
export function checkFactor(f: Factor, n: number, role: string): Int32Array {
  if (f.codes.length !== n) throw new DesignError(designMsg.lengthMismatch(`${role} "${f.name}"`, f.codes.length, n));
  const L = f.levels.length;
  const counts = new Int32Array(L);
  for (let i = 0; i < n; i++) {
    const c = f.codes[i]!;
    if (!(c >= 0 && c < L)) throw new DesignError(designMsg.badCode(`${role} "${f.name}"`, c, i, L));
    counts[c]! += 1;
  }
  return counts;
}

/**
 * Every level must have data (treatments, and every factor of a factorial), and there must
 * be at least two levels. `levelRole` words a level in messages (default: `role`).
 */
export function requireAllLevels(f: Factor, counts: Int32Array, role: string, levelRole = role): void {
  if (counts.length < 2) throw new DesignError(designMsg.tooFewLevels(role, f.name, counts.length));
  for (let k = 0; k < counts.length; k++) {
    if (counts[k] === 0) throw new DesignError(designMsg.levelWithoutData(levelRole, f.levels[k] ?? String(k)));
  }
}

/**
 * Drop levels without observations (e.g. a block whose plots were all missing), recoding to
 * 0..k-1. Returns the factor unchanged when every level is used.
 */
export function compactFactor(f: Factor, counts: Int32Array): { factor: Factor; counts: Int32Array; removed: string[] } {
  const removed: string[] = [];
  const map = new Int32Array(counts.length);
  const levels: string[] = [];
  for (let k = 0; k < counts.length; k++) {
    if (counts[k] === 0) {
      removed.push(f.levels[k] ?? String(k));
      map[k] = -1;
    } else {
      map[k] = levels.length;
      levels.push(f.levels[k] ?? String(k));
    }
  }
  if (removed.length === 0) return { factor: f, counts, removed };
  const codes = new Int32Array(f.codes.length);
  for (let i = 0; i < codes.length; i++) codes[i] = map[f.codes[i]!]!;
  const newCounts = new Int32Array(levels.length);
  for (let k = 0; k < counts.length; k++) if (map[k]! >= 0) newCounts[map[k]!] = counts[k]!;
  return { factor: { name: f.name, codes, levels }, counts: newCounts, removed };
}

/** Counts of each (a, b) combination, a varying fastest: `out[a + A * b]`. */
export function crossCounts(a: Int32Array, levelsA: number, b: Int32Array, levelsB: number): Int32Array {
  const cells = levelsA * levelsB;
  if (cells > 268_435_456) throw new DesignError(designMsg.tooManyCells(cells));
  const out = new Int32Array(cells);
  for (let i = 0; i < a.length; i++) out[a[i]! + levelsA * b[i]!]! += 1;
  return out;
}

/** The common count when every cell has the same count, else -1. */
export function commonCount(counts: Int32Array): number {
  const first = counts[0] ?? 0;
  for (let k = 1; k < counts.length; k++) if (counts[k] !== first) return -1;
  return first;
}
