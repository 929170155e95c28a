/**
 * One-way analysis of variance: a published worked example, a reference library on the same
 * data, and the degrees-of-freedom facts of the trade.
 */
import anova1 from '@stdlib/stats-anova1';
import { describe, expect, it } from 'vitest';
import { shiftDecimals } from '../../../src/stats/decimal/index.ts';
import { DesignError, oneWay } from '../../../src/stats/designs/index.ts';
import { expectAbsolute, expectArrayNear, expectNear, expectRelative, factorOf, normals, plants, PLANTS, seeded } from './support.ts';
import { designMsg } from '../../../src/messages/designs.ts';

describe('oneWay', () => {
  it("reproduces Dobson's plant weights", () => {
    const { y, group } = plants();
    const fit = oneWay(y, group);
    // source: Dobson (1983), plant weights; values confirmed with scipy 1.10.1 (docs/references.md section 3)
    expect(fit.table.source).toEqual(['group', 'error', 'total']);
    expect(fit.table.df).toEqual([2, 27, 29]);
    expectAbsolute(fit.table.ss[0]!, 3.76634, 5e-6, 'between SS');
    expectAbsolute(fit.table.ss[1]!, 10.49209, 5e-6, 'within SS');
    expectRelative(fit.table.f[0]!, 4.846088, 1e-6, 'F');
    expectRelative(fit.table.p[0]!, 0.01591, 1e-4, 'p');
    expect(fit.design).toBe('completely randomized (one-way)');
    expect(fit.balanced).toBe(true);
  });

  it('agrees with @stdlib/stats-anova1 on the same data', () => {
    const { y } = plants();
    const labels = PLANTS.flatMap(([name, row]) => row.map(() => name));
    const ref = anova1(Array.from(y), labels);
    const fit = oneWay(y, factorOf('group', labels));
    // source: @stdlib/stats-anova1 0.2.3
    expectRelative(fit.table.ss[0]!, ref.treatment.ss, 1e-12, 'treatment SS');
    expectRelative(fit.table.ss[1]!, ref.error.ss, 1e-12, 'error SS');
    expectRelative(fit.mse, ref.error.ms, 1e-12, 'error MS');
    expectRelative(fit.table.f[0]!, ref.statistic, 1e-12, 'F');
    expectRelative(fit.table.p[0]!, ref.pValue, 1e-9, 'p');
    expect(fit.table.df[0]).toBe(ref.treatment.df);
    expect(fit.df_error).toBe(ref.error.df);
  });

  it('agrees with @stdlib/stats-anova1 on unequal groups', () => {
    const u = seeded(99);
    const z = normals(u);
    const labels: string[] = [];
    const values: number[] = [];
    ['a', 'b', 'c', 'd'].forEach((g, k) => {
      for (let r = 0; r < 5 + 3 * k; r++) {
        labels.push(g);
        values.push(10 + k * 0.4 + z());
      }
    });
    const ref = anova1(values, labels);
    const fit = oneWay(Float64Array.from(values), factorOf('g', labels));
    // source: @stdlib/stats-anova1 0.2.3
    expectRelative(fit.table.ss[0]!, ref.treatment.ss, 1e-11, 'treatment SS');
    expectRelative(fit.table.ss[1]!, ref.error.ss, 1e-11, 'error SS');
    expectRelative(fit.table.f[0]!, ref.statistic, 1e-11, 'F');
    expectRelative(fit.table.p[0]!, ref.pValue, 1e-8, 'p');
    expect(fit.balanced).toBe(false);
  });

  it('follows the degrees-of-freedom facts and pools variances by their df', () => {
    // common practice, no source: total N - 1, k treatments take k - 1, the pooled variance
    // weights each group's variance by its degrees of freedom.
    const u = seeded(5);
    const sizes = [3, 7, 4, 9, 2];
    const labels: string[] = [];
    const values: number[] = [];
    sizes.forEach((n, k) => {
      for (let r = 0; r < n; r++) {
        labels.push(`g${k}`);
        values.push(u() * 10);
      }
    });
    const fit = oneWay(Float64Array.from(values), factorOf('g', labels));
    const N = values.length;
    expect(fit.table.df).toEqual([sizes.length - 1, N - sizes.length, N - 1]);
    let num = 0;
    let den = 0;
    sizes.forEach((_, k) => {
      const v = values.filter((_, i) => labels[i] === `g${k}`);
      const m = v.reduce((s, x) => s + x, 0) / v.length;
      const s2 = v.reduce((s, x) => s + (x - m) ** 2, 0) / (v.length - 1);
      num += (v.length - 1) * s2;
      den += v.length - 1;
    });
    expectRelative(fit.mse, num / den, 1e-13, 'pooled variance');
    expectNear(fit.table.ss[0]! + fit.table.ss[1]!, fit.table.ss[2]!, 1e-12, 'between + within = total');
  });

  it('returns fitted values, residuals, leverages and studentized residuals consistent with each other', () => {
    const { y, group } = plants();
    const fit = oneWay(y, group);
    expectArrayNear(Float64Array.from(y, (_, i) => fit.fitted[i]! + fit.residuals[i]!), y, 1e-14, 'fitted + residual');
    expectArrayNear(fit.leverage, new Float64Array(30).fill(0.1), 1e-15, 'leverage 1/n');
    const expected = Float64Array.from(fit.residuals, (r, i) => r / Math.sqrt(fit.mse * (1 - fit.leverage[i]!)));
    expectArrayNear(fit.studentized_residuals, expected, 1e-14, 'studentized');
    expectNear(fit.grand_mean, y.reduce((s, v) => s + v, 0) / 30, 1e-14, 'grand mean');
    expectAbsolute(fit.r2, 3.76634 / 14.25843, 1e-5, 'R squared');
  });

  it('adds the decimal offset back to means and fitted values only', () => {
    const { group } = plants();
    const texts = PLANTS.flatMap(([, row]) => row.map((v) => `100000.${String(Math.round(v * 100)).padStart(4, '0')}`));
    const shift = shiftDecimals(texts);
    expect(shift.offset).not.toBe(0);
    const fit = oneWay(shift.shifted, group, { offset: shift.offset });
    const plain = oneWay(plants().y, group);
    // Data are the plant weights / 100 + 100000: SS scale by 1e-4, means by /100 + 100000.
    expectRelative(fit.table.ss[0]!, plain.table.ss[0]! * 1e-4, 1e-12, 'between SS');
    expectRelative(fit.table.f[0]!, plain.table.f[0]!, 1e-11, 'F');
    plain.means.mean.forEach((m, k) => expectNear(fit.means.mean[k]!, 100000 + m / 100, 1e-9, `mean ${k}`));
    expectNear(fit.fitted[0]!, 100000 + plain.fitted[0]! / 100, 1e-9, 'fitted');
    expectNear(fit.residuals[0]!, plain.residuals[0]! / 100, 1e-13, 'residual');
  });

  it('refuses designs it cannot analyse, in plain words', () => {
    const { y, group } = plants();
    const withEmpty = { ...group, levels: [...group.levels, 'trt3'] };
    expect(() => oneWay(y, withEmpty)).toThrow(DesignError);
    expect(() => oneWay(y, withEmpty)).toThrow(/treatment "trt3" has no observations/);
    expect(() => oneWay(y, factorOf('g', new Array<string>(30).fill('x')))).toThrow(/at least 2 are needed/);
    expect(() => oneWay(y.subarray(1), group)).toThrow(/has 30 values but the response has 29/);
    expect(() => oneWay(Float64Array.from([1, NaN, 3, 4]), factorOf('g', ['a', 'a', 'b', 'b']))).toThrow(designMsg.notFinite(1));
    expect(() => oneWay(Float64Array.from([1, 2]), factorOf('g', ['a', 'b']))).toThrow(designMsg.tooFewObservations(2, 2));
    expect(() => oneWay(y, group, { level: 1.5 })).toThrow(designMsg.badLevel(1.5));
  });

  it('echoes the rows dropped upstream into the notes', () => {
    const { y, group } = plants();
    expect(oneWay(y, group, { dropped: 3 }).notes).toContain(designMsg.dropped(3));
  });
});
