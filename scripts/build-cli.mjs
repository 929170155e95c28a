// Builds the command line into plain JavaScript once (npm install runs it as `prepare`), so
// that `furrow` starts without compiling TypeScript. One bundle of our own code and the small
// libraries it needs at start (reading hundreds of little CommonJS files cost a third of the
// start-up); the drawing libraries, which only `furrow report` loads, stay in node_modules
// and load when a report is made. A stamp beside the bundle
// records the newest source it was built from, so bin/furrow.js can tell a stale build in a
// development checkout.
import { build } from 'esbuild';
import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { newestSource } from './sources.mjs';

const OUT = 'build/cli';

const started = Date.now();
rmSync(OUT, { recursive: true, force: true });
mkdirSync(OUT, { recursive: true });
const newest = newestSource('.');
await build({
  entryPoints: ['src/cli/main.ts'],
  outdir: OUT,
  outExtension: { '.js': '.mjs' },
  // the report (and the drawing libraries it imports) is a chunk of its own, loaded on demand
  splitting: true,
  chunkNames: 'chunks/[name]-[hash]',
  bundle: true,
  platform: 'node',
  format: 'esm',
  target: 'node20',
  external: ['vega', 'vega-lite', 'vega-interpreter', 'vega-embed', 'lit', 'dompurify'],
  // bundled CommonJS libraries call require() for Node's own modules
  banner: { js: "import { createRequire as furrowRequire } from 'node:module'; const require = furrowRequire(import.meta.url);" },
  sourcemap: true,
  legalComments: 'none',
  logLevel: 'warning',
});
// the helper thread of `run --json` (src/cli/column-text-helper.ts): a file of its own, so that
// it starts without loading the engine
await build({
  entryPoints: ['src/cli/column-text-worker.ts'],
  outfile: join(OUT, 'column-text-worker.mjs'),
  bundle: true,
  platform: 'node',
  format: 'esm',
  target: 'node20',
  legalComments: 'none',
  logLevel: 'warning',
});
// convert's unit tables (the unit part of mathjs), beside the bundle and loaded only at a
// document's first conversion (src/functions/units.ts): most runs convert nothing
await build({
  entryPoints: ['src/functions/unit-library.ts'],
  outfile: join(OUT, 'unit-library.cjs'),
  bundle: true,
  platform: 'node',
  format: 'cjs',
  target: 'node20',
  minify: true,
  legalComments: 'none',
  logLevel: 'warning',
});
writeFileSync(join(OUT, 'stamp.json'), `${JSON.stringify({ newestSource: newest, builtAt: Date.now() })}\n`);
console.log(`built the command line into ${OUT}/main.mjs in ${Date.now() - started} ms`);
