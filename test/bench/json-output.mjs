// `furrow run --json` on a 1,000,000-row document: wall time, peak resident memory and the
// size of the output, measured with /usr/bin/time -v around bin/furrow.js as a separate
// process. It prints figures and never fails on them.
//
//   node test/bench/json-output.mjs [ROWS] [CHECKOUT]
//
// ROWS defaults to 1,000,000 (50 treatments x 20,000 blocks); CHECKOUT (default: this one)
// is the folder whose bin/furrow.js is measured, so an older commit checked out elsewhere
// can be measured on the same document, before and after a change.
//
// The document is invented: a logged trial of 50 irrigation settings, each block one
// day's run of a rig. Data come from a fixed linear congruential sequence, so every run of
// the script writes the same bytes.
import { execFileSync, spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { createReadStream, existsSync, mkdtempSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { hostname, cpus, tmpdir } from 'node:os';
import { join } from 'node:path';

const TREATMENTS = 50;
const rows = Number(process.argv[2] ?? 1_000_000);
const checkout = process.argv[3] ?? '.';
const blocks = Math.max(1, Math.round(rows / TREATMENTS));

/** A small seeded generator (a 32-bit linear congruential sequence): the bench needs repeatable data, not quality. */
function sequence(seed) {
  let s = seed >>> 0;
  return () => {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
    return s / 4294967296;
  };
}

function writeDocument(dir) {
  const next = sequence(2026);
  const lines = ['block,setting,flow'];
  for (let b = 1; b <= blocks; b++) {
    const day = (next() - 0.5) * 4;
    for (let t = 1; t <= TREATMENTS; t++) {
      const y = 40 + t * 0.1 + day + (next() + next() + next() - 1.5);
      lines.push(`${b},s${t},${y.toFixed(2)}`);
    }
  }
  writeFileSync(join(dir, 'flows.csv'), `${lines.join('\n')}\n`);
  writeFileSync(
    join(dir, 'logged.furrow'),
    'furrow 1\ntitle: Logged rig runs\n\n--- table flows from flows.csv\n\n--- formula\nfit = blocked(flows.flow, flows.setting, flows.block)\n',
  );
}

function digest(path) {
  return new Promise((resolve, reject) => {
    const h = createHash('sha256');
    createReadStream(path).on('data', (d) => h.update(d)).on('end', () => resolve(h.digest('hex'))).on('error', reject);
  });
}

if (!existsSync('/usr/bin/time')) {
  console.log('skipped: /usr/bin/time is not installed (Debian package "time")');
  process.exit(0);
}
// measure the built command line, as a user runs it after npm install
execFileSync(process.execPath, ['scripts/build-cli.mjs'], { stdio: 'ignore', cwd: checkout });
const dir = mkdtempSync(join(tmpdir(), 'furrow-bench-json-'));
try {
  writeDocument(dir);
  console.log(`machine: ${hostname()} (${cpus().length} x ${cpus()[0]?.model ?? '?'}), Node ${process.version}`);
  console.log(`checkout: ${checkout === '.' ? 'this one' : checkout}`);
  console.log(`document: ${rows.toLocaleString('en')} rows (${TREATMENTS} treatments x ${blocks.toLocaleString('en')} blocks), CSV ${(statSync(join(dir, 'flows.csv')).size / 1e6).toFixed(1)} MB`);
  for (const [label, flags] of [['--json', ['--json']], ['human output', []]]) {
    const out = join(dir, 'out.txt');
    const r = spawnSync('/bin/sh', ['-c', `/usr/bin/time -v "${process.execPath}" ${join(checkout, 'bin/furrow.js')} run "${join(dir, 'logged.furrow')}" ${flags.join(' ')} > "${out}"`], {
      encoding: 'utf8',
    });
    const timeText = r.stderr;
    const field = (name) => timeText.split('\n').find((l) => l.trim().startsWith(name))?.split(': ').pop()?.trim() ?? '?';
    const problems = timeText.split('\n').filter((l) => l.startsWith('furrow')).join('\n');
    const cpu = Number(field('User time (seconds)')) + Number(field('System time (seconds)'));
    // on a shared machine the wall time swings with the load; the processor time less so
    console.log(`${label}: exit status ${r.status}, wall time ${field('Elapsed (wall clock) time')} (m:ss), processor time ${cpu.toFixed(2)} s (user + system), max resident ${(Number(field('Maximum resident set size')) / 1024).toFixed(0)} MB`);
    console.log(`  output ${(statSync(out).size / 1e6).toFixed(1)} MB, sha256 ${await digest(out)}${problems ? `\n  ${problems}` : ''}`);
  }
} finally {
  rmSync(dir, { recursive: true, force: true });
}
