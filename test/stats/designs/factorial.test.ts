/**
 * Factorials: a published two-factor example, the closed form against least squares, the
 * adjusted sums of squares of unbalanced data against their definition, and an unreplicated
 * 2^3 whose effects and Lenth margins are worked by hand here.
 */
import tQuantile from '@stdlib/stats-base-dists-t-quantile';
import { describe, expect, it } from 'vitest';
import { DesignError, factorial } from '../../../src/stats/designs/index.ts';
import { denseDesign, fitFactorModel, householderLeastSquares, leastSquaresMeans } from '../../../src/stats/linear/index.ts';
import { expectAbsolute, expectArrayNear, expectNear, expectRelative, factorOf, normals, seeded, subset } from './support.ts';
import { designMsg } from '../../../src/messages/designs.ts';

// source: Montgomery, Design and Analysis of Experiments, battery-life example (from memory):
// material type (3) x temperature (15, 70, 125 F), four batteries per cell.
const BATTERY: number[][][] = [
  [[130, 155, 74, 180], [34, 40, 80, 75], [20, 70, 82, 58]],
  [[150, 188, 159, 126], [136, 122, 106, 115], [25, 70, 58, 45]],
  [[138, 110, 168, 160], [174, 120, 150, 139], [96, 104, 82, 60]],
];

function battery() {
  const y: number[] = [];
  const m: string[] = [];
  const t: string[] = [];
  BATTERY.forEach((mat, i) => mat.forEach((cell, j) => cell.forEach((v) => {
    y.push(v);
    m.push(String(i + 1));
    t.push(['15', '70', '125'][j]!);
  })));
  return { y: Float64Array.from(y), material: factorOf('material', m), temperature: factorOf('temperature', t) };
}

/** Random replicated data on a crossed design with per-cell counts from `count`. */
function crossed(levels: number[], count: (cell: number[]) => number, seed: number) {
  const z = normals(seeded(seed));
  const codes = levels.map(() => [] as string[]);
  const y: number[] = [];
  const total = levels.reduce((a, b) => a * b, 1);
  for (let c = 0; c < total; c++) {
    const cell: number[] = [];
    let rest = c;
    for (const L of levels) {
      cell.push(rest % L);
      rest = Math.floor(rest / L);
    }
    for (let r = 0; r < count(cell); r++) {
      cell.forEach((v, k) => codes[k]!.push(`L${v}`));
      y.push(20 + cell.reduce((s, v, k) => s + Math.sin(v * (k + 2)), 0) + cell[0]! * cell[1]! * 0.5 + z());
    }
  }
  return { y: Float64Array.from(y), factors: codes.map((c, k) => factorOf(String.fromCharCode(97 + k), c)) };
}

