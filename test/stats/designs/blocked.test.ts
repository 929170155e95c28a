/**
 * Randomized complete blocks: the published vascular-graft example, the missing-plot analysis
 * against Yates's method worked independently here, and the closed form against least squares.
 */
import { describe, expect, it } from 'vitest';
import { shiftDecimals } from '../../../src/stats/decimal/index.ts';
import { blocked, DesignError } from '../../../src/stats/designs/index.ts';
import { fitFactorModel, leastSquaresMeans } from '../../../src/stats/linear/index.ts';
import { expectAbsolute, expectArrayNear, expectNear, expectRelative, factorOf, normals, seeded, subset, vascular, VASCULAR } from './support.ts';
import { designMsg } from '../../../src/messages/designs.ts';

describe('blocked: vascular-graft example', () => {
  const { y, pressure, batch } = vascular();
  const fit = blocked(y, pressure, batch);

  it('reproduces the published analysis of variance', () => {
    // source: Montgomery, Design and Analysis of Experiments, vascular-graft example
    // (from memory, docs/references.md section 4): SS 178.17, 192.25, 109.89, 480.31; F = 8.11.
    expect(fit.table.source).toEqual(['pressure', 'batch', 'error', 'total']);
    expect(fit.table.df).toEqual([3, 5, 15, 23]);
    expectAbsolute(fit.table.ss[0]!, 178.17, 0.005, 'treatment SS');
    expectAbsolute(fit.table.ss[1]!, 192.25, 0.005, 'block SS');
    expectAbsolute(fit.table.ss[2]!, 109.89, 0.005, 'error SS');
    expectAbsolute(fit.table.ss[3]!, 480.31, 0.005, 'total SS');
    expectAbsolute(fit.table.f[0]!, 8.11, 0.005, 'F');
    // source: statsmodels 0.13.5 (ols + anova_lm), docs/references.md section 4
    expectRelative(fit.mse, 7.32575, 1e-6, 'error mean square');
    expectRelative(fit.table.p[0]!, 0.001916, 5e-4, 'p');
    expect(fit.design).toBe('randomized complete block');
    expect(fit.balanced).toBe(true);
  });

  it('gives the relative efficiency before and after the degrees-of-freedom correction', () => {
    // source: docs/references.md section 4: 1.9236 before, 1.8727 after ((dfb+1)(dfr+3))/((dfb+3)(dfr+1)),
    // dfb = 15, dfr = 20.
    expectAbsolute(fit.relative_efficiency_uncorrected!, 1.9236, 5e-5, 'uncorrected');
    expectAbsolute(fit.relative_efficiency!, 1.8727, 5e-5, 'corrected');
    // The textbook form ((b - 1) MS_b + b (t - 1) MS_e) / ((bt - 1) MS_e), by hand.
    const msb = fit.table.ms[1]!;
    const hand = (5 * msb + 6 * 3 * fit.mse) / (23 * fit.mse);
    expectRelative(fit.relative_efficiency_uncorrected!, hand, 1e-14, 'textbook form');
    expectRelative(fit.relative_efficiency!, (hand * (16 * 23)) / (18 * 21), 1e-14, 'corrected by hand');
  });

  it("gives Tukey's one-degree-of-freedom test for nonadditivity", () => {
    // source: docs/references.md section 4: SS 0.19686, F = 0.02513 on 1 and 14 df, p = 0.8763
    const na = fit.nonadditivity!;
    expectAbsolute(na.ss, 0.19686, 5e-6, 'SS');
    expectAbsolute(na.f, 0.02513, 5e-6, 'F');
    expectAbsolute(na.p, 0.8763, 5e-5, 'p');
    expect([na.df1, na.df2]).toEqual([1, 14]);
  });

  it('follows the degrees-of-freedom rule (t - 1)(b - 1) for error', () => {
    // common practice, no source
    expect(fit.df_error).toBe((4 - 1) * (6 - 1));
    expect(fit.table.df[3]).toBe(24 - 1);
  });

  it('gives the same analysis when the data arrive as decimal text through the shift', () => {
    const texts = VASCULAR.flatMap(([, row]) => row.map((v) => v.toFixed(1)));
    const shift = shiftDecimals(texts);
    expect(shift.offset).not.toBe(0);
    const viaText = blocked(shift.shifted, pressure, batch, { offset: shift.offset });
    expectArrayNear(viaText.table.ss, fit.table.ss, 1e-12, 'sums of squares');
    expectArrayNear(viaText.means.mean, fit.means.mean, 1e-12, 'means');
    expectArrayNear(viaText.fitted, fit.fitted, 1e-12, 'fitted');
    expectNear(viaText.grand_mean, fit.grand_mean, 1e-12, 'grand mean');
  });
});

