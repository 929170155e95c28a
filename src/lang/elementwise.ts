/**
 * Element-by-element operators: arithmetic, comparison and logic over numbers, texts,
 * booleans and columns of them. A single value is spread over a column; two columns must
 * have the same length; a missing element stays missing (and, for `and` / `or`, the
 * three-valued logic of Kleene: false and missing is false, true or missing is true).
 */
import type { BinaryOp } from './ast.ts';
import { UsageError } from './errors.ts';
import { msg } from '../messages/language.ts';
import {
  MISSING,
  booleanColumn,
  describeType,
  isColumn,
  isMissing,
  numberColumn,
  pickDecimals,
  textColumn,
  type BooleanColumn,
  type Column,
  type NumberColumn,
  type TextColumn,
  type Value,
} from './values.ts';
import { pow } from '../stats/math/portable-power.ts';

type Scalar = number | string | boolean;
type Kind = 'number' | 'text' | 'boolean';

/** A value seen as a sequence of elements of one kind, or as a single scalar. */
interface Operand {
  readonly kind: Kind | 'missing';
  readonly length: number | null; // null for a scalar
  readonly at: (i: number) => Scalar | null; // null for missing
}

function operand(v: Value, op: string, side: Value): Operand {
  if (typeof v === 'number') return { kind: 'number', length: null, at: () => v };
  if (typeof v === 'string') return { kind: 'text', length: null, at: () => v };
  if (typeof v === 'boolean') return { kind: 'boolean', length: null, at: () => v };
  if (isMissing(v)) return { kind: 'missing', length: null, at: () => null };
  if (isColumn(v)) {
    const m = v.missing;
    const n = v.values.length;
    switch (v.type) {
      case 'number': {
        const x = v.values;
        return { kind: 'number', length: n, at: (i) => (m !== null && m[i] === 1 ? null : x[i]!) };
      }
      case 'text': {
        const x = v.values;
        return { kind: 'text', length: n, at: (i) => (m !== null && m[i] === 1 ? null : x[i]!) };
      }
      case 'boolean': {
        const x = v.values;
        return { kind: 'boolean', length: n, at: (i) => (m !== null && m[i] === 1 ? null : x[i] === 1) };
      }
    }
  }
  throw new UsageError(msg.operatorTypes(op, describeType(v), describeType(side)));
}

const ARITHMETIC = new Set<BinaryOp>(['+', '-', '*', '/', '^']);
const ORDERING = new Set<BinaryOp>(['<', '<=', '>', '>=']);

function arith(op: BinaryOp, a: number, b: number): number {
  switch (op) {
    case '+':
      return a + b;
    case '-':
      return a - b;
    case '*':
      return a * b;
    case '/':
      return a / b;
    default:
      return pow(a, b);
  }
}

function compare(op: BinaryOp, a: Scalar, b: Scalar): boolean {
  switch (op) {
    case '==':
      return a === b;
    case '!=':
      return a !== b;
    case '<':
      return a < b;
    case '<=':
      return a <= b;
    case '>':
      return a > b;
    default:
      return a >= b;
  }
}

/** Fast path: number column with number column or number, no per-element closures. */
function arithNumbers(op: BinaryOp, a: Value, b: Value): Value | null {
  const ac = isColumn(a) && a.type === 'number' ? a : null;
  const bc = isColumn(b) && b.type === 'number' ? b : null;
  if (ac === null && bc === null) return null;
  if ((ac === null && typeof a !== 'number') || (bc === null && typeof b !== 'number')) return null;
  const n = (ac ?? bc)!.values.length;
  if (ac !== null && bc !== null && ac.values.length !== bc.values.length) {
    throw new UsageError(msg.lengthMismatch(op, ac.values.length, bc.values.length));
  }
  const out = new Float64Array(n);
  const x = ac?.values;
  const y = bc?.values;
  const sa = typeof a === 'number' ? a : 0;
  const sb = typeof b === 'number' ? b : 0;
  switch (op) {
    case '+':
      for (let i = 0; i < n; i++) out[i] = (x ? x[i]! : sa) + (y ? y[i]! : sb);
      break;
    case '-':
      for (let i = 0; i < n; i++) out[i] = (x ? x[i]! : sa) - (y ? y[i]! : sb);
      break;
    case '*':
      for (let i = 0; i < n; i++) out[i] = (x ? x[i]! : sa) * (y ? y[i]! : sb);
      break;
    case '/':
      for (let i = 0; i < n; i++) out[i] = (x ? x[i]! : sa) / (y ? y[i]! : sb);
      break;
    default:
      for (let i = 0; i < n; i++) out[i] = pow(x ? x[i]! : sa, y ? y[i]! : sb);
  }
  let missing: Uint8Array | null = null;
  for (const c of [ac, bc]) {
    if (c !== null && c.missing !== null) {
      missing ??= new Uint8Array(n);
      for (let i = 0; i < n; i++) {
        if (c.missing[i] === 1) {
          missing[i] = 1;
          out[i] = NaN;
        }
      }
    }
  }
  return numberColumn(out, missing);
}

function typeError(op: BinaryOp, a: Value, b: Value): UsageError {
  return new UsageError(msg.operatorTypes(op, describeType(a), describeType(b)));
}

