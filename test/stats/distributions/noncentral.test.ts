/**
 * Noncentral t and noncentral F (src/stats/distributions/noncentral-t.ts, noncentral-f.ts).
 */
import { describe, expect, it } from 'vitest';
import betainc from '@stdlib/math-base-special-betainc';
import betaincinv from '@stdlib/math-base-special-betaincinv';
import gammaln from '@stdlib/math-base-special-gammaln';
import { xoroshiro128plus } from 'pure-rand/generator/xoroshiro128plus';
import { uniformFloat64 } from 'pure-rand/distribution/uniformFloat64';
import {
  fCdf,
  fUpper,
  noncentralFCdf,
  noncentralFUpper,
  noncentralTCdf,
  noncentralTUpper,
  normalCdf,
  normalUpper,
  tCdf,
  tUpper,
} from '../../../src/stats/distributions/index.ts';
import { expectRel, jStat, relErr, Worst } from './helpers.ts';

describe('reduction to the central distributions, to 1e-12', () => {
  it('delta = 0 gives Student t', () => {
    for (const df of [0.5, 1, 1.5, 2, 3, 7, 20, 100, 1e4, 1e6]) {
      for (const t of [-1e6, -200, -40, -8, -3, -1, -0.2, 0, 0.2, 1, 3, 8, 40, 200, 1e6]) {
        expectRel(noncentralTCdf(t, df, 0), tCdf(t, df), 1e-12, `cdf t ${t}, df ${df}`);
        expectRel(noncentralTUpper(t, df, 0), tUpper(t, df), 1e-12, `upper t ${t}, df ${df}`);
      }
    }
  });

  it('lambda = 0 (and lambda = 1e-13) gives central F', () => {
    for (const [d1, d2] of [[1, 5], [2, 27], [3, 20], [10, 1000], [0.5, 3]] as const) {
      for (const f of [1e-6, 0.1, 1, 3, 10, 100, 1e4]) {
        expectRel(noncentralFCdf(f, d1, d2, 0), fCdf(f, d1, d2), 1e-12, `cdf ${f}, ${d1},${d2}`);
        expectRel(noncentralFUpper(f, d1, d2, 0), fUpper(f, d1, d2), 1e-12, `upper ${f}, ${d1},${d2}`);
        // The mixture path with a tiny noncentrality: the change is about lambda / 2 relative.
        expectRel(noncentralFUpper(f, d1, d2, 1e-13), fUpper(f, d1, d2), 1e-11, `upper, tiny lambda, ${f}`);
        expectRel(noncentralFCdf(f, d1, d2, 1e-13), fCdf(f, d1, d2), 1e-11, `cdf, tiny lambda, ${f}`);
      }
    }
  });
});

/**
 * P(T <= t) by the series of Lenth (1989), Algorithm AS 243, Applied Statistics 38, 185-189
 * (after Guenther 1978), summed plainly with @stdlib's incomplete beta function: an
 * implementation independent of ours (which integrates over the scale).
 */
function lenthSeries(t: number, df: number, delta: number): number {
  if (t < 0) return 1 - lenthSeries(-t, df, -delta);
  const x = (t * t) / (t * t + df);
  const h = (delta * delta) / 2;
  let sum = 0;
  for (let j = 0; j < 400; j++) {
    const pj = Math.exp(-h + j * Math.log(h || 1e-300) - gammaln(j + 1));
    const qj = (delta / Math.SQRT2) * Math.exp(-h + j * Math.log(h || 1e-300) - gammaln(j + 1.5));
    const term = pj * betainc(x, j + 0.5, df / 2) + qj * betainc(x, j + 1, df / 2);
    sum += term;
    if (j > h + 10 && Math.abs(term) < 1e-18) break;
    if (h === 0 && j === 0) break;
  }
  return normalCdf(-delta) + 0.5 * sum;
}

