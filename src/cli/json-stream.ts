/**
 * `furrow run --json` written as it goes: the report (docs/language.md section 9) as a sequence
 * of pieces of text, handed to a stream in buffers of about {@link BUFFER_CHARS} characters
 * and waiting for the stream to drain when it says it is full. The whole text is never held
 * in memory: a long column goes out {@link COLUMN_SLICE} elements at a time, and a table or
 * a record one member at a time.
 *
 * The text is exactly the canonical JSON of src/lang/json.ts: every piece is made by that
 * module's functions (`toJson`, `columnJson`, `jsonText`, `numbersJsonBytes`), and this file
 * only decides where one piece ends and the next begins. test/cli/json-stream.test.ts holds
 * the two equal, byte for byte, on every sample and on values made to cross the slice
 * boundaries.
 *
 * With a {@link ColumnBytes} helper (the command line's), number and boolean columns go out
 * as ASCII bytes instead of strings, and the second half of a long number column is made by
 * a helper thread while this one makes the first, so both processor cores turn numbers into
 * text (src/cli/column-text-helper.ts).
 */
import { once } from 'node:events';
import type { CellState } from '../graph/engine.ts';
import { booleansJsonBytes, columnJson, jsonText, numbersJsonBytes, toJson, typedCanonical } from '../lang/json.ts';
import { isTextRanges, typeOf, type Column, type TextRanges, type Value } from '../lang/values.ts';

/** A piece of the output: text, ASCII bytes, or bytes still being made by a helper thread. */
export type Piece = string | Uint8Array | Promise<Uint8Array>;

/** Makes a number column's elements `from` to `to` as bytes on another thread (the text of {@link numbersJsonBytes}). */
export interface ColumnBytes {
  numbers(values: Float64Array, missing: Uint8Array | null, from: number, to: number): Promise<Uint8Array>;
}

/** Number columns at least this long have their second half made by the helper. */
export const HELPED_FROM = 50_000;

/** Elements of a column turned into text at a time. */
export const COLUMN_SLICE = 8192;

/** Characters gathered before one write to the stream. */
export const BUFFER_CHARS = 1 << 16;

/**
 * The canonical JSON of a value as pieces whose concatenation is `toJson(v)`: columns in
 * slices of `slice` elements, tables and records member by member, everything else (numbers,
 * texts, claims, errors, chart specifications, which the project keeps small) in one piece.
 */
