/**
 * `furrow seal FILE`: appends (or replaces) the document's sealed section, written through a
 * temporary file beside it and a rename, so a crash never leaves half a document.
 *
 * Exit status: 0 when sealed and every cell evaluated; 1 when sealed but some cells hold
 * errors (they are sealed as errors, and said so); 2 when the file cannot be read.
 */
import { closeSync, fsyncSync, openSync, renameSync, rmSync, writeSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { writeDocument } from '../doc/format.ts';
import { prepareForSeal, sealDocument } from '../seal/seal.ts';
import { claimsOf, namedValues } from '../seal/section.ts';
import { readDataFiles } from './data-files.ts';
import { loadDocument, type Output } from './main.ts';
import { cliMsg } from '../messages/cli.ts';

/**
 * Writes text to a file through a temporary file in the same folder and a rename: the file
 * holds either its old bytes or all of the new ones.
 *
 * @param beforeRename called after the temporary file is complete, before the rename (a test
 *   kills the process there)
 */
export function writeWhole(path: string, text: string, beforeRename?: () => void): void {
  const temp = join(dirname(path), `.${basename(path)}.${process.pid}.sealing`);
  const fd = openSync(temp, 'w', 0o644);
  try {
    writeSync(fd, text);
    fsyncSync(fd);
  } catch (err) {
    closeSync(fd);
    rmSync(temp, { force: true });
    throw err;
  }
  closeSync(fd);
  beforeRename?.();
  renameSync(temp, path);
}

/** What sealing did. */
export interface SealOutcome {
  readonly text: string;
  readonly values: number;
  readonly claims: number;
  /** The statements of the claims that do not hold: sealed as they are, and said. */
  readonly failing: readonly string[];
  readonly errors: readonly string[];
}

/** Seals the document at `path` in place. Throws CliFailure when it cannot be read. */
export function sealFile(path: string, beforeRename?: () => void): SealOutcome {
  const { doc, engine } = loadDocument(path);
  const prepared = prepareForSeal(doc);
  engine.update(prepared);
  const states = engine.states();
  const claims = claimsOf(states);
  const sealed = sealDocument(prepared, states, readDataFiles(path, prepared));
  const text = writeDocument(sealed);
  writeWhole(path, text, beforeRename);
  return {
    text,
    values: namedValues(states).length,
    claims: claims.length,
    failing: claims.filter((c) => !c.holds).map((c) => c.statement),
    errors: states.flatMap((s, i) => (s.status === 'error' || s.status === 'upstream' ? [s.name ?? cliMsg.unnamedCell(i + 1, s.kind)] : [])),
  };
}

/** Runs `furrow seal FILE`; returns the exit status. */
export function sealCommand(args: readonly string[], o: Output, usage: string): number {
  if (args.length !== 1 || args[0]!.startsWith('-')) {
    o.err(cliMsg.takesOneFile('seal', usage));
    return 2;
  }
  const path = args[0]!;
  const r = sealFile(path);
  o.out(cliMsg.sealed(path, r.values, r.claims));
  if (r.failing.length > 0) o.out(cliMsg.sealedFailingClaims(r.failing));
  if (r.errors.length === 0) return 0;
  o.out(cliMsg.sealedWithErrors(r.errors));
  return 1;
}
