/**
 * The built-ins as the command line gets them: loaded when a document may call one. The
 * registry holds the statistics and their libraries, about two thirds of the command line's
 * code; a document with no call in it (`furrow run` of a quick calculation, a plan being
 * written) starts without compiling them.
 *
 * Whether a document may call one is told from its text: a call needs an opening bracket.
 * A document without one is evaluated against a {@link WatchedRegistry}, which answers as
 * an empty registry and remembers being asked; the only question an evaluation can ask it
 * without a call is whether an unknown name is a built-in (for the error's words), and then
 * the command loads the built-ins and evaluates again. So the output is always what the full
 * registry gives.
 */
import { Registry } from '../lang/builtins.ts';

let loaded: Registry | null = null;

/** The built-ins, once loaded; null before. */
export function loadedBuiltins(): Registry | null {
  return loaded;
}

/** Loads the built-ins (the first time; at once after). */
export async function loadBuiltins(): Promise<Registry> {
  loaded ??= (await import('../functions/index.ts')).BUILTINS;
  return loaded;
}

/**
 * Hands the command line built-ins it already has (tests, which import them anyway, and so
 * call the command line synchronously).
 */
export function provideBuiltins(registry: Registry): void {
  loaded = registry;
}

/** An empty registry that remembers whether it was asked anything. */
export class WatchedRegistry extends Registry {
  asked = false;

  constructor() {
    super([]);
  }

  override get(name: string): ReturnType<Registry['get']> {
    this.asked = true;
    return super.get(name);
  }

  override has(name: string): boolean {
    this.asked = true;
    return super.has(name);
  }

  override names(): string[] {
    this.asked = true;
    return super.names();
  }

  override all(): ReturnType<Registry['all']> {
    this.asked = true;
    return super.all();
  }
}

/** Evaluating the document asked the built-ins something: load them and evaluate again. */
export class BuiltinsNeeded extends Error {
  constructor() {
    super('the built-ins are needed');
    this.name = 'BuiltinsNeeded';
  }
}

/** True when a document's text may call a built-in (it holds an opening bracket). */
export function mayCall(text: string): boolean {
  return text.includes('(');
}
