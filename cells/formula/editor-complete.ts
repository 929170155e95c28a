/**
 * Completion in formulas, worked out from the text and the catalogue without a DOM: what
 * is being typed at the cursor (a name, a member after `name.`, an argument of a call), and
 * which names fit there. The editor turns the result into CodeMirror's completions.
 */
import { isPlainName, KEYWORDS, scanToken, type Token } from '../../src/lang/lexer.ts';
import type { BuiltinInfo, NameCatalogue } from '../view-api.ts';

/** The call the cursor is inside, when its callee is a plain name. */
export interface CallSpot {
  /** The function's name. */
  readonly fn: string;
  /** Named arguments already given in this call. */
  readonly named: readonly string[];
  /** True right after `(` or `,` of this call: an argument, possibly named, starts here. */
  readonly atArgument: boolean;
}

/** What the cursor is in the middle of. */
export type Spot =
  /** `name.` then the start of a member: `of` is the name before the dot. */
  | { readonly kind: 'member'; readonly of: string; readonly from: number; readonly typed: string; readonly dot: number }
  /** A name (or nothing yet) where an expression can go. */
  | { readonly kind: 'name'; readonly from: number; readonly typed: string; readonly call: CallSpot | null }
  /** Inside a text, a comment or a number: no completion. */
  | { readonly kind: 'none' };

interface Open {
  readonly bracket: '(' | '[';
  readonly fn: string | null;
  readonly named: string[];
}

/** Where a text literal that starts at `i` ends (after its closing quote, or at its line's end). */
function textEnd(text: string, i: number): number {
  let j = i + 1;
  while (j < text.length) {
    const c = text[j];
    if (c === '"') return j + 1;
    if (c === '\n' || c === '\r') return j;
    j += c === '\\' ? 2 : 1;
  }
  return text.length;
}

/** What is being typed at `pos` in `text`. */
export function completionSpot(text: string, pos: number): Spot {
  const tokens: Token[] = [];
  const stack: Open[] = [];
  let i = 0;
  while (i < pos) {
    const s = scanToken(text, i);
    if (s.kind === 'space') {
      i = s.to;
    } else if (s.kind === 'comment') {
      if (pos <= s.to) return { kind: 'none' };
      i = s.to;
    } else if (s.kind === 'error') {
      // A text with a bad escape or no closing quote: skip it whole, and offer nothing inside it.
      const to = text[i] === '"' ? textEnd(text, i) : Math.max(s.error.to, i + 1);
      if (pos < to || (pos === to && text[i] === '"')) return { kind: 'none' };
      i = to;
    } else if (s.kind === 'token') {
      const t = s.token;
      if (t.to > pos || (t.to === pos && (t.type === 'text' || t.type === 'number'))) {
        // the cursor is inside this token, or right after a number or a text
        if (t.type !== 'name' && t.type !== 'keyword') return { kind: 'none' };
      }
      tokens.push(t);
      track(t, tokens, stack);
      i = t.to;
    }
  }

  // The word being typed: a name (or a reserved word being typed past) that reaches the cursor.
  const last = tokens[tokens.length - 1];
  let typed = '';
  let from = pos;
  let before = tokens.length - 1;
  if (last !== undefined && (last.type === 'name' || last.type === 'keyword') && last.from < pos && last.to >= pos) {
    typed = text.slice(last.from, pos);
    from = last.from;
    before = tokens.length - 2;
  }
  const prev = tokens[before];
  if (prev !== undefined && prev.type === 'op' && prev.text === '.') {
    const owner = tokens[before - 1];
    if (owner !== undefined && owner.type === 'name' && owner.to === prev.from) {
      return { kind: 'member', of: owner.text, from, typed, dot: prev.from };
    }
    return { kind: 'none' };
  }

  const top = stack[stack.length - 1];
  let call: CallSpot | null = null;
  if (top !== undefined && top.bracket === '(' && top.fn !== null) {
    const atArgument = prev !== undefined && prev.type === 'op' && (prev.text === '(' || prev.text === ',');
    call = { fn: top.fn, named: [...top.named], atArgument };
  }
  return { kind: 'name', from, typed, call };
}

