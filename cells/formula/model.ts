/**
 * Formula cells: one statement, `NAME = EXPRESSION` or a bare expression
 * (docs/language.md section 2). The body is the formula's text; ranges in errors are offsets
 * into it.
 */
import type { Cell } from '../../src/doc/document.ts';
import type { CellAnalysis } from '../../src/graph/cell-kind.ts';
import { namesRead, type Statement } from '../../src/lang/ast.ts';
import { LangError } from '../../src/lang/errors.ts';
import { evaluate } from '../../src/lang/evaluate.ts';
import { isPlainName } from '../../src/lang/lexer.ts';
import { parseStatement } from '../../src/lang/parser.ts';
import { scanToken } from '../../src/lang/lexer.ts';
import { MISSING, errorValue } from '../../src/lang/values.ts';

/** Parses a formula cell's text, keeping the error when it does not parse. */
export function parseFormula(text: string): { statement: Statement | null; error: LangError | null } {
  try {
    return { statement: parseStatement(text), error: null };
  } catch (err) {
    if (err instanceof LangError) return { statement: null, error: err };
    throw err;
  }
}

/** An empty formula: nothing but blanks and comments, perhaps after `NAME =`. */
export interface EmptyFormula {
  /** The name before `=`, with its offsets, or null for a cell with no text at all. */
  readonly name: { readonly text: string; readonly from: number; readonly to: number } | null;
}

/**
 * Whether a formula is still empty: a new cell (`value1 = `) or one whose expression was
 * deleted. Such a cell is not a mistake yet, so it is shown as empty, not as an error, and
 * the cells that read its name see a missing value.
 */
export function emptyFormula(text: string): EmptyFormula | null {
  const words: { text: string; from: number; to: number }[] = [];
  let pos = 0;
  while (pos < text.length) {
    const s = scanToken(text, pos);
    if (s.kind === 'error') return null;
    if (s.kind !== 'token') {
      pos = s.to;
      continue;
    }
    const t = s.token;
    if (t.type === 'end') break;
    words.push({ text: t.text, from: t.from, to: t.to });
    if (words.length > 2) return null;
    pos = t.to;
  }
  if (words.length === 0) return { name: null };
  const [first, second] = words;
  if (words.length === 2 && second!.text === '=' && isPlainName(first!.text)) return { name: first! };
  return null;
}

/** A change of a formula's text that the page offers as one click. */
export interface FormulaFix {
  /** The name the fixed formula defines. */
  readonly name: string;
  /** Replace the text from `from` to `to` with `insert`. */
  readonly from: number;
  readonly to: number;
  readonly insert: string;
}

/**
 * `value1 = yield_mean = mean(...)`: a name typed after the name a new cell offered. The
 * fix keeps the name typed and drops the offered one with its `=` (`yield_mean = mean(...)`),
 * and keeps anything typed between them; null for any other text. The page offers it, and
 * changes nothing on its own.
 */
export function secondNameFix(text: string): FormulaFix | null {
  const words: { text: string; type: string; from: number; to: number }[] = [];
  let pos = 0;
  while (pos < text.length && words.length < 4) {
    const s = scanToken(text, pos);
    if (s.kind === 'error') return null;
    if (s.kind !== 'token') {
      pos = s.to;
      continue;
    }
    if (s.token.type === 'end') break;
    words.push({ text: s.token.text, type: s.token.type, from: s.token.from, to: s.token.to });
    pos = s.token.to;
  }
  if (words.length < 4) return null;
  const [a, eq1, b, eq2] = words as [(typeof words)[0], (typeof words)[0], (typeof words)[0], (typeof words)[0]];
  if (a.type !== 'name' || eq1.text !== '=' || b.type !== 'name' || eq2.text !== '=' || !isPlainName(a.text) || !isPlainName(b.text)) return null;
  // the offered name, its = and the blanks after it go; a comment or line break typed
  // before the new name stays
  let to = eq1.to;
  while (to < b.from && (text.charCodeAt(to) === 32 || text.charCodeAt(to) === 9)) to++;
  return { name: b.text, from: a.from, to, insert: '' };
}

/** What a formula defines and reads, and how it evaluates. */
export function analyseFormula(cell: Cell): CellAnalysis {
  const empty = emptyFormula(cell.body);
  if (empty !== null) {
    const n = empty.name;
    return {
      defines: n === null ? null : { name: n.text, from: n.from, to: n.to },
      reads: [],
      problem: null,
      evaluates: true,
      evaluate: () => ({ value: MISSING }),
    };
  }
  const { statement, error } = parseFormula(cell.body);
  if (statement === null) {
    const e = error!;
    // A definition that does not parse still claims its name, so the cells that read it
    // say "reads x, which has an error" rather than "there is no x".
    const claimed = /^(\s*)([A-Za-z_][A-Za-z0-9_]*)\s*=(?!=)/.exec(cell.body);
    const name = claimed !== null && isPlainName(claimed[2]!) ? claimed[2]! : null;
    return {
      defines: name === null ? null : { name, from: claimed![1]!.length, to: claimed![1]!.length + name.length },
      reads: [],
      problem: errorValue(e.message, e.from, e.to),
      evaluates: true,
      evaluate: () => ({ value: MISSING }),
    };
  }
  return {
    defines: statement.name === null ? null : { name: statement.name, from: statement.nameFrom, to: statement.nameTo },
    reads: namesRead(statement.expr),
    problem: null,
    evaluates: true,
    evaluate: (env) => ({ value: evaluate(statement.expr, env) }),
  };
}
