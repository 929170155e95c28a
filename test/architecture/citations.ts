/**
 * Citations of the project's own documents: every "docs/NAME.md section N" written in the
 * code, the tests, the scripts and the guides must point at a file of docs/ that has a
 * heading "## N. ...". A citation without a section needs only the file. Citations of the
 * documents by their bare names or from outside the repository ("language.md section 5",
 * "../shared/...") are refused, so a newcomer can follow every one of them in a fresh clone.
 */
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join, relative } from 'node:path';

/** One citation found in a file. */
export interface Citation {
  readonly file: string;
  readonly line: number;
  /** The cited document, as a repository path ("docs/language.md"). */
  readonly doc: string;
  /** The section numbers cited; empty when the whole document is cited. */
  readonly sections: readonly number[];
  readonly text: string;
}

/** "docs/x.md", optionally followed by "section 5", "sections 3 and 4", "sections 3, 6", "sections 3 to 6". */
const CITATION = /docs\/([a-z0-9-]+\.md)(?:,?\s+(sections?)\s+(\d+(?:\s*(?:,|and|to)\s*\d+)*))?/g;
/** Our documents named without their folder, or from outside the repository. */
const STRAY = /(?<![\w./-])(?:language|references|libraries|design|style)\.md\b|\.\.\/shared\//g;

/** The section numbers of a list such as "3, 6", "3 and 4" or "3 to 6". */
export function sectionNumbers(list: string): number[] {
  const out: number[] = [];
  for (const part of list.split(/\s*(?:,|and)\s*/)) {
    const range = /^(\d+)\s*to\s*(\d+)$/.exec(part.trim());
    if (range !== null) {
      for (let n = Number(range[1]); n <= Number(range[2]); n++) out.push(n);
    } else if (part.trim() !== '') out.push(Number(part.trim()));
  }
  return out;
}

/** Every citation of a docs/ file in one file's text. */
export function citationsIn(file: string, text: string): Citation[] {
  const out: Citation[] = [];
  for (const m of text.matchAll(CITATION)) {
    const line = text.slice(0, m.index).split('\n').length;
    out.push({ file, line, doc: `docs/${m[1]!}`, sections: m[3] === undefined ? [] : sectionNumbers(m[3]), text: m[0] });
  }
  return out;
}

/** Every naming of our documents that a reader of the repository alone could not follow. */
export function strayCitations(file: string, text: string): string[] {
  return [...text.matchAll(STRAY)].map((m) => `${file}:${text.slice(0, m.index).split('\n').length}: "${m[0]}" (cite docs/NAME.md section N)`);
}

/** The numbered sections of a document: the N of each "## N. heading". */
export function sectionsOf(markdown: string): Set<number> {
  return new Set([...markdown.matchAll(/^##\s+(\d+)\.\s/gm)].map((m) => Number(m[1])));
}

/** What is wrong with each citation, in words (empty when every one holds). */
export function brokenCitations(citations: readonly Citation[], readDoc: (path: string) => string | null): string[] {
  const out: string[] = [];
  const cache = new Map<string, Set<number> | null>();
  for (const c of citations) {
    if (!cache.has(c.doc)) {
      const text = readDoc(c.doc);
      cache.set(c.doc, text === null ? null : sectionsOf(text));
    }
    const sections = cache.get(c.doc)!;
    if (sections === null) {
      out.push(`${c.file}:${c.line}: "${c.text}" cites ${c.doc}, which does not exist`);
      continue;
    }
    for (const n of c.sections) {
      if (!sections.has(n)) out.push(`${c.file}:${c.line}: "${c.text}" cites section ${n}, which ${c.doc} does not have`);
    }
  }
  return out;
}

const TEXT_FILE = /\.(ts|mjs|js|py|md|html|css|furrow)$/;

/** The repository paths of the text files that may cite the documents. */
export function citingFiles(root: string): string[] {
  const out: string[] = [];
  const walk = (dir: string): void => {
    for (const entry of readdirSync(dir, { withFileTypes: true })) {
      if (entry.name === 'node_modules' || entry.name.startsWith('.')) continue;
      const p = join(dir, entry.name);
      if (entry.isDirectory()) walk(p);
      else if (TEXT_FILE.test(entry.name)) out.push(relative(root, p).replace(/\\/g, '/'));
    }
  };
  for (const folder of ['src', 'cells', 'test', 'scripts', 'docs', 'samples']) if (existsSync(join(root, folder))) walk(join(root, folder));
  for (const guide of ['DEVELOPERS.md', 'README.md']) if (existsSync(join(root, guide))) out.push(guide);
  return out.sort();
}

/** Reads a repository file, or null when it is not there. */
export function readRepositoryFile(root: string, path: string): string | null {
  const full = join(root, path);
  return existsSync(full) ? readFileSync(full, 'utf8') : null;
}
