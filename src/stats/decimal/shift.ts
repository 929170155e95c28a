/**
 * The exact decimal shift (docs/language.md section 5).
 *
 * Data such as 1000000000000.4, 1000000000000.3, ... carry 13 constant leading digits. As
 * binary doubles each value is off by up to 6e-5, which is most of the spread that the
 * analysis is about (about 4 correct digits left in a sum of squares). Shifting first, by an
 * offset chosen from the texts and subtracted on the decimal digits, gives values like 0.15
 * and -0.05 that are each the correctly rounded double of (decimal value - offset), and the
 * sums of squares keep their digits.
 *
 * The offset is a double, so it is exact by construction: it is the midpoint of the data
 * rounded to a multiple of the largest power of two not above their range. Every value then
 * lies within one range of the offset, and the offset's own decimal expansion is short
 * (a multiple of 2^-k has k decimals).
 *
 * Speed: the subtraction is done on integers held exactly in doubles (below 2^53) and
 * finished by one correctly rounded division by an exact power of ten (at most 10^22), so
 * the common case costs a few floating-point operations a text. Texts whose digits do not fit
 * that (more than about 15 significant digits, extreme exponents, very fine offsets) take an
 * exact BigInt path, text by text.
 */
import { EXACT_INTEGER_LIMIT, EXACT_POWERS, newDecimalScan, readDecimal, scanDecimal, scanDecimalIn, type TextRanges } from './scan.ts';
import { decimalOfDouble, roundScaledInteger } from './exact.ts';
import * as pm from '../math/portable.ts';

/** Result of {@link shiftDecimals}. */
export interface DecimalShift {
  /** Exactly representable offset: each original value is `offset + (its exact shift)`. */
  offset: number;
  /** Correctly rounded double of (decimal value - offset), in the order of the texts. */
  shifted: Float64Array;
}

/** A text that is not a decimal number, or whose value is beyond the range of a double. */
export class DecimalTextError extends Error {
  /** Position of the text in the input (counting from 0). */
  readonly index: number;
  /** The offending text. */
  readonly text: string;
  constructor(index: number, text: string, reason: string) {
    super(`value ${index + 1} ("${text.length > 40 ? `${text.slice(0, 40)}...` : text}") ${reason}`);
    this.name = 'DecimalTextError';
    this.index = index;
    this.text = text;
  }
}

/**
 * How one scale of text (texts whose value is `significand * 10^scale`) is shifted on the
 * double path: `((significand - high) * multiplier - low) / divisor`, each step exact.
 */
interface ScalePlan {
  usable: boolean;
  high: number;
  multiplier: number;
  low: number;
  divisor: number;
}

/**
 * Plan the double path for texts of scale `s` against an offset of `offsetInteger /
 * 10^offsetDigits`.
 */
function planScale(s: number, offsetInteger: bigint, offsetDigits: number): ScalePlan {
  const none: ScalePlan = { usable: false, high: 0, multiplier: 1, low: 0, divisor: 1 };
  const limit = BigInt(EXACT_INTEGER_LIMIT);
  if (s >= -offsetDigits) {
    // The text is no finer than the offset: split the offset into the part at the text's
    // scale (high) and the finer remainder (low, 0 <= low < 10^k).
    const k = s + offsetDigits;
    if (k > 15 || offsetDigits > 22) return none;
    const unit = 10n ** BigInt(k);
    let high = offsetInteger / unit;
    let low = offsetInteger - high * unit;
    if (low < 0n) {
      high -= 1n;
      low += unit;
    }
    if (high >= limit || -high >= limit) return none;
    return {
      usable: true,
      high: Number(high),
      multiplier: EXACT_POWERS[k] ?? NaN,
      low: Number(low),
      divisor: EXACT_POWERS[offsetDigits] ?? NaN,
    };
  }
  // The text is finer than the offset: bring the offset to the text's scale.
  const k = -offsetDigits - s;
  if (-s > 22 || k > 22) return none;
  const high = offsetInteger * 10n ** BigInt(k);
  if (high >= limit || -high >= limit) return none;
  return { usable: true, high: Number(high), multiplier: 1, low: 0, divisor: EXACT_POWERS[-s] ?? NaN };
}

/** Exact BigInt path for one text: correctly rounded (value - offset). */
function exactShift(text: string, offsetInteger: bigint, offsetDigits: number, offset: number): number {
  const parsed = readDecimal(text);
  if (parsed === null) return NaN;
  if (parsed.significand === 0n) return offset === 0 ? 0 : -offset;
  // Far outside the range of doubles no digit arithmetic is needed (and a text such as
  // "1e-100000000" must not make us build a power of ten with 300 million bits).
  const magnitude = parsed.scale + (parsed.significand < 0n ? -parsed.significand : parsed.significand).toString().length;
  if (magnitude > 400) return parsed.significand < 0n ? -Infinity : Infinity;
  if (magnitude < -400) return offset === 0 ? (parsed.significand < 0n ? -0 : 0) : -offset; // below half a unit of any offset
  const common = Math.min(parsed.scale, -offsetDigits);
  const a = parsed.significand * 10n ** BigInt(parsed.scale - common);
  const b = offsetInteger * 10n ** BigInt(-offsetDigits - common);
  return roundScaledInteger(a - b, common);
}

