import { describe, expect, it } from 'vitest';
import kruskalTest from '@stdlib/stats-kruskal-test';
import { kruskalWallis, friedman } from '../../../src/stats/ranks/index.ts';
import { StatsInputError } from '../../../src/stats/summary/index.ts';
import { F, expectPrinted, expectRel, uniforms } from './helpers.ts';
import { statsMsg } from '../../../src/messages/stats.ts';

// source: Dobson (1983), An Introduction to Statistical Modelling, plant weights
// (from memory; docs/references.md section 3)
const control = [4.17, 5.58, 5.18, 6.11, 4.5, 4.61, 5.17, 4.53, 5.33, 5.14];
const trt1 = [4.81, 4.17, 4.41, 3.59, 5.87, 3.83, 6.03, 4.89, 4.32, 4.69];
const trt2 = [6.31, 5.12, 5.54, 5.5, 5.37, 5.29, 4.92, 6.15, 5.8, 5.26];
const plants = F([...control, ...trt1, ...trt2]);
const plantGroups = {
  codes: Int32Array.from({ length: 30 }, (_, i) => Math.floor(i / 10)),
  levels: ['control', 'treatment 1', 'treatment 2'],
};

// source: Montgomery, Design and Analysis of Experiments, vascular-graft example
// (from memory; docs/references.md section 4): rows are pressures, columns resin batches 1-6.
const graft = [
  [90.3, 89.2, 98.2, 93.9, 87.4, 97.9],
  [92.5, 89.5, 90.6, 94.7, 87.0, 95.8],
  [85.5, 90.8, 89.6, 86.2, 88.0, 93.4],
  [82.5, 89.5, 85.6, 87.4, 78.9, 90.7],
];

function graftLayout() {
  const y = F(graft.flat());
  const treatment = {
    codes: Int32Array.from({ length: 24 }, (_, i) => Math.floor(i / 6)),
    levels: ['8500', '8700', '8900', '9100'],
  };
  const block = {
    codes: Int32Array.from({ length: 24 }, (_, i) => i % 6),
    levels: ['1', '2', '3', '4', '5', '6'],
  };
  return { y, treatment, block };
}

describe('kruskalWallis', () => {
  it('plant weights: the published tie-corrected H and p', () => {
    // source: scipy 1.10.1 stats.kruskal, via docs/references.md section 6
    const r = kruskalWallis(plants, plantGroups);
    expectPrinted(r.statistic, 7.9882287, 7, 'H');
    expectPrinted(r.p, 0.0184238, 7, 'p');
    expect(r.df).toBe(2);
    expect(r.n).toBe(30);
    expect(r.tie_correction).toBeLessThan(1); // 4.17 occurs twice
  });

  it('agrees with @stdlib/stats-kruskal-test on the plant weights and random tied data', () => {
    // source: @stdlib/stats-kruskal-test 0.2.3
    const ref = kruskalTest(control, trt1, trt2);
    const r = kruskalWallis(plants, plantGroups);
    let worst = expectRel(r.statistic, ref.statistic, 1e-12, 'H');
    worst = Math.max(worst, expectRel(r.p, ref.pValue, 1e-10, 'p'));
    const next = uniforms(23);
    for (let trial = 0; trial < 30; trial++) {
      const k = 2 + (trial % 5);
      const samples: number[][] = [];
      for (let j = 0; j < k; j++) {
        const nj = 2 + Math.floor(next() * 12);
        // rounded to one decimal: plenty of ties
        samples.push(Array.from({ length: nj }, () => Math.round((next() * 3 + j * 0.2) * 10) / 10));
      }
      const y = F(samples.flat());
      const codes = Int32Array.from(samples.flatMap((s, j) => s.map(() => j)));
      const levels = samples.map((_, j) => `g${j}`);
      const ours = kruskalWallis(y, { codes, levels });
      const theirs = kruskalTest(...(samples as [number[], ...number[][]]));
      worst = Math.max(worst, expectRel(ours.statistic, theirs.statistic, 1e-11, `trial ${trial} H`));
      worst = Math.max(worst, expectRel(ours.p, theirs.pValue, 1e-9, `trial ${trial} p`));
      expect(ours.df).toBe(theirs.df);
    }
    expect(worst).toBeLessThan(1e-9);
  });

  it('mean ranks follow the data, and an empty level is left out of df', () => {
    const r = kruskalWallis(F([1, 2, 3, 10, 11, 12]), {
      codes: Int32Array.from([0, 0, 0, 2, 2, 2]),
      levels: ['a', 'b', 'c'],
    });
    expect(r.df).toBe(1);
    expect(Array.from(r.level_n)).toEqual([3, 0, 3]);
    expect(r.mean_rank[0]).toBe(2);
    expect(r.mean_rank[1]).toBeNaN();
    expect(r.mean_rank[2]).toBe(5);
    // by hand: 12 / (6 * 7) * (3 (2 - 3.5)^2 + 3 (5 - 3.5)^2) = 12 / 42 * 13.5
    expectRel(r.statistic, (12 / 42) * 13.5, 1e-15, 'H');
  });

  it('rejects a single group and all-equal data', () => {
    expect(() =>
      kruskalWallis(F([1, 2]), { codes: Int32Array.from([0, 0]), levels: ['a', 'b'] }),
    ).toThrow(StatsInputError);
    expect(() =>
      kruskalWallis(F([2, 2, 2]), { codes: Int32Array.from([0, 1, 1]), levels: ['a', 'b'] }),
    ).toThrow(/all values are equal/);
  });
});

