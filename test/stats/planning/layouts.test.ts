/**
 * Seeded layouts (src/stats/planning/draws.ts, layouts.ts): every block complete, every
 * Latin square Latin, no position bias across seeds, unbiased draws, and bad input refused.
 */
import { describe, expect, it } from 'vitest';
import { chi2Quantile, chi2Upper } from '../../../src/stats/distributions/index.ts';
import { xoroshiro128plus } from 'pure-rand/generator/xoroshiro128plus';
import { Draws, SplitMix64, drawBlocks, drawCompletelyRandom, drawLatin, permutation } from '../../../src/stats/planning/index.ts';
import { planningMsg } from '../../../src/messages/planning.ts';

const names = (k: number): string[] => Array.from({ length: k }, (_, i) => `T${i + 1}`);

/**
 * Pearson's chi-square statistic of a table of counts against expected counts. The p-value
 * threshold of every test below is 0.001 (common practice, no source): a correct generator
 * fails such a test once in a thousand seeds, and the seeds are fixed, so the outcome is
 * reproducible.
 */
function chiSquare(observed: ArrayLike<number>, expected: ArrayLike<number>): number {
  let x = 0;
  for (let i = 0; i < observed.length; i++) x += (observed[i]! - expected[i]!) ** 2 / expected[i]!;
  return x;
}
const THRESHOLD_P = 0.001;

describe('every layout is what it says', () => {
  it('every block of every layout holds each treatment exactly once', () => {
    for (let seed = 0; seed < 300; seed++) {
      const k = 2 + (seed % 9);
      const b = 1 + (seed % 7);
      const l = drawBlocks(names(k), b, seed);
      expect(l.treatment.length).toBe(k * b);
      for (let j = 0; j < b; j++) {
        const seen = new Set<number>();
        for (let p = 0; p < k; p++) {
          const i = j * k + p;
          expect(l.block[i]).toBe(j + 1);
          expect(l.plot[i]).toBe(p + 1);
          seen.add(l.treatment[i]!);
        }
        expect(seen.size).toBe(k);
      }
    }
  });

  it('every Latin square has each treatment once per row and once per column', () => {
    for (let seed = 0; seed < 200; seed++) {
      const k = 2 + (seed % 11);
      const l = drawLatin(names(k), seed);
      expect(l.treatment.length).toBe(k * k);
      const rowSeen = Array.from({ length: k }, () => new Set<number>());
      const colSeen = Array.from({ length: k }, () => new Set<number>());
      for (let i = 0; i < k * k; i++) {
        rowSeen[l.row[i]! - 1]!.add(l.treatment[i]!);
        colSeen[l.column[i]! - 1]!.add(l.treatment[i]!);
      }
      for (const s of [...rowSeen, ...colSeen]) expect(s.size).toBe(k);
    }
  });

  it('a completely randomized plan has each treatment on exactly r plots', () => {
    for (let seed = 0; seed < 100; seed++) {
      const k = 2 + (seed % 5);
      const r = 1 + (seed % 6);
      const l = drawCompletelyRandom(names(k), r, seed);
      const counts = new Int32Array(k);
      for (const t of l.treatment) counts[t]!++;
      expect([...counts]).toEqual(Array.from({ length: k }, () => r));
      expect([...l.plot]).toEqual(Array.from({ length: k * r }, (_, i) => i + 1));
    }
  });

  it('the same seed gives the same layout; another seed another one', () => {
    const a = drawBlocks(names(6), 8, 2026);
    const b = drawBlocks(names(6), 8, 2026);
    const c = drawBlocks(names(6), 8, 2027);
    expect([...a.treatment]).toEqual([...b.treatment]);
    expect([...a.treatment]).not.toEqual([...c.treatment]);
  });
});

/**
 * The position test for shuffles. Each layout contributes a whole permutation (every
 * treatment once in every block), not one independent (treatment, position) pair, so
 * Pearson's X^2 of the k x k table of counts is not chi-square on (k - 1)^2 df: for uniform
 * permutations the centred counts are spread evenly over the (k - 1)^2 directions with zero
 * row and column sums (the product of two standard representations of the symmetric group
 * is irreducible), each with variance L / (k - 1), so X^2 (k - 1) / k is chi-square on
 * (k - 1)^2 df (its mean k(k - 1) before scaling). Derived here; common practice, no source.
 */
function positionTest(counts: Float64Array, k: number, layouts: number): { x: number; df: number; p: number } {
  const x = (chiSquare(counts, new Float64Array(k * k).fill(layouts / k)) * (k - 1)) / k;
  const df = (k - 1) ** 2;
  return { x, df, p: chi2Upper(x, df) };
}

