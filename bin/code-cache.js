// The command line's build compiled from V8's code cache: the bytecode of the functions a
// typical run compiles, made once when the command line is built (scripts/build-cli.mjs runs
// `makeCodeCache` over the samples) and read back at every start, so that a run does not
// parse and compile the same JavaScript again: a run that loads the built-ins starts about
// 12 ms sooner on this project's machine, a one-cell run about as soon as without it (the
// checks below cost what the cache saves there). Node 22 has this built in
// (module.enableCompileCache); Node 20, which Furrow supports, does not.
//
// What keeps a cache from doing harm:
// - a cache is found by the hash of its chunk's text, so a chunk that changed in any way
//   has no cache (V8 itself checks only the text's length);
// - V8 checks every cache's own checksum (--verify-snapshot-checksum: a damaged cache made
//   Node stop without it), its version and its flags, and compiles from the source when one
//   does not fit. The flag is on only while a cache is made or read: on for good, it made
//   V8 refuse Node's own caches for every module loaded after, and in every thread started
//   after (the --json helper started 35 ms later);
// - the caches of one Node version are kept apart from another's;
// - with source maps asked for (node --enable-source-maps), Node's own loader compiles,
//   so that stacks name the sources;
// - only chunks without `import()` are cached (a script compiled here could not import).
// A cache that is missing or refused costs time, never a result.
'use strict';
const Module = require('node:module');
const vm = require('node:vm');
const v8 = require('node:v8');
const { createHash } = require('node:crypto');
const { existsSync, mkdirSync, readFileSync, writeFileSync } = require('node:fs');
const { basename, dirname, join } = require('node:path');

const MAIN = require.main;

/** Runs `work` with V8 checking the checksums of code caches, and only then (see above). */
function checkingCaches(work) {
  v8.setFlagsFromString('--verify-snapshot-checksum');
  try {
    return work();
  } finally {
    v8.setFlagsFromString('--no-verify-snapshot-checksum');
  }
}

/** Compiles `content` as Node's CommonJS loader would, from `cachedData` when given; returns the script. */
function compileChunk(module, content, filename, cachedData) {
  const wrapper = Module.wrapper[0];
  // positions in the file as Node's own loader gives them (the wrapper shares the first line)
  const script = checkingCaches(() => new vm.Script(wrapper + content + Module.wrapper[1], { filename, cachedData, columnOffset: -wrapper.length }));
  const run = script.runInThisContext({ displayErrors: true });
  const require = (id) => module.require(id);
  require.resolve = (request, options) => Module._resolveFilename(request, module, false, options);
  require.main = MAIN;
  require.cache = Module._cache;
  run.call(module.exports, module.exports, require, module, filename, dirname(filename));
  return script;
}

/** True for a file of the build (main.cjs or a chunk beside it). */
function inBuild(buildDir, filename) {
  const dir = dirname(filename);
  return filename.endsWith('.cjs') && (dir === buildDir || dir === join(buildDir, 'chunks'));
}

/** Where this Node version's caches are kept. */
function cacheDirOf(buildDir) {
  return join(buildDir, 'cache', `${process.version}-${process.arch}`);
}

/** The cache file of a chunk's text: named by the text's hash. */
function cacheFileOf(cacheDir, filename, content) {
  const hash = createHash('sha1').update(content).digest('hex').slice(0, 20);
  return join(cacheDir, `${basename(filename)}.${hash}.cache`);
}

/**
 * From now on, chunks of the build that have a cache are compiled from it. Returns the
 * chunks compiled from their cache so far, and those whose cache V8 refused (and compiled
 * from the source instead), by file name.
 */
function useCodeCache(buildDir) {
  const seen = { used: [], refused: [] };
  const cacheDir = cacheDirOf(buildDir);
  if (process.sourceMapsEnabled || !existsSync(cacheDir)) return seen;
  const compile = Module.prototype._compile;
  Module.prototype._compile = function compileFromCache(content, filename) {
    const cacheFile = inBuild(buildDir, filename) ? cacheFileOf(cacheDir, filename, content) : null;
    if (cacheFile === null || !existsSync(cacheFile)) return compile.call(this, content, filename);
    const script = compileChunk(this, content, filename, readFileSync(cacheFile));
    (script.cachedDataRejected ? seen.refused : seen.used).push(basename(filename));
    return undefined;
  };
  return seen;
}

/**
 * From now on, chunks of the build without `import()` are compiled so that their caches
 * can be written; returns the function that writes them (call it after the runs that
 * should warm them), which returns the files written.
 */
function makeCodeCache(buildDir) {
  const cacheDir = cacheDirOf(buildDir);
  const scripts = new Map();
  const compile = Module.prototype._compile;
  Module.prototype._compile = function compileForCache(content, filename) {
    if (!inBuild(buildDir, filename) || content.includes('import(')) return compile.call(this, content, filename);
    scripts.set(cacheFileOf(cacheDir, filename, content), compileChunk(this, content, filename, undefined));
    return undefined;
  };
  return () => {
    mkdirSync(cacheDir, { recursive: true });
    // made as it will be read: V8 keeps the flags of its making in a cache
    for (const [file, script] of scripts) writeFileSync(file, checkingCaches(() => script.createCachedData()));
    return [...scripts.keys()];
  };
}

module.exports = { useCodeCache, makeCodeCache };
