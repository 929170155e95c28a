/**
 * What every kind of cell tells the graph: which name it defines, which names it reads, and
 * how to compute its value. Each kind lives in its own folder under cells/ (model and view);
 * cells/kinds.ts lists them.
 */
import type { Cell } from '../doc/document.ts';
import type { NameUse } from '../lang/ast.ts';
import type { EvalEnv } from '../lang/evaluate.ts';
import type { ErrorValue, Value } from '../lang/values.ts';

/** Files a document may read: CSV files beside it, by file name. */
export interface FileSource {
  /** The file's text, or undefined when there is no such file. */
  read(name: string): string | undefined;
}

/** What analysis of a cell may consult. */
export interface AnalyseEnv {
  readonly files: FileSource;
}

/** The result of evaluating a cell. */
export interface CellOutput {
  readonly value: Value;
  /** For notes: the value of each `{...}` placeholder, in order. */
  readonly parts?: readonly Value[];
}

/** A cell read and checked, ready to evaluate. */
export interface CellAnalysis {
  /** The name the cell defines, with its range in the cell's text (marker names: -1). */
  readonly defines: NameUse | null;
  /** Every name it reads, one entry per occurrence, in text order. */
  readonly reads: readonly NameUse[];
  /** A fault found before evaluation (a parse error, a broken CSV): the cell's value. */
  readonly problem: ErrorValue | null;
  /** Computes the cell's value. Throws LangError; everything else is a fault. */
  evaluate(env: EvalEnv): CellOutput;
  /** False for kinds the engine keeps but does not evaluate. */
  readonly evaluates: boolean;
}

/** One kind of cell. */
export interface CellKind {
  /** The marker's first word. */
  readonly kind: string;
  analyse(cell: Cell, env: AnalyseEnv): CellAnalysis;
}
