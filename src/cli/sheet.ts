/**
 * `furrow sheet FILE NAME -o plan.csv [--columns yield,notes] [--replace]`: writes the layout
 * named NAME of a document as a run sheet (src/doc/run-sheet.ts). Without -o the sheet goes to
 * standard output. Exit status 0 when written, 2 when the document, the name or the output
 * fails.
 *
 * A run sheet is where measurements get typed, so an existing file at -o is never written
 * over unless it already holds exactly this sheet or --replace says so: running the command
 * again after the sheet was filled in must not wipe the measurements.
 */
import { existsSync, readFileSync, realpathSync, writeFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { DEFAULT_MEASUREMENTS, RunSheetError, runSheet } from '../doc/run-sheet.ts';
import { isError, isTable, describeType } from '../lang/values.ts';
import { CliFailure, loadDocument } from './main.ts';
import { cliMsg } from '../messages/cli.ts';

const USAGE = cliMsg.sheetUsage(DEFAULT_MEASUREMENTS);

interface Output {
  out: (s: string) => void;
  err: (s: string) => void;
}

/** Runs `furrow sheet` with the arguments after the command; returns the exit status. */
export function sheetCommand(argv: readonly string[], o: Output): number {
  const positional: string[] = [];
  let outPath: string | null = null;
  let columns: string[] = [...DEFAULT_MEASUREMENTS];
  let replace = false;
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i]!;
    if (a === '-h' || a === '--help') {
      o.out(USAGE);
      return 0;
    }
    if (a === '-o' || a === '--columns') {
      const v = argv[i + 1];
      if (v === undefined) {
        o.err(cliMsg.sheetNeedsValue(a, USAGE));
        return 2;
      }
      if (a === '-o') outPath = v;
      else columns = v.split(',').map((s) => s.trim());
      i++;
      continue;
    }
    if (a === '--replace') {
      replace = true;
      continue;
    }
    if (a.startsWith('-')) {
      o.err(cliMsg.sheetUnknownOption(a, USAGE));
      return 2;
    }
    positional.push(a);
  }
  const [file, name, ...rest] = positional;
  if (file === undefined || name === undefined || rest.length > 0) {
    o.err(cliMsg.sheetArguments(USAGE));
    return 2;
  }
  let text: string;
  try {
    const { engine } = loadDocument(file);
    const state = engine.states().find((s) => s.name === name);
    if (state === undefined) {
      o.err(cliMsg.sheetNoCell(file, name));
      return 2;
    }
    const v = state.value;
    if (isError(v)) {
      o.err(cliMsg.sheetHoldsError(name, v.message));
      return 2;
    }
    if (!isTable(v)) {
      o.err(cliMsg.sheetNotTable(name, describeType(v)));
      return 2;
    }
    text = runSheet(v, columns);
  } catch (err) {
    if (err instanceof RunSheetError) {
      o.err(cliMsg.sheetFailure(err.message));
      return 2;
    }
    if (err instanceof CliFailure) {
      o.err(cliMsg.failure(err.message));
      return 2;
    }
    throw err;
  }
  if (outPath === null) {
    o.out(text.replace(/\n$/, ''));
    return 0;
  }
  try {
    if (existsSync(outPath)) {
      if (realpathSync(outPath) === realpathSync(resolve(file))) {
        o.err(cliMsg.sheetOverDocument());
        return 2;
      }
      if (readFileSync(outPath, 'utf8') === text) return 0;
      if (!replace) {
        o.err(cliMsg.sheetWouldOverwrite(outPath));
        return 2;
      }
      writeFileSync(outPath, text);
    } else {
      // 'wx': if a file appeared since the look above, it is not written over
      writeFileSync(outPath, text, { flag: 'wx' });
    }
  } catch (err) {
    o.err(cliMsg.sheetNotWritten(outPath, (err as Error).message));
    return 2;
  }
  return 0;
}
