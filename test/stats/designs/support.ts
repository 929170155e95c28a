/**
 * Helpers shared by the design, linear-model and comparison tests. Every comparison helper
 * throws (through expect) when the numbers differ.
 */
import { expect } from 'vitest';
import type { Factor } from '../../../src/stats/designs/index.ts';

/** Fail unless |actual - expected| <= tol * max(1, |expected|). */
export function expectNear(actual: number, expected: number, tol: number, label = ''): void {
  const scale = Math.max(1, Math.abs(expected));
  const err = Math.abs(actual - expected);
  if (!(err <= tol * scale)) {
    expect.fail(`${label}: got ${actual}, expected ${expected} (error ${err}, allowed ${tol * scale})`);
  }
}

/** Fail unless |actual - expected| <= tol (for published figures rounded to fixed decimals). */
export function expectAbsolute(actual: number, expected: number, tol: number, label = ''): void {
  const err = Math.abs(actual - expected);
  if (!(err <= tol)) expect.fail(`${label}: got ${actual}, expected ${expected} (error ${err}, allowed ${tol})`);
}

/** Fail unless the relative error |actual - expected| / |expected| is at most tol. */
export function expectRelative(actual: number, expected: number, tol: number, label = ''): void {
  const err = Math.abs(actual - expected) / Math.abs(expected);
  if (!(err <= tol)) expect.fail(`${label}: got ${actual}, expected ${expected} (relative error ${err}, allowed ${tol})`);
}

/** Fail unless two arrays agree elementwise to tol (absolute, scaled by max(1, |b|)). */
export function expectArrayNear(a: ArrayLike<number>, b: ArrayLike<number>, tol: number, label = ''): void {
  expect(a.length, `${label}: length`).toBe(b.length);
  for (let i = 0; i < a.length; i++) expectNear(a[i]!, b[i]!, tol, `${label}[${i}]`);
}

/** Log relative error -log10(|x - c| / |c|), capped at 15 (NIST's scoring). */
export function lre(x: number, c: number): number {
  if (x === c) return 15;
  const v = -Math.log10(Math.abs(x - c) / Math.abs(c));
  return Number.isNaN(v) ? 0 : Math.min(15, Math.max(0, v));
}

/** A factor from labels, levels in first-seen order. */
export function factorOf(name: string, labels: readonly (string | number)[]): Factor {
  const levels: string[] = [];
  const index = new Map<string, number>();
  const codes = new Int32Array(labels.length);
  labels.forEach((l, i) => {
    const key = String(l);
    let k = index.get(key);
    if (k === undefined) {
      k = levels.length;
      index.set(key, k);
      levels.push(key);
    }
    codes[i] = k;
  });
  return { name, codes, levels };
}

/** Keep the rows where keep[i] is true, for y and factors alike (levels unchanged). */
export function subset(y: Float64Array, factors: readonly Factor[], keep: (i: number) => boolean): { y: Float64Array; factors: Factor[] } {
  const rows: number[] = [];
  for (let i = 0; i < y.length; i++) if (keep(i)) rows.push(i);
  return {
    y: Float64Array.from(rows, (i) => y[i]!),
    factors: factors.map((f) => ({ name: f.name, levels: f.levels, codes: Int32Array.from(rows, (i) => f.codes[i]!) })),
  };
}

/** Small seeded generator (a linear congruential generator), uniform on [0, 1). */
export function seeded(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
    return s / 4294967296;
  };
}

/** Standard normal deviates from a seeded uniform generator (Box-Muller). */
export function normals(next: () => number): () => number {
  return () => {
    const u = 1 - next();
    const v = next();
    return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
  };
}

// source: Montgomery, Design and Analysis of Experiments, vascular-graft example (from memory,
// as given in docs/references.md section 4): rows are extrusion pressures, columns batches 1-6.
export const VASCULAR: ReadonlyArray<readonly [string, readonly number[]]> = [
  ['8500', [90.3, 89.2, 98.2, 93.9, 87.4, 97.9]],
  ['8700', [92.5, 89.5, 90.6, 94.7, 87.0, 95.8]],
  ['8900', [85.5, 90.8, 89.6, 86.2, 88.0, 93.4]],
  ['9100', [82.5, 89.5, 85.6, 87.4, 78.9, 90.7]],
];

/** The vascular-graft data as y, pressure, batch (in row order). */
export function vascular(): { y: Float64Array; pressure: Factor; batch: Factor } {
  const y: number[] = [];
  const p: string[] = [];
  const b: string[] = [];
  for (const [pressure, row] of VASCULAR) {
    row.forEach((v, j) => {
      y.push(v);
      p.push(pressure);
      b.push(String(j + 1));
    });
  }
  return { y: Float64Array.from(y), pressure: factorOf('pressure', p), batch: factorOf('batch', b) };
}

// source: Dobson (1983), An Introduction to Statistical Modelling, plant weights (from memory,
// as given in docs/references.md section 3).
export const PLANTS: ReadonlyArray<readonly [string, readonly number[]]> = [
  ['ctrl', [4.17, 5.58, 5.18, 6.11, 4.5, 4.61, 5.17, 4.53, 5.33, 5.14]],
  ['trt1', [4.81, 4.17, 4.41, 3.59, 5.87, 3.83, 6.03, 4.89, 4.32, 4.69]],
  ['trt2', [6.31, 5.12, 5.54, 5.5, 5.37, 5.29, 4.92, 6.15, 5.8, 5.26]],
];

/** Dobson's plant weights as y and group. */
export function plants(): { y: Float64Array; group: Factor } {
  const y: number[] = [];
  const g: string[] = [];
  for (const [name, row] of PLANTS) for (const v of row) {
    y.push(v);
    g.push(name);
  }
  return { y: Float64Array.from(y), group: factorOf('group', g) };
}
