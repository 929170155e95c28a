/**
 * Least squares for factor models, checked against an independent route: the explicit
 * design matrix solved by Householder QR, and reduced models for the adjusted sums of squares.
 */
import { describe, expect, it } from 'vitest';
import {
  centredSumOfSquares,
  choleskyFactor,
  choleskyInverse,
  choleskySolve,
  denseDesign,
  fitFactorModel,
  householderLeastSquares,
  leastSquaresMeans,
  LinearModelError,
  type FactorColumn,
} from '../../../src/stats/linear/index.ts';
import { expectArrayNear, expectNear, expectRelative, normals, seeded } from '../designs/support.ts';

/** Random unbalanced data on factors with the given level counts (every level used). */
function randomData(levels: number[], n: number, seed: number, drop?: (codes: number[]) => boolean) {
  const u = seeded(seed);
  const z = normals(u);
  const codes = levels.map(() => [] as number[]);
  const y: number[] = [];
  while (y.length < n) {
    const row = levels.map((L) => (y.length < L ? y.length : Math.floor(u() * L)));
    if (drop?.(row)) continue;
    row.forEach((c, k) => codes[k]!.push(c));
    y.push(row.reduce((s, c, k) => s + Math.sin(c + k) * (k + 1), 0) + (row[0] === 1 && row[1] === 0 ? 0.8 : 0) + 0.3 * z());
  }
  const factors: FactorColumn[] = levels.map((L, k) => ({
    name: String.fromCharCode(97 + k),
    codes: Int32Array.from(codes[k]!),
    levels: Array.from({ length: L }, (_, j) => `${String.fromCharCode(97 + k)}${j + 1}`),
  }));
  return { y: Float64Array.from(y), factors };
}

/** Plain dense inverse of a small symmetric positive definite matrix (Gauss-Jordan). */
function denseInverse(a: Float64Array, p: number): Float64Array {
  const m = new Float64Array(a);
  const inv = new Float64Array(p * p);
  for (let i = 0; i < p; i++) inv[i * p + i] = 1;
  for (let c = 0; c < p; c++) {
    let piv = c;
    for (let r = c + 1; r < p; r++) if (Math.abs(m[r * p + c]!) > Math.abs(m[piv * p + c]!)) piv = r;
    for (let k = 0; k < p; k++) {
      [m[c * p + k], m[piv * p + k]] = [m[piv * p + k]!, m[c * p + k]!];
      [inv[c * p + k], inv[piv * p + k]] = [inv[piv * p + k]!, inv[c * p + k]!];
    }
    const d = m[c * p + c]!;
    for (let k = 0; k < p; k++) {
      m[c * p + k] = m[c * p + k]! / d;
      inv[c * p + k] = inv[c * p + k]! / d;
    }
    for (let r = 0; r < p; r++) {
      if (r === c) continue;
      const f = m[r * p + c]!;
      for (let k = 0; k < p; k++) {
        m[r * p + k] = m[r * p + k]! - f * m[c * p + k]!;
        inv[r * p + k] = inv[r * p + k]! - f * inv[c * p + k]!;
      }
    }
  }
  return inv;
}

/** X'X of an explicit design. */
function crossProduct(x: Float64Array, n: number, p: number): Float64Array {
  const out = new Float64Array(p * p);
  for (let a = 0; a < p; a++) {
    for (let b = 0; b < p; b++) {
      let s = 0;
      for (let i = 0; i < n; i++) s += x[a * n + i]! * x[b * n + i]!;
      out[a * p + b] = s;
    }
  }
  return out;
}

describe('Cholesky with rank detection in column order', () => {
  it('solves and inverts a positive definite matrix', () => {
    const a = Float64Array.from([4, 2, 0, 2, 5, 1, 0, 1, 3]);
    const f = choleskyFactor(a, 3);
    expect(f.rank).toBe(3);
    const x = choleskySolve(f, Float64Array.from([2, 1, 4]));
    // A x must reproduce the right-hand side.
    const back = [0, 1, 2].map((i) => a[i * 3]! * x[0]! + a[i * 3 + 1]! * x[1]! + a[i * 3 + 2]! * x[2]!);
    expectArrayNear(back, [2, 1, 4], 1e-14, 'A x');
    expectArrayNear(choleskyInverse(f), denseInverse(a, 3), 1e-14, 'inverse');
  });

  it('marks the later of two dependent columns and solves the rest', () => {
    // Third column = first + second.
    const a = Float64Array.from([2, 1, 3, 1, 2, 3, 3, 3, 6]);
    const f = choleskyFactor(a, 3);
    expect(Array.from(f.aliased)).toEqual([0, 0, 1]);
    expect(f.rank).toBe(2);
  });
});

