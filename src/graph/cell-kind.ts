/**
 * What a kind of cell says about itself: how its marker line reads, what a new one holds,
 * the name it goes by, how the margin and the command line show it, and (for the graph)
 * which name it defines, which names it reads and how to compute its value. Each kind lives
 * in its own folder under cells/ (model and view); cells/kinds.ts lists them, and nothing
 * else in the engine, the shell or the command line switches on a kind.
 */
import type { Cell, Marker } from '../doc/document.ts';
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
  /**
   * The same cell's analysis before this change, if it had one: a kind may read the new
   * text faster from what it kept (`CellAnalysis.kept`), as a table re-reads only the
   * rows an edit changed.
   */
  readonly previous?: CellAnalysis | null;
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
  /** What the kind keeps to read the cell's next version faster (its own business). */
  readonly kept?: unknown;
}

/** The marker line and body of a cell, as a new cell or a rename writes them. */
export interface CellText {
  readonly marker: string;
  readonly body: string;
}

/** How the command line prints a cell of this kind. */
export interface CellPrinting {
  /** The heading of the cell in a printout: "table plots", "formula gain", "note". */
  heading(name: string | null): string;
  /**
   * True when a fault with no range lies on the marker line (a table's name or file), so the
   * printout points at that line rather than at the body's first character.
   */
  readonly faultsOnMarker: boolean;
}

/** One kind of cell. */
export interface CellKind {
  /** The marker's first word. */
  readonly kind: string;
  /** The word the page's margin and its add buttons show for the kind ("table"). */
  readonly label: string;
  /**
   * Reads the words of the marker line after the kind word (the kind's marker grammar):
   * its name and file when the marker holds them, and the words it does not use.
   */
  readMarker(rest: string): Omit<Marker, 'kind'>;
  /**
   * What a new cell of this kind holds; `fresh(base)` gives a name not yet taken
   * ("table1"). Absent for kinds the page does not offer to add.
   */
  readonly template?: (fresh: (base: string) => string) => CellText;
  /** The name the cell goes by, from its text alone (no evaluation): the margin shows it. */
  nameOf(cell: Cell): string | null;
  /**
   * The cell's text under a new name, for kinds renamed from the margin. Absent when the
   * kind's own view holds its name (a table's header).
   */
  readonly rename?: (cell: Cell, name: string) => CellText;
  /** The files beside the document that the cell reads, by file name. */
  filesRead(cell: Cell): readonly string[];
  readonly printing: CellPrinting;
  analyse(cell: Cell, env: AnalyseEnv): CellAnalysis;
}