export function valuePieces(v: Value, slice?: number): Generator<string>;
export function valuePieces(v: Value, slice: number, bytes: ColumnBytes | undefined): Generator<Piece>;
export function* valuePieces(v: Value, slice = COLUMN_SLICE, bytes?: ColumnBytes): Generator<Piece> {
  if (typeof v !== 'object') {
    yield toJson(v);
    return;
  }
  switch (v.kind) {
    case 'column': {
      if (bytes !== undefined && v.type !== 'text') {
        yield* columnBytePieces(v, slice, bytes);
        return;
      }
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
        yield* valuePieces(v.columns[i]!, slice, bytes);
      }
      yield '}';
      return;
    case 'record': {
      yield '{';
      let first = true;
      for (const [k, x] of v.fields) {
        yield `${first ? '' : ','}${jsonText(k)}:`;
        yield* valuePieces(x, slice, bytes);
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
 * A number or boolean column as bytes, `slice` elements at a time; the second half of a long
 * number column is asked of the helper first, so that it is made while this thread makes the
 * first half. A column of typed numbers whose texts are mostly their canonical texts is
 * written by this thread alone: those texts are copied as typed (numbersJsonBytes), three
 * times as fast as made from the doubles, and the helper, which gets the doubles only, has
 * the computed columns' halves to make.
 */
function* columnBytePieces(c: Exclude<Column, { type: 'text' }>, slice: number, bytes: ColumnBytes): Generator<Piece> {
  const n = c.values.length;
  const typed = c.type === 'number' && c.decimals !== null && isTextRanges(c.decimals) ? c.decimals : null;
  const helped = c.type === 'number' && n >= HELPED_FROM && !(typed !== null && mostlyAsTyped(c.values, typed));
  const mine = helped ? Math.ceil(n / 2) : n;
  const rest = helped ? bytes.numbers(c.values as Float64Array, c.missing, mine, n) : null;
  yield '[';
  for (let from = 0; from < mine; from += slice) {
    const to = Math.min(mine, from + slice);
    if (from > 0) yield ',';
    yield c.type === 'number' ? numbersJsonBytes(c.values, c.missing, from, to, typed) : booleansJsonBytes(c.values, c.missing, from, to);
  }
  if (rest !== null) {
    yield ',';
    yield rest;
  }
  yield ']';
}

/** True when nine in ten of the first texts of a typed column are their numbers' canonical texts (a column typed as 2.50, 3.00 is not). */
function mostlyAsTyped(values: Float64Array, typed: TextRanges): boolean {
  const k = Math.min(values.length, 100);
  let copied = 0;
  for (let i = 0; i < k; i++) if (typedCanonical(typed.source, typed.from[i]!, typed.to[i]!, values[i]!)) copied++;
  return copied >= 0.9 * k;
}

/**
 * The pieces of `furrow run --json`'s object, one cell after another (without the newline
 * that ends the output): `{"furrow":1,"cells":[` then each cell's fields in the contract's
 * order, cells separated by a comma and a newline.
 */
export function reportPieces(states: readonly CellState[], slice?: number): Generator<string>;
export function reportPieces(states: readonly CellState[], slice: number, bytes: ColumnBytes | undefined): Generator<Piece>;
export function* reportPieces(states: readonly CellState[], slice = COLUMN_SLICE, bytes?: ColumnBytes): Generator<Piece> {
  yield '{"furrow":1,"cells":[';
  for (let i = 0; i < states.length; i++) {
    const s = states[i]!;
    const v = s.value;
    const isErr = typeof v === 'object' && v.kind === 'error';
    yield `${i === 0 ? '' : ',\n'}{"index":${i},"kind":${JSON.stringify(s.kind)},"name":${s.name === null ? 'null' : JSON.stringify(s.name)},"type":${JSON.stringify(isErr ? 'error' : typeOf(v))},"value":`;
    if (isErr) yield 'null';
    else yield* valuePieces(v, slice, bytes);
    yield `,"error":${s.error ? toJson(s.error) : 'null'}`;
    if (s.warnings.length > 0) yield `,"warnings":${JSON.stringify(s.warnings)}`;
    yield '}';
  }
  yield ']}';
}

/** What {@link writePieces} needs of a stream: Node's Writable (process.stdout) has it. */
export interface PieceSink extends NodeJS.EventEmitter {
  write(chunk: string | Uint8Array): boolean;
}

/**
 * Writes pieces, then `ending`, to a stream: texts gathered into buffers of about
 * `bufferChars` characters, bytes as they are (a piece still being made is waited for, in
 * its place). When the stream says it is full, waits for it to drain before making more (a
 * stream that fails while we wait rejects the promise with its error).
 */
export async function writePieces(pieces: Iterable<Piece>, sink: PieceSink, ending = '', bufferChars = BUFFER_CHARS): Promise<void> {
  let buffer = '';
  const send = async (chunk: string | Uint8Array): Promise<void> => {
    if (!sink.write(chunk)) await once(sink, 'drain');
  };
  const sendBuffer = async (): Promise<void> => {
    const text = buffer;
    buffer = '';
    await send(text);
  };
  for (const piece of pieces) {
    if (typeof piece === 'string') {
      buffer += piece;
      if (buffer.length >= bufferChars) await sendBuffer();
      continue;
    }
    if (buffer !== '') await sendBuffer();
    await send(piece instanceof Uint8Array ? piece : await piece);
  }
  buffer += ending;
  if (buffer !== '') await sendBuffer();
}
