/**
 * The canonical JSON of values: numbers, texts, and the contract's shapes.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { booleansJsonBytes, columnJson, jsonNumber, jsonText, numbersJsonBytes, plainJson, toJson, typedCanonical } from '../../src/lang/json.ts';
import {
  MISSING,
  booleanColumn,
  errorValue,
  numberColumn,
  record,
  table,
  textColumn,
  type Table,
} from '../../src/lang/values.ts';

/** The double whose IEEE 754 bits are the 16 hex digits given. */
function fromBits(hex: string): number {
  const view = new DataView(new ArrayBuffer(8));
  view.setBigUint64(0, BigInt(`0x${hex}`));
  return view.getFloat64(0);
}

describe('numbers', () => {
  // source: RFC 8785 (JSON Canonicalization Scheme), Appendix B, "Number Serialization
  // Samples" (from memory); the form is ECMAScript's Number::toString (ECMA-262, 6.1.6.1.20)
  const samples: [string, string][] = [
    ['0000000000000000', '0'],
    ['0000000000000001', '5e-324'],
    ['8000000000000001', '-5e-324'],
    ['7fefffffffffffff', '1.7976931348623157e+308'],
    ['ffefffffffffffff', '-1.7976931348623157e+308'],
    ['4340000000000000', '9007199254740992'],
    ['c340000000000000', '-9007199254740992'],
    ['4430000000000000', '295147905179352830000'],
    ['44b52d02c7e14af5', '9.999999999999997e+22'],
    ['44b52d02c7e14af6', '1e+23'],
    ['44b52d02c7e14af7', '1.0000000000000001e+23'],
    ['444b1ae4d6e2ef4e', '999999999999999700000'],
    ['444b1ae4d6e2ef4f', '999999999999999900000'],
    ['444b1ae4d6e2ef50', '1e+21'],
    ['3eb0c6f7a0b5ed8c', '9.999999999999997e-7'],
    ['3eb0c6f7a0b5ed8d', '0.000001'],
    ['41b3de4355555553', '333333333.3333332'],
    ['41b3de4355555554', '333333333.33333325'],
    ['41b3de4355555555', '333333333.3333333'],
    ['41b3de4355555556', '333333333.3333334'],
    ['becbf647612f3696', '-0.0000033333333333333333'],
    ['43143ff3c1cb0959', '1424953923781206.2'],
  ];
  it.each(samples)('bits %s are written %s', (bits, text) => {
    expect(jsonNumber(fromBits(bits))).toBe(text);
  });

  it('writes non-finite numbers as the contract texts and negative zero as -0 (our one departure from RFC 8785)', () => {
    expect(jsonNumber(NaN)).toBe('"NaN"');
    expect(jsonNumber(Infinity)).toBe('"Infinity"');
    expect(jsonNumber(-Infinity)).toBe('"-Infinity"');
    // RFC 8785 writes -0 as 0; a seal must tell them apart, since numbers compare bit for bit
    expect(jsonNumber(-0)).toBe('-0');
    expect(Object.is(JSON.parse(jsonNumber(-0)), -0)).toBe(true);
  });

  it('reads back as the same double, bit for bit, for any finite number', () => {
    // source: Node's JSON.parse (ECMA-262 JSON.parse) as the reference reader
    fc.assert(
      fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), (x) => {
        expect(Object.is(JSON.parse(jsonNumber(x)), x)).toBe(true);
      }),
      { numRuns: 5000 },
    );
  });

  it('is the shortest text that reads back (no shorter decimal rounds to the same double)', () => {
    // source: ECMA-262 Number::toString, step 5 (k as small as possible)
    fc.assert(
      fc.property(fc.double({ noNaN: true, noDefaultInfinity: true, min: 1e-300, max: 1e300 }), (x) => {
        const digits = x.toExponential().split('e')[0]!.replace('.', '').replace('-', '');
        const k = digits.length;
        if (k > 1) expect(Number(x.toPrecision(k - 1))).not.toBe(x);
      }),
      { numRuns: 2000 },
    );
  });
});

describe('texts', () => {
  it('escapes only what JSON must, as RFC 8785 section 3.2.2.2 shows', () => {
    // source: RFC 8785, section 3.2.2.2, the string example (from memory)
    const input = '\u20ac$\u000F\u000aA\'\u0042\u0022\u005c\\"/';
    expect(jsonText(input)).toBe('"€$\\u000f\\nA\'B\\"\\\\\\\\\\"/"');
  });
  it('escapes a lone surrogate rather than writing ill-formed UTF-16', () => {
    // source: ECMA-262 (2019 and later), JSON.stringify's QuoteJSONString
    expect(jsonText('a\ud800b')).toBe('"a\\ud800b"');
    expect(jsonText('😀')).toBe('"😀"');
  });
});

