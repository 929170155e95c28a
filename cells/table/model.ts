/**
 * Table cells: a CSV body (or a CSV file beside the document) read into a table value.
 * A column is numeric when every non-empty field reads as a decimal number; booleans when
 * every non-empty field is true or false; text otherwise. An empty field is missing. The
 * decimal text of each number is kept for exact work (docs/language.md section 5).
 */
import { isSafeFileName, type Cell, type Marker } from '../../src/doc/document.ts';
import { spliceOf } from '../../src/doc/edits.ts';
import { CsvError, type CsvGrid } from '../../src/doc/csv-error.ts';
import { tableOfGrid } from '../../src/doc/csv-columns.ts';
import { readFieldGrid, type FieldGrid } from '../../src/doc/csv-fields.ts';
import type { AnalyseEnv, CellAnalysis } from '../../src/graph/cell-kind.ts';
import { KeptTable, rereadTable, tableWork } from './model-rows.ts';
import { isPlainName } from '../../src/lang/lexer.ts';
import { msg } from '../../src/messages/language.ts';
import {
  booleanColumn,
  errorValue,
  numberColumn,
  table,
  textColumn,
  type Column,
  type ErrorValue,
  type Table,
} from '../../src/lang/values.ts';

/** The most rows a table holds (a CSV file is also bounded by its size, see src/cli/files.ts). */
export const MAX_TABLE_ROWS = 5_000_000;
/** The most columns a table holds. */
export const MAX_TABLE_COLUMNS = 2000;

/** A decimal number as typed: sign, digits, optional fraction, optional exponent. */
export const DECIMAL = /^[-+]?(\d+(?:\.\d*)?|\.\d+)([eE][-+]?\d+)?$/;

/** The type a column of fields reads as. */
export function columnTypeOf(fields: readonly string[]): 'number' | 'boolean' | 'text' {
  let numbers = true;
  let booleans = true;
  for (const raw of fields) {
    const f = raw.trim();
    if (f === '') continue;
    if (numbers && !DECIMAL.test(f)) numbers = false;
    if (booleans && f !== 'true' && f !== 'false') booleans = false;
    if (!numbers && !booleans) return 'text';
  }
  return numbers ? 'number' : booleans ? 'boolean' : 'text';
}

/**
 * Builds one column from its fields given as strings. Tables read from CSV are built from
 * field ranges instead (src/doc/csv-columns.ts), by the same rule, with no string per field.
 */
export function columnFromFields(name: string, fields: readonly string[]): Column {
  const n = fields.length;
  const missing = new Uint8Array(n);
  const type = columnTypeOf(fields);
  if (type === 'number') {
    const values = new Float64Array(n);
    const decimals: string[] = new Array<string>(n);
    for (let i = 0; i < n; i++) {
      const f = fields[i]!.trim();
      decimals[i] = f;
      if (f === '') {
        missing[i] = 1;
        values[i] = NaN;
      } else values[i] = Number(f);
    }
    return numberColumn(values, missing, name, decimals);
  }
  if (type === 'boolean') {
    const values = new Uint8Array(n);
    for (let i = 0; i < n; i++) {
      const f = fields[i]!.trim();
      if (f === '') missing[i] = 1;
      else values[i] = f === 'true' ? 1 : 0;
    }
    return booleanColumn(values, missing, name);
  }
  const values: string[] = new Array<string>(n);
  for (let i = 0; i < n; i++) {
    const f = fields[i]!;
    if (f.trim() === '') {
      missing[i] = 1;
      values[i] = '';
    } else values[i] = f;
  }
  return textColumn(values, missing, name);
}

/** Builds a table value from a CSV grid of strings. */
export function tableFromGrid(grid: CsvGrid): Table {
  const cols: Column[] = grid.header.map((name, j) =>
    columnFromFields(
      name,
      grid.rows.map((r) => r[j]!),
    ),
  );
  return table(grid.header, cols);
}

/** A table cell read: the grid and value, or the error that stopped it. */
export interface TableRead {
  readonly name: string | null;
  readonly file: string | null;
  readonly grid: FieldGrid | null;
  readonly value: Table | null;
  readonly error: ErrorValue | null;
  /** Whether the body holds a carriage return, when the reading learnt it without a search. */
  readonly hasReturn?: boolean;
}

/**
 * The table's marker grammar, after the word "table": `NAME` or `NAME from FILE`. The file
 * name is the rest of the line, so a name with spaces still works.
 */
export function readTableMarker(rest: string): Omit<Marker, 'kind'> {
  const words = rest.split(/[ \t]+/).filter((w) => w.length > 0);
  const name = words[0] ?? null;
  if (words[1] === 'from') {
    const file = rest.replace(/^\s*\S+\s+from\s+/, '').trim();
    return { name, file: file === '' ? null : file, extra: [] };
  }
  return { name, file: null, extra: words.slice(1) };
}

/** A table's marker line, keeping the words its grammar does not use. */
export function writeTableMarker(name: string, file: string | null, extra: readonly string[] = []): string {
  return `table ${name}${file !== null ? ` from ${file}` : ''}${extra.length > 0 ? ` ${extra.join(' ')}` : ''}`;
}

