/**
 * Parquet files named by a table cell (`--- table plots from plots.parquet`), read with
 * hyparquet into the text of a CSV table, so the table reads them exactly as it reads a CSV
 * file: the same typed columns, the same exact decimal shift, the same errors.
 *
 * Each value becomes the field text that reads back as what the file stores: integers
 * (64-bit ones too) as their digits, doubles as their shortest round-trip text, 32-bit floats
 * as the shortest text that rounds to the same float ("1.1", not 1.100000023841858), dates
 * and timestamps as ISO text, nulls as empty fields. Columns a table cannot hold (nested
 * lists and groups, raw bytes) are refused with the column named.
 *
 * Reading is asynchronous (hyparquet decodes pages with promises), so the files are read
 * into this text when they are loaded, before evaluation.
 */
import { parquetMetadata, parquetReadObjects, parquetSchema } from 'hyparquet';
import { importMsg } from '../messages/import.ts';
import { writeCsv } from './csv-write.ts';
import { isoDateText, shortestDoubleText, shortestFloat32Text } from './field-text.ts';

/** A Parquet file that cannot become a table, with what is wrong. */
export class ParquetError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'ParquetError';
  }
}

type Render = (v: unknown) => string;

/** How a column's values become field text, from its physical and logical types. */
function renderFor(name: string, element: { type?: string; converted_type?: string; logical_type?: { type: string } }): Render {
  const refuse = (what: string): never => {
    throw new ParquetError(importMsg.parquetColumnRefused(name, what));
  };
  const fieldOf: Render = (v) => {
    if (v === null || v === undefined) return '';
    if (typeof v === 'number') return element.type === 'FLOAT' ? shortestFloat32Text(v) : shortestDoubleText(v);
    if (typeof v === 'bigint') return v.toString();
    if (typeof v === 'boolean') return v ? 'true' : 'false';
    if (typeof v === 'string') return v;
    if (v instanceof Date) return Number.isNaN(v.getTime()) ? '' : isoDateText(v);
    if (v instanceof Uint8Array) return refuse('raw bytes');
    return refuse('nested values');
  };
  return fieldOf;
}

/** The Parquet file's bytes as the text of a CSV table (header, then one line per row). */
export async function parquetCsv(bytes: Uint8Array, maxRows: number): Promise<string> {
  const file = bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer;
  let metadata;
  try {
    metadata = parquetMetadata(file);
  } catch (e) {
    throw new ParquetError(importMsg.parquetUnreadable(e instanceof Error ? e.message : String(e)));
  }
  const rows = Number(metadata.num_rows);
  if (rows > maxRows) throw new ParquetError(importMsg.parquetTooManyRows(rows, maxRows));
  const schema = parquetSchema(metadata);
  const columns = schema.children.map((c) => {
    if (c.children.length > 0 || c.element.repetition_type === 'REPEATED') throw new ParquetError(importMsg.parquetColumnRefused(c.element.name, 'nested values'));
    return { name: c.element.name, render: renderFor(c.element.name, c.element) };
  });
  if (columns.length === 0) throw new ParquetError(importMsg.parquetNoColumns());
  let objects: Record<string, unknown>[];
  try {
    objects = await parquetReadObjects({ file, metadata });
  } catch (e) {
    throw new ParquetError(importMsg.parquetUnreadable(e instanceof Error ? e.message : String(e)));
  }
  const header = columns.map((c) => c.name);
  const out = objects.map((o) => columns.map((c) => c.render(o[c.name])));
  return writeCsv(header, out);
}
