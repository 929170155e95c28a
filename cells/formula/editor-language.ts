/**
 * Highlighting of formulas, driven by the language's own lexer (scanToken), so the editor
 * and the engine never disagree on where a number, a text or a name ends. The same token
 * classes colour the static text shown before an editor exists, so a cell looks the same
 * at first paint, in print and while editing.
 */
import { HighlightStyle, StreamLanguage, syntaxHighlighting, type StringStream } from '@codemirror/language';
import type { Extension } from '@codemirror/state';
import { tags, type Tag } from '@lezer/highlight';
import { scanToken, type Token } from '../../src/lang/lexer.ts';
import type { BuiltinInfo } from '../view-api.ts';

/** What a piece of formula text is, for colouring. */
export type TokenClass =
  | 'number'
  | 'text'
  | 'keyword'
  | 'operator'
  | 'bracket'
  | 'punctuation'
  | 'builtin'
  | 'cellName'
  | 'member'
  | 'argName'
  | 'comment'
  | 'invalid';

/**
 * The colours of each class, from the theme's custom properties: built-ins in the accent,
 * names of cells in plain ink, numbers and texts each in a quiet colour of their own.
 */
export const TOKEN_LOOK: Readonly<Record<TokenClass, { readonly color: string; readonly fontStyle?: string; readonly fontWeight?: string }>> = {
  number: { color: 'var(--pending)' },
  text: { color: 'var(--upstream)' },
  keyword: { color: 'var(--ink)', fontWeight: '600' },
  operator: { color: 'var(--ink-soft)' },
  bracket: { color: 'var(--ink-soft)' },
  punctuation: { color: 'var(--ink-soft)' },
  builtin: { color: 'var(--accent)', fontWeight: '600' },
  cellName: { color: 'var(--ink)' },
  member: { color: 'var(--ink-soft)' },
  argName: { color: 'var(--ink-soft)', fontStyle: 'italic' },
  comment: { color: 'var(--muted)', fontStyle: 'italic' },
  invalid: { color: 'var(--error)' },
};

/** The highlighting tag of each class (the editor's side of {@link TOKEN_LOOK}). */
export const TOKEN_TAGS: Readonly<Record<TokenClass, Tag>> = {
  number: tags.number,
  text: tags.string,
  keyword: tags.keyword,
  operator: tags.operator,
  bracket: tags.bracket,
  punctuation: tags.separator,
  builtin: tags.standard(tags.variableName),
  cellName: tags.variableName,
  member: tags.propertyName,
  argName: tags.attributeName,
  comment: tags.comment,
  invalid: tags.invalid,
};

/** The first character after `pos` on the same line that is not a space or tab ('' at the end of the line). */
export function nextOnLine(text: string, pos: number): string {
  let i = pos;
  while (i < text.length) {
    const c = text[i]!;
    if (c === '\n' || c === '\r') return '';
    if (c !== ' ' && c !== '\t') return c;
    i++;
  }
  return '';
}

/**
 * The class of one token. `previous` is the text of the token before it ('' at the start),
 * `next` the first non-blank character after it on its line.
 */
export function classifyToken(token: Token, previous: string, next: string, builtins: ReadonlySet<string>): TokenClass {
  switch (token.type) {
    case 'number':
      return 'number';
    case 'text':
      return 'text';
    case 'keyword':
      return 'keyword';
    case 'op':
      if (token.text === '(' || token.text === ')' || token.text === '[' || token.text === ']') return 'bracket';
      if (token.text === ',' || token.text === ':' || token.text === '.') return 'punctuation';
      return 'operator';
    case 'name':
      if (previous === '.') return 'member';
      // `level: 0.99` inside a call: a named argument
      if (next === ':') return 'argName';
      return builtins.has(token.text) ? 'builtin' : 'cellName';
    case 'end':
      return 'punctuation';
  }
}

/** A coloured stretch of formula text. */
export interface Segment {
  readonly from: number;
  readonly to: number;
  /** null for blanks. */
  readonly cls: TokenClass | null;
}

/**
 * The whole text cut into coloured segments, with the same rules as the editor. Errors
 * (an unterminated text, a stray character) are marked invalid and scanning goes on after
 * them, so one typo does not uncolour the rest of the formula.
 */
