/**
 * The command line's entry: it runs the build that `npm install` made (no TypeScript compiled
 * at start), and in a development checkout whose sources are newer than the build it runs the
 * sources instead, with a note on stderr.
 */
import { spawnSync } from 'node:child_process';
import { copyFileSync, cpSync, mkdirSync, mkdtempSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { builtLoads } from './support.ts';

const ONE_CELL = 'furrow 1\n--- formula\nx = 1 + 1\n';

describe('bin/furrow.js', () => {
  it('runs the built command line, with nothing on stderr', () => {
    const dir = mkdtempSync(join(tmpdir(), 'furrow-bin-'));
    writeFileSync(join(dir, 'one.furrow'), ONE_CELL);
    const r = spawnSync(process.execPath, ['bin/furrow.js', 'run', join(dir, 'one.furrow'), '--json'], { encoding: 'utf8' });
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    expect(JSON.parse(r.stdout).cells[0].value).toBe(2);
  }, 60_000);

  it('a run loads only what it needs: no drawing libraries, built-ins, other commands, papaparse or threads', () => {
    const dir = mkdtempSync(join(tmpdir(), 'furrow-bin-'));
    writeFileSync(join(dir, 'one.furrow'), ONE_CELL);
    const r = builtLoads('run', join(dir, 'one.furrow'));
    expect(r.status).toBe(0);
    expect(r.out).toContain('1 cells, all evaluated.');
    // the build's start: main.cjs and the chunks it requires, all from build/cli
    const ours = r.required.filter((m) => m.startsWith('.') || m.startsWith('/'));
    expect(ours.some((m) => m.endsWith('main.cjs'))).toBe(true);
    expect(ours.length).toBeGreaterThan(1);
    for (const m of ours) expect(m, m).not.toMatch(/functions-|document-commands-|verify-|report-|parquet-|planning-|unit-library/);
    for (const m of r.required) expect(m, m).not.toMatch(/^(vega|vega-lite|vega-interpreter|vega-embed|lit|dompurify|papaparse|mathjs|tsx)/);
    expect(r.nodeModules.some((m) => m.includes('worker_threads'))).toBe(false);
    // the same with a call loads the built-ins' chunk, and still nothing to draw with
    writeFileSync(join(dir, 'call.furrow'), 'furrow 1\n--- formula\nx = sqrt(4)\n');
    const c = builtLoads('run', join(dir, 'call.furrow'));
    expect(c.status).toBe(0);
    expect(c.required.some((m) => /functions-/.test(m))).toBe(true);
    for (const m of c.required) expect(m, m).not.toMatch(/^(vega|vega-lite|vega-interpreter|lit|dompurify)$|report-/);
  }, 60_000);

  it('falls back to the sources, and says so, when the build is older than they are', () => {
    // a checkout of its own: the real sources and libraries, a build stamped as old
    const repo = resolve('.');
    const dir = mkdtempSync(join(tmpdir(), 'furrow-stale-'));
    for (const d of ['src', 'cells', 'scripts', 'node_modules']) symlinkSync(join(repo, d), join(dir, d));
    mkdirSync(join(dir, 'bin'));
    copyFileSync(join(repo, 'bin', 'furrow.js'), join(dir, 'bin', 'furrow.js'));
    copyFileSync(join(repo, 'bin', 'package.json'), join(dir, 'bin', 'package.json'));
    writeFileSync(join(dir, 'package.json'), '{"type": "module"}\n');
    mkdirSync(join(dir, '.git'));
    mkdirSync(join(dir, 'build', 'cli'), { recursive: true });
    cpSync(join(repo, 'build', 'cli'), join(dir, 'build', 'cli'), { recursive: true });
    writeFileSync(join(dir, 'build', 'cli', 'stamp.json'), '{"newestSource": 0}\n');
    writeFileSync(join(dir, 'one.furrow'), ONE_CELL);
    const r = spawnSync(process.execPath, [join(dir, 'bin', 'furrow.js'), 'run', join(dir, 'one.furrow'), '--json'], { encoding: 'utf8' });
    expect(r.stderr).toMatch(/^furrow: running from the TypeScript sources: the sources changed since the command line was built/);
    expect(r.status).toBe(0);
    expect(JSON.parse(r.stdout).cells[0].value).toBe(2);
  }, 60_000);
});