/** Digits from the first nonzero one to the last nonzero one of the significand. */
function significantDigits(text: string): number {
  let first = -1;
  let last = -1;
  let count = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c === 101 || c === 69) break; // exponent
    const d = c - 48;
    if (d < 0 || d > 9) continue;
    if (d !== 0) {
      if (first < 0) first = count;
      last = count;
    }
    count++;
  }
  return first < 0 ? 0 : last - first + 1;
}

/** The texts to shift: strings, or ranges of one source text. */
export type DecimalTexts = readonly string[] | TextRanges;

function isRanges(texts: DecimalTexts): texts is TextRanges {
  return !Array.isArray(texts);
}

/** How many texts there are. */
function countOf(texts: DecimalTexts): number {
  return isRanges(texts) ? texts.from.length : texts.length;
}

/** Text i as a string (only on the slow paths: ranges are scanned in place). */
function textAt(texts: DecimalTexts, i: number): string {
  return isRanges(texts) ? texts.source.slice(texts.from[i]!, texts.to[i]!) : (texts[i] ?? '');
}

/** The texts of a column read once: each text's correctly rounded double, significand and scale. */
export interface DecimalReading {
  readonly texts: DecimalTexts;
  readonly values: Float64Array;
  /** The text's digits as an integer (NaN when they do not fit a double exactly). */
  readonly significand: Float64Array;
  /** The power of ten the significand is scaled by. */
  readonly scale: Int32Array;
}

/**
 * Reads text i into significand[i] and scale[i] and gives its correctly rounded double
 * (Clinger's fast path when the significand and the power of ten are both exact, the exact
 * path otherwise).
 */
function readOne(texts: DecimalTexts, i: number, scan: ReturnType<typeof newDecimalScan>, significand: Float64Array, scale: Int32Array, into: number = i): number {
  const read = isRanges(texts) ? scanDecimalIn(texts.source, texts.from[i]!, texts.to[i]!, scan) : scanDecimal(texts[i] ?? '', scan);
  if (!read) throw new DecimalTextError(into, textAt(texts, i), 'is not a decimal number');
  const s = scan.scale;
  significand[into] = scan.fits ? scan.significand : NaN;
  scale[into] = s;
  let v: number;
  if (scan.fits && s >= -22 && s <= 22) {
    v = s >= 0 ? scan.significand * (EXACT_POWERS[s] ?? NaN) : scan.significand / (EXACT_POWERS[-s] ?? NaN);
  } else {
    const text = textAt(texts, i);
    if (significantDigits(text) <= 20) {
      // ECMAScript requires string-to-number conversion to be correctly rounded for up to
      // 20 significant digits, so the engine's own reader is exact enough here and fast.
      v = Number(text.trim());
    } else {
      v = exactShift(text, 0n, 0, 0);
    }
  }
  if (!Number.isFinite(v)) throw new DecimalTextError(into, textAt(texts, i), 'is too large to hold as a number');
  return v;
}

/**
 * Reads decimal texts for {@link shiftReading}. A column's reading can be kept and, when a
 * few of its texts change, brought up to date with {@link readDecimalsAgain}.
 * @throws DecimalTextError when a text is not a decimal number or is out of range.
 */
export function readDecimals(texts: DecimalTexts): DecimalReading {
  const n = countOf(texts);
  const significand = new Float64Array(n);
  const scale = new Int32Array(n);
  const values = new Float64Array(n);
  const scan = newDecimalScan();
  for (let i = 0; i < n; i++) values[i] = readOne(texts, i, scan, significand, scale);
  return { texts, values, significand, scale };
}

/**
 * The reading of `texts`, which are the texts of `base` with those at `rows` changed (same
 * count): the rest is copied, only those are read.
 * @throws DecimalTextError when a changed text is not a decimal number or is out of range.
 */
export function readDecimalsAgain(base: DecimalReading, texts: DecimalTexts, rows: ArrayLike<number>): DecimalReading {
  return readAgainInto(base, texts, rows, false);
}

/**
 * As {@link readDecimalsAgain}, but the new reading takes over the base's arrays and writes
 * the changed rows into them: the base must never be read again (a private cache that drops
 * it first). Copying three arrays of a 100,000-row column at every keystroke cost more than
 * the rest of the reading; on a failure the base is left half written.
 */
export function readDecimalsAgainInPlace(base: DecimalReading, texts: DecimalTexts, rows: ArrayLike<number>, changed?: DecimalTexts): DecimalReading {
  return readAgainInto(base, texts, rows, true, changed);
}

/**
 * `changed`, when given, holds the texts at `rows` in that order (the same texts as
 * `texts` holds there) and is read instead of `texts`.
 */
