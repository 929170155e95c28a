/**
 * Note cells: Markdown text with `{expression}` placeholders that show live values.
 * A literal brace is written `\{`. The note's value is its text with every placeholder
 * replaced by its value (what the command line prints); the view renders the Markdown with
 * the live parts. A placeholder that fails keeps its source in the text, and its error is in
 * the parts, so the rest of the note still reads.
 */
import type { Cell } from '../../src/doc/document.ts';
import type { CellAnalysis } from '../../src/graph/cell-kind.ts';
import { namesRead, type Expr, type NameUse } from '../../src/lang/ast.ts';
import { LangError } from '../../src/lang/errors.ts';
import { evaluate } from '../../src/lang/evaluate.ts';
import { quantityOf, type Quantity } from '../../src/format/digits.ts';
import { formatInline } from '../../src/lang/format.ts';
import { parseExpression } from '../../src/lang/parser.ts';
import { errorValue, isError, type ErrorValue, type Value } from '../../src/lang/values.ts';
import { msg } from '../../src/messages/language.ts';

/** A piece of a note: literal Markdown or a placeholder. */
export type NotePiece =
  | { readonly type: 'text'; readonly text: string; readonly from: number }
  | {
      readonly type: 'placeholder';
      /** The expression's source, braces excluded. */
      readonly source: string;
      /** The placeholder as written, braces included. */
      readonly raw: string;
      /** Range of the whole placeholder, braces included, in the note's text. */
      readonly from: number;
      readonly to: number;
      readonly expr: Expr | null;
      readonly error: ErrorValue | null;
    };

/** Splits a note into literal text and placeholders; never throws. */
export function splitNote(text: string): NotePiece[] {
  const pieces: NotePiece[] = [];
  let lit = '';
  let litFrom = 0;
  let i = 0;
  while (i < text.length) {
    const c = text[i]!;
    if (c === '\\' && text[i + 1] === '{') {
      // keep the backslash: Markdown renders \{ as a brace
      lit += '\\{';
      i += 2;
      continue;
    }
    if (c !== '{') {
      lit += c;
      i++;
      continue;
    }
    const end = placeholderEnd(text, i + 1);
    if (end < 0) {
      // an unclosed brace: report it as a placeholder with an error, keep the rest as text
      if (lit) pieces.push({ type: 'text', text: lit, from: litFrom });
      const lineEnd = text.indexOf('\n', i);
      const to = lineEnd < 0 ? text.length : lineEnd;
      pieces.push({
        type: 'placeholder',
        source: text.slice(i + 1, to),
        raw: text.slice(i, to),
        from: i,
        to,
        expr: null,
        error: errorValue('This { is never closed: end the placeholder with }, or write \\{ for a brace.', i, i + 1),
      });
      lit = '';
      i = to;
      litFrom = i;
      continue;
    }
    if (lit) pieces.push({ type: 'text', text: lit, from: litFrom });
    lit = '';
    const source = text.slice(i + 1, end);
    const offset = i + 1;
    let expr: Expr | null = null;
    let error: ErrorValue | null = null;
    try {
      expr = parseExpression(source);
    } catch (err) {
      if (!(err instanceof LangError)) throw err;
      error = errorValue(err.message, err.from + offset, Math.max(err.to, err.from + 1) + offset);
    }
    pieces.push({ type: 'placeholder', source, raw: text.slice(i, end + 1), from: i, to: end + 1, expr, error });
    i = end + 1;
    litFrom = i;
  }
  if (lit) pieces.push({ type: 'text', text: lit, from: litFrom });
  return pieces;
}

/**
 * The index of the `}` closing a placeholder opened before `start`, skipping quoted text, or
 * -1. The scan stops at the next `{`, at a blank line, and inside quoted text at the end of
 * the line, so the scans of all the placeholders of a note together read each character a
 * bounded number of times: splitting a note is linear in its length.
 */
function placeholderEnd(text: string, start: number): number {
  let inText = false;
  for (let j = start; j < text.length; j++) {
    const c = text[j];
    if (c === '\n' && !inText) {
      // a placeholder may span lines, but a blank line ends the search
      if (text[j + 1] === '\n') return -1;
    }
    if (inText) {
      // a text ends on its line (as in formulas): an unclosed quote cannot make this scan,
      // and the next one, run to the end of the note
      if (c === '\n' || c === '\r') return -1;
      if (c === '\\') j++;
      else if (c === '"') inText = false;
      continue;
    }
    if (c === '"') inText = true;
    else if (c === '}') return j;
    else if (c === '{') return -1;
  }
  return -1;
}

function shift(uses: NameUse[], offset: number): NameUse[] {
  return uses.map((u) => ({ name: u.name, from: u.from + offset, to: u.to + offset }));
}

/**
 * Placeholders a note may hold. Each is a live value the page keeps up to date (a slot in
 * the page, a value in the worker's answer); real notes hold tens. A note past the limit is
 * an error on the cell and shown as plain text, so a hostile note of a hundred thousand
 * braces costs the page one text, not a hundred thousand slots.
 */
