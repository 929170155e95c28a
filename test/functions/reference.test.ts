import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { BUILTINS } from '../../src/functions/index.ts';
import { referenceMarkdown } from '../../src/functions/reference.ts';
import { signature } from '../../src/lang/builtins.ts';

describe('the built-ins registry', () => {
  it('is what the README documents (run `npm run reference` after changing a built-in)', () => {
    const readme = readFileSync('README.md', 'utf8');
    expect(readme).toContain(referenceMarkdown());
  });
  it('gives every built-in a doc, an example and documented parameters', () => {
    for (const b of BUILTINS.all()) {
      expect(b.doc.length, b.name).toBeGreaterThan(30);
      expect(b.example.startsWith(`${b.name}(`), b.name).toBe(true);
      for (const p of b.params) expect(p.doc.length, `${b.name}.${p.name}`).toBeGreaterThan(5);
      expect(/^[a-z][a-z0-9_]*$/.test(b.name), b.name).toBe(true);
    }
  });
  it('prints signatures with defaults', () => {
    expect(signature(BUILTINS.get('round')!)).toBe('round(x, digits: 0)');
    expect(signature(BUILTINS.get('two_sample')!)).toBe('two_sample(y, group, level: 0.95, equal_variance: true)');
  });
});
