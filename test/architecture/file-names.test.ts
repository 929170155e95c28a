// One file-naming style for code: lower-case words joined by hyphens (`rank-sum.ts`,
// `grid-layout.ts`), with dots only before the kinds (`.test.ts`, `.d.ts`). Data fixtures keep
// the names of the published files they copy (NIST's `SmLs01.dat`) or of the built-in they
// check, so they are not covered.
import { execFileSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';

const CODE_FOLDERS = ['src', 'cells', 'test', 'scripts', 'bin'];
const STYLE = /^[a-z0-9]+(-[a-z0-9]+)*(\.[a-z0-9]+)*$/;

function codeFiles(): string[] {
  const out = execFileSync('git', ['ls-files', ...CODE_FOLDERS], { encoding: 'utf8' });
  return out
    .split('\n')
    .filter((p) => /\.(ts|mjs|js)$/.test(p))
    .filter((p) => !p.startsWith('test/reference/fixtures/'));
}

describe('file names', () => {
  it('every code file and folder is named in lower-case words joined by hyphens', () => {
    const files = codeFiles();
    expect(files.length).toBeGreaterThan(100);
    const off = files.filter((p) => p.split('/').some((part) => !STYLE.test(part)));
    expect(off).toEqual([]);
  });
});