export const MAX_NOTE_PLACEHOLDERS = 2000;

/** How many placeholders the pieces hold. */
export function placeholderCount(pieces: readonly NotePiece[]): number {
  let n = 0;
  for (const p of pieces) if (p.type === 'placeholder') n++;
  return n;
}

/** What a note reads and how its placeholders evaluate. */
export function analyseNote(cell: Cell): CellAnalysis {
  const text = cell.body;
  const pieces = splitNote(text);
  const count = placeholderCount(pieces);
  if (count > MAX_NOTE_PLACEHOLDERS) {
    const problem = errorValue(msg.tooManyPlaceholders(count, MAX_NOTE_PLACEHOLDERS), 0, 0);
    return { defines: null, reads: [], problem, evaluates: true, evaluate: () => ({ value: problem }) };
  }
  const reads: NameUse[] = [];
  for (const p of pieces) {
    if (p.type === 'placeholder' && p.expr !== null) reads.push(...shift(namesRead(p.expr), p.from + 1));
  }
  return {
    defines: null,
    reads,
    problem: null,
    evaluates: true,
    evaluate(env) {
      const parts: Value[] = [];
      let out = '';
      for (const p of pieces) {
        if (p.type === 'text') {
          out += p.text;
          continue;
        }
        let v: Value;
        if (p.error !== null) v = p.error;
        else {
          try {
            v = evaluate(p.expr!, env);
          } catch (err) {
            if (!(err instanceof LangError)) throw err;
            const offset = p.from + 1;
            v = errorValue(err.message, err.from + offset, err.to + offset, err.upstream);
          }
        }
        parts.push(v);
        // a failed placeholder stays as written; its error is in `parts`
        out += isError(v) ? p.raw : formatInline(v, placeholderQuantity(p.expr));
      }
      return { value: out.replace(/(\r?\n)+$/, ''), parts };
    },
  };
}

/**
 * The quantity a placeholder shows, for its digits: the field it reads last (`{fit.mse}` a
 * mean square, `{fit.table.p[1]}` a p-value, `{gain["low"]}` an estimate); anything else (a
 * name on its own, a call, arithmetic) is a plain number.
 */
export function placeholderQuantity(expr: Expr | null): Quantity {
  let e = expr;
  while (e !== null) {
    if (e.type === 'member') return quantityOf(e.name);
    if (e.type !== 'index') return 'plain';
    if (e.index.type === 'text') return quantityOf(e.index.value);
    e = e.object;
  }
  return 'plain';
}

/** The text a placeholder shows for its value (the page, the report and the command line alike). */
export function placeholderText(source: string, v: Value): string {
  let expr: Expr | null = null;
  try {
    expr = parseExpression(source);
  } catch (err) {
    if (!(err instanceof LangError)) throw err;
  }
  return formatInline(v, placeholderQuantity(expr));
}

/**
 * Placeholders a problem line of the page lists before it says how many more there are: a
 * hostile note may have a hundred thousand failing ones, and a line of that many elements
 * would stall the page while saying nothing more (the command line lists them all).
 */
export const PLACEHOLDERS_LISTED = 20;

/** The placeholders a problem line lists, and how many it leaves unlisted. */
export function listedPlaceholders(placeholders: readonly string[], limit = PLACEHOLDERS_LISTED): { listed: readonly string[]; more: number } {
  return placeholders.length <= limit ? { listed: placeholders, more: 0 } : { listed: placeholders.slice(0, limit), more: placeholders.length - limit };
}

/** One distinct error of a note, with the placeholders it affects, in the order they appear. */
export interface NoteProblem {
  readonly message: string;
  /** True when the error comes from a cell the note reads (the note itself is not at fault). */
  readonly upstream: boolean;
  /** The sources of the placeholders it affects, braces excluded, each once. */
  readonly placeholders: readonly string[];
}

/**
 * A note's errors grouped: one entry per distinct message, listing the placeholders it
 * affects, so a failing cell read by five placeholders gives one line and not five
 * near-identical ones. `sources[i]` is the source of placeholder i (as `parts[i]` is its value).
 */
export function groupNoteProblems(parts: readonly Value[], sources: readonly string[]): NoteProblem[] {
  // each group's sources in a Set (kept in insertion order): a hostile note may hold a hundred
  // thousand failing placeholders, and a list searched for each one made this quadratic
  const groups = new Map<string, { message: string; upstream: boolean; placeholders: Set<string> }>();
  parts.forEach((v, i) => {
    if (!isError(v)) return;
    const upstream = v.upstream !== null;
    const key = `${upstream ? 'u' : 'o'}:${v.message}`;
    let g = groups.get(key);
    if (g === undefined) {
      g = { message: v.message, upstream, placeholders: new Set() };
      groups.set(key, g);
    }
    g.placeholders.add(sources[i] ?? '…');
  });
  return [...groups.values()].map((g) => ({ message: g.message, upstream: g.upstream, placeholders: [...g.placeholders] }));
}
