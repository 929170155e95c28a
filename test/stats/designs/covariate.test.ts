/**
 * Analysis of covariance: cross-checks inside the project and bad input. statsmodels'
 * figures are in test/reference/covariate.test.ts.
 */
import { describe, expect, it } from 'vitest';
import { blocked, withCovariate } from '../../../src/stats/designs/index.ts';
import { evalFormula } from '../../helpers.ts';
import { expectRelative, factorOf, normals, seeded } from './support.ts';

function trial(seed: number) {
  const z = normals(seeded(seed));
  const y: number[] = [];
  const t: string[] = [];
  const b: string[] = [];
  for (let k = 0; k < 6; k++) {
    for (let i = 0; i < 4; i++) {
      y.push(10 + i + 0.5 * k + z());
      t.push(`t${i + 1}`);
      b.push(`b${k + 1}`);
    }
  }
  return { y: Float64Array.from(y), trt: factorOf('trt', t), block: factorOf('block', b) };
}

describe('covariate cross-checks', () => {
  it('a covariate with slope exactly zero leaves the blocked sums of squares unchanged', () => {
    const d = trial(3);
    const base = blocked(d.y, d.trt, d.block);
    // a covariate in the error space, orthogonal to the residuals of y: its slope is zero
    // in the full model and in every reduced one (common practice, no source)
    const other = blocked(trial(99).y, d.trt, d.block).residuals;
    const e = base.residuals;
    let ee = 0;
    let oe = 0;
    for (let i = 0; i < e.length; i++) {
      ee += e[i]! * e[i]!;
      oe += other[i]! * e[i]!;
    }
    const x = Float64Array.from(other, (v, i) => 5 + v - (oe / ee) * e[i]!);
    const fit = withCovariate(d.y, { name: 'x', values: x }, d.trt, d.block);
    expect(Math.abs(fit.covariate!.slope)).toBeLessThan(1e-12);
    expectRelative(fit.table.ss[0]!, base.table.ss[0]!, 1e-10, 'treatment SS');
    expectRelative(fit.table.ss[1]!, base.table.ss[1]!, 1e-10, 'block SS');
    expect(fit.table.ss[2]!).toBeLessThan(1e-20);
    expectRelative(fit.table.ss[3]!, base.table.ss[2]!, 1e-12, 'error SS');
    expect(fit.df_error).toBe(base.df_error - 1);
    for (let g = 0; g < 4; g++) expectRelative(fit.means.mean[g]!, base.means.mean[g]!, 1e-12, `mean ${g}`);
  });
  it('each adjusted sum of squares is the rise in error when its term is dropped', () => {
    const d = trial(8);
    const x = Float64Array.from(d.y, (v, i) => (i % 7) + 0.3 * v);
    const full = withCovariate(d.y, { name: 'x', values: x }, d.trt, d.block);
    // blocks adjusted for treatments and the covariate: SSE(treatments + x) - SSE(full)
    const noBlocks = withCovariate(d.y, { name: 'x', values: x }, d.trt, null);
    expectRelative(full.table.ss[1]!, noBlocks.table.ss[2]! - full.table.ss[3]!, 1e-10, 'block SS');
    // the covariate adjusted for both: SSE(treatments + blocks) - SSE(full)
    const noCovariate = blocked(d.y, d.trt, d.block);
    expectRelative(full.table.ss[2]!, noCovariate.table.ss[2]! - full.table.ss[3]!, 1e-10, 'covariate SS');
  });
});

describe('covariate bad input', () => {
  const table = ['--- table p', 'trt,block,x,y', 'a,1,5,10', 'b,1,5,11', 'a,2,5,12', 'b,2,5,14', 'a,3,5,11', 'b,3,5,13', ''];
  it('refuses a constant covariate in plain words', () => {
    const v = evalFormula('blocked(p.y, p.trt, p.block, covariate: p.x)', ...table);
    expect(typeof v === 'object' && v.kind === 'error' ? v.message : '').toMatch(/covariate "x" has the same value in every plot/);
  });
  it('refuses a covariate with a missing value', () => {
    const t2 = table.map((l) => (l === 'b,2,5,14' ? 'b,2,,14' : l));
    const v = evalFormula('one_way(p.y, p.trt, covariate: p.x)', ...t2);
    expect(typeof v === 'object' && v.kind === 'error' ? v.message : '').toMatch(/covariate "x" is missing in 1 plot/);
  });
  it('refuses a covariate that the blocks explain entirely', () => {
    const t3 = table.map((l, i) => (i >= 2 && l.includes(',') ? l.replace(/^(\w),(\d),5,/, (_m, t, b) => `${t},${b},${b},`) : l));
    const v = evalFormula('blocked(p.y, p.trt, p.block, covariate: p.x)', ...t3);
    expect(typeof v === 'object' && v.kind === 'error' ? v.message : '').toMatch(/same value in every plot \(after what the model already explains\)/);
  });
});
