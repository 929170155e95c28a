/**
 * Timings of planning: drawing layouts up to the million-plot limit, and the size searches.
 * Run with `npx vitest bench --run test/bench/planning.bench.ts`; the numbers are for
 * information and assert nothing.
 */
import { bench, describe } from 'vitest';
import { blocksForPower, drawBlocks, drawLatin, replicatesForPower } from '../../src/stats/planning/index.ts';

const four = ['a', 'b', 'c', 'd'];

describe('layouts', () => {
  bench('random complete blocks: 4 treatments x 250,000 blocks (1,000,000 plots)', () => {
    drawBlocks(four, 250_000, 7);
  });
  bench('random complete blocks: 6 treatments x 8 blocks', () => {
    drawBlocks(['a', 'b', 'c', 'd', 'e', 'f'], 8, 7);
  });
  bench('Latin square of 1,000 (1,000,000 plots)', () => {
    drawLatin(Array.from({ length: 1000 }, (_, i) => `t${i}`), 7);
  });
});

describe('size searches', () => {
  bench('replicates_for_power, delta = sd', () => {
    replicatesForPower(1, 1, 0.8, 0.95);
  });
  bench('blocks_for_power, 4 treatments, delta = sd', () => {
    blocksForPower(1, 1, 4, 0.8, 0.95);
  });
  bench('blocks_for_power, 4 treatments, delta = sd / 20 (about 9,600 blocks)', () => {
    blocksForPower(0.05, 1, 4, 0.8, 0.95);
  });
});
