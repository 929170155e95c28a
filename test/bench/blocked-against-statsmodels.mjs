// `furrow run` against pandas + statsmodels on one blocked trial read from a CSV: the same sums
// of squares (checked to 1e-9, relative) and both times end to end, each a separate process
// from start to printed result, as a user would run them. It prints; only a difference in
// the sums of squares makes it exit with status 1. Skips, with a message, when Python or
// statsmodels is missing (Debian: apt-get install -y python3-statsmodels).
//
//   node test/bench/blocked-against-statsmodels.mjs [TREATMENTS] [BLOCKS] [RUNS]
//
// Default 20 treatments x 500 blocks (10,000 rows), three runs of each. The data are
// invented: a coating trial of 20 recipes, each block one batch of panels, from a fixed
// linear congruential sequence, so every run of the script writes the same bytes.
import { execFileSync, spawnSync } from 'node:child_process';
import { cpSync, existsSync, mkdtempSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { cpus, hostname, tmpdir } from 'node:os';
import { join, resolve } from 'node:path';

const treatments = Number(process.argv[2] ?? 20);
const blocks = Number(process.argv[3] ?? 500);
const runs = Number(process.argv[4] ?? 3);
const PYTHON = '/usr/bin/python3';
const TOLERANCE = 1e-9;

function sequence(seed) {
  let s = seed >>> 0;
  return () => {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
    return s / 4294967296;
  };
}

const probe = spawnSync(PYTHON, ['-c', 'import statsmodels, pandas'], { encoding: 'utf8' });
if (probe.error !== undefined || probe.status !== 0) {
  console.log(`skipped: ${PYTHON} with statsmodels and pandas is not available (Debian: apt-get install -y python3-statsmodels)`);
  process.exit(0);
}

execFileSync(process.execPath, ['scripts/build-cli.mjs'], { stdio: 'ignore' });
const dir = mkdtempSync(join(tmpdir(), 'furrow-bench-statsmodels-'));
try {
  const next = sequence(7);
  const lines = ['batch,recipe,gloss'];
  for (let b = 1; b <= blocks; b++) {
    const batch = (next() - 0.5) * 6;
    for (let t = 1; t <= treatments; t++) lines.push(`${b},r${t},${(80 + t * 0.2 + batch + (next() + next() + next() - 1.5) * 2).toFixed(2)}`);
  }
  const csv = join(dir, 'panels.csv');
  writeFileSync(csv, `${lines.join('\n')}\n`);
  const doc = join(dir, 'panels.furrow');
  writeFileSync(doc, 'furrow 1\ntitle: Coating recipes\n\n--- table panels from panels.csv\n\n--- formula\nfit = blocked(panels.gloss, panels.recipe, panels.batch)\n');

  const timed = (command, args) => {
    const t0 = performance.now();
    const r = spawnSync(command, args, { encoding: 'utf8', maxBuffer: 1 << 28 });
    const seconds = (performance.now() - t0) / 1000;
    if (r.status !== 0 && r.status !== 1) throw new Error(`${command} ${args.join(' ')} failed:\n${r.stderr}`);
    return { seconds, out: r.stdout };
  };

  // an installed copy too (what npm puts in place, without the sources): it does not check
  // sources against the build, as this checkout does at every start
  const installed = join(dir, 'installed');
  for (const part of ['bin', 'build', 'package.json']) cpSync(resolve(part), join(installed, part), { recursive: true });
  symlinkSync(resolve('node_modules'), join(installed, 'node_modules'));

  const furrowTimes = [];
  const installedTimes = [];
  const pythonTimes = [];
  let ours;
  let theirs;
  for (let i = 0; i < runs; i++) {
    const f = timed(process.execPath, ['bin/furrow.js', 'run', doc, '--json']);
    furrowTimes.push(f.seconds);
    ours = JSON.parse(f.out).cells.find((c) => c.name === 'fit').value.table;
    const g = timed(process.execPath, [join(installed, 'bin', 'furrow.js'), 'run', doc, '--json']);
    installedTimes.push(g.seconds);
    if (g.out !== f.out) throw new Error('the installed copy printed something else');
    const p = timed(PYTHON, ['test/bench/blocked-against-statsmodels.py', csv, 'gloss', 'recipe', 'batch']);
    pythonTimes.push(p.seconds);
    theirs = JSON.parse(p.out);
  }

  const row = (source) => ours.source.indexOf(source);
  const pairs = [
    ['treatment (recipe)', ours.ss[row('recipe')], theirs.ss.treatment],
    ['block (batch)', ours.ss[row('batch')], theirs.ss.block],
    ['error', ours.ss[row('error')], theirs.ss.error],
  ];
  console.log(`machine: ${hostname()} (${cpus().length} x ${cpus()[0]?.model ?? '?'}), Node ${process.version}, statsmodels ${theirs.statsmodels}, pandas ${theirs.pandas}`);
  console.log(`data: ${(treatments * blocks).toLocaleString('en')} rows (${treatments} treatments x ${blocks} blocks)`);
  let same = true;
  for (const [name, a, b] of pairs) {
    const rel = Math.abs(a - b) / Math.abs(b);
    const ok = rel <= TOLERANCE;
    same &&= ok;
    console.log(`  ss ${name}: furrow ${a}, statsmodels ${b}, relative difference ${rel.toExponential(2)} ${ok ? 'ok' : `MORE THAN ${TOLERANCE}`}`);
  }
  const show = (ts) => ts.map((t) => t.toFixed(2)).join(', ');
  const best = (ts) => Math.min(...ts);
  console.log(`furrow run --json, end to end (s): ${show(furrowTimes)}; from an installed copy: ${show(installedTimes)}`);
  console.log(`python + pandas + statsmodels ols + anova_lm type 1, end to end (s): ${show(pythonTimes)} (of the last: import ${theirs.import_seconds.toFixed(2)}, read and fit ${theirs.fit_seconds.toFixed(2)})`);
  console.log(`best against best: furrow ${(best(pythonTimes) / best(furrowTimes)).toFixed(1)} x faster (installed copy: ${(best(pythonTimes) / best(installedTimes)).toFixed(1)} x)`);
  if (!same) process.exitCode = 1;
} finally {
  rmSync(dir, { recursive: true, force: true });
}
