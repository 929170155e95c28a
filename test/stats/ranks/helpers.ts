/** Test helpers shared by the rank-test files. Every check throws on failure. */

export const F = (a: readonly number[]): Float64Array => Float64Array.from(a);

/** Must round to the printed figure (half a unit in its last place). */
export function expectPrinted(actual: number, printed: number, decimals: number, what = ''): void {
  const half = 0.5 * 10 ** -decimals * (1 + 1e-9);
  if (!(Math.abs(actual - printed) <= half)) {
    throw new Error(`${what}: expected ${printed} (to ${decimals} decimals), got ${actual}`);
  }
}

/** Relative error check; returns the error so that callers can track the worst one. */
export function expectRel(actual: number, expected: number, tol: number, what = ''): number {
  const err = expected === 0 ? Math.abs(actual) : Math.abs(actual - expected) / Math.abs(expected);
  if (!(err <= tol)) {
    throw new Error(`${what}: expected ${expected}, got ${actual} (relative error ${err} > ${tol})`);
  }
  return err;
}

/** Small seeded generator (mulberry32). */
export function uniforms(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Two-sided p from a full null distribution given as (value, probability) pairs. */
export function twoSidedFromNull(values: Float64Array, observed: number): number {
  let lower = 0;
  let upper = 0;
  for (const v of values) {
    if (v <= observed + 1e-9) lower++;
    if (v >= observed - 1e-9) upper++;
  }
  return Math.min(1, (2 * Math.min(lower, upper)) / values.length);
}

/** Calls visit with every subset of size m of 0 .. N-1 (as a boolean mask). */
export function forEachSubset(N: number, m: number, visit: (mask: Uint8Array) => void): void {
  const mask = new Uint8Array(N);
  const pick = (start: number, left: number): void => {
    if (left === 0) {
      visit(mask);
      return;
    }
    for (let i = start; i <= N - left; i++) {
      mask[i] = 1;
      pick(i + 1, left - 1);
      mask[i] = 0;
    }
  };
  pick(0, m);
}
