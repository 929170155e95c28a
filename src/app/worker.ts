/**
 * The evaluation worker: the engine runs here, so that typing never waits for an analysis
 * of a large table. It receives whole documents and evaluates only what changed (the engine
 * compares cells by id and text).
 */
/// <reference lib="webworker" />
import { BUILTINS } from '../functions/index.ts';
import { CELL_KINDS } from '../../cells/kinds.ts';
import { describeParam, signature } from '../lang/builtins.ts';
import { Engine } from '../graph/engine.ts';
import { isRecord, isTable, type Value } from '../lang/values.ts';
import { portable, type CellResult, type FromWorker, type ToWorker } from './protocol.ts';

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

scope.onmessage = (e: MessageEvent<ToWorker>) => {
  const m = e.data;
  if (m.type === 'files') {
    for (const [name, text] of m.files) engine.setFile(name, text);
    return;
  }
  const t0 = performance.now();
  try {
    const ran = engine.update(m.doc);
    const results: CellResult[] = ran.map((id) => {
      const s = engine.state(id)!;
      return {
        id,
        status: s.status,
        value: portable(s.value),
        parts: s.parts === null ? null : s.parts.map(portable),
        warnings: s.warnings,
        error: s.error,
      };
    });
    const readers: [string, string[]][] = m.doc.cells.map((c) => [c.id, []]);
    const byName = new Map<string, string>();
    for (const c of m.doc.cells) {
      const n = engine.state(c.id)?.name;
      if (n) byName.set(n, c.id);
    }
    const index = new Map(readers.map((r) => [r[0], r[1]] as const));
    for (const c of m.doc.cells) {
      for (const use of engine.reads(c.id)) {
        const src = byName.get(use.name);
        const list = src === undefined ? undefined : index.get(src);
        if (list !== undefined && !list.includes(c.id)) list.push(c.id);
      }
    }
    const cells = engine.definedNames().map((name) => {
      const v = engine.valueOf(name);
      return { name, type: v === undefined ? 'unknown' : typeName(v), members: v === undefined ? [] : members(v) };
    });
    post({ type: 'result', seq: m.seq, results, readers, cells, millis: performance.now() - t0 });
  } catch (err) {
    post({ type: 'failure', seq: m.seq, message: err instanceof Error ? err.message : String(err) });
  }
};

post({
  type: 'ready',
  builtins: BUILTINS.all().map((b) => ({
    name: b.name,
    signature: signature(b),
    doc: b.doc,
    returns: b.returns,
    category: b.category,
    params: b.params.map((p) => ({ name: p.name, description: describeParam(p), doc: p.doc })),
  })),
});