/** A Latin square as text, row by row. */
const squareText = (t: Int32Array): string => t.join('');

describe('no position bias over 10,000 seeded layouts (chi-square, fail at p < 0.001)', () => {
  const LAYOUTS = 10_000;

  it('complete blocks of 4: treatment by position within the block, one layout per seed 1..10,000', () => {
    const k = 4;
    const counts = new Float64Array(k * k);
    for (let seed = 1; seed <= LAYOUTS; seed++) {
      const l = drawBlocks(names(k), 1, seed);
      for (let p = 0; p < k; p++) counts[l.treatment[p]! * k + p]!++;
    }
    const { x, df, p } = positionTest(counts, k, LAYOUTS);
    console.log(`blocks of 4 over seeds: scaled chi-square ${x.toFixed(3)} on ${df} df, p = ${p.toFixed(4)} (threshold: fail when p < ${THRESHOLD_P}, that is above ${chi2Quantile(1 - THRESHOLD_P, df).toFixed(3)})`);
    expect(p).toBeGreaterThanOrEqual(THRESHOLD_P);
  });

  it('complete blocks of 5 in 10,000 blocks of one seed: treatment by position', () => {
    const k = 5;
    const l = drawBlocks(names(k), LAYOUTS, 99);
    const counts = new Float64Array(k * k);
    for (let i = 0; i < l.treatment.length; i++) counts[l.treatment[i]! * k + (l.plot[i]! - 1)]!++;
    const { x, df, p } = positionTest(counts, k, LAYOUTS);
    console.log(`blocks of 5 within one seed: scaled chi-square ${x.toFixed(3)} on ${df} df, p = ${p.toFixed(4)}`);
    expect(p).toBeGreaterThanOrEqual(THRESHOLD_P);
  });

  it('all 24 orders of 4 treatments are equally likely over seeds 1..10,000', () => {
    const counts = new Float64Array(24);
    for (let seed = 1; seed <= LAYOUTS; seed++) {
      const p = permutation(4, new Draws(seed));
      // the order's rank in the factorial number system
      let rank = 0;
      const left = [0, 1, 2, 3];
      for (let i = 0; i < 4; i++) {
        const at = left.indexOf(p[i]!);
        rank = rank * (4 - i) + at;
        left.splice(at, 1);
      }
      counts[rank]!++;
    }
    const x = chiSquare(counts, new Float64Array(24).fill(LAYOUTS / 24));
    const p = chi2Upper(x, 23);
    console.log(`orders of 4 over seeds: chi-square ${x.toFixed(3)} on 23 df, p = ${p.toFixed(4)}`);
    expect(p).toBeGreaterThanOrEqual(THRESHOLD_P);
  });

  it.each([
    // size, squares the randomization reaches, seed offset
    // source: OEIS A002860, the number of Latin squares of order n (12 for 3, 576 for 4; from
    // memory). Of the 576 of size 4, 432 are isotopic to the cyclic square (the rest to the
    // table of the Klein four-group), so the draw must reach exactly 432, evenly: 12, 576 and
    // 432 were also counted by enumerating every square and every row, column and symbol
    // permutation of the cyclic one (test/reference/fixtures/latin_counts.py)
    [3, 12, 0],
    [4, 432, 50_000],
  ] as const)('Latin squares of %i over 10,000 seeds: every reachable square equally likely', (k, reachable, offset) => {
    const counts = new Map<string, number>();
    for (let seed = 1; seed <= LAYOUTS; seed++) {
      const key = squareText(drawLatin(names(k), seed + offset).treatment);
      counts.set(key, (counts.get(key) ?? 0) + 1);
    }
    expect(counts.size).toBe(reachable);
    const observed = Float64Array.from(counts.values());
    const x = chiSquare(observed, new Float64Array(reachable).fill(LAYOUTS / reachable));
    const p = chi2Upper(x, reachable - 1);
    console.log(`Latin squares of ${k} over seeds: ${counts.size} distinct squares, chi-square ${x.toFixed(3)} on ${reachable - 1} df, p = ${p.toFixed(4)}`);
    expect(p).toBeGreaterThanOrEqual(THRESHOLD_P);
  });

  it('the test has power: a shuffle with the classic off-by-one mistake (j drawn from 0..i-1) fails it', () => {
    // common practice, no source: that mistake (Sattolo's variant) makes only cyclic orders
    const counts = new Float64Array(16);
    for (let seed = 1; seed <= LAYOUTS; seed++) {
      const d = new Draws(seed);
      const a = [0, 1, 2, 3];
      for (let i = 3; i > 0; i--) {
        const j = d.below(i);
        [a[i], a[j]] = [a[j]!, a[i]!];
      }
      for (let p = 0; p < 4; p++) counts[a[p]! * 4 + p]!++;
    }
    expect(positionTest(counts, 4, LAYOUTS).p).toBeLessThan(THRESHOLD_P);
  });

  it('the test has power: seeding the generator with the seed as it is (no SplitMix64) fails it', () => {
    // measured: pure-rand's xoroshiro128plus(seed) makes neighbouring seeds draw alike
    const counts = new Float64Array(16);
    for (let seed = 1; seed <= LAYOUTS; seed++) {
      const rng = xoroshiro128plus(seed);
      const a = [0, 1, 2, 3];
      for (let i = 3; i > 0; i--) {
        const u = rng.next() >>> 0;
        const j = Math.floor((u / 2 ** 32) * (i + 1));
        [a[i], a[j]] = [a[j]!, a[i]!];
      }
      for (let p = 0; p < 4; p++) counts[a[p]! * 4 + p]!++;
    }
    expect(positionTest(counts, 4, LAYOUTS).p).toBeLessThan(THRESHOLD_P);
  });
});

