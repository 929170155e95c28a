/**
 * Seeded draws for layouts. The generator and the algorithm are fixed and written into every
 * layout's record, because a plan drawn today must be drawn again, plot for plot, on any
 * machine and by any later version (a test pins a handful of layouts byte for byte).
 *
 * - Generator: xoroshiro128+ as implemented by pure-rand 8.4.2, read through its 32-bit
 *   outputs only. Its 128-bit state is filled from the seed by two outputs of SplitMix64
 *   (Steele, Lea and Flood 2014), as the generator's authors advise (Blackman and Vigna,
 *   xoroshiro128plus.c). pure-rand's own `xoroshiro128plus(seed)` puts the seed into the
 *   state as it is, and the first draws of neighbouring seeds (1, 2, 3, ...) are then
 *   strongly alike: over seeds 1 to 10,000 the orders of four treatments were far from
 *   equally likely (chi-square 683 on 23 df; test/stats/planning/layouts.test.ts).
 * - Whole numbers below a bound: the classic rejection method on the 32-bit output. With
 *   limit = 2^32 - (2^32 mod bound), a multiple of bound, accept u < limit and return
 *   floor(u / (limit / bound)); otherwise draw again. Every value is equally likely (no
 *   modulo bias), and the value comes from the high bits of u, the strong ones of
 *   xoroshiro128+ (its lowest bits are weak, as its authors note). The draw is ours, not the
 *   library's distribution helper, so a change in that helper cannot re-draw old plans.
 * - Shuffle: Fisher and Yates (1938) in Durstenfeld's (1964) in-place form: for i from n - 1
 *   down to 1, swap element i with element j drawn uniformly from 0..i.
 */
import { xoroshiro128plusFromState } from 'pure-rand/generator/xoroshiro128plus';
import { PlanningError } from './errors.ts';
import { planningMsg as m } from '../../messages/planning.ts';

/** The generator, as a layout's record names it. */
export const GENERATOR = 'xoroshiro128+ (pure-rand 8.4.2), state from two SplitMix64 outputs of the seed, 32-bit outputs';
/** The algorithm, as a layout's record names it. */
export const ALGORITHM =
  'Fisher-Yates shuffle (Durstenfeld form, from the last position down); each position drawn by rejection from 32-bit outputs, so no modulo bias';

/** The largest seed: seeds are 32-bit words, and every whole number from 0 to this is a different one. */
export const MAX_SEED = 4294967295;

const TWO_32 = 4294967296;

/** Checks a seed: a whole number from 0 to {@link MAX_SEED}. */
export function checkSeed(seed: number): number {
  if (!Number.isInteger(seed) || seed < 0 || seed > MAX_SEED) throw new PlanningError(m.seedNotWhole(seed));
  return seed;
}

const MASK_64 = (1n << 64n) - 1n;

/**
 * SplitMix64 (Steele, Lea and Flood 2014, "Fast splittable pseudorandom number generators",
 * OOPSLA; constants as in Vigna's splitmix64.c): used only to spread a seed over the state.
 */
export class SplitMix64 {
  private x: bigint;

  constructor(seed: bigint) {
    this.x = seed & MASK_64;
  }

  /** The next 64-bit output. */
  next(): bigint {
    this.x = (this.x + 0x9e3779b97f4a7c15n) & MASK_64;
    let z = this.x;
    z = ((z ^ (z >> 30n)) * 0xbf58476d1ce4e5b9n) & MASK_64;
    z = ((z ^ (z >> 27n)) * 0x94d049bb133111ebn) & MASK_64;
    return z ^ (z >> 31n);
  }
}

/** A stream of seeded draws. */
export class Draws {
  private readonly rng: { next(): number };

  constructor(seed: number) {
    const mix = new SplitMix64(BigInt(checkSeed(seed)));
    const s0 = mix.next();
    const s1 = mix.next();
    const hi = (x: bigint) => Number(x >> 32n) | 0;
    const lo = (x: bigint) => Number(x & 0xffffffffn) | 0;
    // pure-rand's state order: high and low word of the first half, then of the second
    this.rng = xoroshiro128plusFromState([hi(s0), lo(s0), hi(s1), lo(s1)]);
  }

  /** The next raw output as an unsigned 32-bit whole number. */
  word(): number {
    return this.rng.next() >>> 0;
  }

  /** A whole number from 0 to bound - 1, each equally likely (1 <= bound <= 2^32). */
  below(bound: number): number {
    if (!Number.isInteger(bound) || bound < 1 || bound > TWO_32) throw new RangeError(`below: bound ${bound}`);
    const limit = TWO_32 - (TWO_32 % bound);
    const width = limit / bound; // a whole number: limit is a multiple of bound
    for (;;) {
      const u = this.word();
      if (u < limit) return Math.floor(u / width);
    }
  }
}

/** Shuffles in place by Fisher-Yates (Durstenfeld form); returns the same array. */
export function shuffle<T>(items: T[], draws: Draws): T[] {
  for (let i = items.length - 1; i > 0; i--) {
    const j = draws.below(i + 1);
    const t = items[i]!;
    items[i] = items[j]!;
    items[j] = t;
  }
  return items;
}

/** A random order of 0..n-1. */
export function permutation(n: number, draws: Draws): Int32Array {
  const p = Array.from({ length: n }, (_, i) => i);
  return Int32Array.from(shuffle(p, draws));
}
