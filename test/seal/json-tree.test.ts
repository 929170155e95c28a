/**
 * The strict JSON reader that reads hand-edited seals back.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { JsonObject, JsonSyntaxError, readJson, sameTree, type JsonTree } from '../../src/seal/json-tree.ts';

/** A tree as plain data, to compare with Node's reader. */
function plain(t: JsonTree): unknown {
  if (t instanceof JsonObject) return Object.fromEntries([...t.members].map(([k, v]) => [k, plain(v)]));
  if (Array.isArray(t)) return t.map(plain);
  return t;
}

describe('readJson', () => {
  it('reads what Node reads, to the same values', () => {
    // source: Node 20 JSON.parse as the reference reader
    fc.assert(
      fc.property(fc.jsonValue(), (x) => {
        const text = JSON.stringify(x);
        expect(plain(readJson(text))).toEqual(JSON.parse(text));
      }),
      { numRuns: 1000 },
    );
  });
  it('keeps members in the order written, integer-like names included', () => {
    const t = readJson('{"b":1,"1":2,"__proto__":3}');
    expect(t).toBeInstanceOf(JsonObject);
    expect([...(t as JsonObject).members.keys()]).toEqual(['b', '1', '__proto__']);
  });
  it('reads -0 as negative zero and compares numbers bit for bit', () => {
    expect(Object.is(readJson('-0'), -0)).toBe(true);
    expect(sameTree(readJson('[0]'), readJson('[-0]'))).toBe(false);
    expect(sameTree(readJson('[1.5e0]'), readJson('[1.5]'))).toBe(true);
    expect(sameTree(readJson('{"a":1,"b":2}'), readJson('{"b":2,"a":1}'))).toBe(false);
  });
  it.each([
    ['{"a":1,"a":2}', /appears twice/],
    ['[1,]', /unexpected/],
    ['{"a" 1}', /expected ":"/],
    ['"abc', /never closed/],
    ['01', /unexpected text after/],
    ['[1] x', /unexpected text after/],
    ['"\\x"', /bad escape/],
    ['', /ends too early/],
    ['NaN', /unexpected/],
  ])('refuses %s in plain words', (text, message) => {
    expect(() => readJson(text)).toThrow(JsonSyntaxError);
    expect(() => readJson(text)).toThrow(message);
  });
  it('refuses nesting deeper than it reads, without overflowing the stack', () => {
    expect(() => readJson('['.repeat(100_000))).toThrow(/nested too deeply/);
  });
});

describe('ulpDistance', () => {
  it('counts the doubles between two numbers', async () => {
    const { ulpDistance } = await import('../../src/seal/verify.ts');
    // source: IEEE 754-2019, binary64: neighbours differ by one in their bit pattern (common practice)
    expect(ulpDistance(1, 1 + Number.EPSILON)).toBe(1);
    expect(ulpDistance(1, 1 + 4 * Number.EPSILON)).toBe(4);
    expect(ulpDistance(3.46171140040452, 3.4617114004045195)).toBe(1);
    expect(ulpDistance(-2, -2 - 4 * Number.EPSILON)).toBe(2); // one unit at 2 is 2 * EPSILON
    expect(ulpDistance(1, -1)).toBe(null);
    expect(ulpDistance(0, -0)).toBe(null);
    expect(ulpDistance(1, Infinity)).toBe(null);
    expect(ulpDistance(2.5, 2.5)).toBe(0);
  });
});
