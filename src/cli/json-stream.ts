/**
 * `furrow run --json` written as it goes: the report (docs/language.md section 9) as a sequence
 * of pieces of text, handed to a stream in buffers of about {@link BUFFER_CHARS} characters
 * and waiting for the stream to drain when it says it is full. The whole text is never held
 * in memory: a long column goes out {@link COLUMN_SLICE} elements at a time, and a table or
 * a record one member at a time.
 *
 * The text is exactly the canonical JSON of src/lang/json.ts: every piece is made by that
 * module's functions (`toJson`, `columnJson`, `jsonText`), and this file only decides where
 * one piece ends and the next begins. test/cli/json-stream.test.ts holds the two equal, byte
 * for byte, on every sample and on values made to cross the slice boundaries.
 */
import { once } from 'node:events';
import type { CellState } from '../graph/engine.ts';
import { columnJson, jsonText, toJson } from '../lang/json.ts';
import { typeOf, type Value } from '../lang/values.ts';

/** Elements of a column turned into text at a time. */
export const COLUMN_SLICE = 8192;

/** Characters gathered before one write to the stream. */
export const BUFFER_CHARS = 1 << 16;

/**
 * The canonical JSON of a value as pieces whose concatenation is `toJson(v)`: columns in
 * slices of `slice` elements, tables and records member by member, everything else (numbers,
 * texts, claims, errors, chart specifications, which the project keeps small) in one piece.
 */
export function* valuePieces(v: Value, slice = COLUMN_SLICE): Generator<string> {
  if (typeof v !== 'object') {
    yield toJson(v);
    return;
  }
  switch (v.kind) {
    case 'column': {
      const n = v.values.length;
      if (n <= slice) {
        yield columnJson(v);
        return;
      }
      yield '[';
      for (let from = 0; from < n; from += slice) {
        const text = columnJson(v, from, Math.min(n, from + slice));
        // columnJson writes the slice in brackets; between slices there is a comma instead
        yield `${from === 0 ? '' : ','}${text.slice(1, -1)}`;
      }
      yield ']';
      return;
    }
    case 'table':
      yield '{';
      for (let i = 0; i < v.names.length; i++) {
        yield `${i === 0 ? '' : ','}${jsonText(v.names[i]!)}:`;
        yield* valuePieces(v.columns[i]!, slice);
      }
      yield '}';
      return;
    case 'record': {
      yield '{';
      let first = true;
      for (const [k, x] of v.fields) {
        yield `${first ? '' : ','}${jsonText(k)}:`;
        yield* valuePieces(x, slice);
        first = false;
      }
      yield '}';
      return;
    }
    default:
      yield toJson(v);
  }
}

/**
 * The pieces of `furrow run --json`'s object, one cell after another (without the newline
 * that ends the output): `{"furrow":1,"cells":[` then each cell's fields in the contract's
 * order, cells separated by a comma and a newline.
 */
export function* reportPieces(states: readonly CellState[], slice = COLUMN_SLICE): Generator<string> {
  yield '{"furrow":1,"cells":[';
  for (let i = 0; i < states.length; i++) {
    const s = states[i]!;
    const v = s.value;
    const isErr = typeof v === 'object' && v.kind === 'error';
    yield `${i === 0 ? '' : ',\n'}{"index":${i},"kind":${JSON.stringify(s.kind)},"name":${s.name === null ? 'null' : JSON.stringify(s.name)},"type":${JSON.stringify(isErr ? 'error' : typeOf(v))},"value":`;
    if (isErr) yield 'null';
    else yield* valuePieces(v, slice);
    yield `,"error":${s.error ? toJson(s.error) : 'null'}`;
    if (s.warnings.length > 0) yield `,"warnings":${JSON.stringify(s.warnings)}`;
    yield '}';
  }
  yield ']}';
}

/** What {@link writePieces} needs of a stream: Node's Writable (process.stdout) has it. */
export interface PieceSink extends NodeJS.EventEmitter {
  write(chunk: string): boolean;
}

/**
 * Writes pieces, then `ending`, to a stream in buffers of about `bufferChars` characters;
 * when the stream says it is full, waits for it to drain before making more text (a stream
 * that fails while we wait rejects the promise with its error).
 */
export async function writePieces(pieces: Iterable<string>, sink: PieceSink, ending = '', bufferChars = BUFFER_CHARS): Promise<void> {
  let buffer = '';
  for (const piece of pieces) {
    buffer += piece;
    if (buffer.length < bufferChars) continue;
    const room = sink.write(buffer);
    buffer = '';
    if (!room) await once(sink, 'drain');
  }
  buffer += ending;
  if (buffer !== '' && !sink.write(buffer)) await once(sink, 'drain');
}
