/**
 * The command line's entry: it runs the build that `npm install` made (no TypeScript compiled
 * at start), and in a development checkout whose sources are newer than the build it runs the
 * sources instead, with a note on stderr.
 */
import { spawnSync } from 'node:child_process';
import { copyFileSync, cpSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
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

  it('a run loads none of the drawing libraries: they are imported only by the report chunk', () => {
    // the modules a run loads: main.mjs and the chunks it imports statically, transitively
    const seen = new Set<string>();
    const visit = (file: string): void => {
      if (seen.has(file)) return;
      seen.add(file);
      const text = readFileSync(file, 'utf8');
      for (const m of text.matchAll(/^import\s[^;]*?from\s*"([^"]+)"/gm)) {
        const target = m[1]!;
        if (target.startsWith('.')) visit(resolve(dirname(file), target));
        else expect(target, `${file} imports ${target} at start`).not.toMatch(/^(vega|vega-lite|vega-interpreter|vega-embed|lit|dompurify)$/);
      }
    };
    visit(resolve('build/cli/main.mjs'));
    expect(seen.size).toBeGreaterThan(1);
    // and the report still has them, in a chunk of its own loaded on demand
    const chunks = readdirSync(resolve('build/cli/chunks')).filter((f) => f.endsWith('.mjs'));
    const drawing = chunks.filter((f) => /from\s*"vega-lite"/.test(readFileSync(resolve('build/cli/chunks', f), 'utf8')));
    expect(drawing.length).toBe(1);
    expect(seen.has(resolve('build/cli/chunks', drawing[0]!))).toBe(false);
  });

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
    cpSync(join(repo, 'build', 'cli'), join(dir, 'build', 'cli'), { recursive: true });
    writeFileSync(join(dir, 'build', 'cli', 'stamp.json'), '{"newestSource": 0}\n');
    writeFileSync(join(dir, 'one.furrow'), ONE_CELL);
    const r = spawnSync(process.execPath, [join(dir, 'bin', 'furrow.js'), 'run', join(dir, 'one.furrow'), '--json'], { encoding: 'utf8' });
    expect(r.stderr).toMatch(/^furrow: running from the TypeScript sources: the sources changed since the command line was built/);
    expect(r.status).toBe(0);
    expect(JSON.parse(r.stdout).cells[0].value).toBe(2);
  }, 60_000);
});
