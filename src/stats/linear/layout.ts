/**
 * Column layout of a factor model, in two coordinate systems:
 *
 * - indicator space: one column per level combination of each term (cell index in mixed
 *   radix, first factor of the term varying fastest), plus the intercept at index 0 unless a
 *   factor is absorbed. Cross products here are plain counts.
 * - parameter space: sum-to-zero coding, (L1 - 1)(L2 - 1)... columns per term. The map from
 *   parameters to indicators, C, is block diagonal with one Kronecker product of
 *   [I; -1 ... -1] blocks per term, so C and C' are applied axis by axis in O(size) time,
 *   never as dense matrices.
 *
 * Sum-to-zero coding is chosen because, with it, the test of a term that keeps every other
 * term in the model is the test of equal unweighted (least-squares) means, the quantity the
 * means table reports.
 */

/** A factor: integer codes 0..levels.length-1 for each observation. */
export interface FactorColumn {
  /** Name used for the factor's term and in messages. */
  name: string;
  /** Level code of each observation. */
  codes: Int32Array;
  /** Level names; code k is `levels[k]`. */
  levels: readonly string[];
}

/** One term of the layout. */
export interface TermLayout {
  /** "a" for a main effect, "a:b" for an interaction. */
  name: string;
  /** Indices of the term's factors in the model's factor list. */
  factors: readonly number[];
  /** Level counts of those factors. */
  shape: readonly number[];
  /** First indicator column of the term, and how many (product of the level counts). */
  indicatorStart: number;
  indicatorSize: number;
  /** First parameter column of the term, and how many (product of level counts - 1). */
  paramStart: number;
  paramSize: number;
}

/** The model's layout. */
export interface ModelLayout {
  terms: readonly TermLayout[];
  /** Whether indicator 0 / parameter 0 is the intercept (false when a factor is absorbed). */
  intercept: boolean;
  /** Total indicator columns (q) and parameter columns (p). */
  indicators: number;
  parameters: number;
}

/** Build the layout for `terms` (lists of factor indices) over `factors`. */
export function buildLayout(
  factors: readonly FactorColumn[],
  terms: readonly (readonly number[])[],
  intercept: boolean,
): ModelLayout {
  let q = intercept ? 1 : 0;
  let p = intercept ? 1 : 0;
  const out: TermLayout[] = [];
  for (const t of terms) {
    const shape = t.map((f) => factors[f]?.levels.length ?? 0);
    const size = shape.reduce((a, b) => a * b, 1);
    const params = shape.reduce((a, b) => a * (b - 1), 1);
    out.push({
      name: t.map((f) => factors[f]?.name ?? `factor ${f + 1}`).join(':'),
      factors: [...t],
      shape,
      indicatorStart: q,
      indicatorSize: size,
      paramStart: p,
      paramSize: params,
    });
    q += size;
    p += params;
  }
  return { terms: out, intercept, indicators: q, parameters: p };
}

/**
 * Indicator column of observation `i` within `term` (offset by the term's start).
 */
export function indicatorOf(term: TermLayout, factors: readonly FactorColumn[], i: number): number {
  let index = 0;
  let stride = 1;
  for (let a = 0; a < term.factors.length; a++) {
    const f = factors[term.factors[a] ?? 0];
    index += (f?.codes[i] ?? 0) * stride;
    stride *= term.shape[a] ?? 1;
  }
  return term.indicatorStart + index;
}

/**
 * For every observation and term, its indicator column: `out[i * terms + t]`. One pass over
 * the codes per term; the result is reused by every later step.
 */
export function indicatorTable(layout: ModelLayout, factors: readonly FactorColumn[], n: number): Int32Array {
  const m = layout.terms.length;
  const out = new Int32Array(n * m);
  for (let t = 0; t < m; t++) {
    const term = layout.terms[t];
    if (term === undefined) continue;
    const start = term.indicatorStart;
    let stride = 1;
    for (let a = 0; a < term.factors.length; a++) {
      const codes = factors[term.factors[a] ?? 0]?.codes;
      if (codes === undefined) continue;
      for (let i = 0; i < n; i++) out[i * m + t] = (out[i * m + t] ?? 0) + (codes[i] ?? 0) * stride;
      stride *= term.shape[a] ?? 1;
    }
    for (let i = 0; i < n; i++) out[i * m + t] = (out[i * m + t] ?? 0) + start;
  }
  return out;
}

/**
 * Apply C' to one term's block: indicator values (length = product of L) to parameter
 * values (length = product of (L - 1)). Along each axis, w_j = v_j - v_last.
 */
