// Makes the command line's code cache (bin/code-cache.js): runs the build over every sample,
// human and --json, in a process of its own, then writes the bytecode V8 compiled for each
// chunk into build/cli/cache. scripts/build-cli.mjs runs it after bundling.
'use strict';
const { readdirSync } = require('node:fs');
const { join, resolve } = require('node:path');
const { makeCodeCache } = require('../bin/code-cache.js');

async function make() {
  const buildDir = resolve('build', 'cli');
  const write = makeCodeCache(buildDir);
  const { main } = require(join(buildDir, 'main.cjs'));
  const quiet = { out: () => {}, err: () => {} };
  for (const name of readdirSync('samples').filter((f) => f.endsWith('.furrow')).sort()) {
    const path = join('samples', name);
    await main(['run', path], quiet);
    await main(['run', path, '--json'], quiet);
  }
  const written = write();
  process.stdout.write(`code cache of ${written.length} chunks\n`);
}

make().catch((err) => {
  process.stderr.write(`the command line's code cache was not made (it starts without one): ${err instanceof Error ? err.message : err}\n`);
});
