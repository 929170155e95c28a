#!/usr/bin/env node
// The command line's entry: loads the TypeScript sources through tsx, so a fresh clone needs
// no build step before `npx furrow run FILE`.
import { register } from 'tsx/esm/api';

register();
const { main } = await import('../src/cli/main.ts');
const code = await main(process.argv.slice(2), {
  out: (s) => process.stdout.write(`${s}\n`),
  err: (s) => process.stderr.write(`${s}\n`),
});
process.exitCode = code;
