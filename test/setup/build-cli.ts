/**
 * Before the tests: build the command line (as `npm install` does), so that the tests that
 * run `bin/furrow.js` test the built JavaScript and not a stale copy of it.
 */
import { execFileSync } from 'node:child_process';

export default function setup(): void {
  execFileSync(process.execPath, ['scripts/build-cli.mjs'], { stdio: 'ignore' });
}
