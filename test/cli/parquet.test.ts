/**
 * A table that reads a Parquet file beside its document, on the command line: evaluated like
 * a CSV table, sealed with the file's bytes in the fingerprint, and refused plainly when the
 * file cannot become a table. The file is a test file of the Apache Parquet project (see
 * test/doc/fixtures/parquet/README.md).
 */
import { copyFileSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { main } from '../../src/cli/main.ts';
import { scratch } from './support.ts';

const FIXTURES = 'test/doc/fixtures/parquet';

async function cliAsync(...args: string[]): Promise<{ code: number; out: string; err: string }> {
  const out: string[] = [];
  const err: string[] = [];
  const code = await main(args, { out: (s) => out.push(s), err: (s) => err.push(s) });
  return { code, out: out.join('\n'), err: err.join('\n') };
}

const DOC = `furrow 1
title: Parquet beside the document

--- table types from alltypes.parquet

--- formula
total = sum(types.double_col)

--- formula
ids = count(types.id)
`;

describe('a table from a Parquet file', () => {
  it('evaluates like a CSV table, with the exact decimal shift on its doubles', async () => {
    const dir = scratch({ 'trial.furrow': DOC });
    copyFileSync(join(FIXTURES, 'alltypes_plain.parquet'), join(dir, 'alltypes.parquet'));
    const r = await cliAsync('run', join(dir, 'trial.furrow'), '--json');
    expect(r.err).toBe('');
    expect(r.code).toBe(0);
    const cells = JSON.parse(r.out).cells as { name: string | null; value: unknown }[];
    // four rows hold 10.1 and four 0 (source: the file's values, read in test/doc/parquet.test.ts)
    expect(cells.find((c) => c.name === 'total')?.value).toBe(40.4);
    expect(cells.find((c) => c.name === 'ids')?.value).toBe(8);
  });

  it('the seal covers the file: replaced by another, verify names it and the values that moved', async () => {
    const dir = scratch({ 'trial.furrow': DOC });
    const file = join(dir, 'alltypes.parquet');
    copyFileSync(join(FIXTURES, 'alltypes_plain.parquet'), file);
    const doc = join(dir, 'trial.furrow');
    expect((await cliAsync('seal', doc)).code).toBe(0);
    expect((await cliAsync('verify', doc)).code).toBe(0);
    // two rows of the same table, compressed another way
    writeFileSync(file, readFileSync(join(FIXTURES, 'alltypes_plain.snappy.parquet')));
    const v = await cliAsync('verify', doc);
    expect(v.code).toBe(1);
    expect(v.out).toMatch(/The data file alltypes\.parquet changed since sealing/);
    expect(v.out).toMatch(/total: was 40\.4, now 10\.1/);
  });

  it('a nested column is refused, naming the table, the file and the column', async () => {
    const dir = scratch({ 'trial.furrow': DOC });
    copyFileSync(join(FIXTURES, 'nulls.snappy.parquet'), join(dir, 'alltypes.parquet'));
    const r = await cliAsync('run', join(dir, 'trial.furrow'));
    expect(r.code).toBe(2);
    expect(r.err).toBe('furrow: ' + join(dir, 'trial.furrow') + ': table types names alltypes.parquet, but the Parquet column b_struct holds nested values, which a table cannot hold');
  });
});
