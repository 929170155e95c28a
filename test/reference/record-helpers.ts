/**
 * Reading fields of records and columns of tables in the reference tests; each helper throws
 * when the value is not what the test expects, so a wrong shape fails the test.
 */
import { isRecord, isTable, type RecordValue, type Table, type Value } from '../../src/lang/values.ts';

/** The value as a record. */
export function rec(v: Value | undefined): RecordValue {
  if (v === undefined || !isRecord(v)) throw new Error(`expected a record, got ${JSON.stringify(v)}`);
  return v;
}

/** The value as a table. */
export function tab(v: Value | undefined): Table {
  if (v === undefined || !isTable(v)) throw new Error('expected a table');
  return v;
}

/** A number column of a table, by name. */
export function nums(t: Table, name: string): number[] {
  const i = t.names.indexOf(name);
  if (i < 0) throw new Error(`no column ${name}`);
  return Array.from(t.columns[i]!.values as Float64Array);
}

/** A number field of a record, by name. */
export function num(r: RecordValue, name: string): number {
  const v = r.fields.get(name);
  if (typeof v !== 'number') throw new Error(`field ${name} is not a number`);
  return v;
}
