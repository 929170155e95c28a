/**
 * What is wrong with a formula, as the view shows it: the parser's error (worked out in the
 * page on every change, so it follows the typing) or else the error the worker reported for
 * the last evaluation. Each problem has the character range it is about, so the editor can
 * underline the exact characters, and a message in plain words for below the editor.
 */
import type { ErrorValue } from '../../src/lang/values.ts';
import type { CellViewState } from '../view-api.ts';
import { emptyFormula, parseFormula } from './model.ts';

/** One problem with a formula. */
export interface FormulaProblem {
  /** Character range in the visible text, clamped to it. */
  readonly from: number;
  readonly to: number;
  readonly message: string;
  /** 'parse': the text does not read; 'evaluation': it reads but fails; 'upstream': a name it reads failed. */
  readonly source: 'parse' | 'evaluation' | 'upstream';
}

/** The name a formula defines and its parse error, for one text (the last one is kept). */
export interface ParsedFormula {
  readonly text: string;
  readonly name: string | null;
  readonly problem: FormulaProblem | null;
  /** A cell still being written: nothing yet, or `name =` and nothing after (model.ts, emptyFormula). */
  readonly empty: boolean;
}

/**
 * Texts parsed, oldest first, up to KEEP_PARSED of them and KEEP_CHARACTERS in all: each
 * formula cell asks about its own text at every draw, and an edit draws every cell that
 * depends on it (2,000 of them in a long document). The characters are bounded too:
 * every version of a long formula being typed into is a text of its own.
 */
const parsed = new Map<string, ParsedFormula>();
const KEEP_PARSED = 10_000;
const KEEP_CHARACTERS = 1_000_000;
let parsedCharacters = 0;

function clampRange(from: number, to: number, length: number): { from: number; to: number } {
  const f = Math.max(0, Math.min(length, Number.isFinite(from) ? Math.floor(from) : 0));
  const t = Math.max(f, Math.min(length, Number.isFinite(to) ? Math.floor(to) : f));
  return { from: f, to: t };
}

/**
 * Parses a formula's visible text. Results are kept (see `parsed`): the editor's underline
 * and the message below it ask about the same text after every keystroke, and every
 * dependent cell asks about its own at every edit.
 */
export function parseVisible(text: string): ParsedFormula {
  const kept = parsed.get(text);
  if (kept !== undefined) return kept;
  const { statement, error } = parseFormula(text);
  const problem = error === null ? null : { ...clampRange(error.from, error.to, text.length), message: error.message, source: 'parse' as const };
  const empty = emptyFormula(text);
  const result = { text, name: statement?.name ?? empty?.name?.text ?? null, problem, empty: empty !== null };
  parsed.set(text, result);
  parsedCharacters += text.length;
  while (parsed.size > 1 && (parsed.size > KEEP_PARSED || parsedCharacters > KEEP_CHARACTERS)) {
    const oldest = parsed.keys().next().value!;
    parsed.delete(oldest);
    parsedCharacters -= oldest.length;
  }
  return result;
}

/**
 * The problems to show for `text`.
 *
 * @param evaluated - the text the worker evaluated when it produced `state`, or null when
 *   that is not known to be the text shown; the evaluation's error is shown only when it
 *   was about this very text, since its offsets mean nothing in another.
 */
export function formulaProblems(text: string, state: CellViewState | null, evaluated: string | null): FormulaProblem[] {
  // a cell still being written (nothing yet, or `name =` and nothing after) is not an error yet
  const parsed = parseVisible(text);
  if (parsed.empty) return [];
  if (parsed.problem !== null) return [parsed.problem];
  if (state === null || evaluated !== text) return [];
  const e: ErrorValue | null = state.error;
  if (e === null || (state.status !== 'error' && state.status !== 'upstream')) return [];
  return [{ ...clampRange(e.from, e.to, text.length), message: e.message, source: e.upstream === null && state.status !== 'upstream' ? 'evaluation' : 'upstream' }];
}
