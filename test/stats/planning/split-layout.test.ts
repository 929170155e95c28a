/**
 * The split-plot layout (src/stats/planning/layouts.ts `drawSplitPlot`): every block holds
 * one whole plot of each whole-plot treatment and every whole plot one subplot of each
 * subplot treatment; over seeds, every arrangement of a block is equally likely, which is
 * the two-stage randomization a split plot needs (whole-plot levels at random within the
 * block, subplot levels at random within each whole plot, independently of the other whole
 * plots); and bad input is refused naming the factor.
 */
import { describe, expect, it } from 'vitest';
import { chi2Quantile, chi2Upper } from '../../../src/stats/distributions/index.ts';
import { PlanningError, drawSplitPlot } from '../../../src/stats/planning/index.ts';
import { planningMsg } from '../../../src/messages/planning.ts';

const names = (prefix: string, k: number): string[] => Array.from({ length: k }, (_, i) => `${prefix}${i + 1}`);

/** Fail at p < 0.001 (common practice, no source), as the other layout tests do; seeds are fixed, so the outcome is reproducible. */
const THRESHOLD_P = 0.001;

describe('a split-plot layout', () => {
  it('has every whole-plot treatment once per block and every subplot treatment once per whole plot', () => {
    for (let seed = 0; seed < 200; seed++) {
      const w = 2 + (seed % 4);
      const k = 2 + (seed % 5);
      const b = 1 + (seed % 6);
      const l = drawSplitPlot(names('W', w), names('S', k), b, seed);
      expect(l.plot.length).toBe(w * k * b);
      for (let block = 1; block <= b; block++) {
        const wholes = new Map<number, number>(); // whole plot -> whole treatment
        const subsOf = new Map<number, Set<number>>();
        const plots = new Set<number>();
        for (let i = 0; i < l.plot.length; i++) {
          if (l.block[i] !== block) continue;
          plots.add(l.plot[i]!);
          const wp = l.wholePlot[i]!;
          // one whole-plot treatment on all of a whole plot's subplots
          if (wholes.has(wp)) expect(wholes.get(wp)).toBe(l.whole[i]);
          wholes.set(wp, l.whole[i]!);
          if (!subsOf.has(wp)) subsOf.set(wp, new Set());
          subsOf.get(wp)!.add(l.sub[i]!);
          // plots run along the block, whole plot by whole plot
          expect(Math.ceil(l.plot[i]! / k)).toBe(wp);
        }
        expect(plots.size).toBe(w * k);
        expect(new Set(wholes.values()).size).toBe(w);
        for (const s of subsOf.values()) expect(s.size).toBe(k);
      }
    }
  });

  it('is the same for the same seed and changes with it', () => {
    const a = drawSplitPlot(['dry', 'wet'], ['A', 'B', 'C'], 3, 42);
    const b = drawSplitPlot(['dry', 'wet'], ['A', 'B', 'C'], 3, 42);
    const c = drawSplitPlot(['dry', 'wet'], ['A', 'B', 'C'], 3, 43);
    expect([...a.whole, ...a.sub]).toEqual([...b.whole, ...b.sub]);
    expect([...a.whole, ...a.sub]).not.toEqual([...c.whole, ...c.sub]);
  });

  it('draws every arrangement of a block equally often over 14,400 seeds (chi-square, fail at p < 0.001)', () => {
    // 2 whole-plot treatments and 3 subplot treatments: 2! x 3! x 3! = 72 arrangements of a
    // block. Uniform over all of them means each stage is uniform and the subplot orders of
    // the two whole plots are independent of each other and of the whole-plot order.
    const LAYOUTS = 14_400;
    const counts = new Float64Array(72);
    const rank3 = (a: number, b: number): number => a * 2 + (b > a ? b - 1 : b); // an order of 3 by its first two
    for (let seed = 1; seed <= LAYOUTS; seed++) {
      const l = drawSplitPlot(['W1', 'W2'], ['S1', 'S2', 'S3'], 1, seed);
      const key = l.whole[0]! * 36 + rank3(l.sub[0]!, l.sub[1]!) * 6 + rank3(l.sub[3]!, l.sub[4]!);
      counts[key]!++;
    }
    const expected = LAYOUTS / 72;
    let x = 0;
    for (const c of counts) x += (c - expected) ** 2 / expected;
    const p = chi2Upper(x, 71);
    console.log(`split-plot blocks over seeds: chi-square ${x.toFixed(2)} on 71 df, p = ${p.toFixed(4)} (fail above ${chi2Quantile(1 - THRESHOLD_P, 71).toFixed(2)})`);
    expect(counts.every((c) => c > 0)).toBe(true);
    expect(p).toBeGreaterThanOrEqual(THRESHOLD_P);
  });

  it('the test has power: subplot orders shared by the whole plots of a block fail it', () => {
    // a mistaken draw that reuses one subplot order for every whole plot of a block reaches
    // only 2 x 6 of the 72 arrangements; the same statistic must reject it
    const LAYOUTS = 14_400;
    const counts = new Float64Array(72);
    for (let seed = 1; seed <= LAYOUTS; seed++) {
      const l = drawSplitPlot(['W1', 'W2'], ['S1', 'S2', 'S3'], 1, seed);
      const order = l.sub[0]! * 2 + (l.sub[1]! > l.sub[0]! ? l.sub[1]! - 1 : l.sub[1]!);
      counts[l.whole[0]! * 36 + order * 6 + order]!++;
    }
    const expected = LAYOUTS / 72;
    let x = 0;
    for (const c of counts) x += (c - expected) ** 2 / expected;
    expect(chi2Upper(x, 71)).toBeLessThan(THRESHOLD_P);
  });

  it('refuses bad input, naming the factor', () => {
    const refused = (f: () => unknown): string => {
      try {
        f();
      } catch (err) {
        expect(err).toBeInstanceOf(PlanningError);
        return (err as Error).message;
      }
      throw new Error('not refused');
    };
    expect(refused(() => drawSplitPlot(['dry'], ['A', 'B'], 2, 1))).toBe(planningMsg.ofFactor('whole-plot', planningMsg.fewTreatments(1)));
    expect(refused(() => drawSplitPlot(['dry', 'wet'], ['A', 'A'], 2, 1))).toBe(planningMsg.ofFactor('subplot', planningMsg.duplicateTreatment('A')));
    expect(refused(() => drawSplitPlot(['dry', 'wet'], ['A', 'B'], 0, 1))).toBe(planningMsg.countNotWhole('blocks', 0, 1));
    expect(refused(() => drawSplitPlot(['dry', 'wet'], ['A', 'B'], 2.5, 1))).toBe(planningMsg.countNotWhole('blocks', 2.5, 1));
    expect(refused(() => drawSplitPlot(names('W', 100), names('S', 100), 101, 1))).toBe(planningMsg.tooManyPlots(1_010_000));
  });
});
