/**
 * What the page gives every cell view, and how a view hands an edit back. Views are lit
 * elements; they never evaluate anything themselves (evaluation runs in a Web Worker) and
 * never change a document in place: they dispatch an Edit, and the shell applies it, records
 * it for undo, sends it to the worker and saves it.
 */
import type { Cell } from '../src/doc/document.ts';
import type { Edit } from '../src/doc/edits.ts';
import type { CellStatus } from '../src/graph/engine.ts';
import type { ErrorValue, Value } from '../src/lang/values.ts';

/** A cell's state as the page knows it. 'pending' while the worker recomputes it. */
export interface CellViewState {
  readonly status: CellStatus | 'pending';
  /** The last value received (kept while pending, so the page does not flicker). */
  readonly value: Value | null;
  readonly parts: readonly Value[] | null;
  readonly warnings: readonly string[];
  readonly error: ErrorValue | null;
  /** Progress of a long evaluation, from 0 to 1, when the worker reports one. */
  readonly progress: number | null;
}

/** A built-in as completion and help show it (generated from the registry). */
export interface BuiltinInfo {
  readonly name: string;
  readonly signature: string;
  readonly doc: string;
  readonly returns: string;
  readonly category: string;
  /** A short call as a user would write it (the registry's example; absent in hand-made catalogues). */
  readonly example?: string;
  readonly params: readonly { readonly name: string; readonly description: string; readonly doc: string }[];
}

/** Names a formula can use, for completion. */
export interface NameCatalogue {
  readonly builtins: readonly BuiltinInfo[];
  /** Names cells define, with the columns of tables and the fields of records. */
  readonly cells: readonly { readonly name: string; readonly type: string; readonly members: readonly string[] }[];
}

/** The event a view dispatches to change the document. */
export const EDIT_EVENT = 'furrow-edit';

/**
 * Sent on `window` by the shell when the page goes away (closed, reloaded, hidden): a view
 * that holds typed text not yet sent as an edit (a formula within its typing pause, a table
 * field being typed) sends it at once, before the shell keeps the document.
 */
export const FLUSH_EVENT = 'furrow-flush';

/** Detail of an edit event. */
export interface EditEventDetail {
  readonly edit: Edit;
  /**
   * Edits with the same merge key that follow each other quickly become one step of undo
   * (typing in an editor), e.g. `body:<cell id>`.
   */
  readonly mergeKey?: string;
  /**
   * The view would have its change drawn together with the worker's answer to it (a field
   * entered in a grid): the page holds drawing for a moment (src/views/draw-gate.ts).
   */
  readonly drawWithAnswer?: boolean;
}

/** Dispatches an edit from a view; it crosses shadow roots to reach the shell. */
export function emitEdit(from: EventTarget, edit: Edit, mergeKey?: string, drawWithAnswer = false): void {
  const detail: EditEventDetail = { edit, ...(mergeKey === undefined ? {} : { mergeKey }), ...(drawWithAnswer ? { drawWithAnswer } : {}) };
  from.dispatchEvent(new CustomEvent<EditEventDetail>(EDIT_EVENT, { detail, bubbles: true, composed: true }));
}

/** Properties every cell view takes. */
export interface CellViewProps {
  cell: Cell;
  state: CellViewState | null;
  catalogue: NameCatalogue;
}
