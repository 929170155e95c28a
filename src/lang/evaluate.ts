/**
 * The evaluator: one walk over a syntax tree, reading other cells through a Scope and
 * calling built-ins through the registry. It has no loops, no user functions and no access
 * to anything outside the document, so evaluation always ends.
 *
 * Errors are thrown as LangError with the range of the exact characters at fault; the graph
 * catches them at the cell boundary and turns them into error values.
 */
import { signature, type Registry, type SourceTable } from './builtins.ts';
import { TYPES } from './types.ts';
import type { Argument, CallNode, Expr, IndexNode, MemberNode } from './ast.ts';
import { filterColumn, binary, negate, not, pickColumn } from './elementwise.ts';
import { LangError, UsageError } from './errors.ts';
import { msg } from '../messages/language.ts';
import { quote } from '../messages/words.ts';
import { suggest } from './suggest.ts';
import {
  MISSING,
  booleanColumn,
  describeType,
  elementAt,
  isColumn,
  isError,
  isMissing,
  isRecord,
  isTable,
  numberColumn,
  table,
  textColumn,
  type BooleanColumn,
  type Column,
  type Value,
} from './values.ts';

/** How a name resolves in the document. */
export type Lookup =
  | { readonly kind: 'value'; readonly value: Value }
  | { readonly kind: 'unknown' }
  /** The name exists but cannot be read (defined twice, or part of a cycle). */
  | { readonly kind: 'problem'; readonly message: string };

/** The names a formula can read. */
export interface Scope {
  lookup(name: string): Lookup;
  /** Every name defined in the document, for "did you mean". */
  names(): Iterable<string>;
}

/** Everything evaluation needs besides the tree. */
export interface EvalEnv {
  readonly scope: Scope;
  readonly registry: Registry;
  warn(message: string): void;
  progress(fraction: number): void;
}

/** Evaluates an expression. Throws LangError. */
export function evaluate(e: Expr, env: EvalEnv): Value {
  try {
    return evalNode(e, env);
  } catch (err) {
    if (err instanceof LangError) throw err;
    if (err instanceof UsageError) throw new LangError(err.message, e.from, e.to);
    if (err instanceof RangeError && /call stack/i.test(err.message)) {
      throw new LangError(msg.tooDeep(200), e.from, e.to);
    }
    throw err;
  }
}

function evalNode(e: Expr, env: EvalEnv): Value {
  switch (e.type) {
    case 'number':
      return e.value;
    case 'text':
      return e.value;
    case 'boolean':
      return e.value;
    case 'name':
      return readName(e.name, e.from, e.to, env);
    case 'list':
      return evalList(e.items, env);
    case 'unary': {
      const v = evalNode(e.operand, env);
      try {
        return e.op === '-' ? negate(v) : not(v);
      } catch (err) {
        throw at(err, e.from, e.to);
      }
    }
    case 'binary': {
      const a = evalNode(e.left, env);
      const b = evalNode(e.right, env);
      try {
        return binary(e.op, a, b);
      } catch (err) {
        throw at(err, e.opFrom, e.opTo);
      }
    }
    case 'member':
      return evalMember(e, env);
    case 'index':
      return evalIndex(e, env);
    case 'call':
      return evalCall(e, env);
  }
}

/** Places a UsageError at a range; other errors pass through. */
function at(err: unknown, from: number, to: number): unknown {
  return err instanceof UsageError ? new LangError(err.message, from, to) : err;
}

function readName(name: string, from: number, to: number, env: EvalEnv): Value {
  const found = env.scope.lookup(name);
  switch (found.kind) {
    case 'value':
      if (isError(found.value)) throw new LangError(msg.upstream(name), from, to, name);
      return found.value;
    case 'problem':
      throw new LangError(found.message, from, to, name);
    case 'unknown':
      if (env.registry.has(name)) throw new LangError(msg.functionAsValue(name), from, to);
      throw new LangError(msg.unknownName(name, suggest(name, env.scope.names())), from, to);
  }
}