/** Applies a binary operator element by element. Throws UsageError. */
export function binary(op: BinaryOp, a: Value, b: Value): Value {
  if (ARITHMETIC.has(op)) {
    if (typeof a === 'number' && typeof b === 'number') return arith(op, a, b);
    const fast = arithNumbers(op, a, b);
    if (fast !== null) return fast;
  }
  const A = operand(a, op, b);
  const B = operand(b, op, a);
  if (A.length !== null && B.length !== null && A.length !== B.length) {
    throw new UsageError(msg.lengthMismatch(op, A.length, B.length));
  }
  const n = A.length ?? B.length;
  const kind = A.kind === 'missing' ? B.kind : A.kind;
  // kinds must agree (a missing scalar goes with anything)
  if (A.kind !== 'missing' && B.kind !== 'missing' && A.kind !== B.kind) {
    if (op === '==' || op === '!=' || ORDERING.has(op)) {
      throw new UsageError(msg.compareTypes(describeType(a), describeType(b)));
    }
    throw typeError(op, a, b);
  }
  if (ARITHMETIC.has(op)) {
    if (kind !== 'number' && kind !== 'missing') throw typeError(op, a, b);
    if (n === null) return MISSING;
    const out = new Float64Array(n);
    const miss = new Uint8Array(n);
    for (let i = 0; i < n; i++) {
      const x = A.at(i);
      const y = B.at(i);
      if (x === null || y === null) {
        miss[i] = 1;
        out[i] = NaN;
      } else out[i] = arith(op, x as number, y as number);
    }
    return numberColumn(out, miss);
  }
  if (op === 'and' || op === 'or') {
    if (kind !== 'boolean' && kind !== 'missing') throw typeError(op, a, b);
    const logic = (x: Scalar | null, y: Scalar | null): boolean | null => {
      if (op === 'and') {
        if (x === false || y === false) return false;
        return x === null || y === null ? null : true;
      }
      if (x === true || y === true) return true;
      return x === null || y === null ? null : false;
    };
    if (n === null) {
      const r = logic(A.at(0), B.at(0));
      return r === null ? MISSING : r;
    }
    const out = new Uint8Array(n);
    const miss = new Uint8Array(n);
    for (let i = 0; i < n; i++) {
      const r = logic(A.at(i), B.at(i));
      if (r === null) miss[i] = 1;
      else out[i] = r ? 1 : 0;
    }
    return booleanColumn(out, miss);
  }
  // comparisons
  if (ORDERING.has(op) && kind === 'boolean') throw new UsageError(msg.compareTypes(describeType(a), describeType(b)));
  if (n === null) {
    const x = A.at(0);
    const y = B.at(0);
    return x === null || y === null ? MISSING : compare(op, x, y);
  }
  const out = new Uint8Array(n);
  const miss = new Uint8Array(n);
  for (let i = 0; i < n; i++) {
    const x = A.at(i);
    const y = B.at(i);
    if (x === null || y === null) miss[i] = 1;
    else out[i] = compare(op, x, y) ? 1 : 0;
  }
  return booleanColumn(out, miss);
}

/** Unary minus. */
export function negate(v: Value): Value {
  if (typeof v === 'number') return -v;
  if (isMissing(v)) return MISSING;
  if (isColumn(v) && v.type === 'number') {
    const out = new Float64Array(v.values.length);
    for (let i = 0; i < out.length; i++) out[i] = -v.values[i]!;
    return numberColumn(out, v.missing);
  }
  throw new UsageError(msg.operatorType('-', describeType(v)));
}

/** Logical not. */
export function not(v: Value): Value {
  if (typeof v === 'boolean') return !v;
  if (isMissing(v)) return MISSING;
  if (isColumn(v) && v.type === 'boolean') {
    const out = new Uint8Array(v.values.length);
    for (let i = 0; i < out.length; i++) out[i] = v.values[i] === 1 ? 0 : 1;
    return booleanColumn(out, v.missing);
  }
  throw new UsageError(msg.operatorType('not', describeType(v)));
}

/** Applies a number function to a number or to each element of a number column. */
export function mapNumbers(v: Value, f: (x: number) => number): Value {
  if (typeof v === 'number') return f(v);
  if (isMissing(v)) return MISSING;
  const c = v as NumberColumn;
  const out = new Float64Array(c.values.length);
  const m = c.missing;
  for (let i = 0; i < out.length; i++) out[i] = m !== null && m[i] === 1 ? NaN : f(c.values[i]!);
  return numberColumn(out, m, c.name);
}

/** Picks elements of a column where a mask is true (missing counts as not true). */
export function filterColumn<C extends Column>(c: C, mask: BooleanColumn): C {
  const n = c.values.length;
  if (mask.values.length !== n) throw new UsageError(msg.maskLength(mask.values.length, n));
  const keep: number[] = [];
  for (let i = 0; i < n; i++) if (mask.values[i] === 1 && !(mask.missing !== null && mask.missing[i] === 1)) keep.push(i);
  return pickColumn(c, keep);
}

/** The elements of a column at the given 0-based positions, in that order. */
export function pickColumn<C extends Column>(c: C, positions: readonly number[]): C {
  const k = positions.length;
  const miss = c.missing === null ? null : new Uint8Array(k);
  if (miss !== null) for (let j = 0; j < k; j++) miss[j] = c.missing![positions[j]!]!;
  switch (c.type) {
    case 'number': {
      const nc = c as NumberColumn;
      const out = new Float64Array(k);
      for (let j = 0; j < k; j++) out[j] = nc.values[positions[j]!]!;
      const dec = nc.decimals === null ? null : pickDecimals(nc.decimals, positions);
      return numberColumn(out, miss, c.name, dec) as C;
    }
    case 'text': {
      const tc = c as TextColumn;
      return textColumn(positions.map((p) => tc.values[p]!), miss, c.name) as C;
    }
    case 'boolean': {
      const bc = c as BooleanColumn;
      const out = new Uint8Array(k);
      for (let j = 0; j < k; j++) out[j] = bc.values[positions[j]!]!;
      return booleanColumn(out, miss, c.name) as C;
    }
  }
}
