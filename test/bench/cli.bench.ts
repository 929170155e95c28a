/**
 * Start-up of the command line: `furrow run` on a one-cell document, through bin/furrow.js
 * (the built JavaScript, in this checkout and in an installed copy) and through the
 * TypeScript sources (tsx), as separate processes,
 * beside Node starting with nothing to do. A document without a call starts without the
 * built-ins (src/cli/builtins.ts); one with a call loads them first.
 */
import { execFileSync } from 'node:child_process';
import { cpSync, mkdtempSync, symlinkSync, writeFileSync } from 'node:fs';
import { hostname, loadavg, tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, bench, describe } from 'vitest';

const dir = mkdtempSync(join(tmpdir(), 'furrow-bench-cli-'));
const doc = join(dir, 'one.furrow');
writeFileSync(doc, 'furrow 1\n--- formula\nx = 1 + 1\n');
const withCall = join(dir, 'one-call.furrow');
writeFileSync(withCall, 'furrow 1\n--- formula\nx = sqrt(2)\n');
// an installed copy: what npm puts in place (bin, build, package.json, libraries), with no
// sources, so no check of the sources against the build
const installed = join(dir, 'installed');
for (const part of ['bin', 'build', 'package.json']) cpSync(resolve(part), join(installed, part), { recursive: true });
symlinkSync(resolve('node_modules'), join(installed, 'node_modules'));
console.log(`machine: ${hostname()}, load average ${loadavg().map((x) => x.toFixed(1)).join(', ')}`);
afterAll(() => console.log(`load average at the end: ${loadavg().map((x) => x.toFixed(1)).join(', ')}`));

describe('furrow run on a one-cell document', () => {
  bench('Node alone (node -e "")', () => {
    execFileSync(process.execPath, ['-e', '']);
  }, { iterations: 15, time: 0 });
  bench('built command line (bin/furrow.js), no call', () => {
    execFileSync(process.execPath, ['bin/furrow.js', 'run', doc]);
  }, { iterations: 15, time: 0 });
  bench('installed copy, no call', () => {
    execFileSync(process.execPath, [join(installed, 'bin', 'furrow.js'), 'run', doc]);
  }, { iterations: 15, time: 0 });
  bench('built command line (bin/furrow.js), one call: the built-ins load', () => {
    execFileSync(process.execPath, ['bin/furrow.js', 'run', withCall]);
  }, { iterations: 15, time: 0 });
  bench('TypeScript sources through tsx', () => {
    execFileSync(process.execPath, ['--import', 'tsx', '-e', `import('./src/cli/main.ts').then((m) => m.main(['run', ${JSON.stringify(doc)}], { out: () => {}, err: () => {} }))`]);
  }, { iterations: 5, time: 0 });
});
