/**
 * The parser of the cell language: a Pratt parser over the precedence table of
 * docs/language.md section 2.
 *
 *   level 1  or            level 5  + -        level 9  call f(x), member t.c,
 *   level 2  and           level 6  * /                 index c[i], filter c[mask]
 *   level 3  not (prefix)  level 7  - (prefix)
 *   level 4  == != < <= > >= (not chainable)   level 8  ^ (right-associative)
 *
 * Nesting is bounded (MAX_DEPTH): a document from someone else could hold ten thousand
 * brackets, and the answer must be an error on that cell, not a stack overflow.
 */
import type { Argument, BinaryOp, Expr, Statement } from './ast.ts';
import { LangError } from './errors.ts';
import { tokenize, type Token } from './lexer.ts';
import { msg } from '../messages/language.ts';
import { quote } from '../messages/words.ts';

/** The deepest nesting of brackets a formula may have. */
export const MAX_DEPTH = 200;

/**
 * The deepest syntax tree a formula may build, counting chains such as a + b + c + ...
 * (which a loop parses but which nest in the tree). The evaluator recurses on the tree, so
 * this bound is what keeps it far from the stack's limit.
 */
export const MAX_TREE_DEPTH = 1000;

const LEVEL = { or: 1, and: 2, not: 3, compare: 4, add: 5, mul: 6, neg: 7, pow: 8, postfix: 9 } as const;

const INFIX: ReadonlyMap<string, { level: number; op: BinaryOp }> = new Map([
  ['or', { level: LEVEL.or, op: 'or' }],
  ['and', { level: LEVEL.and, op: 'and' }],
  ['==', { level: LEVEL.compare, op: '==' }],
  ['!=', { level: LEVEL.compare, op: '!=' }],
  ['<', { level: LEVEL.compare, op: '<' }],
  ['<=', { level: LEVEL.compare, op: '<=' }],
  ['>', { level: LEVEL.compare, op: '>' }],
  ['>=', { level: LEVEL.compare, op: '>=' }],
  ['+', { level: LEVEL.add, op: '+' }],
  ['-', { level: LEVEL.add, op: '-' }],
  ['*', { level: LEVEL.mul, op: '*' }],
  ['/', { level: LEVEL.mul, op: '/' }],
  ['^', { level: LEVEL.pow, op: '^' }],
] as const);

function describeToken(t: Token): string {
  switch (t.type) {
    case 'end':
      return 'nothing more';
    case 'number':
      return `the number ${t.text}`;
    case 'text':
      return `the text ${quote(t.text)}`;
    case 'name':
      return `the name ${quote(t.text)}`;
    default:
      return quote(t.text);
  }
}

class Parser {
  private pos = 0;
  private depth = 0;
  private readonly tokens: readonly Token[];
  /** Depth of each inner node (leaves are 1 and not stored). */
  private readonly heights = new WeakMap<Expr, number>();

  private height(e: Expr): number {
    return this.heights.get(e) ?? 1;
  }

  /** Records a new node's height and refuses trees deeper than MAX_TREE_DEPTH. */
  private grown<E extends Expr>(node: E, children: readonly Expr[], at: { from: number; to: number }): E {
    let h = 0;
    for (const c of children) h = Math.max(h, this.height(c));
    if (h + 1 > MAX_TREE_DEPTH) throw new LangError(msg.tooDeep(MAX_TREE_DEPTH), at.from, at.to);
    this.heights.set(node, h + 1);
    return node;
  }

  constructor(tokens: readonly Token[]) {
    this.tokens = tokens;
  }

  peek(offset = 0): Token {
    return this.tokens[Math.min(this.pos + offset, this.tokens.length - 1)]!;
  }

  next(): Token {
    const t = this.peek();
    if (this.pos < this.tokens.length - 1) this.pos++;
    return t;
  }

  isOp(text: string, offset = 0): boolean {
    const t = this.peek(offset);
    return (t.type === 'op' || t.type === 'keyword') && t.text === text;
  }

