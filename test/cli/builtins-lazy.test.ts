/**
 * The built command line loads the built-ins only for a document that may call one
 * (src/cli/builtins.ts). Whatever it loads, its output must be what the full registry gives:
 * held here against the same command line run in this process with the built-ins loaded.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { main } from '../../src/cli/main.ts';
import { mayCall } from '../../src/cli/builtins.ts';

const dir = mkdtempSync(join(tmpdir(), 'furrow-lazy-'));

/** The command line in this process, built-ins loaded (test/setup/builtins.ts). */
function inProcess(args: string[]): { code: number; out: string; err: string } {
  const out: string[] = [];
  const err: string[] = [];
  const code = main(args, { out: (s) => out.push(s), err: (s) => err.push(s) }) as number;
  return { code, out: out.length > 0 ? `${out.join('\n')}\n` : '', err: err.length > 0 ? `${err.join('\n')}\n` : '' };
}

function built(args: string[]): { code: number; out: string; err: string } {
  const r = spawnSync(process.execPath, ['bin/furrow.js', ...args], { encoding: 'utf8' });
  return { code: r.status ?? -1, out: r.stdout, err: r.stderr.split('\n').filter((l) => !l.includes('running from the TypeScript sources')).join('\n') };
}

const DOCS: Record<string, string> = {
  // no call: evaluated without the built-ins
  arithmetic: 'furrow 1\ntitle: Sums\n\n--- formula\nx = 1 + 2 * 3\n\n--- formula\ny = x ^ 0.5 - 1 / 3\n',
  table: 'furrow 1\ntitle: A table\n\n--- table t\nplot,y\n1,2.5\n2,3.25\n\n--- formula\nz = t.y * 2\n\n--- note\nThe doubled yields are {z}.\n',
  // no bracket, but a built-in's name used as a value: the message names it as a built-in
  named: 'furrow 1\ntitle: A name\n\n--- formula\nm = mean\n\n--- formula\nq = nothing_here + 1\n',
  // calls: the built-ins load first
  calls: 'furrow 1\ntitle: Calls\n\n--- table t\nplot,y\n1,2.5\n2,3.25\n3,4\n\n--- formula\nm = mean(t.y)\n\n--- formula\ns = sd(t.y)\n',
};

describe('the built-ins, loaded only when a document may call one', () => {
  it('tells a document that may call one by its opening bracket', () => {
    expect(mayCall(DOCS.arithmetic!)).toBe(false);
    expect(mayCall(DOCS.table!)).toBe(false);
    expect(mayCall(DOCS.named!)).toBe(false);
    expect(mayCall(DOCS.calls!)).toBe(true);
  });

  it('gives the output of the full registry, human and JSON, with or without calls', () => {
    for (const [name, text] of Object.entries(DOCS)) {
      const path = join(dir, `${name}.furrow`);
      writeFileSync(path, text);
      for (const args of [['run', path], ['run', path, '--json']]) {
        const here = inProcess(args);
        const there = built(args);
        expect(there.out, `${name} ${args.join(' ')}`).toBe(here.out);
        expect(there.code, name).toBe(here.code);
      }
    }
    // the name used as a value is called a built-in, as the full registry says
    expect(built(['run', join(dir, 'named.furrow')]).out).toContain('"mean" is a built-in function');
  });
});
