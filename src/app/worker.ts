/**
 * The evaluation worker: the engine runs here, so that typing never waits for an analysis
 * of a large table. It holds the document: it receives it whole when one is opened, then
 * the page's edits, applies each, and tells the engine which cells the edit touched, so
 * nobody compares documents to learn what changed.
 */
/// <reference lib="webworker" />
import type { Document } from '../doc/document.ts';
import { applyEdit, cellsTouched } from '../doc/edits.ts';
import { settleText } from '../doc/settle-text.ts';
import { BUILTINS } from '../functions/index.ts';
import { CELL_KINDS } from '../../cells/kinds.ts';
import { Engine } from '../graph/engine.ts';
import * as unitLibrary from '../functions/unit-library.ts';
import { provideUnitLibrary } from '../functions/units.ts';
import { isRecord, isTable, type Value } from '../lang/values.ts';
import { builtinInfos } from './builtin-info.ts';
import { ColumnSender } from './column-ledger.ts';
import type { CellResult, FromWorker, ToWorker } from './protocol.ts';

// convert's unit tables: bundled into this worker (the unit part of mathjs only), not the page
provideUnitLibrary(unitLibrary);

const scope = self as unknown as DedicatedWorkerGlobalScope;
const post = (m: FromWorker): void => scope.postMessage(m);

let lastProgress = 0;
const engine = new Engine({
  registry: BUILTINS,
  kinds: CELL_KINDS,
  onProgress: (id, fraction) => {
    const t = performance.now();
    if (t - lastProgress > 50 || fraction >= 1) {
      lastProgress = t;
      post({ type: 'progress', id, fraction });
    }
  },
  onStep: (id, done, total) => {
    const t = performance.now();
    if (t - lastProgress > 50) {
      lastProgress = t;
      post({ type: 'step', id, done, total });
    }
  },
});

function members(v: Value): string[] {
  if (isTable(v)) return [...v.names];
  if (isRecord(v)) return [...v.fields.keys()];
  return [];
}

function typeName(v: Value): string {
  if (typeof v === 'number') return 'number';
  if (typeof v === 'string') return 'text';
  if (typeof v === 'boolean') return 'boolean';
  return v.kind === 'record' && v.tag ? v.tag : v.kind;
}

let doc: Document | null = null;

function settleBodies(): void {
  if (doc !== null) for (const c of doc.cells) settleText(c.body);
}
/** The long columns the page holds, so that results send only what it lacks. */
let ledger = new ColumnSender();

scope.onmessage = (e: MessageEvent<ToWorker>) => {
  const m = e.data;
  const t0 = performance.now();
  let touched: Set<string> | undefined;
  let gone: string[] = [];
  // 1. bring the document held here up to the page's
  try {
    if (m.type === 'load') {
      gone = doc === null ? [] : doc.cells.map((c) => c.id).filter((id) => !m.doc.cells.some((c) => c.id === id));
      doc = m.doc;
      if (m.forget === true) ledger = new ColumnSender();
    } else if (m.type === 'edit') {
      if (doc === null) throw new Error('an edit arrived before a document');
      const next = applyEdit(doc, m.edit).document;
      touched = cellsTouched(m.edit);
      gone = [...touched].filter((id) => !next.cells.some((c) => c.id === id));
      doc = next;
    } else {
      for (const [name, text] of m.files) engine.setFile(name, text);
      if (doc === null) {
        post({ type: 'result', seq: m.seq, results: [], gone: [], cells: [], millis: 0, postedAt: performance.timeOrigin + performance.now() });
        return;
      }
      // the engine sees the files' new versions by itself; no cell text changed
      touched = new Set();
    }
  } catch (err) {
    post({ type: 'failure', seq: m.seq, message: err instanceof Error ? err.message : String(err), outOfStep: true });
    return;
  }
  // 2. evaluate what changed
  try {
    const ran = engine.update(doc, { touched, onPlanned: (ids) => post({ type: 'planned', seq: m.seq, ids }) });
    const batch = ledger.batch();
    const results: CellResult[] = ran.map((id) => {
      const s = engine.state(id)!;
      const { value, parts } = batch.encode(id, { value: s.value, parts: s.parts });
      return { id, status: s.status, value, parts, warnings: s.warnings, error: s.error };
    });
    const cells = engine.definedNames().map((name) => {
      const v = engine.valueOf(name);
      return { name, type: v === undefined ? 'unknown' : typeName(v), members: v === undefined ? [] : members(v) };
    });
    post({ type: 'result', seq: m.seq, results, gone, cells, millis: performance.now() - t0, postedAt: performance.timeOrigin + performance.now() });
    batch.commit(gone);
    // the bodies an edit spliced are made whole now that the result is out (settle-text.ts)
    if (m.type === 'edit') setTimeout(settleBodies, 10);
  } catch (err) {
    post({ type: 'failure', seq: m.seq, message: err instanceof Error ? err.message : String(err), outOfStep: false });
  }
};

post({ type: 'ready', builtins: builtinInfos(BUILTINS) });
