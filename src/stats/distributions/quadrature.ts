/**
 * Gauss-Legendre rules, computed once at load time.
 *
 * The nodes are the roots of the Legendre polynomial P_m, found by Newton's method from the
 * classical starting values cos(pi (i - 1/4) / (m + 1/2)) (Abramowitz and Stegun 22.16.6
 * gives their asymptotics); the weights are 2 / ((1 - x^2) P_m'(x)^2) (A&S 25.4.29). Computing
 * them avoids a hand-typed table of thirty-digit constants, and the Newton iteration reaches
 * full double precision in a handful of steps.
 */
import * as portable from '../math/portable.ts';

/** A Gauss-Legendre rule on [-1, 1]: m nodes and their weights. */
export interface GaussRule {
  readonly nodes: Float64Array;
  readonly weights: Float64Array;
}

/**
 * The m-point Gauss-Legendre rule on [-1, 1] (exact for polynomials of degree 2m - 1).
 * Nodes are returned in increasing order.
 */
export function gaussLegendre(m: number): GaussRule {
  if (!Number.isInteger(m) || m < 1) throw new RangeError(`gaussLegendre: bad order ${m}`);
  const nodes = new Float64Array(m);
  const weights = new Float64Array(m);
  const half = Math.floor((m + 1) / 2);
  for (let i = 0; i < half; i++) {
    let x = portable.cos((Math.PI * (i + 0.75)) / (m + 0.5));
    let dp = 0;
    for (let iter = 0; iter < 100; iter++) {
      // Three-term recurrence for P_m(x) and P_{m-1}(x).
      let p0 = 1;
      let p1 = x;
      for (let j = 2; j <= m; j++) {
        const p2 = ((2 * j - 1) * x * p1 - (j - 1) * p0) / j;
        p0 = p1;
        p1 = p2;
      }
      const pm = m === 1 ? x : p1;
      const pm1 = m === 1 ? 1 : p0;
      dp = (m * (x * pm - pm1)) / (x * x - 1);
      const dx = pm / dp;
      x -= dx;
      if (Math.abs(dx) < 1e-17) break;
    }
    // Recompute the derivative at the converged root for the weight.
    let p0 = 1;
    let p1 = x;
    for (let j = 2; j <= m; j++) {
      const p2 = ((2 * j - 1) * x * p1 - (j - 1) * p0) / j;
      p0 = p1;
      p1 = p2;
    }
    const pm = m === 1 ? x : p1;
    const pm1 = m === 1 ? 1 : p0;
    dp = (m * (x * pm - pm1)) / (x * x - 1);
    const w = 2 / ((1 - x * x) * dp * dp);
    nodes[i] = -x;
    weights[i] = w;
    nodes[m - 1 - i] = x;
    weights[m - 1 - i] = w;
  }
  if (m % 2 === 1) nodes[(m - 1) / 2] = 0;
  return { nodes, weights };
}

/**
 * The 15-point Gauss-Kronrod rule on [-1, 1] and its embedded 7-point Gauss rule, from
 * QUADPACK (Piessens, de Doncker-Kapenga, Ueberhuber and Kahaner 1983, routine QK15).
 * Nodes are listed from the outermost (near 1) inward; the last is 0. Every second node
 * (indices 1, 3, 5 and the centre) is also a Gauss node.
 */
export const KRONROD15 = {
  nodes: Float64Array.of(
    0.991455371120812639206854697526329,
    0.949107912342758524526189684047851,
    0.864864423359769072789712788640926,
    0.741531185599394439863864773280788,
    0.586087235467691130294144845693013,
    0.405845151377397166906606412076961,
    0.207784955007898467600689403773245,
    0,
  ),
  kronrodWeights: Float64Array.of(
    0.02293532201052922496373200805897,
    0.063092092629978553290700663189204,
    0.104790010322250183839876322541518,
    0.140653259715525918745189590510238,
    0.16900472663926790282658342659855,
    0.190350578064785409913256402421014,
    0.204432940075298892414161999234649,
    0.209482141084727828012999174891714,
  ),
  /** Gauss weights for nodes 1, 3, 5 and the centre. */
  gaussWeights: Float64Array.of(
    0.129484966168869693270611432679082,
    0.27970539148927666790146777142378,
    0.381830050505118944950369775488975,
    0.417959183673469387755102040816327,
  ),
} as const;
