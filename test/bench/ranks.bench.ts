/**
 * Timings of the rank tests at sizes a large trial could reach. Run with
 * `npx vitest bench --run test/bench/ranks.bench.ts`; the numbers are for information and
 * assert nothing.
 */
import { bench, describe } from 'vitest';
import {
  kruskalWallis,
  friedman,
  signedRank,
  rankSum,
  mannWhitneyProbabilities,
} from '../../src/stats/ranks/index.ts';

function uniforms(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const next = uniforms(1);
const big = 100_000;
// one decimal place: realistic ties
const y = Float64Array.from({ length: big }, () => Math.round(next() * 1000) / 10);
const fiveGroups = {
  codes: Int32Array.from({ length: big }, (_, i) => i % 5),
  levels: ['a', 'b', 'c', 'd', 'e'],
};
const twoGroups = { codes: Int32Array.from({ length: big }, (_, i) => i % 2), levels: ['a', 'b'] };
const blocks = {
  codes: Int32Array.from({ length: big }, (_, i) => Math.floor(i / 5)),
  levels: Array.from({ length: big / 5 }, (_, i) => `b${i}`),
};
const a = y.subarray(0, big / 2);
const b = y.subarray(big / 2);

const small = Float64Array.from({ length: 100 }, () => next());
const smallGroups = { codes: Int32Array.from({ length: 100 }, (_, i) => i % 2), levels: ['a', 'b'] };

describe('rank tests, 100,000 observations', () => {
  bench('kruskalWallis, 5 groups', () => {
    kruskalWallis(y, fiveGroups);
  });
  bench('friedman, 5 treatments x 20,000 blocks', () => {
    friedman(y, fiveGroups, blocks);
  });
  bench('rankSum, normal approximation', () => {
    rankSum(y, twoGroups);
  });
  bench('signedRank, 50,000 pairs, normal approximation', () => {
    signedRank(a, b);
  });
});

describe('exact distributions at the largest exact sizes', () => {
  bench('rankSum, 50 + 50 without ties (exact)', () => {
    rankSum(small, smallGroups);
  });
  bench('Mann-Whitney probabilities, 50 x 50', () => {
    mannWhitneyProbabilities(50, 50);
  });
  bench('signedRank, 50 pairs without ties (exact)', () => {
    signedRank(small.subarray(0, 50), small.subarray(50));
  });
});