describe('noncentral t against other implementations', () => {
  const POINTS: [number, number, number][] = [];
  for (const df of [1, 3, 5, 12, 30, 100]) {
    for (const delta of [-2, -0.5, 0.5, 1, 2.5, 4]) {
      for (const t of [-3, -1, 0.5, 1, 2, 3.5, 6]) POINTS.push([t, df, delta]);
    }
  }

  it("Lenth's series (AS 243) in the body, to 1e-10", () => {
    // source: Lenth (1989) AS 243 series, evaluated with @stdlib/math-base-special-betainc 0.2.3
    const w = new Worst();
    for (const [t, df, delta] of POINTS) {
      const ref = lenthSeries(t, df, delta);
      if (ref < 1e-6 || ref > 1 - 1e-6) continue;
      const got = noncentralTCdf(t, df, delta);
      w.add('cdf', relErr(got, ref), `t ${t}, df ${df}, delta ${delta}`);
      expectRel(got, ref, 1e-10, `cdf t ${t}, df ${df}, delta ${delta}`);
      expectRel(noncentralTUpper(t, df, delta), 1 - ref, 1e-10, `upper t ${t}, df ${df}, delta ${delta}`);
    }
    w.print("noncentral t against Lenth's series: worst relative error");
  });

  it('jstat in the body, where it is good to about 1e-7', () => {
    // source: jstat 1.9.6 jStat.noncentralt.cdf
    const w = new Worst();
    for (const [t, df, delta] of POINTS) {
      const got = noncentralTCdf(t, df, delta);
      if (got < 1e-3 || got > 1 - 1e-3) continue;
      const e = relErr(jStat.noncentralt.cdf(t, df, delta), got);
      w.add('cdf, body', e, `t ${t}, df ${df}, delta ${delta}`);
      expect(e, `t ${t}, df ${df}, delta ${delta}`).toBeLessThan(1e-6);
    }
    // Its upper tail, as 1 - cdf, collapses far out; ours does not.
    const ours = noncentralTUpper(40, 10, 1);
    expect(ours).toBeGreaterThan(1e-12);
    w.add('upper as 1 - cdf at t 40, df 10, delta 1', relErr(1 - jStat.noncentralt.cdf(40, 10, 1), ours), '');
    w.print('jstat noncentral t against ours');
  });

  it('the square of noncentral t is noncentral F(1, df, delta^2), far tails included', () => {
    // source: JKB 2, ch. 30 (T'^2 on df is F'(1, df, delta^2)); the two sides come from
    // different algorithms (integral over the scale, Poisson mixture of incomplete betas)
    const w = new Worst();
    for (const df of [2, 5, 10, 40]) {
      for (const delta of [0.5, 1, 2, 4]) {
        for (const r of [0.5, 1, 2, 4, 8, 20, 40, 100]) {
          const viaT = noncentralTUpper(r, df, delta) + noncentralTCdf(-r, df, delta);
          const viaF = noncentralFUpper(r * r, 1, df, delta * delta);
          w.add(viaF >= 1e-3 ? 'body' : 'tail', relErr(viaF, viaT), `df ${df}, delta ${delta}, t ${r}`);
          expectRel(viaF, viaT, 1e-10, `T'^2 = F' at df ${df}, delta ${delta}, t ${r}`);
          expectRel(noncentralFCdf(r * r, 1, df, delta * delta), 1 - viaT, 1e-10, `cdf side, df ${df}`);
        }
      }
    }
    w.print('noncentral t squared against noncentral F: worst relative error');
  });

  it('noncentral chi-square on 1 df (df2 = Infinity) in closed form', () => {
    // source: P(chi'^2_1(lambda) <= x) = Phi(sqrt x - sqrt lambda) - Phi(-sqrt x - sqrt lambda)
    // (the square of a normal with mean sqrt lambda; common practice, no source)
    for (const lambda of [0.5, 2, 9, 30]) {
      for (const x of [0.01, 0.5, 2, 5, 20, 60, 150]) {
        const a = Math.sqrt(x);
        const m = Math.sqrt(lambda);
        const upper = normalUpper(a - m) + normalCdf(-a - m);
        const lower = normalCdf(a - m) - normalCdf(-a - m);
        expectRel(noncentralFUpper(x, 1, Infinity, lambda), upper, 1e-11, `upper x ${x}, lambda ${lambda}`);
        expectRel(noncentralFCdf(x, 1, Infinity, lambda), lower, 1e-11, `cdf x ${x}, lambda ${lambda}`);
      }
    }
  });
});

/** Standard normal draws by the Box-Muller transform (Box and Muller 1958). */
function normalSource(seed: number): () => number {
  const rng = xoroshiro128plus(seed);
  let spare: number | null = null;
  return () => {
    if (spare !== null) {
      const v = spare;
      spare = null;
      return v;
    }
    const u1 = 1 - uniformFloat64(rng); // in (0, 1]
    const u2 = uniformFloat64(rng);
    const r = Math.sqrt(-2 * Math.log(u1));
    spare = r * Math.sin(2 * Math.PI * u2);
    return r * Math.cos(2 * Math.PI * u2);
  };
}

/** Clopper-Pearson interval for a binomial proportion (coverage `level`). */
function clopperPearson(x: number, n: number, level: number): [number, number] {
  const a = (1 - level) / 2;
  const lo = x === 0 ? 0 : betaincinv(a, x, n - x + 1);
  const hi = x === n ? 1 : betaincinv(1 - a, x + 1, n - x);
  return [lo, hi];
}

