/**
 * Every citation of the project's documents leads somewhere: "docs/NAME.md section N" in the
 * code, tests, scripts, samples and guides names a file of docs/ with that numbered section,
 * and no citation names a document by a bare or outside path. The reader is checked on
 * made-up texts first, so a check that could never fail is caught too.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { brokenCitations, citationsIn, citingFiles, readRepositoryFile, sectionNumbers, sectionsOf, strayCitations } from './citations.ts';

const root = fileURLToPath(new URL('../..', import.meta.url));
/** This test and its module spell out wrong citations on purpose. */
const SELF = new Set(['test/architecture/citations.ts', 'test/architecture/citations.test.ts']);

describe('reading citations', () => {
  it('reads a single section, lists, ranges and a whole document', () => {
    const text = [
      '// source: docs/references.md section 4 (statsmodels)',
      ' * the shapes of docs/language.md sections 6 and 9, and',
      ' * docs/references.md sections 3 to 6; docs/references.md sections 3, 6',
      'see docs/libraries.md for the rest',
      '(docs/language.md, section 8)',
    ].join('\n');
    expect(citationsIn('x.ts', text).map((c) => [c.doc, c.sections, c.line])).toEqual([
      ['docs/references.md', [4], 1],
      ['docs/language.md', [6, 9], 2],
      ['docs/references.md', [3, 4, 5, 6], 3],
      ['docs/references.md', [3, 6], 3],
      ['docs/libraries.md', [], 4],
      ['docs/language.md', [8], 5],
    ]);
    expect(sectionNumbers('2, 5 and 7')).toEqual([2, 5, 7]);
  });
  it('finds the numbered sections of a document', () => {
    expect([...sectionsOf('# Title\n\n## 1. One\ntext\n## 2. Two\n### 2.1 not a section\n## Notes\n')]).toEqual([1, 2]);
  });
  it('refuses a missing document and a missing section', () => {
    const docs = new Map([['docs/language.md', '## 1. Documents\n## 2. Formulas\n']]);
    const read = (p: string): string | null => docs.get(p) ?? null;
    expect(brokenCitations(citationsIn('a.ts', 'docs/language.md section 2'), read)).toEqual([]);
    expect(brokenCitations(citationsIn('a.ts', 'docs/language.md section 3'), read)).toHaveLength(1);
    expect(brokenCitations(citationsIn('a.ts', 'docs/language.md sections 1 to 3'), read)).toHaveLength(1);
    expect(brokenCitations(citationsIn('a.ts', 'docs/glossary.md section 1'), read)).toHaveLength(1);
  });
  it('refuses documents named without their folder or from outside the repository', () => {
    expect(strayCitations('a.ts', '// language.md section 5\n// (references.md 4)\n// ../shared/design.md')).toHaveLength(3);
    expect(strayCitations('a.ts', '// docs/language.md section 5; README.md; DEVELOPERS.md')).toEqual([]);
  });
});

describe('the repository', () => {
  const files = citingFiles(root).filter((f) => !SELF.has(f));
  const texts = new Map(files.map((f) => [f, readFileSync(join(root, f), 'utf8')]));

  it('cites only documents and sections that exist', () => {
    const citations = files.flatMap((f) => citationsIn(f, texts.get(f)!));
    // the code cites the language, the reference checks and the library notes many times over
    expect(citations.length).toBeGreaterThan(80);
    expect(new Set(citations.map((c) => c.doc))).toEqual(new Set(['docs/language.md', 'docs/references.md', 'docs/libraries.md']));
    expect(brokenCitations(citations, (p) => readRepositoryFile(root, p))).toEqual([]);
  });
  it('names no document by a path a fresh clone cannot follow', () => {
    expect(files.flatMap((f) => strayCitations(f, texts.get(f)!))).toEqual([]);
  });
});
