/**
 * The syntax tree of the cell language. Every node carries its character range, so every
 * error can point at the exact characters it is about.
 */

export type BinaryOp = 'or' | 'and' | '==' | '!=' | '<' | '<=' | '>' | '>=' | '+' | '-' | '*' | '/' | '^';
export type UnaryOp = '-' | 'not';

interface NodeBase {
  readonly from: number;
  readonly to: number;
}

export interface NumberNode extends NodeBase {
  readonly type: 'number';
  readonly value: number;
  /** The literal as written, for exact decimal work. */
  readonly text: string;
}
export interface TextNode extends NodeBase {
  readonly type: 'text';
  readonly value: string;
}
export interface BooleanNode extends NodeBase {
  readonly type: 'boolean';
  readonly value: boolean;
}
export interface NameNode extends NodeBase {
  readonly type: 'name';
  readonly name: string;
}
export interface ListNode extends NodeBase {
  readonly type: 'list';
  readonly items: readonly Expr[];
}
export interface UnaryNode extends NodeBase {
  readonly type: 'unary';
  readonly op: UnaryOp;
  readonly operand: Expr;
}
export interface BinaryNode extends NodeBase {
  readonly type: 'binary';
  readonly op: BinaryOp;
  readonly left: Expr;
  readonly right: Expr;
  /** Range of the operator itself. */
  readonly opFrom: number;
  readonly opTo: number;
}
export interface Argument {
  /** Null for a positional argument. */
  readonly name: string | null;
  readonly nameFrom: number;
  readonly nameTo: number;
  readonly value: Expr;
}
export interface CallNode extends NodeBase {
  readonly type: 'call';
  readonly callee: string;
  readonly calleeFrom: number;
  readonly calleeTo: number;
  readonly args: readonly Argument[];
}
export interface MemberNode extends NodeBase {
  readonly type: 'member';
  readonly object: Expr;
  readonly name: string;
  readonly nameFrom: number;
  readonly nameTo: number;
}
export interface IndexNode extends NodeBase {
  readonly type: 'index';
  readonly object: Expr;
  readonly index: Expr;
}

export type Expr =
  | NumberNode
  | TextNode
  | BooleanNode
  | NameNode
  | ListNode
  | UnaryNode
  | BinaryNode
  | CallNode
  | MemberNode
  | IndexNode;

/** One formula cell's statement: `NAME = EXPRESSION` or a bare expression. */
export interface Statement {
  readonly name: string | null;
  readonly nameFrom: number;
  readonly nameTo: number;
  readonly expr: Expr;
}

/** A name read by an expression, at one place. */
export interface NameUse {
  readonly name: string;
  readonly from: number;
  readonly to: number;
}

/**
 * Every cell name an expression reads, in source order, one entry per occurrence.
 * Function names are not included (they are built-ins, not cells).
 */
export function namesRead(expr: Expr, out: NameUse[] = []): NameUse[] {
  // Iterative walk: the parser bounds the depth, but a long list of items is wide, and an
  // explicit stack costs nothing.
  const stack: Expr[] = [expr];
  const found: NameUse[] = [];
  while (stack.length > 0) {
    const e = stack.pop()!;
    switch (e.type) {
      case 'name':
        found.push({ name: e.name, from: e.from, to: e.to });
        break;
      case 'list':
        for (let i = e.items.length - 1; i >= 0; i--) stack.push(e.items[i]!);
        break;
      case 'unary':
        stack.push(e.operand);
        break;
      case 'binary':
        stack.push(e.right, e.left);
        break;
      case 'call':
        for (let i = e.args.length - 1; i >= 0; i--) stack.push(e.args[i]!.value);
        break;
      case 'member':
        stack.push(e.object);
        break;
      case 'index':
        stack.push(e.index, e.object);
        break;
      default:
        break;
    }
  }
  found.sort((a, b) => a.from - b.from);
  for (const f of found) out.push(f);
  return out;
}

/** Prints an expression with every operation in brackets: the precedence tests read it. */
export function printTree(e: Expr): string {
  switch (e.type) {
    case 'number':
      return e.text;
    case 'text':
      return JSON.stringify(e.value);
    case 'boolean':
      return String(e.value);
    case 'name':
      return e.name;
    case 'list':
      return `[${e.items.map(printTree).join(', ')}]`;
    case 'unary':
      return e.op === 'not' ? `(not ${printTree(e.operand)})` : `(-${printTree(e.operand)})`;
    case 'binary':
      return `(${printTree(e.left)} ${e.op} ${printTree(e.right)})`;
    case 'call':
      return `${e.callee}(${e.args.map((a) => (a.name ? `${a.name}: ${printTree(a.value)}` : printTree(a.value))).join(', ')})`;
    case 'member':
      return `${printTree(e.object)}.${e.name}`;
    case 'index':
      return `${printTree(e.object)}[${printTree(e.index)}]`;
  }
}
