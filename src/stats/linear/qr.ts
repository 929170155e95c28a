/**
 * Dense Householder least squares on the explicit design matrix. Not used by the analyses
 * (see fit.ts for why); kept as an independent route that the tests compare the fast one
 * against, and that the benchmark times.
 */
import { buildLayout, type FactorColumn } from './layout.ts';

/** An explicit design matrix, column-major (`x[j * n + i]`), sum-to-zero coding. */
export interface DenseDesign {
  x: Float64Array;
  n: number;
  p: number;
}

/**
 * Build the explicit n x p sum-to-zero design matrix (intercept first, then the terms in
 * order, each term's columns as Kronecker products of its factors' codings with the first
 * factor varying fastest, matching fit.ts).
 */
export function denseDesign(factors: readonly FactorColumn[], terms: readonly (readonly number[])[], n: number): DenseDesign {
  const layout = buildLayout(factors, terms, true);
  const p = layout.parameters;
  const x = new Float64Array(n * p);
  for (let i = 0; i < n; i++) x[i] = 1;
  for (const term of layout.terms) {
    const dims = term.shape.map((L) => L - 1);
    for (let c = 0; c < term.paramSize; c++) {
      // Per-factor contrast index of parameter column c (mixed radix, first fastest).
      const js: number[] = [];
      let rest = c;
      for (const d of dims) {
        js.push(rest % d);
        rest = Math.floor(rest / d);
      }
      const col = (term.paramStart + c) * n;
      for (let i = 0; i < n; i++) {
        let v = 1;
        for (let a = 0; a < term.factors.length && v !== 0; a++) {
          const f = factors[term.factors[a]!]!;
          const code = f.codes[i]!;
          const last = f.levels.length - 1;
          v *= code === last ? -1 : code === js[a] ? 1 : 0;
        }
        x[col + i] = v;
      }
    }
  }
  return { x, n, p };
}

/** Result of {@link householderLeastSquares}. */
export interface HouseholderResult {
  coefficients: Float64Array;
  residuals: Float64Array;
  /** Sum of squared residuals (formed from the residuals directly). */
  sse: number;
}

/**
 * Least squares by Householder QR of X (overwritten). Throws when X is rank deficient
 * (a column whose reduced norm falls below 1e-10 of its original norm).
 */
export function householderLeastSquares(design: DenseDesign, y: Float64Array): HouseholderResult {
  const { x, n, p } = design;
  const original = new Float64Array(x);
  const qty = new Float64Array(y);
  const rdiag = new Float64Array(p);
  for (let j = 0; j < p; j++) {
    const cj = j * n;
    let norm0 = 0;
    for (let i = 0; i < n; i++) norm0 += original[cj + i]! * original[cj + i]!;
    let norm = 0;
    for (let i = j; i < n; i++) norm += x[cj + i]! * x[cj + i]!;
    norm = Math.sqrt(norm);
    if (!(norm > 1e-10 * Math.sqrt(norm0))) throw new Error(`column ${j} is a combination of earlier columns`);
    const alpha = x[cj + j]! > 0 ? -norm : norm;
    // v = x_j - alpha e_j, stored in place; beta = 2 / v'v.
    x[cj + j] = x[cj + j]! - alpha;
    let vv = 0;
    for (let i = j; i < n; i++) vv += x[cj + i]! * x[cj + i]!;
    const beta = 2 / vv;
    for (let k = j + 1; k < p; k++) {
      const ck = k * n;
      let s = 0;
      for (let i = j; i < n; i++) s += x[cj + i]! * x[ck + i]!;
      s *= beta;
      for (let i = j; i < n; i++) x[ck + i] = x[ck + i]! - s * x[cj + i]!;
    }
    let s = 0;
    for (let i = j; i < n; i++) s += x[cj + i]! * qty[i]!;
    s *= beta;
    for (let i = j; i < n; i++) qty[i] = qty[i]! - s * x[cj + i]!;
    rdiag[j] = alpha;
  }
  const b = new Float64Array(p);
  for (let j = p - 1; j >= 0; j--) {
    let s = qty[j]!;
    for (let k = j + 1; k < p; k++) s -= x[k * n + j]! * b[k]!;
    b[j] = s / rdiag[j]!;
  }
  const residuals = new Float64Array(n);
  let sse = 0;
  for (let i = 0; i < n; i++) {
    let f = 0;
    for (let j = 0; j < p; j++) f += original[j * n + i]! * b[j]!;
    const r = y[i]! - f;
    residuals[i] = r;
    sse += r * r;
  }
  return { coefficients: b, residuals, sse };
}
