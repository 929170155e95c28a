/**
 * Shared checks for the distribution tests. Every comparison throws (through expect) when
 * the numbers differ by more than the tolerance, so no test built on them can pass silently.
 */
import { createRequire } from 'node:module';
import { expect } from 'vitest';

/** |a - b| / |b|; the absolute error |a| when b is 0; Infinity when either is NaN. */
export function relErr(a: number, b: number): number {
  if (a === b) return 0;
  if (Number.isNaN(a) || Number.isNaN(b)) return Infinity;
  if (b === 0) return Math.abs(a);
  return Math.abs(a - b) / Math.abs(b);
}

/** Fails the test unless actual agrees with expected to `tol` relative error. */
export function expectRel(actual: number, expected: number, tol: number, what: string): void {
  const e = relErr(actual, expected);
  if (!(e <= tol)) {
    expect.fail(`${what}: got ${actual}, expected ${expected} (relative error ${e.toExponential(2)} > ${tol})`);
  }
}

/**
 * Fails the test unless `actual` rounds to the printed value: |actual - printed| must not
 * exceed half a unit in the last printed digit (digits = significant digits printed).
 */
export function expectPrinted(actual: number, printed: number, digits: number, what: string): void {
  const unit = Math.pow(10, Math.floor(Math.log10(Math.abs(printed))) - digits + 1);
  const diff = Math.abs(actual - printed);
  if (!(diff <= 0.5 * unit * (1 + 1e-9))) {
    expect.fail(`${what}: got ${actual}, printed value ${printed} (difference ${diff.toExponential(2)} > half of ${unit})`);
  }
}

/** The parts of jstat 1.9.6 that the comparisons use (jstat ships no type declarations). */
export interface JStat {
  studentt: { cdf(x: number, df: number): number; inv(p: number, df: number): number };
  centralF: { cdf(x: number, df1: number, df2: number): number; inv(p: number, df1: number, df2: number): number };
  chisquare: { cdf(x: number, df: number): number; inv(p: number, df: number): number };
  normal: { cdf(x: number, mean: number, sd: number): number; inv(p: number, mean: number, sd: number): number };
  tukey: { cdf(q: number, groups: number, df: number): number; inv(p: number, groups: number, df: number): number };
  noncentralt: { cdf(x: number, df: number, ncp: number): number };
}

/** jstat, loaded as the CommonJS module it is. */
export const jStat = createRequire(import.meta.url)('jstat') as JStat;

/** Worst relative error seen per label, for the printed accuracy tables. */
export class Worst {
  readonly rows = new Map<string, { err: number; at: string }>();
  add(label: string, err: number, at: string): void {
    const row = this.rows.get(label);
    const e = Number.isNaN(err) ? Infinity : err;
    if (row === undefined || e > row.err) this.rows.set(label, { err: e, at });
  }
  get(label: string): number {
    return this.rows.get(label)?.err ?? NaN;
  }
  print(title: string): void {
    const lines = [...this.rows].map(([k, v]) => `  ${k.padEnd(34)} ${v.err.toExponential(2).padStart(9)}   at ${v.at}`);
    console.log(`${title}\n${lines.join('\n')}`);
  }
}
