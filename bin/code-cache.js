// The command line's build compiled from V8's code cache: the bytecode of the functions a
// typical run compiles, made once when the command line is built (scripts/build-cli.mjs runs
// `makeCodeCache` over the samples) and read back at every start, so that a run does not
// parse and compile the same 0.3 to 0.6 MB of JavaScript again. About 10 ms of a one-cell
// run and 20 ms of a blocked analysis of 10,000 rows on this project's machine (README,
// "Measured performance"). Node 22 has this built in (module.enableCompileCache); Node 20,
// which Furrow supports, does not.
//
// Only the build's own chunks are compiled this way, and only those without `import()`
// (a script compiled here could not import). V8 checks every cache against the source and
// its own version and flags, and compiles afresh from the source when one does not fit:
// a stale or damaged cache costs time, never a wrong result.
'use strict';
const Module = require('node:module');
const vm = require('node:vm');
const { existsSync, mkdirSync, readFileSync, writeFileSync } = require('node:fs');
const { basename, dirname, join } = require('node:path');

const MAIN = require.main;

/** Compiles `content` as Node's CommonJS loader would, from `cachedData` when given; returns the script. */
function compileChunk(module, content, filename, cachedData) {
  const wrapper = Module.wrapper[0];
  // positions in the file as Node's own loader gives them (the wrapper shares the first line)
  const script = new vm.Script(wrapper + content + Module.wrapper[1], { filename, cachedData, columnOffset: -wrapper.length });
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

/** The cache file of a chunk of the build. */
function cacheFileOf(buildDir, filename) {
  return join(buildDir, 'cache', `${basename(filename)}.cache`);
}

/**
 * From now on, chunks of the build that have a cache are compiled from it. Returns the
 * chunks compiled from their cache so far, and those whose cache V8 refused (and compiled
 * from the source instead), by file name.
 */
function useCodeCache(buildDir) {
  const seen = { used: [], refused: [] };
  if (!existsSync(join(buildDir, 'cache'))) return seen;
  const compile = Module.prototype._compile;
  Module.prototype._compile = function compileFromCache(content, filename) {
    const cacheFile = inBuild(buildDir, filename) ? cacheFileOf(buildDir, filename) : null;
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
  const scripts = new Map();
  const compile = Module.prototype._compile;
  Module.prototype._compile = function compileForCache(content, filename) {
    if (!inBuild(buildDir, filename) || content.includes('import(')) return compile.call(this, content, filename);
    scripts.set(cacheFileOf(buildDir, filename), compileChunk(this, content, filename, undefined));
    return undefined;
  };
  return () => {
    mkdirSync(join(buildDir, 'cache'), { recursive: true });
    for (const [file, script] of scripts) writeFileSync(file, script.createCachedData());
    return [...scripts.keys()];
  };
}

module.exports = { useCodeCache, makeCodeCache };
