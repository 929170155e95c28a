/**
 * Comparisons after a fit: Tukey intervals against a published worked example, Bonferroni and
 * least-significant-difference against their definitions with a reference library's t
 * distribution, and standard errors of least-squares means against an explicit computation.
 */
import tCdf from '@stdlib/stats-base-dists-t-cdf';
import tQuantile from '@stdlib/stats-base-dists-t-quantile';
import { describe, expect, it } from 'vitest';
import { contrast, difference, pairwise } from '../../../src/stats/compare/index.ts';
import { shiftDecimals } from '../../../src/stats/decimal/index.ts';
import { blocked, DesignError, factorial, oneWay } from '../../../src/stats/designs/index.ts';
import { denseDesign } from '../../../src/stats/linear/index.ts';
import { expectAbsolute, expectNear, expectRelative, factorOf, plants, seeded, subset, vascular } from '../designs/support.ts';
import { designMsg } from '../../../src/messages/designs.ts';

describe('pairwise: Tukey on Dobson\'s plant weights', () => {
  const { y, group } = plants();
  const fit = oneWay(y, group);
  const res = pairwise(fit, 'tukey', 0.95);

  it('reproduces the published intervals and adjusted p-values', () => {
    // source: docs/references.md section 3, Dobson (1983) plant weights, Tukey HSD at 95% confirmed with
    // scipy 1.10.1 (stats.tukey_hsd): trt2 - trt1 = 0.865 (0.174 to 1.556), p = 0.012;
    // ctrl - trt1 = 0.371 (-0.320 to 1.062), p = 0.391.
    const t = res.table;
    expect(t.a).toEqual(['ctrl', 'ctrl', 'trt1']);
    expect(t.b).toEqual(['trt1', 'trt2', 'trt2']);
    // Pairs are first minus second: trt1 - trt2 is the negative of the published trt2 - trt1.
    expectAbsolute(-t.estimate[2]!, 0.865, 5e-4, 'trt2 - trt1');
    expectAbsolute(-t.high[2]!, 0.174, 5e-4, 'low');
    expectAbsolute(-t.low[2]!, 1.556, 5e-4, 'high');
    expectAbsolute(t.p[2]!, 0.012, 5e-4, 'p');
    expectAbsolute(t.estimate[0]!, 0.371, 5e-4, 'ctrl - trt1');
    expectAbsolute(t.low[0]!, -0.32, 5e-4, 'low');
    expectAbsolute(t.high[0]!, 1.062, 5e-4, 'high');
    expectAbsolute(t.p[0]!, 0.391, 5e-4, 'p');
    expect(t.significant).toEqual([false, false, true]);
    expect(res.df).toBe(27);
  });

  it('uses the studentized range critical value q(level; k, df) / sqrt 2', () => {
    // source: docs/references.md section 5 (handbook table, values from scipy 1.10.1): studentized range,
    // 3 groups, 12 df, 5%: 3.772929. Three groups of five give 12 error df.
    const u = seeded(3);
    const labels = Array.from({ length: 15 }, (_, i) => `g${Math.floor(i / 5)}`);
    const small = oneWay(Float64Array.from(labels, () => u()), factorOf('g', labels));
    const r = pairwise(small, 'tukey', 0.95);
    expectAbsolute(r.critical * Math.SQRT2, 3.772929, 5e-7, 'q(0.95; 3, 12)');
    expectNear(r.table.high[0]! - r.table.low[0]!, 2 * r.critical * r.table.se[0]!, 1e-14, 'interval width');
  });
});