describe('blocked: a missing plot (8900 psi in batch 4)', () => {
  const full = vascular();
  const missingIndex = 2 * 6 + 3; // row 8900, batch 4
  const { y, factors } = subset(full.y, [full.pressure, full.batch], (i) => i !== missingIndex);
  const fit = blocked(y, factors[0]!, factors[1]!);

  it('fits by least squares: error SS 90.6116 on 14 df, adjusted treatment SS 172.2159, F 8.869', () => {
    // source: statsmodels 0.13.5 (docs/references.md section 4 and the brief's missing-plot check)
    expect(fit.balanced).toBe(false);
    expect(fit.df_error).toBe(14);
    expectAbsolute(fit.table.ss[2]!, 90.6116, 5e-5, 'error SS');
    expectAbsolute(fit.table.ss[0]!, 172.2159, 5e-5, 'adjusted treatment SS');
    expectAbsolute(fit.table.f[0]!, 8.869, 5e-4, 'F');
    expect(fit.notes).toContain(designMsg.missingPlot('block', '4', '8900'));
  });

  it("agrees with Yates's missing-plot method, computed here from its formulas", () => {
    // source: Yates (1933) missing-plot technique, as in Montgomery's treatment of the
    // vascular-graft example (from memory): x = (tT + bB - G) / ((t - 1)(b - 1)); the
    // completed data give the least-squares error SS; the completed treatment SS less the
    // bias (B - (t - 1) x)^2 / (t (t - 1)) is the adjusted treatment SS.
    const t = 4;
    const b = 6;
    const rows = VASCULAR.map(([, r]) => [...r]);
    const T = rows[2]!.reduce((s, v, j) => (j === 3 ? s : s + v), 0);
    const B = rows.reduce((s, r, i) => (i === 2 ? s : s + r[3]!), 0);
    const G = rows.flat().reduce((s, v) => s + v, 0) - rows[2]![3]!;
    const x = (t * T + b * B - G) / ((t - 1) * (b - 1));
    expectAbsolute(x, 91.7533, 5e-5, 'missing-plot estimate');
    rows[2]![3] = x;
    // Completed-data analysis by the textbook formulas.
    const all = rows.flat();
    const grand = all.reduce((s, v) => s + v, 0) / (t * b);
    const trtMeans = rows.map((r) => r.reduce((s, v) => s + v, 0) / b);
    const blkMeans = Array.from({ length: b }, (_, j) => rows.reduce((s, r) => s + r[j]!, 0) / t);
    const sst = all.reduce((s, v) => s + (v - grand) ** 2, 0);
    const ssTrt = b * trtMeans.reduce((s, m) => s + (m - grand) ** 2, 0);
    const ssBlk = t * blkMeans.reduce((s, m) => s + (m - grand) ** 2, 0);
    const sse = sst - ssTrt - ssBlk;
    const bias = (B - (t - 1) * x) ** 2 / (t * (t - 1));
    expectRelative(fit.table.ss[2]!, sse, 1e-12, 'error SS, least squares against completed data');
    expectRelative(fit.table.ss[0]!, ssTrt - bias, 1e-12, 'adjusted treatment SS against the bias-corrected one');
  });

  it('gives least-squares means with their own standard errors', () => {
    // The 8900 mean rests on five plots plus what the blocks say: its standard error is
    // larger than the others', which are all equal by symmetry.
    const se = fit.means.se;
    expect(se[2]!).toBeGreaterThan(se[0]!);
    expectNear(se[0]!, se[1]!, 1e-12, 'symmetry');
    expectNear(se[0]!, se[3]!, 1e-12, 'symmetry');
    // The complete treatments' least-squares means equal their plain means (each has a plot
    // in every block).
    expectNear(fit.means.mean[0]!, VASCULAR[0]![1].reduce((s, v) => s + v, 0) / 6, 1e-12, 'mean 8500');
    expect(fit.means.n).toEqual([6, 6, 5, 6]);
  });
});

