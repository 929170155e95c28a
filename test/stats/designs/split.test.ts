/**
 * Split plots: cross-checks inside the project and bad input. The published example and
 * statsmodels' figures are in test/reference/split-plot.test.ts.
 */
import { describe, expect, it } from 'vitest';
import { contrast, difference, pairwise } from '../../../src/stats/compare/index.ts';
import { blocked, DesignError, splitPlot } from '../../../src/stats/designs/index.ts';
import { designMsg } from '../../../src/messages/designs.ts';
import { expectRelative, factorOf, normals, seeded } from './support.ts';

/** A generated split plot: r blocks, a whole levels, b sub levels, seeded normal noise. */
function generated(r: number, a: number, b: number, seed: number) {
  const z = normals(seeded(seed));
  const y: number[] = [];
  const wl: string[] = [];
  const sl: string[] = [];
  const bl: string[] = [];
  for (let k = 0; k < r; k++) {
    for (let i = 0; i < a; i++) {
      const wholeNoise = 2 * z();
      for (let j = 0; j < b; j++) {
        y.push(50 + k + 3 * i - 2 * j + wholeNoise + z());
        wl.push(`w${i + 1}`);
        sl.push(`s${j + 1}`);
        bl.push(`b${k + 1}`);
      }
    }
  }
  return { y: Float64Array.from(y), whole: factorOf('whole', wl), sub: factorOf('sub', sl), block: factorOf('block', bl) };
}

describe('split plot cross-checks', () => {
  it('with one whole-plot level is the blocked analysis of the subplot factor', () => {
    const d = generated(5, 1, 4, 11);
    const sp = splitPlot(d.y, d.whole, d.sub, d.block);
    const bl = blocked(d.y, d.sub, d.block);
    // rows: block, whole, whole_error, sub, whole:sub, error, total
    expect(sp.table.df).toEqual([4, 0, 0, 3, 0, 12, 19]);
    expectRelative(sp.table.ss[3]!, bl.table.ss[0]!, 1e-12, 'subplot SS = treatment SS');
    expectRelative(sp.table.ss[0]!, bl.table.ss[1]!, 1e-12, 'block SS');
    expectRelative(sp.table.ss[5]!, bl.table.ss[2]!, 1e-12, 'error SS');
    expectRelative(sp.table.f[3]!, bl.table.f[0]!, 1e-12, 'F of the subplot factor');
    expectRelative(sp.mse, bl.mse, 1e-12, 'error mean square');
    expect(sp.notes.join(' ')).toMatch(/blocked analysis/);
  });

  it('adds up: the strata sum to the total', () => {
    const d = generated(4, 3, 3, 5);
    const sp = splitPlot(d.y, d.whole, d.sub, d.block);
    const parts = sp.table.ss.slice(0, 6).reduce((x, v) => x + v, 0);
    expectRelative(parts, sp.table.ss[6]!, 1e-12, 'sum of squares');
    // common practice, no source: residuals sum to zero within every whole plot
    const sums = new Map<string, number>();
    for (let t = 0; t < d.y.length; t++) {
      const key = `${d.block.codes[t]}-${d.whole.codes[t]}`;
      sums.set(key, (sums.get(key) ?? 0) + sp.residuals[t]!);
    }
    for (const v of sums.values()) expect(Math.abs(v)).toBeLessThan(1e-9);
  });

  it('compares subplot levels within one whole-plot level on the subplot error only', () => {
    const d = generated(4, 3, 3, 7);
    const sp = splitPlot(d.y, d.whole, d.sub, d.block);
    const r = difference(sp, 's1', 's2', 0.95, 'sub', 'w2');
    expectRelative(r.se, Math.sqrt((2 * sp.split!.mseSub) / 4), 1e-14, 'se');
    expect(r.df).toBe(sp.df_error);
    expect(r.notes.join(' ')).toMatch(/within whole plots/);
    const p = pairwise(sp, 'tukey', 0.95, 'sub', 'w1');
    expect(p.table.se.every((s) => Math.abs(s - r.se) < 1e-14)).toBe(true);
    // a contrast of subplot levels at one whole-plot level: variance sum(w^2) Eb / r
    const c = contrast(sp, [1, -0.5, -0.5], 0.95, 'sub', 'w3');
    expectRelative(c.se, Math.sqrt((1.5 * sp.split!.mseSub) / 4), 1e-14, 'contrast se');
    expectRelative(c.estimate, sp.split!.cellShifted[6]! - 0.5 * (sp.split!.cellShifted[7]! + sp.split!.cellShifted[8]!), 1e-14, 'contrast estimate');
    expect(() => difference(sp, 's1', 's2', 0.95, 'sub', 'w9')).toThrow(/no level "w9"/);
    expect(() => difference(sp, 's1', 's2', 0.95, 'block', 'w1')).toThrow(DesignError);
  });
});