function track(t: Token, tokens: readonly Token[], stack: Open[]): void {
  if (t.type !== 'op') return;
  if (t.text === '(' || t.text === '[') {
    const before = tokens[tokens.length - 2];
    // `f(` is a call only when the name is not a member (`t.f(` is not valid anyway)
    const beforeThat = tokens[tokens.length - 3];
    const isCall = t.text === '(' && before !== undefined && before.type === 'name' && !(beforeThat?.type === 'op' && beforeThat.text === '.');
    stack.push({ bracket: t.text, fn: isCall ? before.text : null, named: [] });
  } else if (t.text === ')' || t.text === ']') {
    stack.pop();
  } else if (t.text === ':') {
    const name = tokens[tokens.length - 2];
    const top = stack[stack.length - 1];
    if (name !== undefined && name.type === 'name' && top !== undefined && top.bracket === '(') top.named.push(name.text);
  }
}

/** One thing completion can offer, before it becomes a CodeMirror completion. */
export interface Offer {
  readonly label: string;
  /** What the option is, for the list's right-hand column. */
  readonly type: 'function' | 'variable' | 'property' | 'keyword' | 'argument';
  /** A short text shown beside the label. */
  readonly detail: string;
  /** Text inserted instead of the label, when it differs. */
  readonly apply?: string;
  /** Where the inserted text starts, when it is not where the typed word starts (members that need brackets). */
  readonly replaceFrom?: number;
  /** The built-in whose signature and doc the info panel shows. */
  readonly builtin?: BuiltinInfo;
  /** A line of help for a named argument. */
  readonly help?: string;
  /** Ranks above the others (named arguments inside their call). */
  readonly boost?: number;
}

/** The first sentence of a doc, for one line of help. */
export function firstSentence(doc: string, max = 180): string {
  const flat = doc.replace(/\s+/g, ' ').trim();
  const m = /^(.+?[.!?])(\s|$)/.exec(flat);
  const s = m === null ? flat : m[1]!;
  return s.length > max ? `${s.slice(0, max - 1).trimEnd()}…` : s;
}

/** A text literal for a column header that is not a plain name. */
function quoted(name: string): string {
  return `"${name.replace(/\\/g, '\\\\').replace(/"/g, '\\"')}"`;
}

/**
 * What to offer at a spot. Returns null when nothing fits, or when nothing has been typed
 * and the user did not ask (`explicit`): a list must not pop up at every space.
 */
export function offersAt(spot: Spot, catalogue: NameCatalogue, explicit: boolean): { from: number; offers: Offer[] } | null {
  if (spot.kind === 'none') return null;
  if (spot.kind === 'member') {
    const owner = catalogue.cells.find((c) => c.name === spot.of);
    if (owner === undefined || owner.members.length === 0) return null;
    const offers: Offer[] = owner.members.map((m) =>
      isPlainName(m)
        ? { label: m, type: 'property', detail: `of ${owner.name}` }
        : { label: m, type: 'property', detail: `of ${owner.name}`, apply: `[${quoted(m)}]`, replaceFrom: spot.dot },
    );
    return { from: spot.from, offers };
  }
  if (spot.typed === '' && !explicit) return null;
  const offers: Offer[] = [];
  const call = spot.call;
  if (call !== null && call.atArgument) {
    const fn = catalogue.builtins.find((b) => b.name === call.fn);
    for (const p of fn?.params ?? []) {
      if (call.named.includes(p.name)) continue;
      offers.push({ label: `${p.name}:`, type: 'argument', detail: p.description, apply: `${p.name}: `, help: p.doc, boost: 10 });
    }
  }
  for (const b of catalogue.builtins) {
    offers.push({ label: b.name, type: 'function', detail: b.signature.slice(b.name.length), builtin: b });
  }
  const builtinNames = new Set(catalogue.builtins.map((b) => b.name));
  for (const c of catalogue.cells) {
    if (builtinNames.has(c.name)) continue;
    offers.push({ label: c.name, type: 'variable', detail: c.type });
  }
  for (const k of KEYWORDS) offers.push({ label: k, type: 'keyword', detail: '' });
  return { from: spot.from, offers };
}