describe('factorial', () => {
  it('reproduces the published two-factor analysis', () => {
    const { y, material, temperature } = battery();
    const fit = factorial(y, [material, temperature]);
    // source: Montgomery, battery-life example (from memory): SS 10683.72, 39118.72,
    // 9613.78, error 18230.75, total 77646.97.
    expect(fit.table.source).toEqual(['material', 'temperature', 'material:temperature', 'error', 'total']);
    expect(fit.table.df).toEqual([2, 2, 4, 27, 35]);
    [10683.72, 39118.72, 9613.78, 18230.75, 77646.97].forEach((v, k) => expectAbsolute(fit.table.ss[k]!, v, 0.005, `SS ${k}`));
    expect(fit.design).toBe('3 x 3 factorial');
    expect(fit.balanced).toBe(true);
    // Balanced: the sums of squares add up to the total (common practice, no source).
    const s = fit.table.ss;
    expectRelative(s[0]! + s[1]! + s[2]! + s[3]!, s[4]!, 1e-14, 'sum of SS');
    expect(fit.df_error).toBe(36 - 9);
  });

  it('closed form agrees with least squares on balanced data to 1e-10 (three factors)', () => {
    const { y, factors } = crossed([3, 2, 4], () => 2, 31);
    const fit = factorial(y, factors);
    const terms = [[0], [1], [2], [0, 1], [0, 2], [1, 2], [0, 1, 2]];
    const ls = fitFactorModel({ y, factors, terms });
    expect(fit.table.source.slice(0, 7)).toEqual(['a', 'b', 'c', 'a:b', 'a:c', 'b:c', 'a:b:c']);
    expectArrayNear(fit.table.ss.slice(0, 7), Array.from(ls.termSS), 1e-10, 'term SS');
    expectRelative(fit.table.ss[7]!, ls.sse, 1e-10, 'error SS');
    expectArrayNear(fit.fitted, ls.fitted, 1e-10, 'fitted');
    expectArrayNear(fit.leverage, ls.leverage, 1e-10, 'leverage');
    factors.forEach((_, k) => expectArrayNear(fit.factor_means[k]!.mean, leastSquaresMeans(ls, k).mean, 1e-10, `means of factor ${k}`));
    const s = fit.table.ss;
    expectRelative(s.slice(0, 8).reduce((a, b) => a + b, 0), s[8]!, 1e-13, 'sum of SS');
  });

  it('adjusts each term for every other term when the cells are unequal', () => {
    const { y, factors } = crossed([2, 3], (c) => 2 + ((c[0]! + 2 * c[1]!) % 3), 7);
    const fit = factorial(y, factors);
    expect(fit.balanced).toBe(false);
    expect(fit.ss_method).toMatch(/each term adjusted for every other term/);
    // Definition, fitted independently by Householder QR (common practice, no source):
    // SS(T) = SSE(all terms but T, sum-to-zero coding) - SSE(all terms).
    const terms = [[0], [1], [0, 1]];
    const dense = denseDesign(factors, terms, y.length);
    const full = householderLeastSquares(denseDesign(factors, terms, y.length), y);
    const ranges = [[1, 2], [2, 4], [4, 6]];
    ranges.forEach(([from, to], k) => {
      const keep = Array.from({ length: dense.p }, (_, c) => c).filter((c) => c < from! || c >= to!);
      const x = new Float64Array(keep.length * dense.n);
      keep.forEach((c, j) => x.set(dense.x.subarray(c * dense.n, (c + 1) * dense.n), j * dense.n));
      const reduced = householderLeastSquares({ x, n: dense.n, p: keep.length }, y);
      expectRelative(fit.table.ss[k]!, reduced.sse - full.sse, 1e-10, `adjusted SS of ${fit.table.source[k]}`);
    });
    expectRelative(fit.table.ss[3]!, full.sse, 1e-12, 'error SS');
    // Least-squares means of a are the equal-weight averages of its cell means.
    const cellMean = (a: number, b: number): number => {
      let s = 0;
      let n = 0;
      for (let i = 0; i < y.length; i++) if (factors[0]!.codes[i] === a && factors[1]!.codes[i] === b) {
        s += y[i]!;
        n++;
      }
      return s / n;
    };
    [0, 1].forEach((a) => expectNear(fit.means.mean[a]!, (cellMean(a, 0) + cellMean(a, 1) + cellMean(a, 2)) / 3, 1e-12, `LS mean ${a}`));
  });

  it('unreplicated 2^3: effects from the signs table and Lenth margins, both worked by hand', () => {
    // Runs in standard order; "+" is each factor's second level ("hi").
    const z = normals(seeded(2024));
    const runs: number[][] = [];
    for (let c = 0; c < 8; c++) runs.push([c & 1, (c >> 1) & 1, (c >> 2) & 1]);
    const y = Float64Array.from(runs, ([a, b, c]) => 60 + 8 * a! + 3 * b! - 4 * a! * b! + 1.5 * c! + z());
    const names = ['a', 'b', 'c'];
    const factors = names.map((nm, k) => factorOf(nm, runs.map((r) => (r[k] ? 'hi' : 'lo'))));
    const fit = factorial(y, factors);
    expect(fit.df_error).toBe(0);
    expect(Number.isNaN(fit.table.f[0]!)).toBe(true);
    expect(fit.notes.some((n) => /no error term exists/.test(n))).toBe(true);
    // source: signs table of a 2^3 design (any design-of-experiments text; common practice):
    // effect = (sum of y times the product of the term's signs) / (N / 2).
    const termSets = [[0], [1], [2], [0, 1], [0, 2], [1, 2], [0, 1, 2]];
    const hand = termSets.map((t) => runs.reduce((s, r, i) => s + y[i]! * t.reduce((p, f) => p * (r[f] ? 1 : -1), 1), 0) / 4);
    expect(fit.effects!.term).toEqual(['a', 'b', 'c', 'a:b', 'a:c', 'b:c', 'a:b:c']);
    expectArrayNear(fit.effects!.estimate, hand, 1e-12, 'effects');
    // source: Lenth (1989), Technometrics 31, 469-473: s0 = 1.5 median|c|, PSE = 1.5 median of
    // |c| < 2.5 s0, ME = t(0.975; m/3) PSE, SME = t((1 + 0.95^(1/m))/2; m/3) PSE.
    const abs = hand.map(Math.abs).sort((p, q) => p - q);
    const s0 = 1.5 * abs[3]!;
    const kept = abs.filter((c) => c < 2.5 * s0);
    const med = kept.length % 2 === 1 ? kept[(kept.length - 1) / 2]! : (kept[kept.length / 2 - 1]! + kept[kept.length / 2]!) / 2;
    const pse = 1.5 * med;
    const d = 7 / 3;
    // source: @stdlib/stats-base-dists-t-quantile 0.2.3 for the t quantiles
    const me = tQuantile(0.975, d) * pse;
    const sme = tQuantile((1 + Math.pow(0.95, 1 / 7)) / 2, d) * pse;
    const lenth = fit.lenth!;
    expectRelative(lenth.pse, pse, 1e-14, 'PSE');
    expectRelative(lenth.me, me, 1e-12, 'ME');
    expectRelative(lenth.sme, sme, 1e-12, 'SME');
    expect(lenth.df).toBeCloseTo(d, 15);
    expect(lenth.beyond_me).toEqual(hand.map((c) => Math.abs(c) > me));
    // Sums of squares of a 2^k are N effect^2 / 4 (common practice, no source).
    hand.forEach((e, k) => expectRelative(fit.table.ss[k]!, (8 * e * e) / 4, 1e-12, `SS from effect ${k}`));
  });

  it('refuses an empty cell, naming the interaction, and other broken designs', () => {
    const { y, factors } = crossed([2, 3], () => 2, 3);
    const { y: y2, factors: f2 } = subset(y, factors, (i) => !(factors[0]!.codes[i] === 1 && factors[1]!.codes[i] === 2));
    expect(() => factorial(y2, f2)).toThrow(DesignError);
    expect(() => factorial(y2, f2)).toThrow(designMsg.emptyCell('a = L1, b = L2', 'a:b'));
    expect(() => factorial(y, [factors[0]!])).toThrow(designMsg.factorialNeedsTwo(1));
    const one = factorOf('z', new Array<string>(y.length).fill('only'));
    expect(() => factorial(y, [factors[0]!, one])).toThrow(designMsg.tooFewLevels('factor', 'z', 1));
    const unused = { ...factors[1]!, levels: [...factors[1]!.levels, 'L9'] };
    expect(() => factorial(y, [factors[0]!, unused])).toThrow(/factor "b": level "L9" has no observations/);
    const few = subset(y, factors, (i) => i < 4);
    expect(() => factorial(few.y, few.factors)).toThrow(DesignError);
  });
});
