/**
 * Messages between the page and the evaluation worker. Values travel by structured clone
 * (Maps and typed arrays survive it), with long columns the page already holds sent by
 * number or as a patch (column-ledger.ts); records lose their `internal` part, which only
 * the engine needs.
 */
import type { NameCatalogue } from '../../cells/view-api.ts';
import type { Document } from '../doc/document.ts';
import type { Edit } from '../doc/edits.ts';
import type { CellStatus } from '../graph/engine.ts';
import type { ErrorValue } from '../lang/values.ts';
import type { WireValue } from './column-ledger.ts';

/**
 * Page to worker. The worker holds the document: it is sent whole once (when a document is
 * opened) and then changed by the same edits the page's store applied, in the same order.
 */
export type ToWorker =
  /** Take this document and evaluate it. */
  | {
      readonly type: 'load';
      readonly seq: number;
      readonly doc: Document;
      /** The page holds no columns (its ledger was lost): send every column whole from now on. */
      readonly forget?: boolean;
    }
  /** Apply this edit to the document held and evaluate what it touched. */
  | { readonly type: 'edit'; readonly seq: number; readonly edit: Edit }
  /** CSV files beside the document, by name (undefined removes one); the cells reading them re-evaluate. */
  | { readonly type: 'files'; readonly seq: number; readonly files: ReadonlyArray<readonly [string, string | undefined]> };

/** One evaluated cell as it travels: its values encoded against the page's column ledger. */
export interface CellResult {
  readonly id: string;
  readonly status: CellStatus;
  readonly value: WireValue;
  readonly parts: readonly WireValue[] | null;
  readonly warnings: readonly string[];
  readonly error: ErrorValue | null;
}

/** Worker to page. */
export type FromWorker =
  | { readonly type: 'ready'; readonly builtins: NameCatalogue['builtins'] }
  /** Before evaluating: the cells that may get a new value (the page may mark them). */
  | { readonly type: 'planned'; readonly seq: number; readonly ids: readonly string[] }
  | {
      readonly type: 'result';
      readonly seq: number;
      /** The cells that ran, in the order they ran. */
      readonly results: readonly CellResult[];
      /** The cells that left the document with this update. */
      readonly gone: readonly string[];
      readonly cells: NameCatalogue['cells'];
      readonly millis: number;
      /** When the worker posted this (milliseconds since the epoch), to measure the hand-over. */
      readonly postedAt: number;
    }
  | { readonly type: 'progress'; readonly id: string; readonly fraction: number }
  /** A long update is under way: `done` of `total` cells checked, `id` running now. */
  | { readonly type: 'step'; readonly id: string; readonly done: number; readonly total: number }
  /**
   * An update failed. `outOfStep` says the worker's document no longer follows the page's
   * (an edit did not apply): the page sends its document again.
   */
  | { readonly type: 'failure'; readonly seq: number; readonly message: string; readonly outOfStep: boolean };
