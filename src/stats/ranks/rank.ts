/**
 * Ranks with ties shared out as average ranks (midranks), and the tie totals that the
 * rank tests' variance corrections need.
 */

/** Ranks of a sample and what its ties amount to. */
export interface Ranking {
  /** Rank of each value in input order, 1 .. n, ties given the average of their ranks. */
  readonly ranks: Float64Array;
  /** Sum over groups of tied values of t^3 - t (t = group size); 0 without ties. */
  readonly tieTerm: number;
  /** Number of groups of two or more tied values. */
  readonly tieGroups: number;
}

/**
 * Average ranks of x.
 *
 * @param x - values (NaN must not occur: complete cases)
 * @param tolerance - two neighbouring sorted values are tied when they differ by at most
 *   this much. 0 (exact equality) is right for measured data; a small positive tolerance
 *   suits computed values such as paired differences, whose binary rounding can split
 *   values that are equal in decimal (3.4 - 4.4 gives -1.0000000000000004).
 */
export function averageRanks(x: Float64Array, tolerance = 0): Ranking {
  const n = x.length;
  const order = sortOrder(x);
  const ranks = new Float64Array(n);
  let tieTerm = 0;
  let tieGroups = 0;
  let i = 0;
  while (i < n) {
    let j = i + 1;
    // A run of ties grows while each value stays within `tolerance` of the run's first
    // value, so that a long chain of near-equal values cannot drift.
    const first = x[order[i]!]!;
    while (j < n && x[order[j]!]! - first <= tolerance) j++;
    const t = j - i;
    const r = (i + 1 + j) / 2; // mean of ranks i+1 .. j
    for (let m = i; m < j; m++) ranks[order[m]!] = r;
    if (t > 1) {
      tieTerm += t * t * t - t;
      tieGroups++;
    }
    i = j;
  }
  return { ranks, tieTerm, tieGroups };
}

/** Indices that sort x ascending (stable for equal values). */
export function sortOrder(x: Float64Array): Uint32Array {
  const n = x.length;
  const order = new Uint32Array(n);
  for (let i = 0; i < n; i++) order[i] = i;
  order.sort((p, q) => x[p]! - x[q]! || p - q);
  return order;
}
