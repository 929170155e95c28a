#!/usr/bin/env node
// The command line's entry: loads the TypeScript sources through tsx, so a fresh clone needs
// no build step before `npx furrow run FILE`.
import { register } from 'tsx/esm/api';

register();
// `furrow run x.furrow | head` closes the pipe early: end quietly, as command-line tools do
for (const stream of [process.stdout, process.stderr]) {
  stream.on('error', (err) => {
    if (err.code === 'EPIPE') process.exit(process.exitCode ?? 0);
    throw err;
  });
}
const { main } = await import('../src/cli/main.ts');
const code = main(process.argv.slice(2), {
  out: (s) => process.stdout.write(`${s}\n`),
  err: (s) => process.stderr.write(`${s}\n`),
});
process.exitCode = code;
