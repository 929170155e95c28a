/**
 * The one registry of built-in functions. Each entry carries its signature and its doc; the
 * evaluator checks calls against the signature, the editor's completion shows the doc, and
 * the README's function reference is generated from it (scripts/reference.ts), so the three
 * cannot drift apart.
 */
import type { Table, Value } from './values.ts';
import { TYPES, type TypeKey } from './types.ts';

/** Groups of built-ins, in the order the reference lists them. */
export const CATEGORIES = [
  'summaries',
  'maths',
  'distributions',
  'two groups',
  'designs',
  'after a fit',
  'rank-based',
  'charts',
  'planning',
  'claims',
] as const;
export type Category = (typeof CATEGORIES)[number];

/** One parameter of a built-in. */
export interface Param {
  readonly name: string;
  readonly type: TypeKey;
  /** The default when the argument is left out; absent means required. */
  readonly default?: Value;
  /** Extra texts the argument may be, for enumerated options ("tukey", "lsd"). */
  readonly choices?: readonly string[];
  readonly doc: string;
}

/** What a built-in can tell the evaluator while it runs. */
export interface CallContext {
  /** The function's name, for messages. */
  readonly fn: string;
  /** A warning shown on the cell (for example how many missing values were left out). */
  warn(message: string): void;
  /** Progress of a long computation, from 0 to 1. */
  progress(fraction: number): void;
  /**
   * The table an argument was read from, when the call wrote it as `t.col` or `t["col"]`
   * (null otherwise, or when the evaluator does not say): lets a fit see the rest of its
   * data, for example a blocking column it ignores.
   */
  readonly sourceTable?: (param: string) => SourceTable | null;
}

/** The table an argument's column was read from, and the cell name it was read by (if a plain name). */
export interface SourceTable {
  readonly table: Table;
  readonly name: string | null;
}

/** The checked arguments of a call, by parameter name (defaults filled in). */
export type Args = ReadonlyMap<string, Value>;

/** One built-in function. */
export interface Builtin {
  readonly name: string;
  readonly category: Category;
  readonly params: readonly Param[];
  /** What it returns, in words ("a number", "a fit record"). */
  readonly returns: string;
  /** One paragraph: what it computes, by which published method, and what it assumes. */
  readonly doc: string;
  /** A short example call as a user would write it. */
  readonly example: string;
  /** Runs the function. Throws UsageError for bad input in plain words. */
  readonly run: (args: Args, ctx: CallContext) => Value;
}

/**
 * The signature as users read it: `round(x, digits: 0)`; `scatter(x, y, color?)` for an
 * argument that may be left out and has no default value.
 */
export function signature(b: Builtin): string {
  const parts = b.params.map((p) => {
    if (p.default === undefined) return p.name;
    // an optional argument with no default value of its own (its default is "missing")
    if (typeof p.default === 'object' && p.default.kind === 'missing') return `${p.name}?`;
    return `${p.name}: ${showDefault(p.default)}`;
  });
  return `${b.name}(${parts.join(', ')})`;
}

function showDefault(v: Value): string {
  if (typeof v === 'string') return JSON.stringify(v);
  if (typeof v === 'number' || typeof v === 'boolean') return String(v);
  return '…';
}

/** A parameter's type in words. */
export function describeParam(p: Param): string {
  const base = TYPES[p.type].description;
  return p.choices ? `${base}: ${p.choices.map((c) => JSON.stringify(c)).join(', ')}` : base;
}

/** A set of built-ins looked up by name. */
export class Registry {
  private readonly byName = new Map<string, Builtin>();

  constructor(builtins: Iterable<Builtin>) {
    for (const b of builtins) {
      if (this.byName.has(b.name)) throw new Error(`built-in ${b.name} registered twice`);
      const seen = new Set<string>();
      let optional = false;
      for (const p of b.params) {
        if (seen.has(p.name)) throw new Error(`built-in ${b.name}: parameter ${p.name} twice`);
        seen.add(p.name);
        if (p.default !== undefined) optional = true;
        else if (optional) throw new Error(`built-in ${b.name}: required ${p.name} after an optional one`);
      }
      this.byName.set(b.name, b);
    }
  }

  get(name: string): Builtin | undefined {
    return this.byName.get(name);
  }

  has(name: string): boolean {
    return this.byName.has(name);
  }

  names(): string[] {
    return [...this.byName.keys()];
  }

  all(): Builtin[] {
    return [...this.byName.values()];
  }
}