describe('pairwise: Bonferroni and least significant difference', () => {
  const { y, pressure, batch } = vascular();
  const fit = blocked(y, pressure, batch);

  it('match their definitions with @stdlib t quantiles and tails', () => {
    // source: @stdlib/stats-base-dists-t-quantile 0.2.3 and -t-cdf 0.2.3; definitions are
    // common practice: se = sqrt(2 MSE / b); Bonferroni at level 1 - alpha / m, p = min(1, m p).
    const se = Math.sqrt((2 * fit.mse) / 6);
    const m = 6;
    const bon = pairwise(fit, 'bonferroni');
    const lsd = pairwise(fit, 'lsd', 0.9);
    const tb = tQuantile(1 - 0.05 / m / 2, 15);
    const tl = tQuantile(1 - 0.1 / 2, 15);
    for (let k = 0; k < 6; k++) {
      const est = bon.table.estimate[k]!;
      expectRelative(bon.table.se[k]!, se, 1e-13, 'se');
      expectNear(bon.table.low[k]!, est - tb * se, 1e-12, 'Bonferroni low');
      expectNear(bon.table.high[k]!, est + tb * se, 1e-12, 'Bonferroni high');
      const p = 2 * tCdf(-Math.abs(est / se), 15);
      expectNear(bon.table.p[k]!, Math.min(1, m * p), 1e-12, 'Bonferroni p');
      expectNear(lsd.table.p[k]!, p, 1e-12, 'LSD p');
      expectNear(lsd.table.high[k]! - lsd.table.low[k]!, 2 * tl * se, 1e-12, 'LSD width');
      expect(lsd.table.significant[k]).toBe(p < 0.1);
    }
  });

  it('difference() gives the same estimate, se and interval as an unadjusted pair', () => {
    const d = difference(fit, '8500', '9100');
    const lsd = pairwise(fit, 'lsd');
    expectNear(d.estimate, lsd.table.estimate[2]!, 1e-13, 'estimate');
    expectNear(d.low, lsd.table.low[2]!, 1e-12, 'low');
    expectNear(d.p, lsd.table.p[2]!, 1e-13, 'p');
    expectAbsolute(d.estimate, 92.81667 - 85.76667, 1e-5, 'mean difference');
    expect(d.df).toBe(15);
    expectNear(d.t, d.estimate / d.se, 1e-14, 't');
  });
});

describe('comparisons of least-squares means (missing plot)', () => {
  const full = vascular();
  const { y, factors } = subset(full.y, [full.pressure, full.batch], (i) => i !== 15);
  const fit = blocked(y, factors[0]!, factors[1]!);

  it('standard errors come from the covariance of the least-squares means: l\' (X\'X)^-1 l', () => {
    // Explicit design (intercept, pressure and batch sum-to-zero columns) and its inverse.
    const d = denseDesign(factors, [[0], [1]], y.length);
    const xtx = new Float64Array(d.p * d.p);
    for (let a = 0; a < d.p; a++) for (let b = 0; b < d.p; b++) {
      let s = 0;
      for (let i = 0; i < d.n; i++) s += d.x[a * d.n + i]! * d.x[b * d.n + i]!;
      xtx[a * d.p + b] = s;
    }
    // Solve X'X z = l by Gauss-Jordan for l = row(8500) - row(8900) of the pressure coding.
    const l = new Float64Array(d.p);
    l[1] = 1; // 8500 is level 0
    l[3] = -1; // 8900 is level 2
    const m = Array.from({ length: d.p }, (_, r) => [...Array.from(xtx.subarray(r * d.p, (r + 1) * d.p)), l[r]!]);
    for (let c = 0; c < d.p; c++) {
      let piv = c;
      for (let r = c + 1; r < d.p; r++) if (Math.abs(m[r]![c]!) > Math.abs(m[piv]![c]!)) piv = r;
      [m[c], m[piv]] = [m[piv]!, m[c]!];
      const dv = m[c]![c]!;
      m[c] = m[c]!.map((v) => v / dv);
      for (let r = 0; r < d.p; r++) if (r !== c) {
        const f = m[r]![c]!;
        m[r] = m[r]!.map((v, k) => v - f * m[c]![k]!);
      }
    }
    const v = l.reduce((s, li, r) => s + li * m[r]![d.p]!, 0);
    const diff = difference(fit, '8500', '8900');
    expectRelative(diff.se, Math.sqrt(fit.mse * v), 1e-12, 'se of the difference');
    // Tukey-Kramer uses the same per-pair standard error.
    const tk = pairwise(fit, 'tukey');
    expectRelative(tk.table.se[1]!, diff.se, 1e-14, 'Tukey-Kramer se');
  });
});

