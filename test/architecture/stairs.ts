/**
 * The stairs of the house, read from the imports. Each source file's imports are read as
 * text (static `import`/`export ... from`, side-effect `import '...'`, dynamic `import('...')`)
 * and resolved to a path from the repository root; every rule below names a set of files and
 * the imports they may not have. The rules are those of DEVELOPERS.md ("The shape of the
 * code"): the words users read (src/messages) are the bottom step, the numeric code and the
 * language sit just above them and import nothing higher,
 * the graph is handed its cell kinds, the engine never reaches the screen, and the command
 * line never reaches a view.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { dirname, join, normalize, relative } from 'node:path';

/** One import of one file: `to` is a repository path for a relative import, else the package name. */
export interface ImportArrow {
  readonly from: string;
  readonly to: string;
  readonly line: number;
}

/** A rule: files it covers, and what they may not import. */
export interface StairRule {
  readonly says: string;
  readonly covers: (file: string) => boolean;
  readonly forbids: (target: string) => boolean;
}

const under = (...folders: string[]) => (p: string): boolean => folders.some((f) => p === f || p.startsWith(`${f}/`));
const isPackage = (...names: string[]) => (p: string): boolean =>
  !p.includes('/') || p.startsWith('@')
    ? names.some((n) => p === n || p.startsWith(`${n}/`))
    : false;

/**
 * The engine half of a cell kind: `cells/kinds.ts` and each kind's `kind.ts` and `model*.ts`. Everything
 * else under cells/ is the view half (its lit element and the helpers only it uses).
 */
const isCellModel = (p: string): boolean => p === 'cells/kinds.ts' || /^cells\/[^/]+\/(model[^/]*|kind)\.ts$/.test(p);
const isCellView = (p: string): boolean => p.startsWith('cells/') && !isCellModel(p);

/** Engine code: runs unchanged in Node, in the page and in a worker. */
const isEngine = (p: string): boolean =>
  under('src/doc', 'src/lang', 'src/graph', 'src/functions', 'src/stats', 'src/charts')(p) || isCellModel(p);

/** Packages that need a screen. */
const SCREEN_PACKAGES = isPackage('lit', '@codemirror', '@lezer', 'vega-embed', 'dompurify', 'marked');

/** Folders above the language in the stairs. */
const ABOVE_LANG = under('src/functions', 'src/graph', 'src/doc', 'src/charts', 'src/cli', 'src/app', 'src/views', 'cells');

export const STAIR_RULES: readonly StairRule[] = [
  {
    says: 'the digits policy (src/format) imports nothing of the project: every floor uses it',
    covers: under('src/format'),
    forbids: (t) => t.startsWith('src/') || t.startsWith('cells/') ? !under('src/format')(t) : !t.startsWith('.'),
  },
  {
    says: 'the words users read (src/messages) are the bottom step but for the digits policy they write numbers with',
    covers: under('src/messages'),
    forbids: (t) => t.startsWith('src/') || t.startsWith('cells/') ? !under('src/messages', 'src/format')(t) : false,
  },
  {
    says: 'numeric code (src/stats) imports nothing above it but the words users read and the digits policy',
    covers: under('src/stats'),
    forbids: (t) => t.startsWith('src/') || t.startsWith('cells/') ? !under('src/stats', 'src/messages', 'src/format')(t) : false,
  },
  {
    says: 'the language (src/lang) imports nothing above it',
    covers: under('src/lang'),
    forbids: ABOVE_LANG,
  },
  {
    says: 'the graph (src/graph) is handed its cell kinds and imports none',
    covers: under('src/graph'),
    forbids: under('cells', 'src/functions', 'src/cli', 'src/app', 'src/views'),
  },
  {
    says: 'the document format (src/doc) switches on no cell kind and sits below the graph',
    covers: under('src/doc'),
    forbids: under('cells', 'src/graph', 'src/functions', 'src/charts', 'src/cli', 'src/app', 'src/views'),
  },
  {
    says: 'the engine imports no view, no screen package and nothing of the page',
    covers: isEngine,
    forbids: (t) => SCREEN_PACKAGES(t) || under('src/app', 'src/views', 'src/cli')(t) || isCellView(t),
  },
  {
    says: 'the command line imports no view',
    covers: under('src/cli'),
    forbids: (t) => SCREEN_PACKAGES(t) || under('src/app', 'src/views')(t) || isCellView(t),
  },
  {
    says: 'shared view pieces (src/views) import neither the shell nor a cell kind',
    covers: under('src/views'),
    forbids: under('src/app', 'cells', 'src/cli'),
  },
  {
    says: 'cell kinds do not import the shell',
    covers: under('cells'),
    forbids: under('src/app', 'src/cli'),
  },
];

