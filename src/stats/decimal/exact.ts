/**
 * Exact conversions between binary doubles and decimal integers scaled by powers of ten,
 * on BigInt. Slow compared with the double path in shift.ts, and used only where that path
 * cannot stay exact.
 */
import { powerOfTwo } from '../math/portable.ts';

const bits = new DataView(new ArrayBuffer(8));

/** A double `x` written exactly as `integer / 10^fractionDigits`. */
export interface DecimalOfDouble {
  integer: bigint;
  fractionDigits: number;
}

/**
 * The exact decimal value of a finite double (every double is a finite decimal, because
 * 2^-k = 5^k / 10^k). `fractionDigits` is as small as possible.
 */
export function decimalOfDouble(x: number): DecimalOfDouble {
  if (!Number.isFinite(x)) throw new RangeError(`${x} has no decimal expansion`);
  if (x === 0) return { integer: 0n, fractionDigits: 0 };
  bits.setFloat64(0, x);
  const hi = bits.getUint32(0);
  const lo = bits.getUint32(4);
  const negative = hi >>> 31 === 1;
  const biased = (hi >>> 20) & 0x7ff;
  let mantissa = (BigInt(hi & 0xfffff) << 32n) | BigInt(lo);
  let exponent: number;
  if (biased === 0) {
    exponent = -1074; // subnormal
  } else {
    mantissa |= 1n << 52n;
    exponent = biased - 1075;
  }
  while (exponent < 0 && (mantissa & 1n) === 0n) {
    mantissa >>= 1n;
    exponent++;
  }
  let integer: bigint;
  let fractionDigits: number;
  if (exponent >= 0) {
    integer = mantissa << BigInt(exponent);
    fractionDigits = 0;
  } else {
    integer = mantissa * 5n ** BigInt(-exponent);
    fractionDigits = -exponent;
  }
  return { integer: negative ? -integer : integer, fractionDigits };
}

/** The exact decimal text of a finite double, e.g. 0.1 gives "0.1000000000000000055511...". */
export function exactDecimalText(x: number): string {
  const { integer, fractionDigits } = decimalOfDouble(x);
  const negative = integer < 0n;
  let digits = (negative ? -integer : integer).toString();
  if (fractionDigits > 0) {
    digits = digits.padStart(fractionDigits + 1, '0');
    digits = `${digits.slice(0, -fractionDigits)}.${digits.slice(-fractionDigits)}`;
  }
  return (negative ? '-' : '') + digits;
}

function bitLength(n: bigint): number {
  return n === 0n ? 0 : n.toString(2).length;
}

/**
 * The correctly rounded double (round to nearest, ties to even) of `integer * 10^scale`.
 *
 * Engine-independent: ECMAScript rounds a BigInt to a Number exactly, while string-to-number
 * conversion may truncate after 20 significant digits, so division by a power of ten is done
 * here on BigInt with a sticky bit instead of through a decimal string.
 */
export function roundScaledInteger(integer: bigint, scale: number): number {
  if (integer === 0n) return 0;
  if (scale >= 0) return Number(integer * 10n ** BigInt(scale));
  return roundQuotient(integer, 10n ** BigInt(-scale));
}

/**
 * The correctly rounded double (round to nearest, ties to even) of the rational
 * `numerator / denominator` (denominator positive), on BigInt with a sticky bit.
 */
export function roundQuotient(numerator: bigint, denominator: bigint): number {
  if (denominator <= 0n) throw new RangeError('roundQuotient: the denominator must be positive');
  if (numerator === 0n) return 0;
  const negative = numerator < 0n;
  const num = negative ? -numerator : numerator;
  const den = denominator;
  // Enough quotient bits (>= 55) that a sticky bit sits below the rounding position.
  const shift = Math.max(0, 56 + bitLength(den) - bitLength(num));
  const scaled = num << BigInt(shift);
  let q = scaled / den;
  if (scaled % den !== 0n) q |= 1n;
  // q has at least 55 significant bits, so Number(q) rounds once, correctly; the power of
  // two then rescales exactly unless the result falls into the subnormal range.
  let out = Number(q);
  let remaining = shift;
  while (remaining > 0) {
    const step = Math.min(remaining, 1000);
    out *= powerOfTwo(-step);
    remaining -= step;
  }
  if (Math.abs(out) < 2.2250738585072014e-308) {
    // Subnormal (or rounded to zero): the two-step rounding above could be off by one unit,
    // or give zero for a value just above half the smallest subnormal; redo it directly.
    out = subnormalRound(num, den);
  }
  return negative ? -out : out;
}

/** Correct rounding of num/den into the subnormal range (units of 2^-1074). */
function subnormalRound(num: bigint, den: bigint): number {
  const scaled = num << 1074n;
  let units = scaled / den;
  const rem = scaled % den;
  const twice = rem * 2n;
  if (twice > den || (twice === den && (units & 1n) === 1n)) units += 1n;
  return Number(units) * powerOfTwo(-1074);
}