describe('fitFactorModel', () => {
  it('agrees with Householder QR of the explicit design (main effects and an interaction)', () => {
    const { y, factors } = randomData([3, 4, 5], 400, 11);
    const terms = [[0], [1], [2], [0, 1]];
    const fit = fitFactorModel({ y, factors, terms });
    const qr = householderLeastSquares(denseDesign(factors, terms, y.length), y);
    expect(fit.dfError).toBe(400 - 1 - 2 - 3 - 4 - 6);
    expectNear(fit.coefficients[0]! + fit.mean, qr.coefficients[0]!, 1e-12, 'intercept');
    expectArrayNear(fit.coefficients.subarray(1), qr.coefficients.subarray(1), 1e-12, 'coefficients');
    expectRelative(fit.sse, qr.sse, 1e-12, 'error sum of squares');
    expectArrayNear(fit.residuals, qr.residuals, 1e-12, 'residuals');
    expectArrayNear(Float64Array.from(y, (v, i) => v - fit.fitted[i]!), qr.residuals, 1e-12, 'y - fitted');
  });

  it('gives leverages equal to the diagonal of X (X\'X)^-1 X\' and summing to the rank', () => {
    const { y, factors } = randomData([3, 4], 120, 5);
    const terms = [[0], [1], [0, 1]];
    const fit = fitFactorModel({ y, factors, terms });
    const d = denseDesign(factors, terms, y.length);
    const inv = denseInverse(crossProduct(d.x, d.n, d.p), d.p);
    for (let i = 0; i < d.n; i++) {
      let h = 0;
      for (let a = 0; a < d.p; a++) for (let b = 0; b < d.p; b++) h += d.x[a * d.n + i]! * inv[a * d.p + b]! * d.x[b * d.n + i]!;
      expectNear(fit.leverage[i]!, h, 1e-12, `leverage ${i}`);
    }
    expectNear(fit.leverage.reduce((s, v) => s + v, 0), fit.rank, 1e-10, 'trace of the hat matrix');
  });

  it('adjusted sums of squares equal the rise in error SS when the term alone is dropped', () => {
    // Definition of "adjusted for every other term" with sum-to-zero coding (common practice,
    // no source): SS(T) = SSE(model without T) - SSE(full model), each fitted by QR here.
    const { y, factors } = randomData([2, 3, 4], 300, 23);
    const terms = [[0], [1], [2], [0, 1], [0, 2], [1, 2], [0, 1, 2]];
    const fit = fitFactorModel({ y, factors, terms });
    const full = householderLeastSquares(denseDesign(factors, terms, y.length), y);
    const dense = denseDesign(factors, terms, y.length);
    fit.layout.terms.forEach((t, k) => {
      // Drop the term's columns from the explicit design, keep every other column as coded.
      const keep: number[] = [];
      for (let c = 0; c < dense.p; c++) if (c < t.paramStart || c >= t.paramStart + t.paramSize) keep.push(c);
      const x = new Float64Array(keep.length * dense.n);
      keep.forEach((c, j) => x.set(dense.x.subarray(c * dense.n, (c + 1) * dense.n), j * dense.n));
      const reduced = householderLeastSquares({ x, n: dense.n, p: keep.length }, y);
      expectRelative(fit.termSS[k]!, reduced.sse - full.sse, 1e-9, `adjusted SS of ${t.name}`);
    });
  });

  it('absorbing a factor gives the same fit as estimating its effects', () => {
    const { y, factors } = randomData([4, 30], 200, 3, (r) => r[0] === 2 && r[1]! % 7 === 0);
    const plain = fitFactorModel({ y, factors, terms: [[0], [1]] });
    const absorbed = fitFactorModel({ y, factors, terms: [[0]], absorb: 1 });
    expect(absorbed.dfError).toBe(plain.dfError);
    expectRelative(absorbed.sse, plain.sse, 1e-12, 'SSE');
    expectArrayNear(absorbed.fitted, plain.fitted, 1e-12, 'fitted');
    expectArrayNear(absorbed.leverage, plain.leverage, 1e-12, 'leverage');
    expectRelative(absorbed.termSS[0]!, plain.termSS[0]!, 1e-11, 'treatment SS adjusted for blocks');
    const a = leastSquaresMeans(absorbed, 0);
    const b = leastSquaresMeans(plain, 0);
    expectArrayNear(a.mean, b.mean, 1e-12, 'least-squares means');
    expectArrayNear(a.covariance, b.covariance, 1e-12, 'covariance of the means');
  });

  it('least-squares means are equal-weight averages of the fitted cell means, with covariance l\' (X\'X)^-1 l', () => {
    const { y, factors } = randomData([3, 4], 150, 8);
    const terms = [[0], [1]];
    const fit = fitFactorModel({ y, factors, terms });
    const d = denseDesign(factors, terms, y.length);
    const b = householderLeastSquares(denseDesign(factors, terms, y.length), y).coefficients;
    const inv = denseInverse(crossProduct(d.x, d.n, d.p), d.p);
    // Design row of cell (i, j) under sum-to-zero coding: [1, a-coding(i), b-coding(j)].
    const code = (level: number, L: number): number[] => Array.from({ length: L - 1 }, (_, k) => (level === L - 1 ? -1 : level === k ? 1 : 0));
    const rows = [0, 1, 2].map((i) => {
      const l = new Array<number>(d.p).fill(0);
      l[0] = 1;
      code(i, 3).forEach((v, k) => (l[1 + k] = v));
      // the average over the 4 levels of b of its coding is zero
      return l;
    });
    const ls = leastSquaresMeans(fit, 0);
    rows.forEach((l, i) => {
      const cellAverage = [0, 1, 2, 3].reduce((s, j) => {
        const row = [1, ...code(i, 3), ...code(j, 4)];
        return s + row.reduce((acc, v, k) => acc + v * b[k]!, 0);
      }, 0) / 4;
      expectNear(ls.mean[i]!, cellAverage, 1e-12, `mean of level ${i}`);
      rows.forEach((m, j) => {
        let v = 0;
        for (let a = 0; a < d.p; a++) for (let c = 0; c < d.p; c++) v += l[a]! * inv[a * d.p + c]! * m[c]!;
        expectNear(ls.covariance[i * 3 + j]!, v, 1e-12, `covariance ${i},${j}`);
      });
    });
  });

  it('names the term that the data cannot estimate', () => {
    // An empty cell (a1, b2) in a model with the a:b interaction.
    const { y, factors } = randomData([2, 3], 60, 4, (r) => r[0] === 0 && r[1] === 1);
    const fit = fitFactorModel({ y, factors, terms: [[0], [1], [0, 1]] });
    expect(fit.aliasedTerms.map((t) => [t.term, t.lost, t.df])).toEqual([['a:b', 1, 2]]);
    expect(fit.aliasedTerms[0]!.message).toMatch(/a:b interaction can be estimated for only 1 of its 2 degrees of freedom/);
    expect(() => leastSquaresMeans(fit, 0)).toThrow(LinearModelError);
    // A factor that repeats another one.
    const copy = { ...factors[0]!, name: 'copy' };
    const twin = fitFactorModel({ y, factors: [factors[0]!, copy], terms: [[0], [1]] });
    expect(twin.aliasedTerms.map((t) => t.term)).toEqual(['copy']);
    expect(twin.aliasedTerms[0]!.message).toMatch(/"copy" cannot be estimated/);
  });

  it('refuses inconsistent input in plain words', () => {
    const { y, factors } = randomData([2, 3], 30, 1);
    const short = { ...factors[0]!, codes: factors[0]!.codes.subarray(1) };
    expect(() => fitFactorModel({ y, factors: [short], terms: [[0]] })).toThrow(/has 29 values but the response has 30/);
    const bad = { ...factors[0]!, codes: Int32Array.from(factors[0]!.codes, (c, i) => (i === 3 ? 7 : c)) };
    expect(() => fitFactorModel({ y, factors: [bad], terms: [[0]] })).toThrow(/code 7 at position 4/);
    expect(() => fitFactorModel({ y, factors, terms: [[0], [1]], absorb: 1 })).toThrow(/absorbed and cannot also appear/);
    expect(() => fitFactorModel({ y, factors, terms: [[0, 1]], maxColumns: 5 })).toThrow(LinearModelError);
  });
});

describe('centred two-pass sums', () => {
  it('keep every digit when the data sit far from zero', () => {
    // 1e9 + 1, ..., 1e9 + 5: sum of squares about the mean is exactly 10.
    const x = Float64Array.from([1, 2, 3, 4, 5], (v) => 1e9 + v);
    expect(centredSumOfSquares(x)).toBe(10);
  });
});
