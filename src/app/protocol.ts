/**
 * Messages between the page and the evaluation worker. Values travel by structured clone
 * (Maps and typed arrays survive it); records lose their `internal` part, which only the
 * engine needs.
 */
import type { NameCatalogue } from '../../cells/view-api.ts';
import type { Document } from '../doc/document.ts';
import type { CellStatus } from '../graph/engine.ts';
import type { ErrorValue, Value } from '../lang/values.ts';

/** Page to worker. */
export type ToWorker =
  /** Evaluate this version of the document (the worker evaluates only what changed). */
  | { readonly type: 'update'; readonly seq: number; readonly doc: Document }
  /** CSV files beside the document, by name (undefined removes one). */
  | { readonly type: 'files'; readonly files: ReadonlyArray<readonly [string, string | undefined]> };

/** One evaluated cell. */
export interface CellResult {
  readonly id: string;
  readonly status: CellStatus;
  readonly value: Value;
  readonly parts: readonly Value[] | null;
  readonly warnings: readonly string[];
  readonly error: ErrorValue | null;
}

/** Worker to page. */
export type FromWorker =
  | { readonly type: 'ready'; readonly builtins: NameCatalogue['builtins'] }
  | {
      readonly type: 'result';
      readonly seq: number;
      /** The cells that ran, in the order they ran. */
      readonly results: readonly CellResult[];
      /** For every cell, the ids of the cells that read it directly. */
      readonly readers: ReadonlyArray<readonly [string, readonly string[]]>;
      readonly cells: NameCatalogue['cells'];
      readonly millis: number;
    }
  | { readonly type: 'progress'; readonly id: string; readonly fraction: number }
  /** A long update is under way: `done` of `total` cells checked, `id` running now. */
  | { readonly type: 'step'; readonly id: string; readonly done: number; readonly total: number }
  | { readonly type: 'failure'; readonly seq: number; readonly message: string };

/** A value without engine-only parts, ready to post. */
export function portable(v: Value): Value {
  if (typeof v !== 'object') return v;
  if (v.kind === 'record') {
    const fields = new Map<string, Value>();
    for (const [k, x] of v.fields) fields.set(k, portable(x));
    return { kind: 'record', fields, tag: v.tag };
  }
  return v;
}
