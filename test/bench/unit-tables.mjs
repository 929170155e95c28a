// What convert's unit tables cost to load, each in a fresh Node process: the unit part of
// mathjs as the command line's build bundles it (build/cli/unit-library.cjs), the whole
// mathjs package (what a test or a run from the sources loads), and making the unit system
// from the factories. It prints figures and never fails on them.
//   node test/bench/unit-tables.mjs
import { execFileSync } from 'node:child_process';
import { cpus, hostname } from 'node:os';
import { resolve } from 'node:path';

execFileSync(process.execPath, ['scripts/build-cli.mjs'], { stdio: 'ignore' });
const bundle = resolve('build/cli/unit-library.cjs');

/** Runs a snippet in a fresh Node and returns what it printed (milliseconds, as JSON). */
function measure(code) {
  return JSON.parse(execFileSync(process.execPath, ['--input-type=module', '-e', code], { encoding: 'utf8' }));
}

const load = (what) => `
  import { createRequire } from 'node:module';
  const require = createRequire(${JSON.stringify(resolve('package.json'))});
  const cpu0 = process.cpuUsage();
  const t0 = performance.now();
  const lib = require(${JSON.stringify(what)});
  const t1 = performance.now();
  const m = lib.create({ unitDependencies: lib.unitDependencies, createUnitDependencies: lib.createUnitDependencies });
  m.unit(1, 't').toNumber('kg');
  const t2 = performance.now();
  const cpu = process.cpuUsage(cpu0);
  console.log(JSON.stringify({ load: t1 - t0, make: t2 - t1, cpu: (cpu.user + cpu.system) / 1000 }));
`;

console.log(`machine: ${hostname()} (${cpus().length} x ${cpus()[0]?.model ?? '?'}), Node ${process.version}`);
for (const [label, what] of [['unit part, bundled (build/cli/unit-library.cjs)', bundle], ['whole mathjs package', 'mathjs']]) {
  for (let i = 0; i < 3; i++) {
    const r = measure(load(what));
    console.log(`${label}: load ${r.load.toFixed(0)} ms, make the unit system ${r.make.toFixed(0)} ms, processor ${r.cpu.toFixed(0)} ms`);
  }
}
