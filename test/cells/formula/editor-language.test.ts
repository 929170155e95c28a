import { EditorState } from '@codemirror/state';
import { ensureSyntaxTree } from '@codemirror/language';
import { describe, expect, it } from 'vitest';
import { highlightTree, tagHighlighter } from '@lezer/highlight';
import { classifyToken, formulaLanguage, highlightSegments, nextOnLine, staticTokenCss, TOKEN_LOOK, TOKEN_TAGS, type TokenClass } from '../../../cells/formula/editor-language.ts';

const builtins = new Set(['mean', 'blocked', 'round']);

function classes(text: string) {
  return highlightSegments(text, builtins)
    .filter((s) => s.cls !== null)
    .map((s) => [text.slice(s.from, s.to), s.cls]);
}

describe('highlightSegments', () => {
  it('colours each kind of token, with built-ins apart from cell names', () => {
    expect(classes('fit = blocked(trees.yield_kg, trees.method, level: 0.99) # the main fit')).toEqual([
      ['fit', 'cellName'],
      ['=', 'operator'],
      ['blocked', 'builtin'],
      ['(', 'bracket'],
      ['trees', 'cellName'],
      ['.', 'punctuation'],
      ['yield_kg', 'member'],
      [',', 'punctuation'],
      ['trees', 'cellName'],
      ['.', 'punctuation'],
      ['method', 'member'],
      [',', 'punctuation'],
      ['level', 'argName'],
      [':', 'punctuation'],
      ['0.99', 'number'],
      [')', 'bracket'],
      ['# the main fit', 'comment'],
    ]);
  });

  it('colours texts and reserved words', () => {
    expect(classes('not x == "a \\"b\\"" or true')).toEqual([
      ['not', 'keyword'],
      ['x', 'cellName'],
      ['==', 'operator'],
      ['"a \\"b\\""', 'text'],
      ['or', 'keyword'],
      ['true', 'keyword'],
    ]);
  });

  it('marks an error and goes on colouring after it', () => {
    expect(classes('a $ 2e b')).toEqual([
      ['a', 'cellName'],
      ['$', 'invalid'],
      ['2e', 'invalid'],
      ['b', 'cellName'],
    ]);
    // an unterminated text runs to the end of its line only
    expect(classes('x = "open\ny')).toEqual([
      ['x', 'cellName'],
      ['=', 'operator'],
      ['"open', 'invalid'],
      ['y', 'cellName'],
    ]);
  });

  it('covers the whole text without gaps or overlaps', () => {
    const text = 'a = round(mean(t.x) ^ -2, 1)\n  # end';
    const segs = highlightSegments(text, builtins);
    let pos = 0;
    for (const s of segs) {
      expect(s.from).toBe(pos);
      expect(s.to).toBeGreaterThan(s.from);
      pos = s.to;
    }
    expect(pos).toBe(text.length);
  });

  it('takes a member after a dot at the end of the previous line', () => {
    expect(classes('t.\nx')).toEqual([
      ['t', 'cellName'],
      ['.', 'punctuation'],
      ['x', 'member'],
    ]);
  });
});

describe('classifyToken and nextOnLine', () => {
  it('reads a name followed by a colon as a named argument', () => {
    const t = { type: 'name' as const, text: 'mean', value: NaN, from: 0, to: 4 };
    expect(classifyToken(t, '', ':', builtins)).toBe('argName');
    expect(classifyToken(t, '', '(', builtins)).toBe('builtin');
    expect(classifyToken(t, '.', '', builtins)).toBe('member');
  });

  it('looks no further than the line', () => {
    expect(nextOnLine('a  : b', 1)).toBe(':');
    expect(nextOnLine('a  \n: b', 1)).toBe('');
  });
});

describe('the CodeMirror language', () => {
  it('highlights with the same classes as the static text', () => {
    const text = 'gain = mean(trees.yield_kg, level: 0.9) # kg\nx = "t" and $';
    const state = EditorState.create({ doc: text, extensions: [formulaLanguage(builtins)] });
    const tree = ensureSyntaxTree(state, state.doc.length, 5000)!;
    const highlighter = tagHighlighter((Object.keys(TOKEN_TAGS) as TokenClass[]).map((cls) => ({ tag: TOKEN_TAGS[cls], class: cls })));
    const seen: [string, string][] = [];
    highlightTree(tree, highlighter, (from, to, cls) => seen.push([text.slice(from, to), cls]));
    const expected = highlightSegments(text, builtins)
      .filter((s) => s.cls !== null)
      .map((s) => [text.slice(s.from, s.to), s.cls]);
    expect(seen).toEqual(expected);
    expect(seen.some(([t, c]) => t === 'mean' && c === 'builtin')).toBe(true);
  });
});

describe('staticTokenCss', () => {
  it('gives every class its look from the theme', () => {
    const cssText = staticTokenCss();
    for (const cls of Object.keys(TOKEN_LOOK)) expect(cssText).toContain(`.tok-${cls} {`);
    expect(cssText).toContain('var(--accent)');
  });
});
