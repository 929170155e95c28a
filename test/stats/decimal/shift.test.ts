/**
 * The exact decimal shift: every shifted value must be the correctly rounded double of
 * (exact decimal value - offset). The oracle below is independent of the implementation: it
 * parses texts with a regular expression into BigInt rationals, turns doubles into rationals
 * by scaling with powers of two, and checks that the exact difference lies between the
 * midpoints to the result's two neighbouring doubles.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { DecimalTextError, exactDecimalText, readDecimals, readDecimalsAgain, roundScaledInteger, shiftDecimals, shiftReading } from '../../../src/stats/decimal/index.ts';
import { lre } from '../designs/support.ts';

interface Rational {
  n: bigint;
  d: bigint; // > 0
}

function cmp(a: Rational, b: Rational): number {
  const l = a.n * b.d;
  const r = b.n * a.d;
  return l < r ? -1 : l > r ? 1 : 0;
}

function sub(a: Rational, b: Rational): Rational {
  return { n: a.n * b.d - b.n * a.d, d: a.d * b.d };
}

/** Exact rational value of a decimal text (independent parser). */
function textRational(text: string): Rational {
  const m = /^\s*([+-]?)(\d*)(?:\.(\d*))?(?:[eE]([+-]?\d+))?\s*$/.exec(text);
  if (m === null) throw new Error(`oracle cannot read ${text}`);
  const digits = `${m[2] ?? ''}${m[3] ?? ''}` || '0';
  const exp = Number(m[4] ?? '0') - (m[3] ?? '').length;
  let n = BigInt(digits) * (m[1] === '-' ? -1n : 1n);
  let d = 1n;
  if (exp >= 0) n *= 10n ** BigInt(exp);
  else d = 10n ** BigInt(-exp);
  return { n, d };
}

/** Exact rational value of a finite double, by scaling with powers of two. */
function doubleRational(x: number): Rational {
  if (Number.isInteger(x)) return { n: BigInt(x), d: 1n };
  let k = 0;
  let v = x;
  while (!Number.isInteger(v)) {
    v *= 2; // exact
    k++;
  }
  return { n: BigInt(v), d: 2n ** BigInt(k) };
}

const view = new DataView(new ArrayBuffer(8));
/** The next double away from zero (up) or toward it (down), through the bits. */
function neighbour(x: number, up: boolean): number {
  if (x === 0) return up ? Number.MIN_VALUE : -Number.MIN_VALUE;
  view.setFloat64(0, x);
  let bits = view.getBigUint64(0);
  const towardLarger = (x > 0) === up;
  bits = towardLarger ? bits + 1n : bits - 1n;
  view.setBigUint64(0, bits);
  return view.getFloat64(0);
}

/** Fail unless r is the correctly rounded double of the exact value v. */
function expectCorrectlyRounded(r: number, v: Rational, label: string): void {
  const rr = doubleRational(r);
  const above = doubleRational(neighbour(r, true));
  const below = doubleRational(neighbour(r, false));
  const half = (a: Rational, b: Rational): Rational => ({ n: a.n * b.d + b.n * a.d, d: 2n * a.d * b.d });
  const hi = half(rr, above);
  const lo = half(rr, below);
  const [mLow, mHigh] = cmp(lo, hi) <= 0 ? [lo, hi] : [hi, lo];
  if (cmp(v, mLow) < 0 || cmp(v, mHigh) > 0) {
    expect.fail(`${label}: ${r} is not the nearest double to ${v.n}/${v.d}`);
  }
}

function checkAll(texts: string[]): void {
  const { offset, shifted } = shiftDecimals(texts);
  expect(Number.isFinite(offset)).toBe(true);
  const o = doubleRational(offset); // the offset is a double, hence exact as written
  texts.forEach((t, i) => expectCorrectlyRounded(shifted[i]!, sub(textRational(t), o), `text ${t}, offset ${offset}`));
}

/** Decimal texts that share `lead` constant leading digits, in varied spellings. */
const sharedLeading = fc
  .record({
    lead: fc.bigInt({ min: 1n, max: 10n ** 15n }),
    leadFraction: fc.integer({ min: 0, max: 8 }),
    tails: fc.array(fc.integer({ min: 0, max: 99999 }), { minLength: 1, maxLength: 40 }),
    tailDigits: fc.integer({ min: 1, max: 5 }),
    negative: fc.boolean(),
  })
  .map(({ lead, leadFraction, tails, tailDigits, negative }) => {
    const leadText = lead.toString();
    return tails.map((tail) => {
      const t = String(tail % 10 ** tailDigits).padStart(tailDigits, '0');
      const all = leadText + t;
      const fracDigits = leadFraction + tailDigits;
      const intPart = all.length > fracDigits ? all.slice(0, all.length - fracDigits) : '0';
      const frac = all.length > fracDigits ? all.slice(all.length - fracDigits) : all.padStart(fracDigits, '0');
      return `${negative ? '-' : ''}${intPart}.${frac}`;
    });
  });

