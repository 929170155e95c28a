/**
 * Piecewise Chebyshev approximation of a smooth function, built adaptively.
 *
 * Each piece interpolates the function at the Chebyshev points of the first kind and is
 * accepted when its last coefficients fall below the tolerance and the interpolant matches
 * the function at two extra points; otherwise the piece is halved. This is the usual
 * coefficient-decay test (see Trefethen, Approximation Theory and Approximation Practice,
 * SIAM 2013, chapters 3 and 8). Evaluation is by Clenshaw's recurrence.
 */
import * as pm from '../math/portable.ts';

/** A piecewise Chebyshev approximant on [breaks[0], breaks[last]]. */
export interface PiecewiseChebyshev {
  /** Piece boundaries, increasing; piece i covers [breaks[i], breaks[i + 1]]. */
  readonly breaks: Float64Array;
  /** Coefficients, `degree + 1` per piece, piece after piece. */
  readonly coeffs: Float64Array;
  /** Coefficients of the derivative with respect to x (not the scaled variable). */
  readonly dcoeffs: Float64Array;
  readonly degree: number;
}

function chebCoefficients(values: Float64Array): Float64Array {
  const m = values.length;
  const c = new Float64Array(m);
  for (let j = 0; j < m; j++) {
    let s = 0;
    for (let i = 0; i < m; i++) {
      s += (values[i] as number) * pm.cos((Math.PI * j * (i + 0.5)) / m);
    }
    c[j] = ((j === 0 ? 1 : 2) * s) / m;
  }
  return c;
}

/** Clenshaw's recurrence for sum c_j T_j(t), t in [-1, 1]. */
function clenshaw(c: Float64Array, offset: number, m: number, t: number): number {
  let b1 = 0;
  let b2 = 0;
  const t2 = 2 * t;
  for (let j = m - 1; j >= 1; j--) {
    const b0 = t2 * b1 - b2 + (c[offset + j] as number);
    b2 = b1;
    b1 = b0;
  }
  return t * b1 - b2 + (c[offset] as number);
}

/** Coefficients of d/dt of sum c_j T_j(t) (standard recurrence c'_{j-1} = c'_{j+1} + 2 j c_j). */
function derivativeCoefficients(c: Float64Array): Float64Array {
  const m = c.length;
  const d = new Float64Array(m);
  if (m < 2) return d;
  d[m - 1] = 0;
  d[m - 2] = 2 * (m - 1) * (c[m - 1] as number);
  for (let j = m - 2; j >= 1; j--) d[j - 1] = (d[j + 1] as number) + 2 * j * (c[j] as number);
  d[0] = (d[0] as number) / 2;
  return d;
}

/**
 * Builds an approximant of f on [a, b]. `initialBreaks` (inside (a, b)) seed the partition;
 * `tol(value, x)` gives the allowed absolute error for function values of size `value` near x; pieces are halved up to
 * `maxDepth` times.
 */
export function fitPiecewiseChebyshev(
  f: (x: number) => number,
  a: number,
  b: number,
  initialBreaks: readonly number[],
  degree: number,
  tol: (value: number, x: number) => number,
  maxDepth = 12,
): PiecewiseChebyshev {
  const m = degree + 1;
  const pieces: { lo: number; hi: number; c: Float64Array }[] = [];
  const fitPiece = (lo: number, hi: number, depth: number): void => {
    const values = new Float64Array(m);
    const half = 0.5 * (hi - lo);
    const mid = 0.5 * (hi + lo);
    let scale = 0;
    for (let i = 0; i < m; i++) {
      const t = pm.cos((Math.PI * (i + 0.5)) / m);
      const v = f(mid + half * t);
      values[i] = v;
      scale = Math.max(scale, Math.abs(v));
    }
    const c = chebCoefficients(values);
    const allowed = tol(scale, Math.max(Math.abs(lo), Math.abs(hi)));
    let ok = Number.isFinite(scale);
    if (ok) {
      const tail = Math.max(
        Math.abs(c[m - 1] as number),
        Math.abs(c[m - 2] as number),
        Math.abs(c[m - 3] as number),
      );
      ok = tail <= allowed;
    }
    if (ok) {
      // Two checks away from the interpolation points.
      for (const t of [-0.6180339887, 0.7071067812]) {
        const exact = f(mid + half * t);
        if (!(Math.abs(clenshaw(c, 0, m, t) - exact) <= 4 * allowed)) ok = false;
      }
    }
    if (ok || depth >= maxDepth) {
      pieces.push({ lo, hi, c });
      return;
    }
    fitPiece(lo, mid, depth + 1);
    fitPiece(mid, hi, depth + 1);
  };
  const edges = [a, ...initialBreaks.filter((x) => x > a && x < b), b];
  for (let i = 0; i + 1 < edges.length; i++) fitPiece(edges[i] as number, edges[i + 1] as number, 0);
  const breaks = new Float64Array(pieces.length + 1);
  const coeffs = new Float64Array(pieces.length * m);
  const dcoeffs = new Float64Array(pieces.length * m);
  pieces.forEach((p, i) => {
    breaks[i] = p.lo;
    coeffs.set(p.c, i * m);
    const d = derivativeCoefficients(p.c);
    const scale = 2 / (p.hi - p.lo);
    for (let j = 0; j < m; j++) dcoeffs[i * m + j] = (d[j] as number) * scale;
  });
  breaks[pieces.length] = b;
  return { breaks, coeffs, dcoeffs, degree };
}

function findPiece(p: PiecewiseChebyshev, x: number): number {
  const br = p.breaks;
  let lo = 0;
  let hi = br.length - 2;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if ((br[mid] as number) <= x) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}

/** Value of the approximant at x (x inside its interval). */
export function evalChebyshev(p: PiecewiseChebyshev, x: number): number {
  const i = findPiece(p, x);
  const lo = p.breaks[i] as number;
  const hi = p.breaks[i + 1] as number;
  const t = (2 * x - lo - hi) / (hi - lo);
  const m = p.degree + 1;
  return clenshaw(p.coeffs, i * m, m, t);
}

/** Derivative of the approximant at x. */
export function evalChebyshevDerivative(p: PiecewiseChebyshev, x: number): number {
  const i = findPiece(p, x);
  const lo = p.breaks[i] as number;
  const hi = p.breaks[i + 1] as number;
  const t = (2 * x - lo - hi) / (hi - lo);
  const m = p.degree + 1;
  return clenshaw(p.dcoeffs, i * m, m, t);
}
