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

/** What a formula defines and reads, and how it evaluates. */
export function analyseFormula(cell: Cell): CellAnalysis {
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