function evalList(items: readonly Expr[], env: EvalEnv): Value {
  const values = items.map((it) => evalNode(it, env));
  if (values.length === 0) return numberColumn(new Float64Array(0));
  // a list of columns is a table of them: factorial(y, [a, b]) reads factors this way
  if (values.every(isColumn)) return columnsAsTable(values as Column[], items);
  let kind: 'number' | 'text' | 'boolean' | null = null;
  for (let i = 0; i < values.length; i++) {
    const v = values[i]!;
    if (isMissing(v)) continue;
    const k = typeof v === 'number' ? 'number' : typeof v === 'string' ? 'text' : typeof v === 'boolean' ? 'boolean' : null;
    if (k === null) throw new LangError(msg.listElement(describeType(v)), items[i]!.from, items[i]!.to);
    if (kind !== null && k !== kind) throw new LangError(msg.mixedList(), items[i]!.from, items[i]!.to);
    kind = k;
  }
  const n = values.length;
  const miss = new Uint8Array(n);
  values.forEach((v, i) => {
    if (isMissing(v)) miss[i] = 1;
  });
  if (kind === 'text') return textColumn(values.map((v) => (typeof v === 'string' ? v : '')), miss);
  if (kind === 'boolean') {
    const out = new Uint8Array(n);
    values.forEach((v, i) => {
      out[i] = v === true ? 1 : 0;
    });
    return booleanColumn(out, miss);
  }
  const out = new Float64Array(n);
  values.forEach((v, i) => {
    out[i] = typeof v === 'number' ? v : NaN;
  });
  // keep the decimal text of literal numbers, so that typed data keep their digits
  const decimals = items.every((it) => it.type === 'number' || (it.type === 'unary' && it.op === '-' && it.operand.type === 'number'))
    ? items.map((it) => (it.type === 'number' ? it.text : it.type === 'unary' && it.operand.type === 'number' ? `-${it.operand.text}` : ''))
    : null;
  return numberColumn(out, miss, null, decimals);
}

function columnsAsTable(cols: readonly Column[], items: readonly Expr[]): Value {
  const n = cols[0]!.values.length;
  for (let i = 1; i < cols.length; i++) {
    if (cols[i]!.values.length !== n) {
      throw new LangError(msg.lengthMismatch('[ ]', n, cols[i]!.values.length), items[i]!.from, items[i]!.to);
    }
  }
  const names: string[] = [];
  cols.forEach((c, i) => {
    let base = c.name ?? `item_${i + 1}`;
    let name = base;
    for (let k = 2; names.includes(name); k++) name = `${base}_${k}`;
    names.push(name);
  });
  return table(names, cols);
}

function evalMember(e: MemberNode, env: EvalEnv): Value {
  return memberOf(e, evalNode(e.object, env));
}

/** The member `e.name` of an already evaluated object. */
function memberOf(e: MemberNode, obj: Value): Value {
  const label = e.object.type === 'name' ? e.object.name : '';
  if (isTable(obj)) {
    const i = obj.names.indexOf(e.name);
    if (i < 0) throw new LangError(msg.noColumn(label, e.name, suggest(e.name, obj.names)), e.nameFrom, e.nameTo);
    return obj.columns[i]!;
  }
  if (isRecord(obj)) {
    const v = obj.fields.get(e.name);
    if (v === undefined) {
      const names = [...obj.fields.keys()];
      throw new LangError(msg.noField(e.name, names, suggest(e.name, names)), e.nameFrom, e.nameTo);
    }
    return v;
  }
  throw new LangError(msg.memberOf(`${label ? `${quote(label)}, ` : ''}${describeType(obj)},`), e.nameFrom - 1, e.nameTo);
}

function evalIndex(e: IndexNode, env: EvalEnv): Value {
  return indexOf(e, evalNode(e.object, env), env);
}

/** `obj[index]` for an already evaluated object. */
function indexOf(e: IndexNode, obj: Value, env: EvalEnv): Value {
  const idx = evalNode(e.index, env);
  const fail = (): never => {
    throw new LangError(msg.cannotIndex(describeType(obj), describeType(idx)), e.index.from, e.index.to);
  };
  try {
    if (isColumn(obj)) {
      const n = obj.values.length;
      if (typeof idx === 'number') return elementAt(obj, position(idx, n));
      if (isColumn(idx) && idx.type === 'boolean') return filterColumn(obj, idx);
      if (isColumn(idx) && idx.type === 'number') {
        const pos: number[] = [];
        for (let i = 0; i < idx.values.length; i++) {
          if (idx.missing !== null && idx.missing[i] === 1) throw new UsageError(msg.missingCondition());
          pos.push(position(idx.values[i]!, n));
        }
        return pickColumn(obj, pos);
      }
      return fail();
    }
    if (isTable(obj)) {
      if (typeof idx === 'string') {
        const i = obj.names.indexOf(idx);
        if (i < 0) {
          const label = e.object.type === 'name' ? e.object.name : '';
          throw new UsageError(msg.noColumn(label, idx, suggest(idx, obj.names)));
        }
        return obj.columns[i]!;
      }
      if (isColumn(idx) && idx.type === 'boolean') {
        return table(obj.names, obj.columns.map((c) => filterColumn(c, idx as BooleanColumn)));
      }
      return fail();
    }
    if (isRecord(obj) && typeof idx === 'string') {
      const v = obj.fields.get(idx);
      if (v === undefined) {
        const names = [...obj.fields.keys()];
        throw new UsageError(msg.noField(idx, names, suggest(idx, names)));
      }
      return v;
    }
    if (isMissing(obj)) return MISSING;
    return fail();
  } catch (err) {
    throw at(err, e.index.from, e.index.to);
  }
}

