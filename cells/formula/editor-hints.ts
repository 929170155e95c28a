/**
 * What the formula editor's hints are about, worked out from the text alone (no DOM): the
 * built-in name under the pointer (for its doc on hover) and the call the caret is in, with
 * the argument being typed (for the signature hint that follows `(` and `,`).
 */
import { scanToken, type Token } from '../../src/lang/lexer.ts';
import type { BuiltinInfo } from '../view-api.ts';

/** A name in the text, with its range. */
export interface NameSpot {
  readonly name: string;
  readonly from: number;
  readonly to: number;
}

/** The tokens of a text, skipping blanks, comments and characters that do not scan. */
function tokensOf(text: string, until = text.length): Token[] {
  const out: Token[] = [];
  let pos = 0;
  while (pos < until) {
    const s = scanToken(text, pos);
    if (s.kind === 'token') {
      if (s.token.type === 'end') break;
      out.push(s.token);
      pos = s.token.to;
    } else if (s.kind === 'error') pos = Math.max(s.error.to, pos + 1);
    else pos = s.to;
  }
  return out;
}

/**
 * The name under `pos` (on it or touching its end) when it can be a built-in: a plain name,
 * not a member (`t.mean` is a column) and not an argument's name (`level:`). Null elsewhere.
 */
export function nameAt(text: string, pos: number): NameSpot | null {
  const tokens = tokensOf(text);
  for (let i = 0; i < tokens.length; i++) {
    const t = tokens[i]!;
    if (t.from > pos) break;
    if (t.type !== 'name' || pos > t.to) continue;
    const before = tokens[i - 1];
    const after = tokens[i + 1];
    if (before !== undefined && before.type === 'op' && before.text === '.') return null;
    if (after !== undefined && after.type === 'op' && after.text === ':') return null;
    return { name: t.text, from: t.from, to: t.to };
  }
  return null;
}

/** The call the caret is inside, and which argument it is in. */
export interface CallArgument {
  /** The function's name and range. */
  readonly fn: NameSpot;
  /** Where the call's `(` is. */
  readonly open: number;
  /** 0 for the first argument, counting the commas of this call before the caret. */
  readonly index: number;
  /** The argument's name when it is written `name: value`, else null. */
  readonly named: string | null;
  /** How many positional arguments come before this one in the call. */
  readonly positional: number;
}

interface Frame {
  readonly bracket: '(' | '[';
  readonly fn: NameSpot | null;
  readonly open: number;
  index: number;
  positional: number;
  named: string | null;
}

/** The innermost call of a plain-named function whose brackets hold `pos`. */
export function callAt(text: string, pos: number): CallArgument | null {
  const tokens = tokensOf(text, pos);
  const stack: Frame[] = [];
  for (let i = 0; i < tokens.length; i++) {
    const t = tokens[i]!;
    if (t.to > pos) break;
    if (t.type !== 'op') continue;
    if (t.text === '(' || t.text === '[') {
      const before = tokens[i - 1];
      const beforeThat = tokens[i - 2];
      const isCall = t.text === '(' && before !== undefined && before.type === 'name' && !(beforeThat?.type === 'op' && beforeThat.text === '.');
      stack.push({ bracket: t.text, fn: isCall ? { name: before.text, from: before.from, to: before.to } : null, open: t.from, index: 0, positional: 0, named: null });
    } else if (t.text === ')' || t.text === ']') {
      stack.pop();
    } else if (t.text === ',') {
      const top = stack[stack.length - 1];
      if (top !== undefined) {
        if (top.named === null) top.positional++;
        top.index++;
        top.named = null;
      }
    } else if (t.text === ':') {
      const top = stack[stack.length - 1];
      const name = tokens[i - 1];
      const beforeName = tokens[i - 2];
      // `name:` right after `(` or `,` names this argument
      if (top !== undefined && name !== undefined && name.type === 'name' && beforeName !== undefined && beforeName.type === 'op' && (beforeName.text === '(' || beforeName.text === ',')) {
        top.named = name.text;
      }
    }
  }
  const top = stack[stack.length - 1];
  if (top === undefined || top.bracket !== '(' || top.fn === null) return null;
  return { fn: top.fn, open: top.open, index: top.index, named: top.named, positional: top.positional };
}

/**
 * Which parameter of a built-in an argument fills: the one it names, or the next positional
 * one (positional arguments come first, in order). -1 when none fits (too many arguments,
 * or a name the function does not have).
 */
export function parameterOf(b: BuiltinInfo, arg: CallArgument): number {
  if (arg.named !== null) return b.params.findIndex((p) => p.name === arg.named);
  return arg.positional < b.params.length ? arg.positional : -1;
}

/** The pieces of a signature, `name(`, each parameter's text, `)`, for drawing one in bold. */
export function signaturePieces(b: BuiltinInfo): { readonly head: string; readonly params: readonly string[]; readonly tail: string } {
  const sig = b.signature;
  const open = sig.indexOf('(');
  const close = sig.lastIndexOf(')');
  if (open < 0 || close < open) return { head: sig, params: [], tail: '' };
  const inner = sig.slice(open + 1, close);
  // defaults are numbers, booleans, quoted texts or "…": none holds a comma outside quotes
  const params: string[] = [];
  let depth = 0;
  let quoted = false;
  let start = 0;
  for (let i = 0; i < inner.length; i++) {
    const c = inner[i];
    if (quoted) {
      if (c === '\\') i++;
      else if (c === '"') quoted = false;
    } else if (c === '"') quoted = true;
    else if (c === '(' || c === '[') depth++;
    else if (c === ')' || c === ']') depth--;
    else if (c === ',' && depth === 0) {
      params.push(inner.slice(start, i).trim());
      start = i + 1;
    }
  }
  if (inner.trim() !== '') params.push(inner.slice(start).trim());
  return { head: sig.slice(0, open + 1), params, tail: sig.slice(close) };
}
