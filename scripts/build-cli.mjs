// Builds the command line into plain JavaScript once (npm install runs it as `prepare`), so
// that `furrow` starts without compiling TypeScript. CommonJS, split into chunks: what a run
// needs at start (build/cli/main.cjs and the chunks it requires), and chunks loaded when
// asked for (the built-ins, the commands beyond `run`, Parquet, the report). CommonJS
// because Node loads it with less ceremony than ES modules: about 20 ms less at every start
// on this project's machine (README, "Measured performance"). The drawing libraries, which
// only `furrow report` loads, stay in node_modules and are imported when a chart is drawn.
// A stamp beside the bundle records the newest source it was built from, so bin/furrow.js
// can tell a stale build in a development checkout.
import { build as bundle } from 'rolldown';
import { execFileSync } from 'node:child_process';
import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { newestSource } from './sources.cjs';

const OUT = 'build/cli';
const CHUNKS = join(OUT, 'chunks');

const started = Date.now();
rmSync(OUT, { recursive: true, force: true });
mkdirSync(OUT, { recursive: true });
const newest = newestSource('.');
await bundle({
  input: { main: 'src/cli/main.ts' },
  platform: 'node',
  external: [/^node:/, 'vega', 'vega-lite', 'vega-interpreter', 'vega-embed', 'lit', 'dompurify'],
  logLevel: 'warn',
  output: {
    dir: OUT,
    format: 'cjs',
    entryFileNames: '[name].cjs',
    chunkFileNames: 'chunks/[name]-[hash].cjs',
    // the drawing libraries are ES modules: imported, not required
    dynamicImportInCjs: true,
    sourcemap: true,
    // the sources' comments are in the source maps: not compiled at every start
    comments: false,
    minify: true,
  },
});
/** One file of its own, bundled with the libraries it needs. */
const oneFile = (input, file, format) =>
  bundle({ input, platform: 'node', logLevel: 'warn', output: { file, format, comments: false, minify: true, codeSplitting: false } });
// the helper thread of `run --json` (src/cli/column-text-helper.ts): a file of its own, so that
// it starts without loading the engine
await oneFile('src/cli/column-text-worker.ts', join(OUT, 'column-text-worker.mjs'), 'esm');
// convert's unit tables (the unit part of mathjs), beside the chunk that requires them and
// loaded only at a document's first conversion (src/functions/units.ts): most runs convert
// nothing
await oneFile('src/functions/unit-library.ts', join(CHUNKS, 'unit-library.cjs'), 'cjs');
// V8's code cache of the chunks a run compiles (bin/code-cache.js), made by running the
// build over the samples in a process of its own; without it the command line works as well,
// only starts a little slower
try {
  execFileSync(process.execPath, ['scripts/make-code-cache.cjs'], { stdio: ['ignore', 'ignore', 'inherit'] });
} catch {
  // whatever stopped it, the build stands without a cache (or with part of one: a cache is
  // used only for the very text it was made from)
  console.warn('the command line\'s code cache was not made: it starts a little slower without it');
}
writeFileSync(join(OUT, 'stamp.json'), `${JSON.stringify({ newestSource: newest, builtAt: Date.now() })}\n`);
console.log(`built the command line into ${OUT}/main.cjs in ${Date.now() - started} ms`);
