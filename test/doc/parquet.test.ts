// Parquet files read into table text. The files are test files of the Apache Parquet
// project (github.com/apache/parquet-testing, data/, Apache License 2.0; see
// test/doc/fixtures/parquet/README.md): what they hold is checked against the CSV the
// project publishes beside delta_binary_packed.parquet, and, for alltypes_plain, against the
// values listed in that project's own readers' tests (from memory, cross-checked here with
// the file's two compressions agreeing).
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseCsv } from '../../src/doc/csv.ts';
import { shortestFloat32Text } from '../../src/doc/field-text.ts';
import { parquetCsv, ParquetError } from '../../src/doc/parquet.ts';

const fixture = (name: string): Uint8Array => new Uint8Array(readFileSync(new URL(`./fixtures/parquet/${name}`, import.meta.url)));
const MANY = 5_000_000;

describe('Parquet into table text', () => {
  it('delta-packed 32- and 64-bit integers match the CSV published beside the file', async () => {
    const got = parseCsv(await parquetCsv(fixture('delta_binary_packed.parquet'), MANY));
    const expected = parseCsv(readFileSync(new URL('./fixtures/parquet/delta_binary_packed_expect.csv', import.meta.url), 'utf8'));
    expect(got.header).toEqual(expected.header);
    expect(got.rows.length).toBe(expected.rows.length);
    expect(got.rows.length).toBeGreaterThan(100);
    expect(got.rows).toEqual(expected.rows);
  });

  it('plain and snappy-compressed copies of one table give the same text; floats read as typed', async () => {
    const plain = await parquetCsv(fixture('alltypes_plain.parquet'), MANY);
    const snappy = parseCsv(await parquetCsv(fixture('alltypes_plain.snappy.parquet'), MANY));
    const g = parseCsv(plain);
    expect(g.header).toEqual(['id', 'bool_col', 'tinyint_col', 'smallint_col', 'int_col', 'bigint_col', 'float_col', 'double_col', 'date_string_col', 'string_col', 'timestamp_col']);
    // source: apache/parquet-testing data/alltypes_plain.parquet, 8 rows, ids 4 5 6 7 2 3 0 1
    // (from memory; the snappy file holds the first two rows of the same table, ids 6 and 7)
    expect(g.rows.map((r) => r[0])).toEqual(['4', '5', '6', '7', '2', '3', '0', '1']);
    expect(g.rows[1]).toEqual(['5', 'false', '1', '1', '1', '10', '1.1', '10.1', '03/01/09', '1', '2009-03-01T00:01:00']);
    expect(g.rows[0]![10]).toBe('2009-03-01');
    expect(snappy.header).toEqual(g.header);
    expect(snappy.rows).toEqual(g.rows.slice(2, 4));
  });

  it('optional columns: nulls become empty fields, as in the CSV published beside the file', async () => {
    const got = parseCsv(await parquetCsv(fixture('delta_encoding_optional_column.parquet'), MANY));
    const expected = parseCsv(readFileSync(new URL('./fixtures/parquet/delta_encoding_optional_column_expect.csv', import.meta.url), 'utf8'));
    expect(got.header).toEqual(expected.header);
    expect(got.rows).toEqual(expected.rows);
    expect(got.rows.some((r) => r.includes(''))).toBe(true);
  });

  it('a decimal column reads as its decimal text', async () => {
    const g = parseCsv(await parquetCsv(fixture('int32_decimal.parquet'), MANY));
    // source: apache/parquet-testing data/int32_decimal.parquet, the decimals 1.00 to 24.00
    // (INT32, precision 4, scale 2); the values are from memory, the project lists the file
    // without them
    expect(g.rows.map((r) => Number(r[0]))).toEqual(Array.from({ length: 24 }, (_, i) => i + 1));
  });

  it('a nested column is refused with its name', async () => {
    await expect(parquetCsv(fixture('nulls.snappy.parquet'), MANY)).rejects.toThrow('the Parquet column b_struct holds nested values, which a table cannot hold');
  });

  it('a float column keeps the shortest text that rounds to the same 32-bit float', () => {
    expect(shortestFloat32Text(Math.fround(1.1))).toBe('1.1');
    expect(shortestFloat32Text(Math.fround(0.1))).toBe('0.1');
    expect(shortestFloat32Text(Math.fround(123456.79))).toBe('123456.79');
    expect(shortestFloat32Text(Math.fround(3.4028234e38))).toBe('3.4028235e+38');
    for (const x of [1.1, 0.3, 2.675, 1e-7, 16777217]) {
      const f = Math.fround(x);
      expect(Math.fround(Number(shortestFloat32Text(f)))).toBe(f);
    }
  });

  it('refuses what is not Parquet, and a file past the row limit, with a plain message', async () => {
    await expect(parquetCsv(new TextEncoder().encode('plot,y\n1,2\n'), MANY)).rejects.toThrow(ParquetError);
    await expect(parquetCsv(new TextEncoder().encode('plot,y\n1,2\n'), MANY)).rejects.toThrow(/could not be read as Parquet/);
    await expect(parquetCsv(fixture('alltypes_plain.parquet'), 5)).rejects.toThrow(/8 rows; a table holds at most 5/);
  });
});