describe('shiftDecimals', () => {
  it('chooses an exact offset and shifts 13 constant leading digits exactly', () => {
    const texts = ['1000000000000.4', '1000000000000.3', '1000000000000.5'];
    const { offset, shifted } = shiftDecimals(texts);
    // The offset is a double; its exact decimal text reads back to the same double.
    expect(Number(exactDecimalText(offset))).toBe(offset);
    expect(Math.abs(offset - 1e12)).toBeLessThan(1);
    // 1000000000000.4 - offset, etc., computed exactly on the digits, then rounded once.
    texts.forEach((t, i) => expectCorrectlyRounded(shifted[i]!, sub(textRational(t), doubleRational(offset)), t));
    expect(shifted[0]! - shifted[1]!).toBeCloseTo(0.1, 15);
  });

  it('leaves data without constant leading digits unshifted (offset 0, plain correctly rounded values)', () => {
    const texts = ['-0.5', '1e-3', '2', '+.25', '3.', '  7.125 ', '-0'];
    const { offset, shifted } = shiftDecimals(texts);
    expect(offset).toBe(0);
    // Same value as the engine's own correctly rounded reading ("-0" reads as plain 0).
    texts.forEach((t, i) => expect(shifted[i]! === Number(t), t).toBe(true));
    expect(Object.is(shifted[6], 0)).toBe(true);
  });

  it('handles a constant column, exponents, mixed precision and long digit strings', () => {
    checkAll(['5', '5', '5']);
    checkAll(['1.5e3', '1501', '1500.25', '15.0075e2']);
    checkAll(['107.8681568', '107.8681465', '107.8681572', '107.86819']);
    checkAll(['123456789012345678901.5', '123456789012345678901.25', '123456789012345678902']);
    checkAll(['0.000000000123456789', '0.000000000123456788', '1.23456787e-10']);
    checkAll(['99999999999999999999999999.000000000000000001', '99999999999999999999999999']);
    checkAll(['-2000000.001', '-2000000.002', '-1999999.999']);
  });

  it('property: shifted values are correctly rounded (value - offset) for data with constant leading digits', () => {
    fc.assert(fc.property(sharedLeading, (texts) => checkAll(texts)), { numRuns: 400 });
  });

  it('property: arbitrary decimal texts, in any spelling, are shifted exactly', () => {
    const text = fc
      .record({
        sign: fc.constantFrom('', '-', '+'),
        int: fc.stringMatching(/^\d{0,25}$/),
        frac: fc.stringMatching(/^\d{0,25}$/),
        exp: fc.option(fc.integer({ min: -40, max: 40 }), { nil: undefined }),
      })
      .filter((r) => r.int.length + r.frac.length > 0)
      .map((r) => `${r.sign}${r.int}${r.frac.length > 0 || r.int.length === 0 ? `.${r.frac}` : ''}${r.exp === undefined ? '' : `e${r.exp}`}`);
    fc.assert(fc.property(fc.array(text, { minLength: 1, maxLength: 30 }), (texts) => checkAll(texts)), { numRuns: 400 });
  });

  it('property: BigInt rounding of integer * 10^scale is correct, ties to even included', () => {
    fc.assert(
      fc.property(fc.bigInt({ min: -(10n ** 40n), max: 10n ** 40n }), fc.integer({ min: -60, max: 12 }), (n, s) => {
        const v: Rational = s >= 0 ? { n: n * 10n ** BigInt(s), d: 1n } : { n, d: 10n ** BigInt(-s) };
        expectCorrectlyRounded(roundScaledInteger(n, s), v, `${n}e${s}`);
      }),
      { numRuns: 2000 },
    );
    // Exact midpoints between neighbouring doubles, written as integer * 10^-k.
    fc.assert(
      fc.property(fc.double({ min: 1e-6, max: 1e12, noNaN: true }), (x) => {
        const a = doubleRational(x);
        const b = doubleRational(neighbour(x, true));
        const mid: Rational = { n: a.n * b.d + b.n * a.d, d: 2n * a.d * b.d };
        let k = 0n;
        while ((mid.n * 10n ** k) % mid.d !== 0n) k++;
        const r = roundScaledInteger((mid.n * 10n ** k) / mid.d, -Number(k));
        view.setFloat64(0, r);
        expect(r === x || r === neighbour(x, true)).toBe(true);
        expect(view.getBigUint64(0) % 2n, `tie at ${x} must go to the even neighbour`).toBe(0n);
      }),
      { numRuns: 300 },
    );
  });

  it('refuses texts that are not decimal numbers, naming the position', () => {
    for (const bad of ['', 'abc', '1.2.3', '1e', '--1', '0x10', 'Infinity', 'NaN', '1,5', '.', '1e5.5']) {
      expect(() => shiftDecimals(['1', bad]), bad).toThrow(DecimalTextError);
    }
    try {
      shiftDecimals(['1', '2', 'x7']);
      expect.fail('no error');
    } catch (e) {
      expect(e).toBeInstanceOf(DecimalTextError);
      expect((e as DecimalTextError).index).toBe(2);
      expect((e as Error).message).toContain('value 3');
    }
    expect(() => shiftDecimals(['1e400'])).toThrow(/too large/);
    // Far out of range: no digit arithmetic (this must return at once).
    const start = performance.now();
    expect(() => shiftDecimals(['1e100000000'])).toThrow(/too large/);
    expect(Array.from(shiftDecimals(['1e-100000000', '2']).shifted)).toEqual([0, 2]);
    expect(performance.now() - start).toBeLessThan(1000);
    checkAll(['1e-330', '-2.5e-320', '4.9e-324', '2.4703282292062328e-324']);
  });

  it('SmLs09-like texts: plain doubles lose digits, the shift does not', () => {
    // source: NIST StRD SmLs09 generation rule (reference README): y = 10^12 + c(t) + c(r),
    // c(1) = 0.2, c(even) = 0.1, c(odd > 1) = 0.3, 9 treatments x 2001 replicates; certified
    // within-treatment sum of squares 1.80000000000000E+02.
    const c = (k: number): string => (k === 1 ? '2' : k % 2 === 0 ? '1' : '3');
    const texts: string[] = [];
    const group: number[] = [];
    for (let t = 1; t <= 9; t++) {
      for (let r = 1; r <= 2001; r++) {
        const tenths = Number(c(t)) + Number(c(r));
        texts.push(`1000000000000.${tenths}`);
        group.push(t - 1);
      }
    }
    const withinSS = (y: Float64Array): number => {
      const sum = new Float64Array(9);
      for (let i = 0; i < y.length; i++) sum[group[i]!]! += y[i]!;
      const mean = Array.from(sum, (s) => s / 2001);
      let ss = 0;
      for (let i = 0; i < y.length; i++) ss += (y[i]! - mean[group[i]!]!) ** 2;
      return ss;
    };
    const plain = lre(withinSS(Float64Array.from(texts, Number)), 180);
    const shifted = lre(withinSS(shiftDecimals(texts).shifted), 180);
    console.log(`SmLs09-like within SS: LRE ${plain.toFixed(1)} on plain doubles, ${shifted.toFixed(1)} after the shift`);
    expect(plain).toBeLessThan(6);
    expect(shifted).toBeGreaterThanOrEqual(12);
  });
});

