/**
 * `furrow verify FILE`: recomputes a sealed document and prints what differs from its seal,
 * the engine's version first when it differs, then the fingerprint, every named value
 * (same / changed with old and new / missing / new) and every claim that does not hold.
 *
 * Exit status: 0 only when everything matches and every claim holds; 1 otherwise; 2 when
 * the file cannot be read as a document.
 */
import { verificationText } from '../seal/verify-text.ts';
import { verifyDocument, type Verification } from '../seal/verify.ts';
import { readDataFiles } from './data-files.ts';
import { loadDocument, type Output } from './main.ts';
import { cliMsg } from '../messages/cli.ts';

/** Verifies the document at `path`. Throws CliFailure when it cannot be read. */
export function verifyFile(path: string): Verification {
  const { doc, engine } = loadDocument(path);
  return verifyDocument(doc, engine.states(), readDataFiles(path, doc));
}

/** Runs `furrow verify FILE`; returns the exit status. */
export function verifyCommand(args: readonly string[], o: Output, usage: string): number {
  if (args.length !== 1 || args[0]!.startsWith('-')) {
    o.err(cliMsg.takesOneFile('verify', usage));
    return 2;
  }
  const v = verifyFile(args[0]!);
  for (const l of verificationText(args[0]!, v)) o.out(l);
  return v.matches ? 0 : 1;
}