function readAgainInto(base: DecimalReading, texts: DecimalTexts, rows: ArrayLike<number>, inPlace: boolean, changed?: DecimalTexts): DecimalReading {
  if (countOf(texts) !== base.values.length) throw new RangeError('a reading read again must keep its count of texts');
  if (changed !== undefined && countOf(changed) !== rows.length) throw new RangeError('the changed texts must be as many as the rows');
  const values = inPlace ? base.values : base.values.slice();
  const significand = inPlace ? base.significand : base.significand.slice();
  const scale = inPlace ? base.scale : base.scale.slice();
  const scan = newDecimalScan();
  for (let k = 0; k < rows.length; k++) {
    const i = rows[k]!;
    values[i] = changed === undefined ? readOne(texts, i, scan, significand, scale) : readOne(changed, k, scan, significand, scale, i);
  }
  return { texts, values, significand, scale };
}

/**
 * Choose the offset from the values: 0 when they straddle zero or have no constant leading
 * binary digit (nothing to gain), otherwise the midpoint rounded to a multiple of the
 * largest power of two not above the range.
 */
function chooseOffset(values: Float64Array): number {
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i < values.length; i++) {
    const v = values[i] ?? 0;
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  if (!(lo <= hi) || (lo <= 0 && hi >= 0)) return 0;
  const spread = hi - lo;
  if (spread === 0) return lo;
  const magnitude = Math.max(Math.abs(lo), Math.abs(hi));
  if (magnitude < 2 * spread) return 0;
  const grain = pm.powerOfTwo(Math.floor(pm.log2(spread)));
  const middle = lo + spread / 2;
  return Math.round(middle / grain) * grain;
}

/**
 * Shift a numeric column given as decimal texts by an exactly representable offset chosen
 * from the texts, subtracting on the decimal digits (docs/language.md section 5).
 *
 * Each `shifted[i]` is the correctly rounded double of (exact decimal value of `texts[i]` -
 * `offset`); sums of squares formed on `shifted` keep the digits that constant leading
 * digits would cost in plain doubles. Add `offset` back to means and fitted values.
 *
 * @param texts - the column's texts as typed, one per value, no missing values
 *   (leading/trailing spaces allowed; `[+-]digits[.digits][e[+-]digits]`), as strings or as
 *   ranges of one source text (scanned in place, no string made per text).
 * @throws DecimalTextError when a text is not a decimal number or is out of range.
 */
export function shiftDecimals(texts: DecimalTexts): DecimalShift {
  return shiftRead(readDecimals(texts), false);
}

/** {@link shiftDecimals} of texts already read; the reading is left as it was. */
export function shiftReading(reading: DecimalReading): DecimalShift {
  return shiftRead(reading, true);
}

/**
 * {@link shiftReading} for a caller that only reads the shifted values, and only until it
 * next reads this reading or writes it: `shifted` is the reading's own values when the
 * offset is 0, otherwise `scratch` (as long as the reading) written over. A sum of a
 * 100,000-row column at each keystroke then writes no fresh memory.
 */
export function shiftReadingBorrowed(reading: DecimalReading, scratch: Float64Array): DecimalShift {
  if (scratch.length !== reading.values.length) throw new RangeError('the scratch array must be as long as the reading');
  const offset = chooseOffset(reading.values);
  if (offset === 0) return { offset: 0, shifted: reading.values };
  scratch.set(reading.values);
  return shiftRead(reading, false, scratch);
}

function shiftRead(reading: DecimalReading, keep: boolean, into?: Float64Array): DecimalShift {
  const { texts, significand, scale } = reading;
  const n = reading.values.length;
  const values = into ?? (keep ? reading.values.slice() : reading.values);
  const offset = chooseOffset(values);
  if (offset === 0) return { offset: 0, shifted: values };

  const { integer: offsetInteger, fractionDigits: offsetDigits } = decimalOfDouble(offset);
  // One plan per distinct scale, found through a one-entry cache (neighbouring texts nearly
  // always share a scale) backed by a map.
  const plans = new Map<number, ScalePlan>();
  let lastScale = NaN;
  // The current plan's fields live in locals: the hot loop then reads no object fields.
  let usable = false;
  let high = 0;
  let multiplier = 1;
  let low = 0;
  let divisor = 1;
  const limit = EXACT_INTEGER_LIMIT;
  const shifted = values; // overwritten in place: each value is read before it is replaced
  for (let i = 0; i < n; i++) {
    const s = scale[i]!;
    if (s !== lastScale) {
      let found = plans.get(s);
      if (found === undefined) {
        found = planScale(s, offsetInteger, offsetDigits);
        plans.set(s, found);
      }
      usable = found.usable;
      high = found.high;
      multiplier = found.multiplier;
      low = found.low;
      divisor = found.divisor;
      lastScale = s;
    }
    const m = significand[i]!;
    if (usable) {
      // Each step is exact while its result stays below 2^53; rounding is monotone, so a
      // result that comes out below the limit was computed exactly. (NaN, for a significand
      // that did not fit, fails the first test.)
      const a = m - high;
      if (a < limit && a > -limit) {
        const p = a * multiplier;
        if (p < limit && p > -limit) {
          const d = p - low;
          if (d < limit && d > -limit) {
            shifted[i] = d / divisor;
            continue;
          }
        }
      }
    }
    shifted[i] = exactShift(textAt(texts, i), offsetInteger, offsetDigits, offset);
  }
  return { offset, shifted };
}
