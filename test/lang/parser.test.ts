import { describe, expect, it } from 'vitest';
import { printTree } from '../../src/lang/ast.ts';
import { LangError } from '../../src/lang/errors.ts';
import { MAX_DEPTH, parseExpression, parseStatement } from '../../src/lang/parser.ts';

const tree = (s: string): string => printTree(parseExpression(s));

function parseError(s: string): LangError {
  try {
    parseStatement(s);
  } catch (e) {
    if (e instanceof LangError) return e;
    throw e;
  }
  throw new Error(`expected a parse error for ${s}`);
}

// The precedence table of docs/language.md section 2, one row at a time, each against its
// neighbours: the fully bracketed tree shows which operator binds tighter.
describe('precedence table', () => {
  it('level 1: or is loosest, left-associative', () => {
    expect(tree('a or b or c')).toBe('((a or b) or c)');
    expect(tree('a or b and c')).toBe('(a or (b and c))');
  });
  it('level 2: and binds tighter than or, looser than not', () => {
    expect(tree('a and b or c and d')).toBe('((a and b) or (c and d))');
    expect(tree('a and b and c')).toBe('((a and b) and c)');
    expect(tree('not a and b')).toBe('((not a) and b)');
  });
  it('level 3: not binds looser than comparison', () => {
    expect(tree('not a == b')).toBe('(not (a == b))');
    expect(tree('not not a')).toBe('(not (not a))');
    expect(tree('a and not b')).toBe('(a and (not b))');
  });
  it('level 4: comparisons, all six, looser than + and not chainable', () => {
    for (const op of ['==', '!=', '<', '<=', '>', '>=']) {
      expect(tree(`a + 1 ${op} b * 2`)).toBe(`((a + 1) ${op} (b * 2))`);
      expect(tree(`a ${op} b and c`)).toBe(`((a ${op} b) and c)`);
    }
    const e = parseError('x = a < b < c');
    expect(e.message).toMatch(/cannot be chained/);
    expect(e.from).toBe('x = a < b '.length);
  });
  it('level 5: + and - left-associative, looser than * /', () => {
    expect(tree('a - b + c')).toBe('((a - b) + c)');
    expect(tree('a - b - c')).toBe('((a - b) - c)');
    expect(tree('a + b * c')).toBe('(a + (b * c))');
  });
  it('level 6: * and / left-associative, looser than unary minus', () => {
    expect(tree('a / b * c')).toBe('((a / b) * c)');
    expect(tree('a / b / c')).toBe('((a / b) / c)');
    expect(tree('-a * b')).toBe('((-a) * b)');
  });
  it('level 7: unary minus looser than ^, so -2 ^ 2 is -(2 ^ 2)', () => {
    expect(tree('-2 ^ 2')).toBe('(-(2 ^ 2))');
    expect(tree('- - a')).toBe('(-(-a))');
    expect(tree('2 ^ -1')).toBe('(2 ^ (-1))');
    expect(tree('2 ^ -1 * 3')).toBe('((2 ^ (-1)) * 3)');
  });
  it('level 8: ^ is right-associative', () => {
    expect(tree('a ^ b ^ c')).toBe('(a ^ (b ^ c))');
    expect(tree('a * b ^ c')).toBe('(a * (b ^ c))');
  });
  it('level 9: call, member, index and filter bind tightest', () => {
    expect(tree('-t.y ^ 2')).toBe('(-(t.y ^ 2))');
    expect(tree('f(x, level: 0.99)')).toBe('f(x, level: 0.99)');
    expect(tree('t.col[3]')).toBe('t.col[3]');
    expect(tree('c[c > 2] * 2')).toBe('(c[(c > 2)] * 2)');
    expect(tree('fit.means.mean[1]')).toBe('fit.means.mean[1]');
    expect(tree('t["yield (kg)"]')).toBe('t["yield (kg)"]');
    expect(tree('mean(t.y)^2')).toBe('(mean(t.y) ^ 2)');
  });
  it('brackets override', () => {
    expect(tree('(a + b) * c')).toBe('((a + b) * c)');
    expect(tree('(-2) ^ 2')).toBe('((-2) ^ 2)');
  });
});

