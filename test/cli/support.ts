/**
 * Helpers of the command line's tests: run a command in process, make scratch folders.
 */
import { spawnSync } from 'node:child_process';
import { copyFileSync, mkdtempSync, readFileSync, readdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { main } from '../../src/cli/main.ts';

/** Runs a synchronous command (run, seal, verify) and collects what it printed. */
export function cli(...args: string[]): { code: number; out: string; err: string } {
  const out: string[] = [];
  const err: string[] = [];
  const code = main(args, { out: (s) => out.push(s), err: (s) => err.push(s) }) as number;
  return { code, out: out.join('\n'), err: err.join('\n') };
}

export function scratch(files: Record<string, string>): string {
  const dir = mkdtempSync(join(tmpdir(), 'furrow-seal-'));
  for (const [name, text] of Object.entries(files)) writeFileSync(join(dir, name), text);
  return dir;
}

/** A copy of every sample in a scratch folder. */
export function sampleCopies(): string[] {
  const dir = mkdtempSync(join(tmpdir(), 'furrow-samples-'));
  return readdirSync('samples')
    .filter((f) => f.endsWith('.furrow'))
    .map((f) => {
      copyFileSync(join('samples', f), join(dir, f));
      return join(dir, f);
    });
}


/**
 * Runs the built command line (bin/furrow.js) and lists what it loaded: every module it
 * required (Node's `Module._load`, watched by a preloaded script) and Node's own modules.
 */
export function builtLoads(...args: string[]): { status: number | null; out: string; err: string; required: string[]; nodeModules: string[] } {
  const dir = mkdtempSync(join(tmpdir(), 'furrow-loads-'));
  const hook = join(dir, 'watch.cjs');
  const list = join(dir, 'loads.json');
  writeFileSync(
    hook,
    `const Module = require('node:module');
const load = Module._load;
const required = [];
Module._load = function (request) { required.push(request); return load.apply(this, arguments); };
process.on('exit', () => require('node:fs').writeFileSync(${JSON.stringify(list)}, JSON.stringify({ required, nodeModules: process.moduleLoadList })));
`,
  );
  const r = spawnSync(process.execPath, ['-r', hook, 'bin/furrow.js', ...args], { encoding: 'utf8' });
  const loads = JSON.parse(readFileSync(list, 'utf8')) as { required: string[]; nodeModules: string[] };
  return { status: r.status, out: r.stdout, err: r.stderr, ...loads };
}