function contractTerm(input: Float64Array, inStart: number, shape: readonly number[], output: Float64Array, outStart: number): void {
  let current = input.subarray(inStart, inStart + shape.reduce((a, b) => a * b, 1));
  const dims = [...shape];
  for (let axis = 0; axis < dims.length; axis++) {
    const L = dims[axis] ?? 1;
    const inner = dims.slice(0, axis).reduce((a, b) => a * b, 1);
    const outer = dims.slice(axis + 1).reduce((a, b) => a * b, 1);
    const next = new Float64Array(inner * (L - 1) * outer);
    for (let o = 0; o < outer; o++) {
      for (let j = 0; j < L - 1; j++) {
        for (let k = 0; k < inner; k++) {
          const base = o * L * inner;
          next[(o * (L - 1) + j) * inner + k] = (current[base + j * inner + k] ?? 0) - (current[base + (L - 1) * inner + k] ?? 0);
        }
      }
    }
    dims[axis] = L - 1;
    current = next;
  }
  output.set(current, outStart);
}

/**
 * Apply C to one term's block: parameter values to indicator values. Along each axis,
 * v_j = w_j for j < L - 1 and v_last = -(w_0 + ... + w_{L-2}).
 */
function expandTerm(input: Float64Array, inStart: number, shape: readonly number[], output: Float64Array, outStart: number): void {
  const dims = shape.map((L) => L - 1);
  let current = input.subarray(inStart, inStart + dims.reduce((a, b) => a * b, 1));
  for (let axis = 0; axis < dims.length; axis++) {
    const L = shape[axis] ?? 1;
    const inner = dims.slice(0, axis).reduce((a, b) => a * b, 1);
    const outer = dims.slice(axis + 1).reduce((a, b) => a * b, 1);
    const next = new Float64Array(inner * L * outer);
    for (let o = 0; o < outer; o++) {
      for (let k = 0; k < inner; k++) {
        let sum = 0;
        for (let j = 0; j < L - 1; j++) {
          const v = current[(o * (L - 1) + j) * inner + k] ?? 0;
          next[(o * L + j) * inner + k] = v;
          sum += v;
        }
        next[(o * L + (L - 1)) * inner + k] = -sum;
      }
    }
    dims[axis] = L;
    current = next;
  }
  output.set(current, outStart);
}

/** C' v: an indicator-space vector to parameter space. */
export function toParameters(layout: ModelLayout, v: Float64Array): Float64Array {
  const out = new Float64Array(layout.parameters);
  if (layout.intercept) out[0] = v[0] ?? 0;
  for (const t of layout.terms) contractTerm(v, t.indicatorStart, t.shape, out, t.paramStart);
  return out;
}

/** C w: a parameter-space vector to indicator space. */
export function toIndicators(layout: ModelLayout, w: Float64Array): Float64Array {
  const out = new Float64Array(layout.indicators);
  if (layout.intercept) out[0] = w[0] ?? 0;
  for (const t of layout.terms) expandTerm(w, t.paramStart, t.shape, out, t.indicatorStart);
  return out;
}

/**
 * C' M C for a symmetric indicator-space matrix M (q x q, row-major): the parameter-space
 * cross-product matrix (p x p).
 */
export function congruenceToParameters(layout: ModelLayout, m: Float64Array): Float64Array {
  const q = layout.indicators;
  const p = layout.parameters;
  // Rows of M are columns of M (symmetry), so C' M is built one indicator column at a time.
  const half = new Float64Array(q * p); // (C' M)' stored row-major as q x p
  const row = new Float64Array(q);
  for (let j = 0; j < q; j++) {
    for (let i = 0; i < q; i++) row[i] = m[j * q + i] ?? 0;
    half.set(toParameters(layout, row), j * p);
  }
  const out = new Float64Array(p * p);
  const col = new Float64Array(q);
  for (let r = 0; r < p; r++) {
    for (let j = 0; j < q; j++) col[j] = half[j * p + r] ?? 0;
    out.set(toParameters(layout, col), r * p);
  }
  return out;
}

/** C V C' for a symmetric parameter-space matrix V (p x p): indicator space (q x q). */
export function congruenceToIndicators(layout: ModelLayout, v: Float64Array): Float64Array {
  const q = layout.indicators;
  const p = layout.parameters;
  const half = new Float64Array(p * q); // (V C')' ... rows: C applied to each row of V
  const row = new Float64Array(p);
  for (let r = 0; r < p; r++) {
    for (let i = 0; i < p; i++) row[i] = v[r * p + i] ?? 0;
    half.set(toIndicators(layout, row), r * q);
  }
  const out = new Float64Array(q * q);
  const col = new Float64Array(p);
  for (let j = 0; j < q; j++) {
    for (let r = 0; r < p; r++) col[r] = half[r * q + j] ?? 0;
    out.set(toIndicators(layout, col), j * q);
  }
  return out;
}