describe('contrast', () => {
  const { y, group } = plants();
  const fit = oneWay(y, group);

  it('estimates sum w_i m_i with se sqrt(mse sum w_i^2 / n_i)', () => {
    const c = contrast(fit, [1, -0.5, -0.5]);
    const m = fit.means.mean;
    expectNear(c.estimate, m[0]! - 0.5 * m[1]! - 0.5 * m[2]!, 1e-13, 'estimate');
    expectRelative(c.se, Math.sqrt((fit.mse * 1.5) / 10), 1e-13, 'se');
    // source: @stdlib/stats-base-dists-t-cdf 0.2.3
    expectNear(c.p, 2 * tCdf(-Math.abs(c.t), 27), 1e-13, 'p');
    const tq = tQuantile(0.995, 27);
    const c99 = contrast(fit, [1, -0.5, -0.5], 0.99);
    expectNear(c99.high - c99.low, 2 * tq * c.se, 1e-12, '99% width');
  });

  it('refuses weights that do not add to zero or do not match the levels, in plain words', () => {
    expect(() => contrast(fit, [1, 1, -1])).toThrow(DesignError);
    expect(() => contrast(fit, [1, 1, -1])).toThrow(/must add up to zero; these add up to 1/);
    expect(() => contrast(fit, [1, -1])).toThrow(/one weight per level of "group": 3 weights, got 2/);
    expect(() => contrast(fit, [0, 0, 0])).toThrow(/all zero/);
    expect(() => contrast(fit, [1, NaN, -1])).toThrow(/finite/);
    // Weights typed as decimals add to zero only up to rounding, and are accepted.
    expect(() => contrast(fit, [0.3, 0.7, -1])).not.toThrow();
  });
});

describe('comparison errors', () => {
  const { y, group } = plants();
  const fit = oneWay(y, group);
  it('name the problem', () => {
    expect(() => difference(fit, 'ctrl', 'trt9')).toThrow(designMsg.unknownLevel('group', 'trt9', ['ctrl', 'trt1', 'trt2']));
    expect(() => difference(fit, 'ctrl', 'ctrl')).toThrow(designMsg.sameLevel('ctrl'));
    expect(() => pairwise(fit, 'scheffe')).toThrow(designMsg.unknownMethod('scheffe'));
    expect(() => pairwise(fit, 'tukey', 0)).toThrow(designMsg.badLevel(0));
    expect(() => difference(fit, 'ctrl', 'trt1', 0.95, 'block')).toThrow(/no factor "block"/);
  });
  it('refuse a fit without error degrees of freedom', () => {
    const runs = [0, 1, 2, 3].map((c) => [c & 1, c >> 1]);
    const f = factorial(Float64Array.from([3, 5, 4, 9]), [factorOf('a', runs.map((r) => r[0]!)), factorOf('b', runs.map((r) => r[1]!))]);
    expect(() => difference(f, '0', '1')).toThrow(/no error degrees of freedom/);
  });
});

describe('differences keep the digits the decimal shift kept', () => {
  it('SmLs09-like groups 1 and 2 differ by exactly 0.1 to 13 digits', () => {
    // source: NIST StRD SmLs09 generation rule (fixture README): group means 10^12 + c(t) + 0.2
    // approximately; group 1 minus group 2 = c(1) - c(2) = 0.1.
    const c = (k: number): number => (k === 1 ? 2 : k % 2 === 0 ? 1 : 3);
    const texts: string[] = [];
    const g: number[] = [];
    for (let t = 1; t <= 3; t++) for (let r = 1; r <= 21; r++) {
      texts.push(`1000000000000.${c(t) + c(r)}`);
      g.push(t);
    }
    const s = shiftDecimals(texts);
    const fit = oneWay(s.shifted, factorOf('t', g), { offset: s.offset });
    const d = difference(fit, '1', '2');
    expectRelative(d.estimate, 0.1, 1e-13, 'difference');
    // Formed from the displayed means (offset added) the same difference is off in the 4th digit.
    const naive = fit.means.mean[0]! - fit.means.mean[1]!;
    expect(Math.abs(naive - 0.1) / 0.1).toBeGreaterThan(1e-6);
  });
});

describe('seeded sanity: Tukey p-values never fall below unadjusted ones', () => {
  it('holds on random one-way data', () => {
    const u = seeded(77);
    const labels: string[] = [];
    const values: number[] = [];
    for (let k = 0; k < 5; k++) for (let r = 0; r < 4 + k; r++) {
      labels.push(`g${k}`);
      values.push(u() + k * 0.2);
    }
    const fit = oneWay(Float64Array.from(values), factorOf('g', labels));
    const tk = pairwise(fit, 'tukey');
    const lsd = pairwise(fit, 'lsd');
    tk.table.p.forEach((p, k) => expect(p).toBeGreaterThanOrEqual(lsd.table.p[k]!));
    tk.table.high.forEach((h, k) => expect(h - tk.table.low[k]!).toBeGreaterThan(lsd.table.high[k]! - lsd.table.low[k]!));
  });
});
