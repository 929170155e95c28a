/**
 * Seeded draws for layouts. The generator and the algorithm are fixed and written into every
 * layout's record, because a plan drawn today must be drawn again, plot for plot, on any
 * machine and by any later version (a test pins a handful of layouts byte for byte).
 *
 * - Generator: xoroshiro128+ as implemented by pure-rand 8.4.2 (`xoroshiro128plus(seed)`),
 *   read through its 32-bit outputs only.
 * - Whole numbers below a bound: the classic rejection method on the 32-bit output (accept
 *   u < 2^32 - (2^32 mod bound), then take u mod bound; otherwise draw again), so every value
 *   is equally likely; no modulo bias. The draw is ours, not the
 *   library's distribution helper, so a change in that helper cannot re-draw old plans.
 * - Shuffle: Fisher and Yates (1938) in Durstenfeld's (1964) in-place form: for i from n - 1
 *   down to 1, swap element i with element j drawn uniformly from 0..i.
 */
import { xoroshiro128plus } from 'pure-rand/generator/xoroshiro128plus';
import { PlanningError } from './errors.ts';
import { planningMessages as m } from './messages.ts';

/** The generator, as a layout's record names it. */
export const GENERATOR = 'xoroshiro128+ (pure-rand 8.4.2, xoroshiro128plus(seed)), 32-bit outputs';
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

/** A stream of seeded draws. */
export class Draws {
  private readonly rng: { next(): number };

  constructor(seed: number) {
    // pure-rand reads the seed as a signed 32-bit word; 2^31..2^32-1 map one to one onto
    // the negative words, so every allowed seed is a different stream
    this.rng = xoroshiro128plus(checkSeed(seed) | 0);
  }

  /** The next raw output as an unsigned 32-bit whole number. */
  word(): number {
    return this.rng.next() >>> 0;
  }

  /** A whole number from 0 to bound - 1, each equally likely (1 <= bound <= 2^32). */
  below(bound: number): number {
    if (!Number.isInteger(bound) || bound < 1 || bound > TWO_32) throw new RangeError(`below: bound ${bound}`);
    const limit = TWO_32 - (TWO_32 % bound);
    for (;;) {
      const u = this.word();
      if (u < limit) return u % bound;
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
