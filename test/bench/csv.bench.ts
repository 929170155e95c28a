/**
 * Reading a 1,000,000-row x 3-column CSV (text, whole number, decimal) into a table value,
 * three ways: papaparse to one string per field and columns built from those strings (the
 * reader before), udsv's typed columns (only when a copy of udsv is named by UDSV_DIR, since
 * it is not a dependency), and our reader from the text to field ranges to typed columns.
 * Prints figures with the machine; never fails a build, but each bench checks what it made.
 *
 *   npx vitest bench --run test/bench/csv.bench.ts
 *   UDSV_DIR=/path/to/node_modules/udsv npx vitest bench --run test/bench/csv.bench.ts
 */
import { existsSync } from 'node:fs';
import { cpus, hostname, loadavg } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, bench, describe } from 'vitest';
import { parseCsv } from '../../src/doc/csv.ts';
import { tableOfGrid } from '../../src/doc/csv-columns.ts';
import { readFieldGrid } from '../../src/doc/csv-fields.ts';
import { tableFromGrid } from '../../cells/table/model.ts';
import { shiftDecimals } from '../../src/stats/decimal/index.ts';
import type { NumberColumn } from '../../src/lang/values.ts';
import { bigTrialCsv } from './support/big-csv.ts';

const N = 1_000_000;
const text = bigTrialCsv(N);
console.log(`machine: ${hostname()}, ${cpus()[0]?.model ?? 'unknown CPU'}, ${cpus().length} cores, Node ${process.version}`);
console.log(`CSV: ${N.toLocaleString('en-US')} rows x 3 columns, ${(text.length / 1e6).toFixed(1)} MB`);

/** Processor time (user + system, ms) of each run of each bench: less swayed by a busy machine than the wall clock. */
const processorMs = new Map<string, number[]>();
function timed(label: string, f: () => void): () => void {
  const list: number[] = [];
  processorMs.set(label, list);
  return () => {
    const before = process.cpuUsage();
    f();
    const used = process.cpuUsage(before);
    list.push((used.user + used.system) / 1000);
  };
}

function check(ok: boolean, what: string): void {
  if (!ok) throw new Error(`bench made the wrong result: ${what}`);
}

interface UdsvModule {
  inferSchema(csv: string, opts?: object): unknown;
  initParser(schema: unknown): { typedCols(csv: string): unknown[][] };
}
const udsvDir = process.env.UDSV_DIR;
const udsvEntry = udsvDir === undefined ? null : join(udsvDir, 'dist', 'uDSV.mjs');
const udsv: UdsvModule | null =
  udsvEntry !== null && existsSync(udsvEntry) ? ((await import(pathToFileURL(udsvEntry).href)) as UdsvModule) : null;
if (udsv === null) console.log('udsv: skipped (set UDSV_DIR to a node_modules/udsv folder to measure it)');

describe(`read ${N.toLocaleString('en-US')} CSV rows into a table`, () => {
  bench(
    'papaparse, a string per field, columns from the strings (before)',
    timed('papaparse, a string per field, columns from the strings (before)', () => {
      const t = tableFromGrid(parseCsv(text));
      check(t.rows === N && t.columns[2]!.type === 'number', 'rows and types');
    }),
    { iterations: 3, time: 0, warmupIterations: 0, warmupTime: 0 },
  );
  if (udsv !== null) {
    bench(
      'udsv typed columns (no decimal texts kept: not exact enough for the shift)',
      timed('udsv typed columns (no decimal texts kept: not exact enough for the shift)', () => {
        const cols = udsv.initParser(udsv.inferSchema(text)).typedCols(text);
        check(cols.length === 3 && cols[2]!.length === N, 'columns');
      }),
      { iterations: 3, time: 0, warmupIterations: 0, warmupTime: 0 },
    );
  }
  bench(
    'ours: text to field ranges to typed columns',
    timed('ours: text to field ranges to typed columns', () => {
      const t = tableOfGrid(readFieldGrid(text));
      check(t.rows === N && t.columns[2]!.type === 'number', 'rows and types');
    }),
    { iterations: 5, time: 0, warmupIterations: 0, warmupTime: 0 },
  );
  const y = tableOfGrid(readFieldGrid(text)).columns[2] as NumberColumn;
  bench(
    'ours, then the exact decimal shift of the yield column (texts scanned in place)',
    timed('ours, then the exact decimal shift of the yield column (texts scanned in place)', () => {
      check(shiftDecimals(y.decimals!).shifted.length === N, 'shifted');
    }),
    { iterations: 5, time: 0, warmupIterations: 0, warmupTime: 0 },
  );
});

afterAll(() => {
  for (const [label, list] of processorMs) {
    if (list.length > 0) console.log(`${label}: processor time per read (ms): ${list.map((x) => x.toFixed(0)).join(', ')}`);
  }
  console.log(`load average at the end: ${loadavg().map((x) => x.toFixed(1)).join(', ')} on ${cpus().length} cores`);
});
