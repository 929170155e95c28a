#!/usr/bin/env node
// The command line's entry. `npm install` builds the command line into plain JavaScript
// (scripts/build-cli.mjs, run as `prepare`), and this runs that build, so `furrow` starts
// without compiling anything. In a development checkout whose sources changed since the
// build, it runs the TypeScript sources through tsx instead and says so on stderr.
// CommonJS (bin/package.json), as the build is: no ES module loader at start.
'use strict';
const { existsSync, readFileSync } = require('node:fs');
const { join } = require('node:path');

// `furrow run x.furrow | head` closes the pipe early: end quietly, as command-line tools do
for (const stream of [process.stdout, process.stderr]) {
  stream.on('error', (err) => {
    if (err.code === 'EPIPE') process.exit(process.exitCode ?? 0);
    throw err;
  });
}

const root = join(__dirname, '..');
const built = join(root, 'build', 'cli', 'main.cjs');

/** Why the build cannot be used, or null when it can. */
function staleBuild() {
  if (!existsSync(built)) return 'the command line has not been built (npm install builds it)';
  // only a development checkout can hold sources newer than its build
  if (!existsSync(join(root, '.git'))) return null;
  try {
    const stamp = JSON.parse(readFileSync(join(root, 'build', 'cli', 'stamp.json'), 'utf8'));
    const { newestSource } = require('../scripts/sources.cjs');
    return newestSource(root) > stamp.newestSource ? 'the sources changed since the command line was built (npm run build:cli rebuilds it)' : null;
  } catch {
    return 'the build has no readable stamp (npm run build:cli rebuilds it)';
  }
}

/** The command line's `main`: the build's, or the sources' through tsx. */
async function commandLine(why) {
  if (why === null) {
    // the build's chunks compiled from V8's code cache, made when it was built (bin/code-cache.js)
    require('./code-cache.js').useCodeCache(join(root, 'build', 'cli'));
    return require(built).main;
  }
  process.stderr.write(`furrow: running from the TypeScript sources: ${why}.\n`);
  const { register } = await import('tsx/esm/api');
  register();
  return (await import('../src/cli/main.ts')).main;
}

async function start() {
  const why = staleBuild();
  const main = await commandLine(why);
  const code = await main(process.argv.slice(2), {
    out: (s) => process.stdout.write(`${s}\n`),
    err: (s) => process.stderr.write(`${s}\n`),
    // `run --json` writes to the stream as it goes, waiting when the pipe is full
    stream: process.stdout,
    // the build's helper thread for turning long number columns into text (--json)
    ...(why === null ? { helperScript: join(root, 'build', 'cli', 'column-text-worker.mjs') } : {}),
  });
  process.exitCode = code;
  // Left alone, Node waits at the end for V8's compile tasks in the background (about 4 ms
  // of a short run here). When nothing waits to be written, the run is over: end now.
  if (process.stdout.writableLength === 0 && process.stderr.writableLength === 0) process.exit(code);
}

start();
