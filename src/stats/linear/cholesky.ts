/**
 * Cholesky factorization of a small symmetric positive semi-definite matrix (row-major
 * Float64Array), with rank detection in column order.
 *
 * Why column order and not pivoting: for factor models the order of the columns is the order
 * of the terms (intercept, main effects, interactions). Eliminating in that order declares a
 * column aliased only when it is a combination of the columns before it, so a rank deficiency
 * is attributed to the later term (the interaction with an empty cell, the block that repeats
 * another factor), which is what can be said in plain words. Cholesky needs no pivoting for
 * stability on a positive definite matrix, and the cross-product matrices here are built
 * exactly from counts, so a structural deficiency leaves a pivot at rounding level (about
 * 1e-14 relative), far below the tolerance.
 */

/** Relative pivot size below which a column counts as a combination of earlier ones. */
export const ALIAS_TOLERANCE = 1e-9;

/** A factorization made by {@link choleskyFactor}. */
export interface CholeskyFactor {
  /** Order of the matrix. */
  p: number;
  /** Lower triangle L (row-major, p x p) with A = L L' on the non-aliased columns. */
  lower: Float64Array;
  /** 1 where the column was found to be a combination of earlier columns. */
  aliased: Uint8Array;
  /** Number of non-aliased columns. */
  rank: number;
}

/**
 * Factor the symmetric matrix `a` (only its lower triangle is read). Aliased columns get a
 * zero row and column in L.
 */
export function choleskyFactor(a: Float64Array, p: number, tolerance = ALIAS_TOLERANCE): CholeskyFactor {
  const lower = new Float64Array(p * p);
  const aliased = new Uint8Array(p);
  let rank = 0;
  for (let j = 0; j < p; j++) {
    const rowJ = j * p;
    const ajj = a[rowJ + j] ?? 0;
    let d = ajj;
    for (let k = 0; k < j; k++) {
      const l = lower[rowJ + k] ?? 0;
      d -= l * l;
    }
    if (!(ajj > 0) || d <= tolerance * ajj) {
      aliased[j] = 1;
      continue; // row and column j of L stay zero
    }
    const ljj = Math.sqrt(d);
    lower[rowJ + j] = ljj;
    rank++;
    for (let i = j + 1; i < p; i++) {
      const rowI = i * p;
      let s = a[rowI + j] ?? 0;
      for (let k = 0; k < j; k++) s -= (lower[rowI + k] ?? 0) * (lower[rowJ + k] ?? 0);
      lower[rowI + j] = s / ljj;
    }
  }
  return { p, lower, aliased, rank };
}

/**
 * Solve A x = b for the non-aliased columns; aliased components of x are 0 (the solution of
 * the model with those columns left out).
 */
export function choleskySolve(f: CholeskyFactor, b: Float64Array): Float64Array {
  const { p, lower, aliased } = f;
  const z = new Float64Array(p);
  for (let i = 0; i < p; i++) {
    if (aliased[i]) continue;
    const row = i * p;
    let s = b[i] ?? 0;
    for (let k = 0; k < i; k++) s -= (lower[row + k] ?? 0) * (z[k] ?? 0);
    z[i] = s / (lower[row + i] ?? 1);
  }
  const x = new Float64Array(p);
  for (let i = p - 1; i >= 0; i--) {
    if (aliased[i]) continue;
    let s = z[i] ?? 0;
    for (let k = i + 1; k < p; k++) s -= (lower[k * p + i] ?? 0) * (x[k] ?? 0);
    x[i] = s / (lower[i * p + i] ?? 1);
  }
  return x;
}

/**
 * The inverse of A restricted to the non-aliased columns, with zero rows and columns for the
 * aliased ones (a generalized inverse), row-major p x p.
 */
export function choleskyInverse(f: CholeskyFactor): Float64Array {
  const { p, lower, aliased } = f;
  // M = L^-1 (lower triangular), column by column.
  const inv = new Float64Array(p * p);
  for (let j = 0; j < p; j++) {
    if (aliased[j]) continue;
    inv[j * p + j] = 1 / (lower[j * p + j] ?? 1);
    for (let i = j + 1; i < p; i++) {
      if (aliased[i]) continue;
      const row = i * p;
      let s = 0;
      for (let k = j; k < i; k++) s -= (lower[row + k] ?? 0) * (inv[k * p + j] ?? 0);
      inv[row + j] = s / (lower[row + i] ?? 1);
    }
  }
  // A^-1 = M' M.
  const out = new Float64Array(p * p);
  for (let i = 0; i < p; i++) {
    for (let j = 0; j <= i; j++) {
      let s = 0;
      for (let k = i; k < p; k++) s += (inv[k * p + i] ?? 0) * (inv[k * p + j] ?? 0);
      out[i * p + j] = s;
      out[j * p + i] = s;
    }
  }
  return out;
}