const IMPORT_FORMS = [
  /\bimport\s+(?:type\s+)?[^'";]*?\sfrom\s*'([^']+)'/g,
  /\bexport\s+(?:type\s+)?[^'";]*?\sfrom\s*'([^']+)'/g,
  /\bimport\s*'([^']+)'/g,
  /\bimport\(\s*'([^']+)'\s*\)/g,
];

/** Drops comments, so a path named in a comment is not read as an import. */
function withoutComments(text: string): string {
  return text.replace(/\/\*[\s\S]*?\*\//g, (c) => c.replace(/[^\n]/g, ' ')).replace(/(^|[^:'"`])\/\/[^\n]*/g, '$1');
}

/** The imports of one file's text, resolved against its repository path. */
export function readImports(file: string, text: string): ImportArrow[] {
  const clean = withoutComments(text);
  const out: ImportArrow[] = [];
  for (const form of IMPORT_FORMS) {
    for (const m of clean.matchAll(form)) {
      const spec = m[1]!;
      const line = clean.slice(0, m.index).split('\n').length;
      const to = spec.startsWith('.') ? normalize(join(dirname(file), spec)).replace(/\\/g, '/') : spec;
      out.push({ from: file, to, line });
    }
  }
  return out;
}

/** Every arrow that breaks a rule, in words. */
export function brokenStairs(arrows: readonly ImportArrow[], rules: readonly StairRule[] = STAIR_RULES): string[] {
  const out: string[] = [];
  for (const a of arrows) {
    for (const r of rules) {
      if (r.covers(a.from) && r.forbids(a.to)) out.push(`${a.from}:${a.line} imports ${a.to}: ${r.says}`);
    }
  }
  return out;
}

/** The TypeScript files under the given folders, as repository paths. */
export function sourceFiles(root: string, folders: readonly string[]): string[] {
  const out: string[] = [];
  const walk = (dir: string): void => {
    for (const entry of readdirSync(dir, { withFileTypes: true })) {
      const p = join(dir, entry.name);
      if (entry.isDirectory()) walk(p);
      else if (entry.name.endsWith('.ts')) out.push(relative(root, p).replace(/\\/g, '/'));
    }
  };
  for (const f of folders) walk(join(root, f));
  return out.sort();
}

/** Every import of every product file. */
export function productArrows(root: string): ImportArrow[] {
  return sourceFiles(root, ['src', 'cells']).flatMap((f) => readImports(f, readFileSync(join(root, f), 'utf8')));
}

/** Globals that exist only with a screen. */
const SCREEN_GLOBALS = /(?<![.\w$])(window|customElements|HTMLElement|localStorage|sessionStorage|indexedDB|navigator|requestAnimationFrame)\b|(?<![.\w$])document\s*\.\s*(createElement|querySelector|getElementById|body|head)\b/g;

/** Where engine code reaches for a screen-only global, in words. */
export function screenGlobals(file: string, text: string): string[] {
  if (!isEngine(file)) return [];
  const clean = withoutComments(text).replace(/'(?:[^'\\\n]|\\.)*'|"(?:[^"\\\n]|\\.)*"|`(?:[^`\\]|\\.)*`/g, "''");
  return [...clean.matchAll(SCREEN_GLOBALS)].map((m) => `${file}:${clean.slice(0, m.index).split('\n').length} uses ${m[0]}`);
}

/** Every screen-only global used by engine code. */
export function productScreenGlobals(root: string): string[] {
  return sourceFiles(root, ['src', 'cells']).flatMap((f) => screenGlobals(f, readFileSync(join(root, f), 'utf8')));
}