describe('friedman', () => {
  it('vascular-graft blocks: the published tie-corrected statistic and p', () => {
    // source: scipy 1.10.1 stats.friedmanchisquare, via docs/references.md section 6
    const { y, treatment, block } = graftLayout();
    const r = friedman(y, treatment, block);
    expectPrinted(r.statistic, 6.4576271, 7, 'statistic');
    expectPrinted(r.p, 0.0913486, 7, 'p');
    expect(r.df).toBe(3);
    expect(r.treatments).toBe(4);
    expect(r.blocks).toBe(6);
    // by hand: batch 2 holds 89.5 twice (8700 and 9100), the only tie: t^3 - t = 6,
    // correction 1 - 6 / (6 * 4 * 15) = 0.98333...
    expectRel(r.tie_correction, 1 - 6 / 360, 1e-15, 'tie correction');
    expect(Array.from(r.rank_sum)).toEqual([18, 18.5, 15, 8.5]);
  });

  it('gives the same result whatever the row order', () => {
    const { y, treatment, block } = graftLayout();
    const order = [5, 17, 0, 23, 11, 3, 8, 20, 14, 1, 22, 9, 4, 16, 12, 7, 19, 2, 21, 10, 15, 6, 18, 13];
    const r0 = friedman(y, treatment, block);
    const r1 = friedman(
      F(order.map((i) => y[i]!)),
      { codes: Int32Array.from(order, (i) => treatment.codes[i]!), levels: treatment.levels },
      { codes: Int32Array.from(order, (i) => block.codes[i]!), levels: block.levels },
    );
    expectRel(r1.statistic, r0.statistic, 1e-15, 'statistic');
  });

  it('with two treatments and no ties equals the squared sign-test statistic', () => {
    // source: by hand from the definition: with k = 2 each block ranks 1, 2, so
    // R_1 = b + (number of blocks where the first is larger) and the statistic reduces to
    // (n_plus - n_minus)^2 / b.
    const next = uniforms(31);
    for (let trial = 0; trial < 10; trial++) {
      const b = 3 + trial * 4;
      const y = new Float64Array(2 * b);
      let plus = 0;
      for (let i = 0; i < b; i++) {
        y[2 * i] = next();
        y[2 * i + 1] = next();
        if (y[2 * i]! > y[2 * i + 1]!) plus++;
      }
      const r = friedman(
        y,
        { codes: Int32Array.from(y, (_, i) => i % 2), levels: ['x', 'y'] },
        { codes: Int32Array.from(y, (_, i) => Math.floor(i / 2)), levels: Array.from({ length: b }, (_, i) => `${i}`) },
      );
      const minus = b - plus;
      const expected = (plus - minus) ** 2 / b;
      if (expected === 0) expect(r.statistic).toBeLessThan(1e-14);
      else expectRel(r.statistic, expected, 1e-13, `trial ${trial}`);
    }
  });

  it('leaves out a treatment or block level that has no data at all', () => {
    const { y, treatment, block } = graftLayout();
    const r0 = friedman(y, treatment, block);
    // the same data with an extra, unused level on each factor
    const r1 = friedman(
      y,
      { codes: treatment.codes.map((c) => (c === 0 ? 0 : c + 1)), levels: ['8500', 'unused', '8700', '8900', '9100'] },
      { codes: block.codes, levels: [...block.levels, 'empty batch'] },
    );
    expect(r1.treatments).toBe(4);
    expect(r1.blocks).toBe(6);
    expect(r1.level).toEqual(['8500', '8700', '8900', '9100']);
    expect(r1.statistic).toBe(r0.statistic);
  });

  it('rejects incomplete and repeated cells, naming them', () => {
    const { y, treatment, block } = graftLayout();
    const drop = 7;
    const keep = Array.from({ length: 24 }, (_, i) => i).filter((i) => i !== drop);
    expect(() =>
      friedman(
        F(keep.map((i) => y[i]!)),
        { codes: Int32Array.from(keep, (i) => treatment.codes[i]!), levels: treatment.levels },
        { codes: Int32Array.from(keep, (i) => block.codes[i]!), levels: block.levels },
      ),
    ).toThrow(statsMsg.friedmanMissing('2', '8700'));
    const twice = Int32Array.from(block.codes);
    twice[1] = 0; // second observation of 8500 moved into batch 1
    expect(() => friedman(y, treatment, { codes: twice, levels: block.levels })).toThrow(
      /more than one value/,
    );
    expect(() =>
      friedman(F([1, 1, 2, 2]), { codes: Int32Array.from([0, 1, 0, 1]), levels: ['a', 'b'] }, {
        codes: Int32Array.from([0, 0, 1, 1]),
        levels: ['p', 'q'],
      }),
    ).toThrow(statsMsg.blocksAllTied());
  });
});
