/**
 * The help panel's workings, without a DOM: finding built-ins by name or word, grouping them
 * by the registry's categories, and fitting an example to the open document (which names it
 * reads, which of them the document lacks, and a table it can read instead when one has
 * every column the example names).
 */
import type { BuiltinInfo, NameCatalogue } from '../../../cells/view-api.ts';
import type { Expr } from '../../lang/ast.ts';
import { CATEGORIES } from '../../lang/builtins.ts';
import { LangError } from '../../lang/errors.ts';
import { parseStatement } from '../../lang/parser.ts';

/** The categories in the registry's order, each with its built-ins (empty ones left out). */
export function byCategory(list: readonly BuiltinInfo[]): { readonly category: string; readonly builtins: readonly BuiltinInfo[] }[] {
  const order: string[] = [...CATEGORIES];
  for (const b of list) if (!order.includes(b.category)) order.push(b.category);
  return order.map((category) => ({ category, builtins: list.filter((b) => b.category === category) })).filter((g) => g.builtins.length > 0);
}

/** How well a built-in matches one word of a search: higher is better, 0 is no match. */
function wordScore(b: BuiltinInfo, word: string): number {
  const name = b.name.toLowerCase();
  if (name === word) return 100;
  if (name.startsWith(word)) return 60;
  if (name.includes(word)) return 40;
  if (b.category.toLowerCase().includes(word)) return 20;
  if (b.params.some((p) => p.name.toLowerCase().includes(word))) return 15;
  if (b.doc.toLowerCase().includes(word) || b.returns.toLowerCase().includes(word)) return 10;
  return 0;
}

/**
 * The built-ins that match a search (every word must match somewhere), best first: the name
 * itself, then names that start with or hold the words, then category, parameters and doc.
 * An empty search gives the whole list in its order. `category` narrows to one group.
 */
export function searchBuiltins(list: readonly BuiltinInfo[], query: string, category: string | null = null): BuiltinInfo[] {
  const words = query.toLowerCase().split(/[\s,()]+/).filter((w) => w.length > 0);
  const pool = category === null ? list : list.filter((b) => b.category === category);
  if (words.length === 0) return [...pool];
  const scored: { b: BuiltinInfo; score: number; at: number }[] = [];
  pool.forEach((b, at) => {
    let score = 0;
    for (const w of words) {
      const s = wordScore(b, w);
      if (s === 0) return;
      score += s;
    }
    scored.push({ b, score, at });
  });
  scored.sort((x, y) => y.score - x.score || x.at - y.at);
  return scored.map((s) => s.b);
}

/** A name an example reads, with the columns or fields it reads from it. */
export interface ExampleName {
  readonly name: string;
  /** Columns or fields read as `name.member` or `name["member"]`, in order, once each. */
  readonly members: readonly string[];
  /** Where the name stands in the example (each occurrence). */
  readonly at: readonly { readonly from: number; readonly to: number }[];
}

/** The names an example reads (cells of the document, not built-ins), in order of first use. */
export function exampleNames(example: string): ExampleName[] | null {
  let expr: Expr;
  try {
    expr = parseStatement(example).expr;
  } catch (err) {
    if (err instanceof LangError) return null;
    throw err;
  }
  const found = new Map<string, { members: string[]; at: { from: number; to: number }[] }>();
  const entry = (name: string) => {
    let e = found.get(name);
    if (e === undefined) {
      e = { members: [], at: [] };
      found.set(name, e);
    }
    return e;
  };
  const stack: Expr[] = [expr];
  const uses: { name: string; from: number; to: number; member: string | null }[] = [];
  while (stack.length > 0) {
    const e = stack.pop()!;
    switch (e.type) {
      case 'name':
        uses.push({ name: e.name, from: e.from, to: e.to, member: null });
        break;
      case 'member':
        if (e.object.type === 'name') uses.push({ name: e.object.name, from: e.object.from, to: e.object.to, member: e.name });
        else stack.push(e.object);
        break;
      case 'index':
        if (e.object.type === 'name' && e.index.type === 'text') uses.push({ name: e.object.name, from: e.object.from, to: e.object.to, member: e.index.value });
        else stack.push(e.object);
        stack.push(e.index);
        break;
      case 'list':
        stack.push(...e.items);
        break;
      case 'unary':
        stack.push(e.operand);
        break;
      case 'binary':
        stack.push(e.left, e.right);
        break;
      case 'call':
        for (const a of e.args) stack.push(a.value);
        break;
      default:
        break;
    }
  }
  uses.sort((a, b) => a.from - b.from);
  for (const u of uses) {
    const e = entry(u.name);
    e.at.push({ from: u.from, to: u.to });
    if (u.member !== null && !e.members.includes(u.member)) e.members.push(u.member);
  }
  return [...found].map(([name, e]) => ({ name, members: e.members, at: e.at }));
}

/** An example fitted to the open document. */
export interface ExampleFit {
  /** The formula to add: the example, with table names changed where the document has a fitting table. */
  readonly text: string;
  /** Names the example reads, said in words ("the table plots (yield, variety, block)"). */
  readonly reads: readonly string[];
  /** Tables read instead of the example's: [the example's name, the document's]. */
  readonly renamed: readonly (readonly [string, string])[];
  /** What the document lacks, in words; empty when the example can work as it is added. */
  readonly missing: readonly string[];
}

function describe(n: ExampleName): string {
  return n.members.length > 0 ? `${n.name} (${n.members.join(', ')})` : n.name;
}

/**
 * Fits an example to the document. A name the document has (with every member the example
 * reads from it) is kept. A table name it lacks is replaced by the document's first table
 * that has every column the example names, so `blocked(plots.yield, plots.variety,
 * plots.block)` reads `harvest` in a document whose table `harvest` has those columns.
 * Nothing else is guessed: which column plays which part is the user's call, so an example
 * whose columns the document lacks is added as written and the panel says what is missing.
 */
export function fitExample(example: string, cells: NameCatalogue['cells']): ExampleFit {
  const names = exampleNames(example);
  if (names === null) return { text: example, reads: [], renamed: [], missing: [] };
  const byName = new Map(cells.map((c) => [c.name, c]));
  const used = new Set(names.map((n) => n.name).filter((n) => byName.has(n)));
  const replace: { from: number; to: number; name: string }[] = [];
  const renamed: [string, string][] = [];
  const missing: string[] = [];
  for (const n of names) {
    const own = byName.get(n.name);
    if (own !== undefined && n.members.every((m) => own.members.includes(m))) continue;
    const stand =
      n.members.length > 0 ? cells.find((c) => !used.has(c.name) && c.name !== n.name && n.members.every((m) => c.members.includes(m))) : undefined;
    if (stand !== undefined) {
      used.add(stand.name);
      renamed.push([n.name, stand.name]);
      for (const at of n.at) replace.push({ ...at, name: stand.name });
      continue;
    }
    if (own !== undefined) missing.push(`${n.members.filter((m) => !own.members.includes(m)).join(', ')} in ${n.name}`);
    else missing.push(describe(n));
  }
  let text = example;
  for (const r of replace.sort((a, b) => b.from - a.from)) text = text.slice(0, r.from) + r.name + text.slice(r.to);
  const instead = new Map(renamed);
  return { text, reads: names.map((n) => describe({ ...n, name: instead.get(n.name) ?? n.name })), renamed, missing };
}
