/**
 * One-pass accumulation for two crossed factors (treatments and blocks): level counts, the
 * table of cell counts, first-pass sums, with the code range checks folded in. The blocked
 * analysis of a million plots is a handful of passes over the data, and this is the first.
 */
import { DesignError } from './errors.ts';
import { designMsg } from '../../messages/designs.ts';
import type { Factor } from './types.ts';

/** Sums of one pass over (y, a, b). */
export interface TwoWaySums {
  countA: Int32Array;
  countB: Int32Array;
  /** Cell counts, a varying fastest: `cells[a + A * b]`. */
  cells: Int32Array;
  sumA: Float64Array;
  sumB: Float64Array;
  sum: number;
}

/** Accumulate counts and sums; throws DesignError on a code out of range or a value that is not finite. */
export function accumulateTwoWay(y: Float64Array, a: Factor, b: Factor, roleA: string, roleB: string): TwoWaySums {
  const n = y.length;
  const A = a.levels.length;
  const B = b.levels.length;
  if (A * B > 268_435_456) throw new DesignError(designMsg.tooManyCells(A * B));
  const ca = a.codes;
  const cb = b.codes;
  const countA = new Int32Array(A);
  const countB = new Int32Array(B);
  const cells = new Int32Array(A * B);
  const sumA = new Float64Array(A);
  const sumB = new Float64Array(B);
  let sum = 0;
  for (let i = 0; i < n; i++) {
    const u = ca[i]!;
    const v = cb[i]!;
    // One unsigned comparison each catches negative codes too.
    if (u >>> 0 >= A) throw new DesignError(designMsg.badCode(`${roleA} "${a.name}"`, u, i, A));
    if (v >>> 0 >= B) throw new DesignError(designMsg.badCode(`${roleB} "${b.name}"`, v, i, B));
    const yi = y[i]!;
    if (yi - yi !== 0) throw new DesignError(designMsg.notFinite(i));
    countA[u]!++;
    countB[v]!++;
    cells[u + A * v]!++;
    sumA[u]! += yi;
    sumB[v]! += yi;
    sum += yi;
  }
  return { countA, countB, cells, sumA, sumB, sum };
}

/** Means of both factors and the grand mean, corrected in a second pass; plus the total SS. */
export interface TwoWayMeans {
  meanA: Float64Array;
  meanB: Float64Array;
  grand: number;
  /** Centred total sum of squares of y. */
  sst: number;
}

/**
 * Second pass: corrects the first-pass means (corrected two-pass algorithm) and forms the
 * total sum of squares about the first-pass grand mean with the same correction, which makes
 * it the sum about the exact mean.
 */
export function correctTwoWay(y: Float64Array, a: Int32Array, b: Int32Array, s: TwoWaySums): TwoWayMeans {
  const n = y.length;
  const A = s.countA.length;
  const B = s.countB.length;
  const meanA = new Float64Array(A);
  const meanB = new Float64Array(B);
  for (let k = 0; k < A; k++) meanA[k] = s.sumA[k]! / s.countA[k]!;
  for (let k = 0; k < B; k++) meanB[k] = s.sumB[k]! / s.countB[k]!;
  const m0 = s.sum / n;
  const corrA = new Float64Array(A);
  const corrB = new Float64Array(B);
  let c = 0;
  let ss = 0;
  for (let i = 0; i < n; i++) {
    const yi = y[i]!;
    const u = a[i]!;
    const v = b[i]!;
    corrA[u]! += yi - meanA[u]!;
    corrB[v]! += yi - meanB[v]!;
    const d = yi - m0;
    c += d;
    ss += d * d;
  }
  for (let k = 0; k < A; k++) meanA[k]! += corrA[k]! / s.countA[k]!;
  for (let k = 0; k < B; k++) meanB[k]! += corrB[k]! / s.countB[k]!;
  return { meanA, meanB, grand: m0 + c / n, sst: ss - (c * c) / n };
}