export function highlightSegments(text: string, builtins: ReadonlySet<string>): Segment[] {
  const out: Segment[] = [];
  let pos = 0;
  let previous = '';
  while (pos < text.length) {
    const s = scanToken(text, pos);
    switch (s.kind) {
      case 'space':
        out.push({ from: pos, to: s.to, cls: null });
        pos = s.to;
        break;
      case 'comment':
        out.push({ from: pos, to: s.to, cls: 'comment' });
        pos = s.to;
        break;
      case 'error': {
        const to = Math.min(text.length, Math.max(s.error.to, pos + 1));
        out.push({ from: pos, to, cls: 'invalid' });
        pos = to;
        previous = '';
        break;
      }
      case 'token': {
        const t = s.token;
        out.push({ from: t.from, to: t.to, cls: classifyToken(t, previous, nextOnLine(text, t.to), builtins) });
        previous = t.text;
        pos = t.to;
        break;
      }
    }
  }
  return out;
}

interface LineState {
  previous: string;
}

/**
 * The stream tokenizer for CodeMirror. A stream sees one line at a time; tokens never span
 * lines in this language (texts and comments end at a newline), so scanning the line is the
 * same as scanning the formula. The text of the previous token is carried across lines so
 * that `t.` at a line's end still makes the next line's first name a member.
 */
function tokenizer(builtins: ReadonlySet<string>) {
  return (stream: StringStream, state: LineState): string | null => {
    const line = stream.string;
    const pos = stream.pos;
    const s = scanToken(line, pos);
    switch (s.kind) {
      case 'space':
        stream.pos = s.to;
        return null;
      case 'comment':
        stream.pos = s.to;
        return 'comment';
      case 'error':
        stream.pos = Math.min(line.length, Math.max(s.error.to, pos + 1));
        state.previous = '';
        return 'invalid';
      case 'token': {
        const t = s.token;
        stream.pos = t.to;
        const cls = classifyToken(t, state.previous, nextOnLine(line, t.to), builtins);
        state.previous = t.text;
        return cls;
      }
    }
  };
}

const tokenTable: { [name: string]: Tag } = { ...TOKEN_TAGS };

/** The CodeMirror language of formulas, for a given set of built-in names. */
export function formulaLanguage(builtins: ReadonlySet<string>): StreamLanguage<LineState> {
  return StreamLanguage.define<LineState>({
    name: 'furrow-formula',
    startState: () => ({ previous: '' }),
    copyState: (s) => ({ previous: s.previous }),
    token: tokenizer(builtins),
    tokenTable,
    languageData: { commentTokens: { line: '#' } },
  });
}

/** The highlight style: our colours for our tags. */
export const formulaHighlightStyle = HighlightStyle.define(
  (Object.keys(TOKEN_TAGS) as TokenClass[]).map((cls) => ({ tag: TOKEN_TAGS[cls], ...TOKEN_LOOK[cls] })),
);

/** Language and highlighting as one extension. */
export function formulaHighlighting(builtins: ReadonlySet<string>): Extension {
  return [formulaLanguage(builtins), syntaxHighlighting(formulaHighlightStyle)];
}

/** CSS for the static text: one class per token class, the same look as the editor. */
export function staticTokenCss(): string {
  return (Object.keys(TOKEN_LOOK) as TokenClass[])
    .map((cls) => {
      const look = TOKEN_LOOK[cls];
      return `.tok-${cls} { color: ${look.color};${look.fontStyle ? ` font-style: ${look.fontStyle};` : ''}${look.fontWeight ? ` font-weight: ${look.fontWeight};` : ''} }`;
    })
    .join('\n');
}

const nameSets = new WeakMap<readonly BuiltinInfo[], ReadonlySet<string>>();

/** The names of a catalogue's built-ins as a set, made once per list. */
export function builtinNames(builtins: readonly BuiltinInfo[]): ReadonlySet<string> {
  let set = nameSets.get(builtins);
  if (set === undefined) {
    set = new Set(builtins.map((b) => b.name));
    nameSets.set(builtins, set);
  }
  return set;
}
