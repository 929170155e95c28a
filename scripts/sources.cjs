// The newest modification time of the command line's TypeScript sources: the build records
// it, and bin/furrow.js compares it to tell a stale build in a development checkout.
// CommonJS, so that bin/furrow.js requires it without starting Node's ES module loader.
'use strict';
const { readdirSync, statSync } = require('node:fs');
const { join } = require('node:path');

const SOURCES = ['src', 'cells'];

/** The newest modification time of the .ts files under src/ and cells/, in milliseconds. */
exports.newestSource = function newestSource(root) {
  let newest = 0;
  const walk = (dir) => {
    for (const e of readdirSync(dir, { withFileTypes: true })) {
      const p = join(dir, e.name);
      if (e.isDirectory()) walk(p);
      else if (e.name.endsWith('.ts')) newest = Math.max(newest, statSync(p).mtimeMs);
    }
  };
  for (const s of SOURCES) walk(join(root, s));
  return newest;
};
