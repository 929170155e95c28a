/**
 * The page's side of the worker (src/app/bridge.ts) with a stand-in worker: results whose
 * long columns refer to what the page holds are put back together, and a result that refers
 * to a column the page does not hold (ledgers out of step) makes the page start its ledger
 * afresh and ask for the document's values again, whole, instead of failing.
 */
import { describe, expect, it } from 'vitest';
import { ColumnSender } from '../../src/app/column-ledger.ts';
import { EvaluationBridge } from '../../src/app/bridge.ts';
import type { FromWorker, ToWorker } from '../../src/app/protocol.ts';
import { emptyDocument } from '../../src/doc/document.ts';
import { decimalAt, numberColumn, table, type Table } from '../../src/lang/values.ts';

class StandInWorker {
  readonly sent: ToWorker[] = [];
  onmessage: ((e: MessageEvent<FromWorker>) => void) | null = null;
  onerror: ((e: ErrorEvent) => void) | null = null;
  postMessage(m: ToWorker): void {
    this.sent.push(m);
  }
  answer(m: FromWorker): void {
    this.onmessage!({ data: structuredClone(m) } as MessageEvent<FromWorker>);
  }
}

function bridgeWith(worker: StandInWorker): EvaluationBridge {
  return new EvaluationBridge({ onStates: () => {}, onFailure: (m) => { throw new Error(m); } }, () => emptyDocument(), () => worker as unknown as Worker);
}

const column = (values: number[]) => numberColumn(Float64Array.from(values), null, 'y', values.map(String));

describe('the bridge', () => {
  it('puts back columns sent whole and as patches, and starts afresh when a result names a column it lacks', async () => {
    const worker = new StandInWorker();
    const bridge = bridgeWith(worker);
    bridge.load(emptyDocument());
    const sender = new ColumnSender();
    const y0 = column(Array.from({ length: 1000 }, (_, i) => i));
    const y1 = column(Array.from({ length: 1000 }, (_, i) => (i === 5 ? 55 : i)));
    const send = (seq: number, t: Table) => {
      const batch = sender.batch();
      const { value, parts } = batch.encode('big', { value: t, parts: null });
      worker.answer({ type: 'result', seq, results: [{ id: 'big', status: 'ok', value, parts, warnings: [], error: null }], gone: [], cells: [], millis: 1, postedAt: 0 });
      batch.commit([]);
    };
    send(1, table(['y'], [y0]));
    bridge.load(emptyDocument());
    send(2, table(['y'], [y1]));
    const got = bridge.state('big')!.value as Table;
    const y = got.columns[0]!;
    expect(y.values[5]).toBe(55);
    expect(y.type === 'number' && y.decimals !== null ? decimalAt(y.decimals, 5) : null).toBe('55');
    await bridge.settled();
    // a worker whose ledger believes the page holds a column it does not
    bridge.load(emptyDocument());
    const wrong = { kind: 'table', names: ['y'], columns: [{ kind: 'column-held', id: 999 }], rows: 1000 };
    worker.answer({ type: 'result', seq: 3, results: [{ id: 'big', status: 'ok', value: wrong as never, parts: null, warnings: [], error: null }], gone: [], cells: [], millis: 1, postedAt: 0 });
    const last = worker.sent[worker.sent.length - 1]!;
    expect(last.type).toBe('load');
    expect(last.type === 'load' && last.forget).toBe(true);
    // the cell keeps its last good value meanwhile
    expect((bridge.state('big')!.value as Table).columns[0]!.values[5]).toBe(55);
  });
});
