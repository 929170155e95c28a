/**
 * The helper thread of `furrow run --json` (src/cli/column-text-helper.ts): turns the numbers
 * it is sent into their canonical JSON text, as ASCII bytes, with the same function the main
 * thread uses, and sends the bytes back without copying them.
 */
import { parentPort } from 'node:worker_threads';
import { numbersJsonBytes } from '../lang/json.ts';

/** One request: number elements (a copy of a column's slice) and their missing marks. */
export interface ColumnTextRequest {
  readonly id: number;
  readonly values: Float64Array;
  readonly missing: Uint8Array | null;
}

/** The answer: the elements' text, comma-separated, as {@link numbersJsonBytes} makes it. */
export interface ColumnTextAnswer {
  readonly id: number;
  readonly bytes: Uint8Array;
}

parentPort?.on('message', (m: ColumnTextRequest) => {
  const bytes = numbersJsonBytes(m.values, m.missing);
  const answer: ColumnTextAnswer = { id: m.id, bytes };
  parentPort!.postMessage(answer, [bytes.buffer as ArrayBuffer]);
});