  statement(): Statement {
    const first = this.peek();
    if (first.type === 'end') throw new LangError(msg.emptyFormula(), 0, 0);
    let name: string | null = null;
    let nameFrom = 0;
    let nameTo = 0;
    if (first.type === 'name' && this.isOp('=', 1)) {
      name = first.text;
      nameFrom = first.from;
      nameTo = first.to;
      this.next();
      this.next();
      if (this.peek().type === 'end') {
        const eq = this.tokens[this.pos - 1]!;
        throw new LangError(msg.expectedAfterOperator('='), eq.from, eq.to);
      }
    } else if (first.type === 'keyword' && this.isOp('=', 1) && first.text !== 'not') {
      throw new LangError(msg.reservedName(first.text), first.from, first.to);
    }
    const expr = this.expression(0);
    const rest = this.peek();
    if (rest.type !== 'end') {
      if (rest.type === 'op' && rest.text === '=') {
        throw new LangError(msg.singleEquals(), rest.from, rest.to);
      }
      if (rest.type === 'op' && (rest.text === ')' || rest.text === ']')) {
        throw new LangError(msg.unmatchedClose(rest.text), rest.from, rest.to);
      }
      throw new LangError(msg.trailingInput(describeToken(rest)), rest.from, rest.to);
    }
    return { name, nameFrom, nameTo, expr };
  }

  /** Parses an expression whose operators all bind at least as tightly as `minLevel`. */
  expression(minLevel: number): Expr {
    if (++this.depth > MAX_DEPTH) {
      const t = this.peek();
      throw new LangError(msg.tooDeep(MAX_DEPTH), t.from, t.to);
    }
    let left = this.prefix(minLevel);
    for (;;) {
      const t = this.peek();
      if (t.type !== 'op' && t.type !== 'keyword') break;
      // level 9: call, member, index
      if (t.text === '(' || t.text === '.' || t.text === '[') {
        left = this.postfix(left);
        continue;
      }
      const info = INFIX.get(t.text);
      if (info === undefined || info.level < minLevel) break;
      this.next();
      // right-associative ^ parses its right side at its own level; the others one above
      const right = this.operand(info.level === LEVEL.pow ? LEVEL.pow : info.level + 1, t);
      left = this.grown(
        { type: 'binary', op: info.op, left, right, from: left.from, to: right.to, opFrom: t.from, opTo: t.to },
        [left, right],
        t,
      );
      if (info.level === LEVEL.compare) {
        const after = this.peek();
        const again = INFIX.get(after.text);
        if ((after.type === 'op') && again !== undefined && again.level === LEVEL.compare) {
          throw new LangError(msg.chainedComparison(), after.from, after.to);
        }
      }
    }
    this.depth--;
    return left;
  }

  /** The right-hand side of an operator, with a message that names the operator if absent. */
  private operand(level: number, op: Token): Expr {
    const t = this.peek();
    if (t.type === 'end' || (t.type === 'op' && (t.text === ')' || t.text === ']' || t.text === ',' || t.text === ':'))) {
      throw new LangError(msg.expectedAfterOperator(op.text), op.from, op.to);
    }
    return this.expression(level);
  }

  private prefix(minLevel: number): Expr {
    const t = this.next();
    switch (t.type) {
      case 'number':
        return { type: 'number', value: t.value, text: t.text, from: t.from, to: t.to };
      case 'text':
        return { type: 'text', value: t.text, from: t.from, to: t.to };
      case 'name':
        return { type: 'name', name: t.text, from: t.from, to: t.to };
      case 'keyword':
        if (t.text === 'true' || t.text === 'false') return { type: 'boolean', value: t.text === 'true', from: t.from, to: t.to };
        if (t.text === 'not') {
          if (minLevel > LEVEL.not) throw new LangError(msg.notNeedsBrackets(), t.from, t.to);
          const operand = this.operand(LEVEL.not, t);
          return this.grown({ type: 'unary', op: 'not', operand, from: t.from, to: operand.to }, [operand], t);
        }
        throw new LangError(msg.expectedExpression(describeToken(t)), t.from, t.to);
      case 'op':
        if (t.text === '-') {
          const operand = this.operand(LEVEL.neg, t);
          return this.grown({ type: 'unary', op: '-', operand, from: t.from, to: operand.to }, [operand], t);
        }
        if (t.text === '(') {
          const inner = this.expression(0);
          const close = this.peek();
          if (!this.isOp(')')) {
            if (close.type === 'end') throw new LangError(msg.unclosed('(', ')'), t.from, t.to);
            throw new LangError(msg.expectedCloseAfter(')', 'bracket opened earlier'), close.from, close.to);
          }
          this.next();
          // an operation in brackets takes the brackets' range, so an error on the group
          // points at all of it; a lone name keeps its own range
          if (inner.type === 'name' || inner.type === 'number' || inner.type === 'text' || inner.type === 'boolean') return inner;
          const wide = { ...inner, from: t.from, to: close.to } as Expr;
          this.heights.set(wide, this.height(inner));
          return wide;
        }
        if (t.text === '[') return this.list(t);
        if (t.text === ')' || t.text === ']') throw new LangError(msg.unmatchedClose(t.text), t.from, t.to);
        throw new LangError(msg.expectedExpression(describeToken(t)), t.from, t.to);
      case 'end':
        throw new LangError(msg.expectedExpression(describeToken(t)), t.from, t.to);
    }
  }

