/**
 * Elementary functions that give the same bits in every JavaScript engine.
 *
 * The language promises that a document evaluates to bitwise the same values on every run
 * and machine, and a sealed document is verified bit for bit, in Node and in the page. The
 * engines' own Math.exp, Math.log, Math.pow and the trigonometric functions are not specified
 * to the last bit, and they differ: on 20,000 fixed arguments Node 20.20.2 and Chromium 156
 * disagreed in the last place for about 10% of exp and pow results, 5% of log. These are
 * ports of the published fdlibm algorithms in plain JavaScript (@stdlib), built from IEEE
 * arithmetic alone, so their results are the same wherever they run.
 *
 * Math.sqrt, Math.abs, Math.floor and the like are exact (IEEE 754 requires correctly
 * rounded square roots), so they stay. A test (test/stats/math/portable.test.ts) keeps the
 * engine's code free of the engine-dependent functions.
 */
import asinFn from '@stdlib/math-base-special-asin';
import cosFn from '@stdlib/math-base-special-cos';
import expFn from '@stdlib/math-base-special-exp';
import expm1Fn from '@stdlib/math-base-special-expm1';
import lnFn from '@stdlib/math-base-special-ln';
import log10Fn from '@stdlib/math-base-special-log10';
import log1pFn from '@stdlib/math-base-special-log1p';
import log2Fn from '@stdlib/math-base-special-log2';
import sinFn from '@stdlib/math-base-special-sin';

/** e to the power x. */
export const exp: (x: number) => number = expFn;
/** The natural logarithm. */
export const log: (x: number) => number = lnFn;
/** The logarithm to base 10. */
export const log10: (x: number) => number = log10Fn;
/** The logarithm to base 2. */
export const log2: (x: number) => number = log2Fn;
/** x to the power y (the language's `^`), in a module of its own for the evaluator. */
export { pow } from './portable-power.ts';
/** exp(x) - 1, accurate near 0. */
export const expm1: (x: number) => number = expm1Fn;
/** ln(1 + x), accurate near 0. */
export const log1p: (x: number) => number = log1pFn;
/** Cosine (radians). */
export const cos: (x: number) => number = cosFn;
/** Sine (radians). */
export const sin: (x: number) => number = sinFn;
/** Arcsine. */
export const asin: (x: number) => number = asinFn;
/** x times x: exact to one rounding everywhere (`x ** 2` goes through the engine's pow). */
export function sq(x: number): number {
  return x * x;
}

const bits = new DataView(new ArrayBuffer(8));

/**
 * 2 to the power n for a whole n, built from its bits: exact, with no call to the engine's
 * pow (0 below the smallest subnormal, Infinity above the largest double).
 */
export function powerOfTwo(n: number): number {
  if (n > 1023) return Infinity;
  if (n < -1074) return 0;
  if (n >= -1022) {
    bits.setUint32(0, (n + 1023) << 20);
    bits.setUint32(4, 0);
  } else {
    // subnormal: one mantissa bit, n + 1074 places up from the lowest
    const place = n + 1074;
    bits.setUint32(0, place >= 32 ? 1 << (place - 32) : 0);
    bits.setUint32(4, place < 32 ? (1 << place) >>> 0 : 0);
  }
  return bits.getFloat64(0);
}
