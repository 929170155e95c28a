/**
 * What the parts of the table cell's view (row window, selection, field editor, clipboard,
 * toolbar, CSV text) see of the element they serve. The element, `<furrow-table-cell>` in
 * view.ts, owns the reactive state and the grid it read; each part holds one job and reaches
 * the rest only through this interface.
 */
import type { ReactiveControllerHost } from 'lit';
import type { Cell } from '../../src/doc/document.ts';
import type { Edit } from '../../src/doc/edits.ts';
import type { CellViewState, NameCatalogue } from '../view-api.ts';
import type { EditMode, GridCommand, Pos, Selection } from './grid-keys.ts';
import type { BodyGrid, FieldSource } from './grid-model.ts';

/** The field editor while it is open: which field, how keys behave, where it is laid. */
export interface EditorState {
  readonly pos: Pos;
  readonly mode: EditMode;
  /** The text the editor opens with. */
  readonly initial: string;
  readonly left: number;
  readonly width: number;
  readonly height: number;
  readonly problem: string | null;
}

/** The line under the grid: what the last action did, or why it could not. */
export interface StatusLine {
  readonly kind: 'info' | 'problem';
  readonly text: string;
}

/** The fields on screen and the width of each column, in characters. */
export interface Shown {
  readonly source: FieldSource;
  readonly widths: number[];
}

/** The element as its parts see it. */
export interface GridHost extends ReactiveControllerHost {
  readonly cell: Cell;
  readonly state: CellViewState | null;
  readonly catalogue: NameCatalogue;
  readonly renderRoot: HTMLElement | DocumentFragment;
  dispatchEvent(e: Event): boolean;

  sel: Selection;
  editor: EditorState | null;
  status: StatusLine | null;
  printing: boolean;

  /** The grid of the body (null for a file table or a body that does not read). */
  readonly grid: BodyGrid | null;
  /** The CSV file the table reads, or null for a table with a body. */
  readonly file: string | null;
  readonly readOnly: boolean;
  readonly tableName: string | null;
  readonly shown: Shown | null;
  readonly extent: { rows: number; cols: number };

  /**
   * Sends a body edit for a grid the view made, and shows that grid at once (or, with
   * `withAnswer`, together with the worker's answer to it: src/views/draw-gate.ts).
   */
  commit(next: BodyGrid, mergeKey?: string, withAnswer?: boolean): void;
  /** Sends an edit of the cell (the view never changes the document itself). */
  send(edit: Edit, mergeKey?: string): void;
  say(kind: StatusLine['kind'], text: string): void;
  /** Selects, and scrolls the focused field into view after the next draw. */
  select(next: Selection): void;
  focusGrid(): void;
  /** Draws at once, within the current event (an input method must find the editor there). */
  drawNow(): void;
  run(cmd: GridCommand): void;
}