describe('a reading of decimal texts kept and read again', () => {
  it('reading again the changed texts gives what reading all of them gives, and shifting a kept reading leaves it as it was', () => {
    const text = fc.oneof(
      fc.constantFrom('0', '-0', '1.5', '1000000000000.4', '1e-7', ' 42 ', '12345678901234567890123', '9.999999999999999e22'),
      fc.integer({ min: -10_000_000, max: 10_000_000 }).map((k) => (k / 1000).toString()),
    );
    fc.assert(
      fc.property(fc.array(text, { minLength: 1, maxLength: 40 }), fc.array(fc.tuple(fc.nat(), text), { maxLength: 5 }), (texts, changes) => {
        const base = readDecimals(texts);
        const next = texts.slice();
        const rows = changes.map(([at, t]) => {
          next[at % texts.length] = t;
          return at % texts.length;
        });
        const again = readDecimalsAgain(base, next, rows);
        const full = readDecimals(next);
        expect(Array.from(again.values)).toEqual(Array.from(full.values));
        expect(Array.from(again.significand)).toEqual(Array.from(full.significand));
        expect(Array.from(again.scale)).toEqual(Array.from(full.scale));
        const before = Array.from(again.values);
        const s = shiftReading(again);
        const direct = shiftDecimals(next);
        expect(s.offset).toBe(direct.offset);
        expect(Array.from(s.shifted)).toEqual(Array.from(direct.shifted));
        expect(Array.from(again.values)).toEqual(before);
      }),
      { numRuns: 500, seed: 20261202 },
    );
  });
});
