/**
 * Start-up of the command line: `furrow run` on a one-cell document, through bin/furrow.js
 * (the built JavaScript) and through the TypeScript sources (tsx), as separate processes.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { hostname, tmpdir } from 'node:os';
import { join } from 'node:path';
import { bench, describe } from 'vitest';

const dir = mkdtempSync(join(tmpdir(), 'furrow-bench-cli-'));
const doc = join(dir, 'one.furrow');
writeFileSync(doc, 'furrow 1\n--- formula\nx = 1 + 1\n');
console.log(`machine: ${hostname()}`);

describe('furrow run on a one-cell document', () => {
  bench('built command line (bin/furrow.js)', () => {
    execFileSync(process.execPath, ['bin/furrow.js', 'run', doc]);
  }, { iterations: 5, time: 0 });
  bench('TypeScript sources through tsx', () => {
    execFileSync(process.execPath, ['--import', 'tsx', '-e', `import('./src/cli/main.ts').then((m) => m.main(['run', ${JSON.stringify(doc)}], { out: () => {}, err: () => {} }))`]);
  }, { iterations: 5, time: 0 });
});