describe('seeded Monte Carlo (40,000 draws, 99.9% Clopper-Pearson interval)', () => {
  const N = 40_000;

  it.each([
    // t, df, delta, which tail
    [2.0, 10, 1.5, 'upper'],
    [-1.0, 5, 0.5, 'lower'],
    [3.0, 20, 2.5, 'upper'],
    [1.5, 3, -0.5, 'upper'],
  ] as const)('noncentral t at t %f, df %i, delta %f (%s)', (t, df, delta, tail) => {
    const z = normalSource(20260 + df);
    let hits = 0;
    for (let i = 0; i < N; i++) {
      let ss = 0;
      for (let j = 0; j < df; j++) {
        const e = z();
        ss += e * e;
      }
      const value = (z() + delta) / Math.sqrt(ss / df);
      if (tail === 'upper' ? value > t : value <= t) hits++;
    }
    const p = tail === 'upper' ? noncentralTUpper(t, df, delta) : noncentralTCdf(t, df, delta);
    const [lo, hi] = clopperPearson(hits, N, 0.999);
    console.log(`noncentral t ${t}, ${df}, ${delta} ${tail}: computed ${p.toFixed(5)}, simulated ${(hits / N).toFixed(5)} [${lo.toFixed(5)}, ${hi.toFixed(5)}]`);
    expect(p).toBeGreaterThanOrEqual(lo);
    expect(p).toBeLessThanOrEqual(hi);
  });

  it.each([
    // f, df1, df2, lambda
    [3.0, 3, 15, 6],
    [1.5, 2, 30, 2],
    [5.0, 4, 12, 20],
    [2.0, 1, 10, 9],
  ] as const)('noncentral F upper at f %f, df %i and %i, lambda %f', (f, d1, d2, lambda) => {
    const z = normalSource(7919 + d1 * 100 + d2);
    const shift = Math.sqrt(lambda);
    let hits = 0;
    for (let i = 0; i < N; i++) {
      const first = z() + shift;
      let num = first * first;
      for (let j = 1; j < d1; j++) {
        const e = z();
        num += e * e;
      }
      let den = 0;
      for (let j = 0; j < d2; j++) {
        const e = z();
        den += e * e;
      }
      if (num / d1 / (den / d2) > f) hits++;
    }
    const p = noncentralFUpper(f, d1, d2, lambda);
    const [lo, hi] = clopperPearson(hits, N, 0.999);
    console.log(`noncentral F ${f}, ${d1}, ${d2}, ${lambda}: computed ${p.toFixed(5)}, simulated ${(hits / N).toFixed(5)} [${lo.toFixed(5)}, ${hi.toFixed(5)}]`);
    expect(p).toBeGreaterThanOrEqual(lo);
    expect(p).toBeLessThanOrEqual(hi);
  });
});

describe('tails and edges', () => {
  // The two tails are summed separately, so their sum checks the rounding of both; the
  // accuracy target is 1e-10, and the sums are asked to be 1 within 1e-12 (measured values
  // are printed).
  it('far tails stay positive and add up with the other tail', () => {
    const w = new Worst();
    for (const [t, df, delta] of [[40, 10, 1], [200, 3, 2], [-30, 8, 1], [15, 50, -3]] as const) {
      const u = noncentralTUpper(t, df, delta);
      const c = noncentralTCdf(t, df, delta);
      expect(Math.min(u, c)).toBeGreaterThan(0);
      w.add('noncentral t: |upper + cdf - 1|', Math.abs(u + c - 1), `${t}, ${df}, ${delta}`);
      expect(Math.abs(u + c - 1)).toBeLessThan(1e-12);
    }
    for (const [f, d1, d2, lambda] of [[1000, 3, 20, 5], [1e4, 2, 5, 30], [1e-8, 5, 10, 50], [60, 4, 30, 2000]] as const) {
      const u = noncentralFUpper(f, d1, d2, lambda);
      const c = noncentralFCdf(f, d1, d2, lambda);
      expect(Math.min(u, c)).toBeGreaterThan(0);
      w.add('noncentral F: |upper + cdf - 1|', Math.abs(u + c - 1), `${f}, ${d1}, ${d2}, ${lambda}`);
      expect(Math.abs(u + c - 1)).toBeLessThan(1e-12);
    }
    w.print('sum of the two tails');
  });

  it('large noncentrality', () => {
    // The mean of F'(d1, d2, lambda) is d2 (d1 + lambda) / (d1 (d2 - 2)) (JKB 2, eq. 30.18);
    // with lambda = 2000 most of the mass sits near it, and the two tails still add up to 1.
    const mean = (30 * (4 + 2000)) / (4 * 28);
    const c = noncentralFCdf(mean, 4, 30, 2000);
    expect(c).toBeGreaterThan(0.3);
    expect(c).toBeLessThan(0.8);
    expect(Math.abs(c + noncentralFUpper(mean, 4, 30, 2000) - 1)).toBeLessThan(1e-12);
    // Power grows with the noncentrality.
    let prev = 0;
    for (const lambda of [0, 1, 5, 20, 80, 300]) {
      const p = noncentralFUpper(3, 3, 20, lambda);
      expect(p).toBeGreaterThan(prev);
      prev = p;
    }
  });

  it('invalid parameters give NaN', () => {
    expect(noncentralTCdf(1, 0, 1)).toBeNaN();
    expect(noncentralTUpper(1, -2, 1)).toBeNaN();
    expect(noncentralTCdf(NaN, 5, 1)).toBeNaN();
    expect(noncentralTCdf(1, 5, NaN)).toBeNaN();
    expect(noncentralFCdf(1, 0, 5, 1)).toBeNaN();
    expect(noncentralFUpper(1, 3, 0, 1)).toBeNaN();
    expect(noncentralFUpper(1, 3, 5, -1)).toBeNaN();
    expect(noncentralFUpper(NaN, 3, 5, 1)).toBeNaN();
  });
});
