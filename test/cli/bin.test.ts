/**
 * The command line's entry: it runs the build that `npm install` made (no TypeScript compiled
 * at start), and in a development checkout whose sources are newer than the build it runs the
 * sources instead, with a note on stderr.
 */
import { spawnSync } from 'node:child_process';
import { copyFileSync, cpSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, symlinkSync, writeFileSync } from 'node:fs';
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

  it('compiles the build from the code cache made with it, and from the source when a cache is refused', () => {
    const dir = mkdtempSync(join(tmpdir(), 'furrow-cache-'));
    writeFileSync(join(dir, 'call.furrow'), 'furrow 1\n--- table t\nx,y\n1,2.5\n2,3.5\n3,4\n\n--- formula\nm = mean(t.y)\n');
    // a run in a process of its own, reporting which chunks came from the cache
    const runWith = (build: string): { out: string; seen: { used: string[]; refused: string[] } } => {
      const script = `const seen = require(${JSON.stringify(resolve('bin/code-cache.js'))}).useCodeCache(${JSON.stringify(build)});
const out = [];
Promise.resolve(require(${JSON.stringify(join(build, 'main.cjs'))}).main(['run', ${JSON.stringify(join(dir, 'call.furrow'))}, '--json'], { out: (s) => out.push(s), err: (s) => out.push(s) }))
  .then(() => process.stdout.write(JSON.stringify({ out: out.join('\\n'), seen })));`;
      const r = spawnSync(process.execPath, ['-e', script], { encoding: 'utf8' });
      expect(r.stderr).toBe('');
      return JSON.parse(r.stdout) as { out: string; seen: { used: string[]; refused: string[] } };
    };
    const good = runWith(resolve('build/cli'));
    expect(good.seen.refused).toEqual([]);
    expect(good.seen.used).toContain('main.cjs');
    expect(good.seen.used.some((f) => f.startsWith('functions-'))).toBe(true);
    expect(JSON.parse(good.out).cells[1].value).toBe(10 / 3);
    // the same build with every cache damaged, in its header or past it: V8 refuses them
    // all (it checks each cache's checksum), and the output is the same
    const copy = join(dir, 'build');
    cpSync(resolve('build/cli'), copy, { recursive: true });
    const caches = readdirSync(join(copy, 'cache'), { recursive: true, withFileTypes: true }).filter((e) => e.isFile());
    expect(caches.length).toBe(good.seen.used.length);
    caches.forEach((e, k) => {
      const file = join(e.parentPath, e.name);
      const bytes = readFileSync(file);
      if (k % 2 === 0) bytes.fill(7, 0, 64);
      else for (let i = 200; i < Math.min(bytes.length, 400); i++) bytes[i]! ^= 0x5a;
      writeFileSync(file, bytes);
    });
    const damaged = runWith(copy);
    expect(damaged.seen.used).toEqual([]);
    expect(damaged.seen.refused.sort()).toEqual(good.seen.used.sort());
    expect(damaged.out).toBe(good.out);
    // a chunk changed after its cache was made (as long as before, as V8's own check sees it)
    // finds no cache and runs as it now is
    const again = join(dir, 'build-changed');
    cpSync(resolve('build/cli'), again, { recursive: true });
    const chunk = readdirSync(join(again, 'chunks')).find((f) => f.startsWith('main-') && f.endsWith('.cjs'))!;
    const text = readFileSync(join(again, 'chunks', chunk), 'utf8');
    expect(text).toContain('all evaluated.');
    writeFileSync(join(again, 'chunks', chunk), text.replace('all evaluated.', 'ALL EVALUATED'));
    const changed = runWith(again);
    expect(changed.seen.used).not.toContain(chunk);
    expect(changed.seen.refused).toEqual([]);
    // with source maps asked for, Node's own loader compiles, so stacks name the sources
    const loadWith = (flags: string[]): { used: string[]; refused: string[] } => {
      const script = `const seen = require(${JSON.stringify(resolve('bin/code-cache.js'))}).useCodeCache(${JSON.stringify(resolve('build/cli'))});
require(${JSON.stringify(resolve('build/cli/main.cjs'))});
process.stdout.write(JSON.stringify(seen));`;
      return JSON.parse(spawnSync(process.execPath, [...flags, '-e', script], { encoding: 'utf8' }).stdout) as { used: string[]; refused: string[] };
    };
    expect(loadWith([]).used).toContain('main.cjs');
    expect(loadWith(['--enable-source-maps'])).toEqual({ used: [], refused: [] });
    // V8 checks caches' checksums only while it reads ours: Node's own modules loaded after
    // (here the threads module, as the --json helper needs) keep their caches
    const after = spawnSync(
      process.execPath,
      ['-e', `require(${JSON.stringify(resolve('bin/code-cache.js'))}).useCodeCache(${JSON.stringify(resolve('build/cli'))}); require(${JSON.stringify(resolve('build/cli/main.cjs'))}); require('node:worker_threads'); require('node:readline');`],
      { encoding: 'utf8', env: { ...process.env, NODE_DEBUG_NATIVE: 'CODE_CACHE' } },
    );
    expect(after.status).toBe(0);
    expect(after.stderr).toContain('Code cache of');
    expect(after.stderr).not.toMatch(/is rejected/);
  }, 60_000);

  it('falls back to the sources, and says so, when the build is older than they are', () => {
    // a checkout of its own: the real sources and libraries, a build stamped as old
    const repo = resolve('.');
    const dir = mkdtempSync(join(tmpdir(), 'furrow-stale-'));
    for (const d of ['src', 'cells', 'scripts', 'node_modules']) symlinkSync(join(repo, d), join(dir, d));
    mkdirSync(join(dir, 'bin'));
    copyFileSync(join(repo, 'bin', 'furrow.js'), join(dir, 'bin', 'furrow.js'));
    copyFileSync(join(repo, 'bin', 'package.json'), join(dir, 'bin', 'package.json'));
    copyFileSync(join(repo, 'bin', 'code-cache.js'), join(dir, 'bin', 'code-cache.js'));
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