describe('SplitMix64, the seeding', () => {
  it('gives the published first outputs for seed 0', () => {
    // source: Vigna, splitmix64.c (the first three outputs from state 0; from memory)
    const m = new SplitMix64(0n);
    expect(m.next().toString(16)).toBe('e220a8397b1dcdaf');
    expect(m.next().toString(16)).toBe('6e789e6aa1b965f4');
    expect(m.next().toString(16)).toBe('6c45d188009454f');
  });
});

describe('whole numbers below a bound, without modulo bias', () => {
  it('below(3) over 300,000 draws: each value a third of the time', () => {
    const d = new Draws(7);
    const counts = new Float64Array(3);
    for (let i = 0; i < 300_000; i++) counts[d.below(3)]!++;
    const p = chi2Upper(chiSquare(counts, new Float64Array(3).fill(100_000)), 2);
    expect(p).toBeGreaterThanOrEqual(THRESHOLD_P);
  });

  it('a bound just above 2^31 would be biased by a plain modulo; the draw stays uniform on its two halves', () => {
    // common practice, no source: with bound 3 * 2^30, u mod bound would give the lower
    // third twice the chance of the rest; rejection gives each third a third
    const bound = 3 * 2 ** 30;
    const d = new Draws(11);
    const counts = new Float64Array(3);
    for (let i = 0; i < 60_000; i++) counts[Math.floor(d.below(bound) / 2 ** 30)]!++;
    const p = chi2Upper(chiSquare(counts, new Float64Array(3).fill(20_000)), 2);
    expect(p).toBeGreaterThanOrEqual(THRESHOLD_P);
  });

  it('every draw lies in range', () => {
    const d = new Draws(3);
    for (const bound of [1, 2, 5, 1000, 2 ** 32]) {
      for (let i = 0; i < 1000; i++) {
        const v = d.below(bound);
        expect(Number.isInteger(v) && v >= 0 && v < bound).toBe(true);
      }
    }
  });
});

describe('bad input is refused in plain words', () => {
  it.each([
    [() => drawBlocks(['a'], 2, 1), planningMsg.fewTreatments(1)],
    [() => drawBlocks([], 2, 1), planningMsg.fewTreatments(0)],
    [() => drawBlocks(['a', 'a'], 2, 1), planningMsg.duplicateTreatment('a')],
    [() => drawBlocks(['a', ' '], 2, 1), planningMsg.emptyTreatment(1)],
    [() => drawBlocks(['a', 'b'], 0, 1), planningMsg.countNotWhole('blocks', 0, 1)],
    [() => drawBlocks(['a', 'b'], 2.5, 1), planningMsg.countNotWhole('blocks', 2.5, 1)],
    [() => drawCompletelyRandom(['a', 'b'], -1, 1), planningMsg.countNotWhole('replicates', -1, 1)],
    [() => drawBlocks(['a', 'b'], 2, 1.5), planningMsg.seedNotWhole(1.5)],
    [() => drawBlocks(['a', 'b'], 2, -1), planningMsg.seedNotWhole(-1)],
    [() => drawBlocks(['a', 'b'], 2, 2 ** 32), planningMsg.seedNotWhole(2 ** 32)],
    [() => drawBlocks(['a', 'b'], 500_001, 1), planningMsg.tooManyPlots(1_000_002)],
    [() => drawLatin(names(1001), 1), planningMsg.tooManyPlots(1_002_001)],
  ] as const)('%#', (f, message) => {
    expect(f).toThrow(message);
  });

  it('a million plots exactly is allowed', () => {
    expect(drawBlocks(['a', 'b'], 500_000, 1).treatment.length).toBe(1_000_000);
  });
});
