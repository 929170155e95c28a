/**
 * The command line's entry: it runs the build that `npm install` made (no TypeScript compiled
 * at start), and in a development checkout whose sources are newer than the build it runs the
 * sources instead, with a note on stderr.
 */
import { spawnSync } from 'node:child_process';
import { copyFileSync, mkdirSync, mkdtempSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';

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

  it('falls back to the sources, and says so, when the build is older than they are', () => {
    // a checkout of its own: the real sources and libraries, a build stamped as old
    const repo = resolve('.');
    const dir = mkdtempSync(join(tmpdir(), 'furrow-stale-'));
    for (const d of ['src', 'cells', 'scripts', 'node_modules']) symlinkSync(join(repo, d), join(dir, d));
    mkdirSync(join(dir, 'bin'));
    copyFileSync(join(repo, 'bin', 'furrow.js'), join(dir, 'bin', 'furrow.js'));
    writeFileSync(join(dir, 'package.json'), '{"type": "module"}\n');
    mkdirSync(join(dir, '.git'));
    mkdirSync(join(dir, 'build', 'cli'), { recursive: true });
    copyFileSync(join(repo, 'build', 'cli', 'main.mjs'), join(dir, 'build', 'cli', 'main.mjs'));
    writeFileSync(join(dir, 'build', 'cli', 'stamp.json'), '{"newestSource": 0}\n');
    writeFileSync(join(dir, 'one.furrow'), ONE_CELL);
    const r = spawnSync(process.execPath, [join(dir, 'bin', 'furrow.js'), 'run', join(dir, 'one.furrow'), '--json'], { encoding: 'utf8' });
    expect(r.stderr).toMatch(/^furrow: running from the TypeScript sources: the sources changed since the command line was built/);
    expect(r.status).toBe(0);
    expect(JSON.parse(r.stdout).cells[0].value).toBe(2);
  }, 60_000);
});