describe('statements', () => {
  it('reads a definition and a bare expression', () => {
    const s = parseStatement('fit = blocked(t.y, t.trt, t.block)');
    expect(s.name).toBe('fit');
    expect(printTree(s.expr)).toBe('blocked(t.y, t.trt, t.block)');
    expect(parseStatement('1 + 2').name).toBeNull();
  });
  it('lets an expression span lines and carry comments', () => {
    const s = parseStatement('gain = difference(fit, # the pair that matters\n  "open", "spindle")');
    expect(printTree(s.expr)).toBe('difference(fit, "open", "spindle")');
  });
  it('reads literals', () => {
    expect(tree('[1, 2.5, 1e-3]')).toBe('[1, 2.5, 1e-3]');
    expect(tree('["a", "b\\"c"]')).toBe('["a", "b\\"c"]');
    expect(tree('true and false')).toBe('(true and false)');
  });
});

describe('errors carry a position and plain words', () => {
  const cases: [string, RegExp, number][] = [
    ['x = "open', /never closed/, 4],
    ['x = mean(t.y', /never closed/, 8],
    ['x = (1 + 2', /never closed/, 4],
    ['x = [1, 2', /never closed/, 4],
    ['x = 1 + ', /needs a value after it/, 6],
    ['x = 1 +', /needs a value after it/, 6],
    ['x = 1 )', /no matching opening/, 6],
    ['x = 1 2', /should end here/, 6],
    ['x = a = b', /single =/, 6],
    ['x = 3 @ 4', /has no meaning/, 6],
    ["x = 'a'", /double quotes/, 4],
    ['x = f(level: 1, 2)', /positional arguments come before named/, 16],
    ['x = f(a: 1, a: 2)', /given twice/, 12],
    ['x = round(2.5, )', /An argument is missing after this comma in the call of round/, 13],
    ['x = round(2.5,, 1)', /An argument is missing after this comma/, 13],
    ['x = [1, 2, ]', /An element is missing after this comma in the list/, 9],
    ['x = [1,, 2]', /An element is missing after this comma/, 6],
    ['x = t.', /name is expected after the dot/, 5],
    ['x = 2e', /is not a number/, 4],
    ['x = 12abc', /is not a number/, 4],
    ['x = "a\\n"', /Unknown escape/, 6],
    ['true = 1', /reserved word/, 0],
    ['', /empty/, 0],
    ['x = -not a', /brackets/, 5],
    ['x = (1)(2)', /Only built-in functions can be called/, 7],
  ];
  for (const [src, re, from] of cases) {
    it(`${JSON.stringify(src)}`, () => {
      const e = parseError(src);
      expect(e.message).toMatch(re);
      expect(e.from).toBe(from);
      expect(e.to).toBeGreaterThanOrEqual(e.from);
    });
  }

  it('10,000 nested brackets give an error, not a stack overflow', () => {
    const src = `x = ${'('.repeat(10_000)}1${')'.repeat(10_000)}`;
    const e = parseError(src);
    expect(e.message).toMatch(/nested more than/);
    // it points at the bracket that goes one level deeper than the limit
    expect(e.from).toBe(4 + MAX_DEPTH);
  });
  it('10,000 nested lists and calls too', () => {
    expect(parseError(`x = ${'['.repeat(10_000)}`).message).toMatch(/nested more than/);
    expect(parseError(`x = ${'sqrt('.repeat(10_000)}1${')'.repeat(10_000)}`).message).toMatch(/nested more than/);
    expect(parseError(`x = ${'-'.repeat(10_000)}1`).message).toMatch(/nested more than/);
  });
  it('a long chain a + a + ... is bounded in depth too', () => {
    const e = parseError(`x = ${Array.from({ length: 5000 }, () => 'a').join(' + ')}`);
    expect(e.message).toMatch(/nested more than/);
  });
  it('a formula of 10 MB on one line is refused with its position, before it is read', () => {
    const src = `x = ${'1+'.repeat(5 * 1024 * 1024)}1`;
    const e = parseError(src);
    expect(e.message).toMatch(/characters long/);
    expect(e.from).toBe(1_000_000);
    expect(e.to).toBe(src.length);
  });
});
