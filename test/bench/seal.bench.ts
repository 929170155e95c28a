/**
 * Sealing, verifying and reporting against running: the largest sample, and a document with
 * a 100,000-row table and a blocked fit on it. The hand-off should cost well under a second
 * more than `furrow run`. Prints figures; never fails a build.
 */
import { copyFileSync, mkdtempSync, readdirSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, bench, describe } from 'vitest';
import { loadDocument, main } from '../../src/cli/main.ts';
import { sealFile } from '../../src/cli/seal.ts';
import { verifyFile } from '../../src/cli/verify.ts';

const dir = mkdtempSync(join(tmpdir(), 'furrow-bench-seal-'));
const largest = readdirSync('samples')
  .filter((f) => f.endsWith('.furrow'))
  .sort((a, b) => statSync(join('samples', b)).size - statSync(join('samples', a)).size)[0]!;
copyFileSync(join('samples', largest), join(dir, largest));

const rows: string[] = [];
for (let b = 1; b <= 10_000; b++) for (let t = 1; t <= 10; t++) rows.push(`${b},T${t},${(50 + t * 0.7 + (b % 13) * 0.31 + ((b * 7 + t * 3) % 11) * 0.05).toFixed(2)}`);
writeFileSync(
  join(dir, 'big.furrow'),
  `furrow 1\ntitle: a hundred thousand plots\n\n--- table plots\nblock,variety,yield\n${rows.join('\n')}\n\n--- formula\nfit = blocked(plots.yield, plots.variety, plots.block)\n\n--- formula\nbetter = claim(fit.table.p[1] < 0.05, "varieties differ")\n`,
);

const quiet = { out: () => {}, err: () => {} };
const figures: string[] = [];

function time(f: () => unknown, times = 3): number {
  let best = Infinity;
  for (let i = 0; i < times; i++) {
    const t0 = performance.now();
    f();
    best = Math.min(best, performance.now() - t0);
  }
  return best;
}

for (const name of [largest, 'big.furrow']) {
  const path = join(dir, name);
  describe(`hand-off of ${name}`, () => {
    const run = time(() => main(['run', path], quiet));
    const load = time(() => loadDocument(path));
    const seal = time(() => sealFile(path));
    const verify = time(() => verifyFile(path));
    figures.push(
      `${name}: run ${run.toFixed(0)} ms (evaluation alone ${load.toFixed(0)} ms); seal ${seal.toFixed(0)} ms (+${(seal - run).toFixed(0)} ms); verify ${verify.toFixed(0)} ms (+${(verify - run).toFixed(0)} ms)`,
    );
    bench('verify', () => {
      verifyFile(path);
    }, { iterations: 2, time: 0 });
  });
}

afterAll(() => {
  console.log(`\n${figures.join('\n')}\n`);
});
