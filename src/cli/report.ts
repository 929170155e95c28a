/**
 * `furrow report FILE -o OUT.html [--replace]`: one self-contained HTML report of the
 * document (src/report/build.ts), written through a temporary file and a rename. An earlier
 * report at OUT is written over; any other file there (a mistyped name: a data file, a
 * document) only with --replace, so a slip of the keyboard loses nothing typed.
 *
 * Exit status: 0 when the report was written (a report of a document with errors or
 * failing claims shows them; it is still a report); 2 when the file cannot be read or the
 * report cannot be written.
 */
import { existsSync, readFileSync, realpathSync } from 'node:fs';
import { basename, resolve } from 'node:path';
import { buildReport } from '../report/build.ts';
import { carriedDocument } from '../report/source.ts';
import { readDataFiles } from './data-files.ts';
import { CliFailure, loadDocument, type Output } from './main.ts';
import { writeWhole } from './seal.ts';
import { cliMsg } from '../messages/cli.ts';

/** Builds the report of the document at `path` as HTML text. */
export async function reportHtml(path: string): Promise<string> {
  const { doc, engine } = loadDocument(path);
  return buildReport({
    name: basename(path),
    bytes: readFileSync(path),
    doc,
    states: engine.states(),
    readsOf: (id) => engine.reads(id),
    files: readDataFiles(path, doc),
  });
}

/** Runs `furrow report FILE -o OUT.html`; returns the exit status. */
export async function reportCommand(args: readonly string[], o: Output, usage: string): Promise<number> {
  const files: string[] = [];
  let out: string | null = null;
  let replace = false;
  for (let i = 0; i < args.length; i++) {
    const a = args[i]!;
    if (a === '-o' || a === '--output') {
      out = args[++i] ?? null;
      if (out === null) {
        o.err(cliMsg.needsFileName(a, usage));
        return 2;
      }
    } else if (a === '--replace') {
      replace = true;
    } else if (a.startsWith('-')) {
      o.err(cliMsg.unknownOption(a, usage));
      return 2;
    } else files.push(a);
  }
  if (files.length !== 1 || out === null) {
    o.err(cliMsg.reportArguments(usage));
    return 2;
  }
  const outExists = existsSync(out);
  if (resolve(out) === resolve(files[0]!) || (outExists && existsSync(files[0]!) && realpathSync(out) === realpathSync(files[0]!))) {
    o.err(cliMsg.reportOverDocument());
    return 2;
  }
  if (outExists && !replace && carriedDocument(readFileSync(out, 'utf8')) === null) {
    o.err(cliMsg.reportWouldOverwrite(out));
    return 2;
  }
  const html = await reportHtml(files[0]!);
  try {
    writeWhole(out, html);
  } catch (err) {
    throw new CliFailure(cliMsg.reportNotWritten(out, (err as Error).message));
  }
  o.out(cliMsg.reportWritten(out, Math.round(html.length / 1024)));
  return 0;
}