  private list(open: Token): Expr {
    const items: Expr[] = [];
    if (!this.isOp(']')) {
      for (;;) {
        if (this.peek().type === 'end') throw new LangError(msg.unclosed('[', ']'), open.from, open.to);
        items.push(this.expression(0));
        if (this.isOp(',')) {
          const comma = this.next();
          if (this.isOp(']') || this.isOp(',')) throw new LangError(msg.missingAfterComma('element', 'list'), comma.from, comma.to);
          continue;
        }
        break;
      }
    }
    const close = this.peek();
    if (!this.isOp(']')) {
      if (close.type === 'end') throw new LangError(msg.unclosed('[', ']'), open.from, open.to);
      throw new LangError(msg.expectedCloseAfter(']', 'list'), close.from, close.to);
    }
    this.next();
    return this.grown({ type: 'list', items, from: open.from, to: close.to }, items, open);
  }

  private postfix(left: Expr): Expr {
    const t = this.next();
    if (t.text === '.') {
      const n = this.peek();
      if (n.type !== 'name' && n.type !== 'keyword') throw new LangError(msg.memberNeedsName(), t.from, t.to);
      this.next();
      return this.grown(
        { type: 'member', object: left, name: n.text, nameFrom: n.from, nameTo: n.to, from: left.from, to: n.to },
        [left],
        t,
      );
    }
    if (t.text === '[') {
      if (this.isOp(']')) throw new LangError(msg.expectedExpression(quote(']')), this.peek().from, this.peek().to);
      const index = this.expression(0);
      const close = this.peek();
      if (!this.isOp(']')) {
        if (close.type === 'end') throw new LangError(msg.unclosed('[', ']'), t.from, t.to);
        throw new LangError(msg.expectedCloseAfter(']', 'position or condition'), close.from, close.to);
      }
      this.next();
      return this.grown({ type: 'index', object: left, index, from: left.from, to: close.to }, [left, index], t);
    }
    // call
    if (left.type !== 'name') throw new LangError(msg.callOnlyNames(), t.from, t.to);
    const args: Argument[] = [];
    const seen = new Set<string>();
    let namedSeen: string | null = null;
    if (!this.isOp(')')) {
      for (;;) {
        const a = this.peek();
        if (a.type === 'end') throw new LangError(msg.unclosed('(', ')'), t.from, t.to);
        if (a.type === 'name' && this.isOp(':', 1)) {
          this.next();
          this.next();
          if (seen.has(a.text)) throw new LangError(msg.duplicateNamedArgument(a.text), a.from, a.to);
          seen.add(a.text);
          namedSeen = a.text;
          const value = this.operand(0, { ...a, text: ':' });
          args.push({ name: a.text, nameFrom: a.from, nameTo: a.to, value });
        } else {
          const value = this.expression(0);
          if (namedSeen !== null) throw new LangError(msg.namedBeforePositional(namedSeen), value.from, value.to);
          args.push({ name: null, nameFrom: value.from, nameTo: value.from, value });
        }
        if (this.isOp(',')) {
          const comma = this.next();
          if (this.isOp(')') || this.isOp(',')) throw new LangError(msg.missingAfterComma('argument', `call of ${left.name}`), comma.from, comma.to);
          continue;
        }
        break;
      }
    }
    const close = this.peek();
    if (!this.isOp(')')) {
      if (close.type === 'end') throw new LangError(msg.unclosed('(', ')'), t.from, t.to);
      throw new LangError(msg.expectedCloseAfter(')', `call of ${left.name}`), close.from, close.to);
    }
    this.next();
    return this.grown(
      { type: 'call', callee: left.name, calleeFrom: left.from, calleeTo: left.to, args, from: left.from, to: close.to },
      args.map((a) => a.value),
      t,
    );
  }
}

/** Parses one formula cell's text. Throws LangError with a range and plain words. */
export function parseStatement(text: string): Statement {
  return new Parser(tokenize(text)).statement();
}

/** Parses a lone expression (a note's placeholder). Throws LangError. */
export function parseExpression(text: string): Expr {
  const p = new Parser(tokenize(text));
  if (p.peek().type === 'end') throw new LangError(msg.expectedExpression('nothing'), 0, text.length);
  const e = p.expression(0);
  const rest = p.peek();
  if (rest.type !== 'end') throw new LangError(msg.trailingInput(describeToken(rest)), rest.from, rest.to);
  return e;
}
