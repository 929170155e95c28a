/**
 * The lexer of the cell language. One pass over the text, producing tokens that carry
 * their character range. The same rules drive the editor's highlighting (through
 * `scanToken`, which reads one token at a position), so the page and the engine never
 * disagree on what a formula says.
 */
import { LangError } from './errors.ts';
import { msg } from '../messages/language.ts';

/** Reserved words. */
export const KEYWORDS = ['and', 'or', 'not', 'true', 'false'] as const;
export type Keyword = (typeof KEYWORDS)[number];
const KEYWORD_SET: ReadonlySet<string> = new Set(KEYWORDS);

/** True when a word is reserved. */
export function isKeyword(word: string): word is Keyword {
  return KEYWORD_SET.has(word);
}

/** Punctuation and operators, longest first where one is a prefix of another. */
export const OPERATORS = ['==', '!=', '<=', '>=', '<', '>', '+', '-', '*', '/', '^', '(', ')', '[', ']', ',', ':', '.', '='] as const;
export type Operator = (typeof OPERATORS)[number];

export type TokenType = 'number' | 'text' | 'name' | 'keyword' | 'op' | 'end';

/** One token with its character range [from, to). */
export interface Token {
  readonly type: TokenType;
  /** For names, keywords and operators: the source text; for text literals: the unescaped text. */
  readonly text: string;
  /** For numbers: the value. */
  readonly value: number;
  readonly from: number;
  readonly to: number;
}

/** The longest formula the language reads, in characters. */
export const MAX_FORMULA_LENGTH = 1_000_000;

const isDigit = (c: number): boolean => c >= 48 && c <= 57;
const isNameStart = (c: number): boolean => (c >= 65 && c <= 90) || (c >= 97 && c <= 122) || c === 95;
const isNamePart = (c: number): boolean => isNameStart(c) || isDigit(c);

/** True when a string is a plain name (a letter or _, then letters, digits, _) and not reserved. */
export function isPlainName(s: string): boolean {
  if (s.length === 0 || !isNameStart(s.charCodeAt(0))) return false;
  for (let i = 1; i < s.length; i++) if (!isNamePart(s.charCodeAt(i))) return false;
  return !isKeyword(s);
}

/** What `scanToken` found at a position: a token, a comment, whitespace or an error. */
export type Scan =
  | { readonly kind: 'token'; readonly token: Token }
  | { readonly kind: 'space' | 'comment'; readonly to: number }
  | { readonly kind: 'error'; readonly error: LangError };

/**
 * Reads whatever starts at `pos` (which must be < text.length). Never throws; errors are
 * returned so the editor's highlighter can mark them and move on.
 */
export function scanToken(text: string, pos: number): Scan {
  const c = text.charCodeAt(pos);
  // whitespace, newlines included: an expression may span lines
  if (c === 32 || c === 9 || c === 10 || c === 13) {
    let i = pos + 1;
    while (i < text.length) {
      const d = text.charCodeAt(i);
      if (d !== 32 && d !== 9 && d !== 10 && d !== 13) break;
      i++;
    }
    return { kind: 'space', to: i };
  }
  if (c === 35 /* # */) {
    let i = pos + 1;
    while (i < text.length && text.charCodeAt(i) !== 10) i++;
    return { kind: 'comment', to: i };
  }
  if (isDigit(c)) return scanNumber(text, pos);
  if (isNameStart(c)) {
    let i = pos + 1;
    while (i < text.length && isNamePart(text.charCodeAt(i))) i++;
    const word = text.slice(pos, i);
    return { kind: 'token', token: { type: isKeyword(word) ? 'keyword' : 'name', text: word, value: NaN, from: pos, to: i } };
  }
  if (c === 34 /* " */) return scanText(text, pos);
  if (c === 39 /* ' */) return { kind: 'error', error: new LangError(msg.singleQuote(), pos, pos + 1) };
  for (const op of OPERATORS) {
    if (text.startsWith(op, pos)) {
      return { kind: 'token', token: { type: 'op', text: op, value: NaN, from: pos, to: pos + op.length } };
    }
  }
  // one whole code point, so that an emoji is reported as one character
  const cp = text.codePointAt(pos) ?? c;
  const len = cp > 0xffff ? 2 : 1;
  return { kind: 'error', error: new LangError(msg.unexpectedCharacter(text.slice(pos, pos + len)), pos, pos + len) };
}

function scanNumber(text: string, pos: number): Scan {
  let i = pos;
  while (i < text.length && isDigit(text.charCodeAt(i))) i++;
  if (text.charCodeAt(i) === 46 /* . */ && isDigit(text.charCodeAt(i + 1))) {
    i++;
    while (i < text.length && isDigit(text.charCodeAt(i))) i++;
  }
  const e = text.charCodeAt(i);
  if (e === 101 || e === 69 /* e E */) {
    let j = i + 1;
    const s = text.charCodeAt(j);
    if (s === 43 || s === 45) j++;
    if (isDigit(text.charCodeAt(j))) {
      while (j < text.length && isDigit(text.charCodeAt(j))) j++;
      i = j;
    } else {
      // "2e" or "2e+" : a number glued to letters is a typo, not a name
      let k = j;
      while (k < text.length && isNamePart(text.charCodeAt(k))) k++;
      return { kind: 'error', error: new LangError(msg.badNumber(text.slice(pos, k)), pos, k) };
    }
  }
  if (i < text.length && isNameStart(text.charCodeAt(i))) {
    let k = i;
    while (k < text.length && isNamePart(text.charCodeAt(k))) k++;
    return { kind: 'error', error: new LangError(msg.badNumber(text.slice(pos, k)), pos, k) };
  }
  const src = text.slice(pos, i);
  return { kind: 'token', token: { type: 'number', text: src, value: Number(src), from: pos, to: i } };
}

function scanText(text: string, pos: number): Scan {
  let i = pos + 1;
  let out = '';
  let start = i;
  while (i < text.length) {
    const c = text.charCodeAt(i);
    if (c === 34) {
      out += text.slice(start, i);
      return { kind: 'token', token: { type: 'text', text: out, value: NaN, from: pos, to: i + 1 } };
    }
    if (c === 10 || c === 13) break;
    if (c === 92 /* \ */) {
      const n = text.charCodeAt(i + 1);
      if (n === 34 || n === 92) {
        out += text.slice(start, i) + text[i + 1];
        i += 2;
        start = i;
        continue;
      }
      if (Number.isNaN(n) || n === 10 || n === 13) break;
      return { kind: 'error', error: new LangError(msg.badEscape(text.slice(i, i + 2)), i, i + 2) };
    }
    i++;
  }
  return { kind: 'error', error: new LangError(msg.unterminatedText(), pos, i) };
}

/** Splits a whole formula into tokens, ending with an 'end' token. Throws LangError. */
export function tokenize(text: string): Token[] {
  if (text.length > MAX_FORMULA_LENGTH) {
    throw new LangError(msg.formulaTooLong(text.length, MAX_FORMULA_LENGTH), MAX_FORMULA_LENGTH, text.length);
  }
  const tokens: Token[] = [];
  let pos = 0;
  while (pos < text.length) {
    const s = scanToken(text, pos);
    switch (s.kind) {
      case 'token':
        tokens.push(s.token);
        pos = s.token.to;
        break;
      case 'space':
      case 'comment':
        pos = s.to;
        break;
      case 'error':
        throw s.error;
    }
  }
  tokens.push({ type: 'end', text: '', value: NaN, from: text.length, to: text.length });
  return tokens;
}