describe('split plot bad input', () => {
  it('whole_error zero: no F for the whole-plot factor, no standard errors, no comparison, said in words', () => {
    const d = generated(3, 2, 3, 4);
    // whole-plot totals made exactly additive in blocks and whole levels: each subplot value
    // shifted so that its whole plot's mean is 50 + block + 3 * whole level
    const mRA = new Map<string, number[]>();
    for (let t = 0; t < d.y.length; t++) {
      const key = `${d.block.codes[t]}-${d.whole.codes[t]}`;
      mRA.set(key, [...(mRA.get(key) ?? []), d.y[t]!]);
    }
    const y = Float64Array.from(d.y, (v, t) => {
      const vs = mRA.get(`${d.block.codes[t]}-${d.whole.codes[t]}`)!;
      const m = vs.reduce((a, b) => a + b, 0) / vs.length;
      return v - m + 50 + d.block.codes[t]! + 3 * d.whole.codes[t]!;
    });
    const sp = splitPlot(y, d.whole, d.sub, d.block);
    expect(sp.table.ss[2]! / sp.table.ss[6]!).toBeLessThan(1e-12);
    expect(Number.isNaN(sp.table.f[1]!) && Number.isNaN(sp.table.p[1]!)).toBe(true);
    expect(sp.means.se.every((s) => Number.isNaN(s))).toBe(true);
    expect(sp.notes).toContain(designMsg.splitWholeExact('whole'));
    expect(() => difference(sp, 'w1', 'w2')).toThrow(designMsg.ownErrorZero(designMsg.splitWholeNote()));
    // the subplot factor keeps its test and its comparisons within whole plots
    expect(Number.isFinite(sp.table.f[3]!)).toBe(true);
    expect(difference(sp, 's1', 's2', 0.95, 'sub').se).toBeGreaterThan(0);
  });
  it('refuses a subplot level twice in one whole plot: not a split plot', () => {
    const d = generated(3, 2, 3, 1);
    const codes = Int32Array.from(d.sub.codes);
    codes[1] = 0; // block 1, whole 1: s1 twice, s2 missing
    expect(() => splitPlot(d.y, d.whole, { ...d.sub, codes }, d.block)).toThrow(/holds sub "s1" 2 times.*not a split plot/);
  });
  it('refuses a missing subplot, naming it', () => {
    const d = generated(3, 2, 3, 2);
    const keep = (i: number): boolean => i !== 4;
    const pick = (f: typeof d.whole) => ({ ...f, codes: f.codes.filter((_, i) => keep(i)) });
    expect(() => splitPlot(d.y.filter((_, i) => keep(i)), pick(d.whole), pick(d.sub), pick(d.block))).toThrow(/block "b1", whole "w2" has no plot for sub "s2"/);
  });
  it('refuses one block', () => {
    const d = generated(1, 2, 3, 3);
    expect(() => splitPlot(d.y, d.whole, d.sub, d.block)).toThrow(/block "block" has 1 level/);
  });
});