/** The marker of a table cell. */
export function tableMarker(cell: Cell): Omit<Marker, 'kind'> {
  return readTableMarker(cell.marker.replace(/^[ \t]*\S+[ \t]*/, ''));
}

/** Reads a table cell (body or CSV file). */
export function readTable(cell: Cell, env: AnalyseEnv): TableRead {
  const m = tableMarker(cell);
  const name = m.name;
  const fail = (e: ErrorValue): TableRead => ({ name, file: m.file, grid: null, value: null, error: e });
  if (name === null) return fail(errorValue(msg.missingTableName(), 0, 0));
  if (!isPlainName(name)) return fail(errorValue(msg.badTableName(name), 0, 0));
  let text = cell.body;
  if (m.file !== null) {
    if (!isSafeFileName(m.file)) return fail(errorValue(msg.csvFileUnsafe(m.file), 0, 0));
    const t = env.files.read(m.file);
    if (t === undefined) return fail(errorValue(msg.csvFileMissing(m.file), 0, 0));
    text = t;
  }
  // a body edited since the last reading: read only the lines the edit changed
  const kept = env.previous?.kept;
  if (m.file === null && kept instanceof KeptTable) {
    // a splice of the kept body (a field typed over in the grid) says where it changed
    const made = spliceOf(cell);
    const change = made !== undefined && made.edit.type === 'splice' && made.base === kept.body ? made.edit : undefined;
    const again = rereadTable(kept, text, change);
    if (again !== null) {
      if (again.grid.rows > MAX_TABLE_ROWS) return fail(errorValue(msg.tooManyRows(again.grid.rows, MAX_TABLE_ROWS), 0, 0));
      if (again.grid.header.length > MAX_TABLE_COLUMNS) return fail(errorValue(msg.tooManyColumns(again.grid.header.length, MAX_TABLE_COLUMNS), 0, 0));
      // read again only when neither the kept body nor the changed lines hold a return
      return { name, file: null, grid: again.grid, value: again.value, error: null, hasReturn: false };
    }
  }
  try {
    const grid = readFieldGrid(text);
    tableWork.rowsRead += grid.rows + 1;
    tableWork.columnsBuilt += grid.header.length;
    if (grid.rows > MAX_TABLE_ROWS) return fail(errorValue(msg.tooManyRows(grid.rows, MAX_TABLE_ROWS), 0, 0));
    if (grid.header.length > MAX_TABLE_COLUMNS) return fail(errorValue(msg.tooManyColumns(grid.header.length, MAX_TABLE_COLUMNS), 0, 0));
    return { name, file: m.file, grid, value: tableOfGrid(grid), error: null };
  } catch (err) {
    if (!(err instanceof CsvError)) throw err;
    // ranges point into the body; for a file they would point into another text
    return m.file === null
      ? fail(errorValue(err.message, err.from, err.to))
      : fail(errorValue(`In ${m.file}: ${err.message}`, 0, 0));
  }
}

/**
 * Characters that print as nothing: zero-width spaces and joiners, the word joiner, the soft
 * hyphen, byte-order marks and direction marks. Two column names that differ only by one of
 * them look the same on every screen and in every report.
 */
const INVISIBLE = /[\u00AD\u061C\u180E\u200B-\u200F\u202A-\u202E\u2060-\u2064\u2066-\u2069\uFEFF]/g;

/** Warnings for column names that hold invisible characters or look like another name. */
export function lookalikeNames(names: readonly string[]): string[] {
  const byLook = new Map<string, string[]>();
  for (const name of names) {
    const shown = name.normalize('NFC').replace(INVISIBLE, '');
    const list = byLook.get(shown);
    if (list === undefined) byLook.set(shown, [name]);
    else list.push(name);
  }
  const codesIn = (list: readonly string[]): string[] =>
    [...new Set(list.join('').match(INVISIBLE) ?? [])].map((c) => `U+${c.charCodeAt(0).toString(16).toUpperCase().padStart(4, '0')}`);
  const out: string[] = [];
  for (const [shown, list] of byLook) {
    if (list.length > 1) out.push(msg.lookalikeColumns(shown, codesIn(list)));
    else if (list[0] !== shown && codesIn(list).length > 0) out.push(msg.invisibleInColumn(shown, codesIn(list)));
  }
  return out;
}

/** What a table cell defines and how it evaluates. */
export function analyseTable(cell: Cell, env: AnalyseEnv): CellAnalysis {
  const r = readTable(cell, env);
  // the evaluation holds the value only: a file's field ranges are not kept past reading
  const value = r.value;
  return {
    defines: r.name !== null && isPlainName(r.name) ? { name: r.name, from: -1, to: -1 } : null,
    reads: [],
    problem: r.error,
    evaluates: true,
    evaluate: (ev) => {
      if (value !== null) for (const w of lookalikeNames(value.names)) ev.warn(w);
      return { value: value! };
    },
    kept: r.file === null && r.grid !== null && r.value !== null ? new KeptTable(cell.body, r.grid, r.value, r.hasReturn) : undefined,
  };
}