/** A 1-based position checked against a length, as a 0-based index. */
function position(i: number, n: number): number {
  if (!Number.isInteger(i)) throw new UsageError(msg.indexNotWhole(i));
  if (i < 1 || i > n) throw new UsageError(msg.indexOutOfRange(i, n));
  return i - 1;
}

function evalCall(e: CallNode, env: EvalEnv): Value {
  const fn = env.registry.get(e.callee);
  if (fn === undefined) {
    const asCell = env.scope.lookup(e.callee);
    if (asCell.kind !== 'unknown') throw new LangError(msg.notAFunction(e.callee), e.calleeFrom, e.calleeTo);
    throw new LangError(msg.unknownFunction(e.callee, suggest(e.callee, env.registry.names())), e.calleeFrom, e.calleeTo);
  }
  const paramNames = fn.params.map((p) => p.name);
  const given = new Map<string, { value: Value; source: SourceTable | null; arg: Argument }>();
  let positional = 0;
  for (const arg of e.args) {
    if (arg.name === null) {
      const p = fn.params[positional];
      if (p === undefined) {
        throw new LangError(msg.tooManyArguments(e.callee, fn.params.length, countPositional(e.args), paramNames), arg.value.from, arg.value.to);
      }
      positional++;
      given.set(p.name, { ...evalArgument(arg.value, env), arg });
    } else {
      if (!paramNames.includes(arg.name)) {
        throw new LangError(msg.unknownArgument(e.callee, arg.name, paramNames, suggest(arg.name, paramNames)), arg.nameFrom, arg.nameTo);
      }
      if (given.has(arg.name)) throw new LangError(msg.argumentTwice(e.callee, arg.name), arg.nameFrom, arg.nameTo);
      given.set(arg.name, { ...evalArgument(arg.value, env), arg });
    }
  }
  const args = new Map<string, Value>();
  for (const p of fn.params) {
    const g = given.get(p.name);
    if (g === undefined) {
      if (p.default === undefined) {
        throw new LangError(msg.missingArgument(e.callee, p.name, signature(fn)), e.from, e.to);
      }
      args.set(p.name, p.default);
      continue;
    }
    const t = TYPES[p.type];
    const checked = t.check(g.value);
    if (!checked.ok) {
      throw new LangError(msg.wrongType(e.callee, p.name, t.description, checked.got), g.arg.value.from, g.arg.value.to);
    }
    if (p.choices !== undefined && (typeof checked.value !== 'string' || !p.choices.includes(checked.value))) {
      const options = p.choices.map((c) => JSON.stringify(c)).join(', ');
      throw new LangError(
        msg.wrongType(e.callee, p.name, `one of ${options}`, typeof checked.value === 'string' ? quote(checked.value) : describeType(checked.value)),
        g.arg.value.from,
        g.arg.value.to,
      );
    }
    args.set(p.name, checked.value);
  }
  const sourceTable = (param: string): SourceTable | null => given.get(param)?.source ?? null;
  try {
    return fn.run(args, { fn: fn.name, warn: (m) => env.warn(m), progress: (f) => env.progress(f), sourceTable });
  } catch (err) {
    if (err instanceof UsageError || err instanceof LangError) throw new LangError(`${fn.name}: ${err.message}`, e.from, e.to);
    // A thrown error of any other kind is a fault in a built-in; it still stays in this cell.
    // (The wiring of the statistics turns their plain-words errors into UsageError.)
    const detail = err instanceof Error ? err.message : String(err);
    throw new LangError(msg.internal(fn.name, detail), e.from, e.to);
  }
}

/**
 * An argument's value and, when it is written as a column of a table (`t.col` or
 * `t["col"]`), that table: a built-in can then see the rest of the data its columns came
 * from (the design warning of one_way and two_sample reads it). Any other form of argument
 * has no source table.
 */
function evalArgument(e: Expr, env: EvalEnv): { value: Value; source: SourceTable | null } {
  if (e.type === 'member' || (e.type === 'index' && e.index.type === 'text')) {
    const obj = evalNode(e.object, env);
    const value = e.type === 'member' ? memberOf(e, obj) : indexOf(e, obj, env);
    const name = e.object.type === 'name' ? e.object.name : null;
    return { value, source: isTable(obj) && isColumn(value) ? { table: obj, name } : null };
  }
  return { value: evalNode(e, env), source: null };
}

function countPositional(args: readonly Argument[]): number {
  return args.filter((a) => a.name === null).length;
}


