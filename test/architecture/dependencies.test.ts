// Every runtime dependency is one the product imports; a library only tests use belongs in
// devDependencies, so that installing Furrow brings nothing it does not run.
import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';

const PRODUCT = ['src', 'cells', 'bin', 'scripts', 'index.html', 'vite.config.ts'];

describe('dependencies', () => {
  it('every package in dependencies is imported by the product', () => {
    const pkg = JSON.parse(readFileSync('package.json', 'utf8')) as { dependencies: Record<string, string> };
    const files = execFileSync('git', ['ls-files', ...PRODUCT], { encoding: 'utf8' })
      .split('\n')
      .filter((f) => /\.(ts|mjs|js|html)$/.test(f));
    const text = files.map((f) => readFileSync(f, 'utf8')).join('\n');
    const unused = Object.keys(pkg.dependencies).filter((name) => {
      const quoted = name.replace(/[.*+?^${}()|[\]\\/]/g, '\\$&');
      return !new RegExp(`(from\\s*|import\\s*\\(\\s*|import\\s+)['"]${quoted}(/[^'"]*)?['"]`).test(text);
    });
    expect(Object.keys(pkg.dependencies).length).toBeGreaterThan(10);
    expect(unused).toEqual([]);
  });
});
