/**
 * Gauss-Legendre rules, computed once at load time.
 *
 * The nodes are the roots of the Legendre polynomial P_m, found by Newton's method from the
 * classical starting values cos(pi (i - 1/4) / (m + 1/2)) (Abramowitz and Stegun 22.16.6
 * gives their asymptotics); the weights are 2 / ((1 - x^2) P_m'(x)^2) (A&S 25.4.29). Computing
 * them avoids a hand-typed table of thirty-digit constants, and the Newton iteration reaches
 * full double precision in a handful of steps.
 */

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
    let x = Math.cos((Math.PI * (i + 0.75)) / (m + 0.5));
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