describe('value shapes (docs/language.md section 9)', () => {
  const y = numberColumn(new Float64Array([1.5, NaN, -0.0025]), new Uint8Array([0, 1, 0]), 'y', ['1.5', '', '-0.0025']);
  const g = textColumn(['a', '__proto__', 'c'], null, 'g');
  const t = table(['y', 'g'], [y, g]);

  it('writes each kind in its contract shape, with no whitespace', () => {
    expect(toJson(3)).toBe('3');
    expect(toJson('x"y')).toBe('"x\\"y"');
    expect(toJson(true)).toBe('true');
    expect(toJson(MISSING)).toBe('null');
    expect(toJson(y)).toBe('[1.5,null,-0.0025]');
    expect(toJson(booleanColumn(new Uint8Array([1, 0]), new Uint8Array([0, 1])))).toBe('[true,null]');
    expect(toJson(t)).toBe('{"y":[1.5,null,-0.0025],"g":["a","__proto__","c"]}');
    expect(toJson(record([['mse', 0.25], ['means', t]]))).toBe('{"mse":0.25,"means":{"y":[1.5,null,-0.0025],"g":["a","__proto__","c"]}}');
    expect(toJson({ kind: 'claim', holds: false, statement: 'A beats B' })).toBe('{"holds":false,"statement":"A beats B"}');
    expect(toJson(errorValue('no such name', 2, 5))).toBe('{"message":"no such name","from":2,"to":5}');
    expect(toJson({ kind: 'chart', spec: { mark: 'point', data: { values: [{ x: 1, y: -0 }] } }, caption: 'c' })).toBe(
      '{"vega_lite":{"mark":"point","data":{"values":[{"x":1,"y":-0}]}}}',
    );
  });

  it('keeps column order and field order: they are part of the value', () => {
    const a = table(['1', 'b'], [numberColumn(new Float64Array([1])), numberColumn(new Float64Array([2]))]);
    const b = table(['b', '1'], [numberColumn(new Float64Array([2])), numberColumn(new Float64Array([1]))]);
    expect(toJson(a)).toBe('{"1":[1],"b":[2]}');
    expect(toJson(b)).toBe('{"b":[2],"1":[1]}');
  });

  it('ignores a descriptive part a value may carry beyond the contract fields', () => {
    const drawn: Table = { ...t, drawn: record([['generator', 'x'], ['seed', 7]], 'drawn') };
    expect(toJson(drawn)).toBe(toJson(t));
  });

  it('writes plain data the way Node writes it, except for the non-finite numbers and -0', () => {
    // source: Node 20's JSON.stringify (ECMA-262) as the reference writer
    fc.assert(
      fc.property(fc.jsonValue(), (x) => {
        const hasNegZero = JSON.stringify(x, (_k, v: unknown) => (Object.is(v, -0) ? '§-0' : v)).includes('§-0');
        if (!hasNegZero) expect(plainJson(x)).toBe(JSON.stringify(x));
      }),
      { numRuns: 2000 },
    );
  });

  it('refuses what is not plain data', () => {
    expect(() => plainJson({ f: () => 1 })).toThrow(/not plain data/);
    expect(() => plainJson(new Float64Array(2))).toThrow(/plain objects/);
    const loop: { self?: unknown } = {};
    loop.self = loop;
    expect(() => plainJson(loop)).toThrow(/too deeply/);
  });
});

