/**
 * End to end on a large file: `furrow run` (bin/furrow.js) on a document naming a
 * 1,000,000-row x 3-column CSV beside it with a blocked analysis, human output. Each run is a
 * separate process under `/usr/bin/time -v`, which gives the wall time, the processor time
 * and the largest resident size; they are printed with the machine and its load, never
 * asserted. Skipped with a message where /usr/bin/time is missing.
 *
 *   npm run build:cli && npx vitest bench --run test/bench/csv-run.bench.ts
 *
 * FURROW_BEFORE=/path/to/other/bin/furrow.js runs that command line too, on the same file in
 * the same session (how the figures of an older build were taken for comparison).
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { cpus, hostname, loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, bench, describe } from 'vitest';
import { bigTrialCsv, bigTrialDocument } from './support/big-csv.ts';

const N = 1_000_000;
const dir = mkdtempSync(join(tmpdir(), 'furrow-bench-csv-run-'));
writeFileSync(join(dir, 'plots.csv'), bigTrialCsv(N));
const doc = join(dir, 'trial.furrow');
writeFileSync(doc, bigTrialDocument('plots.csv'));
const timer = '/usr/bin/time';
interface Run {
  wall: number;
  cpu: number;
  rssMb: number;
}
const programs = new Map<string, string>([['this checkout (bin/furrow.js)', 'bin/furrow.js']]);
if (process.env.FURROW_BEFORE !== undefined) programs.set(`FURROW_BEFORE (${process.env.FURROW_BEFORE})`, process.env.FURROW_BEFORE);
const runs = new Map<string, Run[]>();

console.log(`machine: ${hostname()}, ${cpus()[0]?.model ?? 'unknown CPU'}, ${cpus().length} cores, Node ${process.version}`);
if (!existsSync('build/cli/main.cjs')) console.log('note: no build/cli: bin/furrow.js runs the sources through tsx (npm run build:cli first)');

/** A figure from /usr/bin/time -v's report. */
function figure(report: string, label: string): number {
  const line = report.split('\n').find((l) => l.trim().startsWith(label));
  if (line === undefined) throw new Error(`no "${label}" in the report of /usr/bin/time`);
  const value = line.slice(line.lastIndexOf(': ') + 2).trim();
  // the wall clock reads h:mm:ss or m:ss.ss
  if (value.includes(':')) return value.split(':').reduce((acc, part) => acc * 60 + Number(part), 0);
  return Number(value);
}

describe(`furrow run, ${N.toLocaleString('en-US')} rows from a CSV file, blocked analysis, human output`, () => {
  if (!existsSync(timer)) {
    console.log('skipped: /usr/bin/time is missing (apt-get install -y time)');
    return;
  }
  for (const [label, program] of programs) {
    const list: Run[] = [];
    runs.set(label, list);
    bench(
      label,
      () => {
        const r = spawnSync(timer, ['-v', process.execPath, program, 'run', doc], { encoding: 'utf8', maxBuffer: 1 << 26 });
        if (r.status !== 0) throw new Error(`furrow run failed: ${r.stderr}`);
        if (!r.stdout.includes('randomized complete block')) throw new Error('the run did not print the fit');
        list.push({
          wall: figure(r.stderr, 'Elapsed (wall clock) time'),
          cpu: figure(r.stderr, 'User time (seconds)') + figure(r.stderr, 'System time (seconds)'),
          rssMb: figure(r.stderr, 'Maximum resident set size (kbytes)') / 1024,
        });
      },
      { iterations: 3, time: 0, warmupIterations: 0, warmupTime: 0 },
    );
  }
});

afterAll(() => {
  for (const [label, list] of runs) {
    if (list.length === 0) continue;
    const figures = (f: (r: Run) => number, digits: number): string => list.map((r) => f(r).toFixed(digits)).join(', ');
    console.log(label);
    console.log(`  wall clock (s): ${figures((r) => r.wall, 2)}`);
    console.log(`  processor time, user + system (s): ${figures((r) => r.cpu, 2)}`);
    console.log(`  largest resident size (MB): ${figures((r) => r.rssMb, 0)}`);
  }
  console.log(`load average at the end: ${loadavg().map((x) => x.toFixed(1)).join(', ')} on ${cpus().length} cores`);
  rmSync(dir, { recursive: true, force: true });
});
