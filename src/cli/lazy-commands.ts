/**
 * `seal`, `verify` and `sheet`, loaded the first time one is asked for (as `report` is): a
 * `furrow run` never needs them. Tests hand them over at once (test/setup/builtins.ts), so
 * that they call these commands synchronously as they always have.
 */
type DocumentCommands = typeof import('./document-commands.ts');

let loaded: DocumentCommands | null = null;

/** The commands, once loaded; null before. */
export function loadedCommands(): DocumentCommands | null {
  return loaded;
}

/** Loads the commands (the first time; at once after). */
export async function loadCommands(): Promise<DocumentCommands> {
  loaded ??= await import('./document-commands.ts');
  return loaded;
}

/** Hands the command line the commands it already has (tests). */
export function provideCommands(commands: DocumentCommands): void {
  loaded = commands;
}