describe('number and boolean elements as bytes', () => {
  // the command line writes long columns as ASCII bytes; they must be columnJson's characters exactly
  const between = (c: Parameters<typeof columnJson>[0], from: number, to: number): string => columnJson(c, from, to).slice(1, -1);

  it('are the characters of the canonical text, for any doubles and missing marks', () => {
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.double(), fc.boolean()), { maxLength: 60 }),
        fc.nat(60),
        fc.nat(60),
        (elements, a, b) => {
          const values = Float64Array.from(elements.map(([x]) => x));
          const missing = Uint8Array.from(elements.map(([, m]) => (m ? 1 : 0)));
          const c = numberColumn(values, missing);
          const from = Math.min(a, b, values.length);
          const to = Math.min(Math.max(a, b), values.length);
          const bytes = numbersJsonBytes(c.values, c.missing, from, to);
          expect(bytes.every((x) => x < 128)).toBe(true);
          expect(new TextDecoder().decode(bytes)).toBe(between(c, from, to));
        },
      ),
      { numRuns: 2000 },
    );
  });

  it('copy a typed text only where it is the canonical text of its number, for any decimal texts', () => {
    // decimal texts as people type them: signs, leading and trailing zeros, points at either
    // end, exponents, up to 18 digits, below 1e-6; the values read from them as the readers do
    const digits = fc.stringMatching(/^[0-9]{1,18}$/);
    const typedText = fc.oneof(
      fc.tuple(fc.constantFrom('', '-', '+'), digits, fc.constantFrom('', '.'), fc.stringMatching(/^[0-9]{0,18}$/), fc.constantFrom('', 'e3', 'E-2')).map((p) => p.join('')),
      fc.constantFrom('0', '-0', '0.0', '0.000001', '-0.000001', '0.0000001', '0.0000012345', '1e-7', '.5', '5.', '007', '2.50', '123456789012345', '1234567890123456', '999999999999999.9', '0.1', '0.30000000000000004', '9007199254740993'),
    );
    fc.assert(
      fc.property(fc.array(fc.tuple(typedText, fc.boolean()), { minLength: 1, maxLength: 40 }), fc.boolean(), (elements, offByOne) => {
        const source = elements.map(([t]) => t).join(' ');
        const from = new Int32Array(elements.length);
        const to = new Int32Array(elements.length);
        let at = 0;
        elements.forEach(([t], i) => {
          from[i] = at;
          to[i] = at + t.length;
          at += t.length + 1;
        });
        const values = Float64Array.from(elements, ([t]) => Number(t));
        // now and then a value that is not the one its text reads as: never copied then
        if (offByOne) values[0] = values[0]! + 1;
        const missing = Uint8Array.from(elements, ([, m]) => (m ? 1 : 0));
        const c = numberColumn(values, missing);
        const typed = numbersJsonBytes(values, missing, 0, values.length, { source, from, to });
        expect(new TextDecoder().decode(typed)).toBe(between(c, 0, values.length));
      }),
      { numRuns: 3000, seed: 20261202 },
    );
    // and the text is copied where it may be (a text made from the double would also match,
    // so this is the shortcut's own check: a value the text does not read as is refused)
    expect(typedCanonical('81.23', 0, 5, 81.23)).toBe(true);
    expect(typedCanonical('-0.000001', 0, 9, -0.000001)).toBe(true);
    expect(typedCanonical('-0', 0, 2, -0)).toBe(true);
    expect(typedCanonical('-0', 0, 2, 0)).toBe(false);
    expect(typedCanonical('81.23', 0, 5, 81.24)).toBe(false);
    expect(typedCanonical('81.230', 0, 6, 81.23)).toBe(false);
    expect(typedCanonical('0.0000001', 0, 9, 1e-7)).toBe(false);
    expect(typedCanonical('1234567890123456', 0, 16, 1234567890123456)).toBe(false);
  });

  it('cover the longest texts a number has, and booleans with missing marks', () => {
    // the longest texts of all: 17 digits after "-0.00000" (25 characters), then exponent forms
    const extremes = [-0.0000012345678901234567, -9.999999999999999e-6, -Number.MAX_VALUE, -Number.MIN_VALUE, -2.2250738585072014e-308, -1.2345678901234567e-300, -0, NaN, -Infinity, 123456789012345680000];
    const c = numberColumn(Float64Array.from(extremes));
    expect(new TextDecoder().decode(numbersJsonBytes(c.values, null))).toBe(between(c, 0, extremes.length));
    expect(new TextDecoder().decode(numbersJsonBytes(c.values, null))).toContain('-2.2250738585072014e-308,-1.2345678901234568e-300,-0,"NaN","-Infinity"');
    const b = booleanColumn(Uint8Array.from([1, 0, 1, 0]), Uint8Array.from([0, 0, 1, 0]));
    expect(new TextDecoder().decode(booleansJsonBytes(b.values, b.missing))).toBe('true,false,null,false');
    expect(new TextDecoder().decode(booleansJsonBytes(b.values, b.missing, 1, 3))).toBe(between(b, 1, 3));
    expect(numbersJsonBytes(new Float64Array(0), null).length).toBe(0);
  });

  it('lose no digit in a column where every text is as long as a number can be', () => {
    // 20,000 negative numbers between 1e-6 and 1e-5 that need 17 digits: 25 characters each
    const n = 20_000;
    const values = Float64Array.from({ length: n }, (_, i) => -(1.2345678901234567e-6 + i * 3.3e-16));
    expect(values.every((x) => jsonNumber(x).length === 25)).toBe(true);
    const c = numberColumn(values);
    expect(new TextDecoder().decode(numbersJsonBytes(c.values, null))).toBe(between(c, 0, n));
    fc.assert(
      fc.property(fc.array(fc.double({ min: -1e-5, max: -1e-6, noNaN: true }), { maxLength: 40 }), (xs) => {
        const col = numberColumn(Float64Array.from(xs));
        expect(new TextDecoder().decode(numbersJsonBytes(col.values, null))).toBe(between(col, 0, xs.length));
      }),
      { numRuns: 500 },
    );
  });
});
