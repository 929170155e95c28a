/**
 * Helpers of the command line's tests: run a command in process, make scratch folders.
 */
import { copyFileSync, mkdtempSync, readdirSync, writeFileSync } from 'node:fs';
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

