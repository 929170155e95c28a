/**
 * Reading decimal texts ("1000000000000.4", "-0.5", "1e-3", "+.25") into an integer
 * significand and a power of ten, without going through a binary double.
 *
 * Two readers share one grammar: {@link scanDecimal} is the hot-path reader (no allocation,
 * significand as an exact double while it fits in 53 bits) and {@link readDecimal} is the
 * exact reader (significand as a BigInt) used where the first one overflows.
 *
 * Grammar (after trimming spaces and tabs at both ends):
 * `[+-]? (digits [. digits?] | . digits) ([eE] [+-]? digits)?`.
 */

/** 2^53: every integer of smaller magnitude is an exact double. */
export const EXACT_INTEGER_LIMIT = 9007199254740992;

/**
 * Powers of ten that are exact doubles (10^0 .. 10^22), built by multiplication, each step
 * exact (10^22 = 2^22 * 5^22 and 5^22 < 2^53), with no call to pow.
 */
export const EXACT_POWERS: readonly number[] = Array.from({ length: 23 }, (_, k) => {
  let p = 1;
  for (let i = 0; i < k; i++) p *= 10;
  return p;
});

/** Exponents beyond this are refused before they can overflow an integer. */
const EXPONENT_CAP = 100000;

/**
 * Reusable result of {@link scanDecimal}: the text's value is
 * `significand * 10^scale`, with trailing zeros of the significand moved into `scale`.
 * Mutable on purpose, so that scanning a million texts allocates nothing.
 */
export interface DecimalScan {
  /** Signed integer significand without trailing zeros; exact when `fits` is true. */
  significand: number;
  /** Power of ten that multiplies the significand. */
  scale: number;
  /** True when the significand is below 2^53 in magnitude and so held exactly. */
  fits: boolean;
}

/** A fresh {@link DecimalScan} to pass to {@link scanDecimal}. */
export function newDecimalScan(): DecimalScan {
  return { significand: 0, scale: 0, fits: true };
}

function isBlank(c: number): boolean {
  return c === 32 || c === 9;
}

/**
 * Read `text` into `out`. Returns false when the text is not a decimal number (then `out`
 * is unspecified). Never allocates.
 */
export function scanDecimal(text: string, out: DecimalScan): boolean {
  return scanDecimalIn(text, 0, text.length, out);
}

/**
 * Decimal texts held as ranges of one source text: text i is `source.slice(from[i], to[i])`.
 * How a column read from CSV keeps its texts without a string per number.
 */
export interface TextRanges {
  readonly source: string;
  readonly from: Int32Array;
  readonly to: Int32Array;
}

/** {@link scanDecimal} on the part [from, to) of `text`, without slicing it. */
export function scanDecimalIn(text: string, from: number, to: number, out: DecimalScan): boolean {
  let i = from;
  let end = to;
  while (i < end && isBlank(text.charCodeAt(i))) i++;
  while (end > i && isBlank(text.charCodeAt(end - 1))) end--;
  if (i >= end) return false;

  let negative = false;
  let c = text.charCodeAt(i);
  if (c === 43 /* + */ || c === 45 /* - */) {
    negative = c === 45;
    i++;
  }

  // Digits accumulate into m while it stays below 2^53 (then it is exact); zeros are counted
  // so that trailing ones can be moved into the scale afterwards.
  let m = 0;
  let digits = 0;
  let trailingZeros = 0;
  let fractionDigits = 0;
  for (; i < end; i++) {
    const d = text.charCodeAt(i) - 48;
    if (d < 0 || d > 9) break;
    m = m * 10 + d;
    trailingZeros = d === 0 ? trailingZeros + 1 : 0;
    digits++;
  }
  if (i < end && text.charCodeAt(i) === 46 /* . */) {
    i++;
    for (; i < end; i++) {
      const d = text.charCodeAt(i) - 48;
      if (d < 0 || d > 9) break;
      m = m * 10 + d;
      trailingZeros = d === 0 ? trailingZeros + 1 : 0;
      digits++;
      fractionDigits++;
    }
  }
  if (digits === 0) return false;
  // Below 2^53 every step above was exact (rounding is monotone, so a final value under the
  // limit never passed through an inexact one).
  let fits = m < EXACT_INTEGER_LIMIT;
  const started = m !== 0 || !fits;
  if (fits) {
    for (let z = 0; z < trailingZeros && m !== 0; z++) m /= 10; // exact: m is a multiple of 10
  } else {
    fits = false;
  }

  let exponent = 0;
  if (i < end) {
    c = text.charCodeAt(i);
    if (c !== 101 /* e */ && c !== 69 /* E */) return false;
    i++;
    let expNegative = false;
    if (i < end) {
      c = text.charCodeAt(i);
      if (c === 43 || c === 45) {
        expNegative = c === 45;
        i++;
      }
    }
    let expDigits = 0;
    for (; i < end; i++) {
      const d = text.charCodeAt(i) - 48;
      if (d < 0 || d > 9) return false;
      expDigits++;
      if (exponent < EXPONENT_CAP) exponent = exponent * 10 + d;
    }
    if (expDigits === 0) return false;
    if (expNegative) exponent = -exponent;
  }

  out.significand = started ? (negative ? -m : m) : 0;
  out.scale = started ? exponent - fractionDigits + (fits ? trailingZeros : 0) : 0;
  out.fits = fits;
  return true;
}

/** Exact reading of a decimal text: the value is `significand * 10^scale`. */
export interface ExactDecimal {
  significand: bigint;
  scale: number;
}

/**
 * Exact reader for texts whose significand does not fit in 53 bits. Returns null when the
 * text is not a decimal number.
 */
export function readDecimal(text: string): ExactDecimal | null {
  const probe = newDecimalScan();
  if (!scanDecimal(text, probe)) return null;
  if (probe.fits) return { significand: BigInt(probe.significand), scale: probe.scale };
  const trimmed = text.trim();
  let body = trimmed;
  let exponent = 0;
  const e = body.search(/[eE]/);
  if (e >= 0) {
    // Clamped like scanDecimal's: beyond this the value is 0 or infinite anyway.
    exponent = Math.max(-EXPONENT_CAP, Math.min(EXPONENT_CAP, Number(body.slice(e + 1))));
    body = body.slice(0, e);
  }
  let negative = false;
  if (body.startsWith('+') || body.startsWith('-')) {
    negative = body.startsWith('-');
    body = body.slice(1);
  }
  const point = body.indexOf('.');
  const fraction = point >= 0 ? body.length - point - 1 : 0;
  let digits = point >= 0 ? body.slice(0, point) + body.slice(point + 1) : body;
  let trailing = 0;
  while (digits.length > 1 && digits.endsWith('0')) {
    digits = digits.slice(0, -1);
    trailing++;
  }
  const magnitude = BigInt(digits);
  return {
    significand: negative ? -magnitude : magnitude,
    scale: exponent - fraction + trailing,
  };
}
