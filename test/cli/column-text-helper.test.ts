/**
 * The helper thread of `furrow run --json` (src/cli/column-text-helper.ts), built as
 * scripts/build-cli.mjs builds it: its text must be the main thread's, byte for byte, and a
 * helper that cannot start or dies must hand its work back rather than lose or reorder it.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { build } from 'rolldown';
import { beforeAll, describe, expect, it } from 'vitest';
import { ColumnTextHelper } from '../../src/cli/column-text-helper.ts';
import { numbersJsonBytes } from '../../src/lang/json.ts';

const dir = mkdtempSync(join(tmpdir(), 'furrow-helper-'));
const script = join(dir, 'column-text-worker.mjs');

beforeAll(async () => {
  await build({ input: 'src/cli/column-text-worker.ts', platform: 'node', logLevel: 'silent', output: { file: script, format: 'esm' } });
});

function column(n: number, seed: number): { values: Float64Array; missing: Uint8Array } {
  const values = new Float64Array(n);
  const missing = new Uint8Array(n);
  let s = seed >>> 0;
  for (let i = 0; i < n; i++) {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
    values[i] = i % 97 === 0 ? NaN : i % 89 === 0 ? -0 : (s / 4294967296 - 0.5) * 10 ** ((i % 13) - 4);
    missing[i] = i % 31 === 0 ? 1 : 0;
  }
  return { values, missing };
}

const text = (b: Uint8Array): string => new TextDecoder().decode(b);

describe('the helper thread', () => {
  it('makes the same text as the main thread, for several requests in flight at once', async () => {
    const helper = new ColumnTextHelper(script);
    try {
      const cols = [column(70_000, 1), column(5, 2), column(0, 3), column(40_000, 4)];
      const answers = await Promise.all(cols.map((c, k) => helper.numbers(c.values, k === 1 ? null : c.missing, k === 0 ? 1234 : 0, c.values.length)));
      cols.forEach((c, k) => {
        expect(text(answers[k]!)).toBe(text(numbersJsonBytes(c.values, k === 1 ? null : c.missing, k === 0 ? 1234 : 0, c.values.length)));
      });
      expect(text(answers[0]!)).toContain('"NaN"');
      expect(text(answers[0]!)).toContain('null');
      // made on a thread of its own, not by the main thread standing in
      expect(helper.threaded).toBe(true);
    } finally {
      helper.close();
    }
  });

  it('hands the work back when the helper cannot start', async () => {
    const helper = new ColumnTextHelper(join(dir, 'no-such-worker.mjs'));
    const c = column(1000, 5);
    expect(text(await helper.numbers(c.values, c.missing, 10, 990))).toBe(text(numbersJsonBytes(c.values, c.missing, 10, 990)));
    helper.close();
  });

  it('hands the work back when the helper dies while it works', async () => {
    const dying = join(dir, 'dying-worker.mjs');
    writeFileSync(dying, "import { parentPort } from 'node:worker_threads';\nparentPort.on('message', () => process.exit(3));\n");
    const helper = new ColumnTextHelper(dying);
    const c = column(3000, 6);
    const [a, b] = await Promise.all([helper.numbers(c.values, c.missing, 0, 1500), helper.numbers(c.values, null, 1500, 3000)]);
    expect(text(a!)).toBe(text(numbersJsonBytes(c.values, c.missing, 0, 1500)));
    expect(text(b!)).toBe(text(numbersJsonBytes(c.values, null, 1500, 3000)));
    helper.close();
  });

  it('keeps the process alive while an answer is awaited, and lets it end afterwards', async () => {
    // a process whose only pending work is the helper's answer: it must wait for it, then end
    const runner = join(dir, 'runner.mjs');
    const entry = join(dir, 'runner-entry.ts');
    writeFileSync(
      entry,
      [
        `import { ColumnTextHelper } from ${JSON.stringify(join(process.cwd(), 'src/cli/column-text-helper.ts'))};`,
        `const helper = new ColumnTextHelper(${JSON.stringify(script)});`,
        `const values = new Float64Array(200000).map((_, i) => i / 7);`,
        `helper.numbers(values, null, 0, values.length).then((b) => process.stdout.write(String(b.length)));`,
      ].join('\n'),
    );
    await build({ input: entry, platform: 'node', logLevel: 'silent', output: { file: runner, format: 'esm' } });
    const r = spawnSync(process.execPath, [runner], { encoding: 'utf8', timeout: 20_000 });
    expect(r.status, r.stderr).toBe(0);
    expect(Number(r.stdout)).toBe(numbersJsonBytes(new Float64Array(200000).map((_, i) => i / 7), null).length);
  });
});
