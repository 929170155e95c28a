/**
 * Shared helpers of the engine's tests: evaluate a document's text, and look at one cell.
 */
import { readDocument } from '../src/doc/format.ts';
import { BUILTINS } from '../src/functions/index.ts';
import { CELL_KINDS } from '../cells/kinds.ts';
import { Engine, type CellState } from '../src/graph/engine.ts';
import type { Value } from '../src/lang/values.ts';

/** A document text from lines of cells: `cells('--- formula', 'x = 1')`. */
export function doc(...lines: string[]): string {
  return `furrow 1\ntitle: test\n\n${lines.join('\n')}\n`;
}

/** Evaluates a document's text; returns the engine and its states. */
export function run(text: string): { engine: Engine; states: CellState[] } {
  const engine = new Engine({ registry: BUILTINS, kinds: CELL_KINDS });
  engine.update(readDocument(text).document);
  return { engine, states: engine.states() };
}

/** The value of the cell that defines `name` (throws when there is none). */
export function valueOf(engine: Engine, name: string): Value {
  const v = engine.valueOf(name);
  if (v === undefined) throw new Error(`no single cell defines ${name}`);
  return v;
}

/** Evaluates one formula (as the only cell, or after other cells) and returns its value. */
export function evalFormula(expr: string, ...before: string[]): Value {
  const { engine } = run(doc(...before, '--- formula', `result_ = ${expr}`));
  return valueOf(engine, 'result_');
}