describe('blocked: closed form against least squares on balanced data', () => {
  for (const r of [1, 2]) {
    it(`agrees to 1e-10 with ${r} plot${r === 1 ? '' : 's'} per cell`, () => {
      const u = seeded(17 + r);
      const z = normals(u);
      const trt: number[] = [];
      const blk: number[] = [];
      const yv: number[] = [];
      for (let j = 0; j < 7; j++) {
        for (let k = 0; k < 5; k++) {
          for (let rep = 0; rep < r; rep++) {
            trt.push(k);
            blk.push(j);
            yv.push(50 + k * 0.7 + Math.cos(j) * 2 + z());
          }
        }
      }
      const y = Float64Array.from(yv);
      const T = factorOf('t', trt);
      const B = factorOf('b', blk);
      const closed = blocked(y, T, B);
      const ls = fitFactorModel({ y, factors: [T, B], terms: [[0], [1]] });
      expect(closed.balanced).toBe(true);
      expect(closed.df_error).toBe(ls.dfError);
      expectRelative(closed.table.ss[0]!, ls.termSS[0]!, 1e-10, 'treatment SS');
      expectRelative(closed.table.ss[1]!, ls.termSS[1]!, 1e-10, 'block SS');
      expectRelative(closed.table.ss[2]!, ls.sse, 1e-10, 'error SS');
      expectArrayNear(closed.fitted, ls.fitted, 1e-10, 'fitted');
      expectArrayNear(closed.residuals, ls.residuals, 1e-10, 'residuals');
      expectArrayNear(closed.leverage, ls.leverage, 1e-10, 'leverage');
      const lsMeans = leastSquaresMeans(ls, 0);
      expectArrayNear(closed.means.mean, lsMeans.mean, 1e-10, 'means');
      const k = 5;
      closed.means.se.forEach((se, i) => expectRelative(se, Math.sqrt(closed.mse * lsMeans.covariance[i * k + i]!), 1e-10, `se ${i}`));
      // Sums of squares of a balanced design add up to the total (common practice, no source).
      expectRelative(closed.table.ss[0]! + closed.table.ss[1]! + closed.table.ss[2]!, closed.table.ss[3]!, 1e-12, 'sum of SS');
      expect(closed.nonadditivity === undefined).toBe(r !== 1);
    });
  }
});

describe('blocked: designs too broken to estimate', () => {
  const { y, pressure, batch } = vascular();
  it('refuses a block with one plot', () => {
    const { y: y2, factors } = subset(y, [pressure, batch], (i) => i % 6 !== 5 || i === 5);
    expect(() => blocked(y2, factors[0]!, factors[1]!)).toThrow(DesignError);
    expect(() => blocked(y2, factors[0]!, factors[1]!)).toThrow(/block "6" has only one plot/);
  });
  it('refuses a treatment with no data', () => {
    const { y: y2, factors } = subset(y, [pressure, batch], (i) => i >= 6);
    expect(() => blocked(y2, factors[0]!, factors[1]!)).toThrow(/treatment "8500" has no observations/);
  });
  it('refuses treatments that never meet through blocks', () => {
    // 8500 and 8700 only in batches 1-3, 8900 and 9100 only in batches 4-6.
    const keep = (i: number): boolean => (Math.floor(i / 6) < 2 ? i % 6 < 3 : i % 6 >= 3);
    const { y: y2, factors } = subset(y, [pressure, batch], keep);
    expect(() => blocked(y2, factors[0]!, factors[1]!)).toThrow(/never meet in a block/);
  });
  it('refuses a response that is not finite and codes out of range', () => {
    const bad = Float64Array.from(y, (v, i) => (i === 4 ? Infinity : v));
    expect(() => blocked(bad, pressure, batch)).toThrow(designMsg.notFinite(4));
    const codes = Int32Array.from(batch.codes, (c, i) => (i === 2 ? 9 : c));
    expect(() => blocked(y, pressure, { ...batch, codes })).toThrow(/level code 9 at row 3, but only 6 levels/);
    expect(() => blocked(y.subarray(2), pressure, batch)).toThrow(designMsg.lengthMismatch('treatment "pressure"', 24, 22));
  });
  it('drops a block whose plots are all missing, with a note', () => {
    const { y: y2, factors } = subset(y, [pressure, batch], (i) => i % 6 !== 2);
    const fit = blocked(y2, factors[0]!, factors[1]!);
    expect(fit.notes).toContain(designMsg.emptyBlockDropped('3'));
    expect(fit.df_error).toBe(3 * 4);
    expect(fit.balanced).toBe(true);
  });
});
