/**
 * `furrow sheet FILE NAME -o plan.csv [--columns yield,notes]`: writes the layout named NAME
 * of a document as a run sheet (src/doc/run-sheet.ts). Without -o the sheet goes to standard
 * output. Exit status 0 when written, 2 when the document, the name or the output fails.
 */
import { writeFileSync } from 'node:fs';
import { DEFAULT_MEASUREMENTS, RunSheetError, runSheet } from '../doc/run-sheet.ts';
import { isError, isTable, describeType } from '../lang/values.ts';
import { CliFailure, loadDocument } from './main.ts';

const USAGE = `Usage: furrow sheet FILE NAME [-o plan.csv] [--columns a,b]

  Writes the layout NAME of the document FILE (a table, for example one made by
  random_layout) as a run sheet: its columns, then empty columns for the measurements
  (by default: ${DEFAULT_MEASUREMENTS.join(', ')}).

  -o FILE          write to FILE instead of standard output
  --columns a,b    the measurement columns, comma-separated`;

interface Output {
  out: (s: string) => void;
  err: (s: string) => void;
}

/** Runs `furrow sheet` with the arguments after the command; returns the exit status. */
export function sheetCommand(argv: readonly string[], o: Output): number {
  const positional: string[] = [];
  let outPath: string | null = null;
  let columns: string[] = [...DEFAULT_MEASUREMENTS];
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i]!;
    if (a === '-h' || a === '--help') {
      o.out(USAGE);
      return 0;
    }
    if (a === '-o' || a === '--columns') {
      const v = argv[i + 1];
      if (v === undefined) {
        o.err(`furrow sheet: ${a} needs a value.\n\n${USAGE}`);
        return 2;
      }
      if (a === '-o') outPath = v;
      else columns = v.split(',').map((s) => s.trim());
      i++;
      continue;
    }
    if (a.startsWith('-')) {
      o.err(`furrow sheet: unknown option ${a}\n\n${USAGE}`);
      return 2;
    }
    positional.push(a);
  }
  const [file, name, ...rest] = positional;
  if (file === undefined || name === undefined || rest.length > 0) {
    o.err(`furrow sheet: give one document and the name of one layout in it.\n\n${USAGE}`);
    return 2;
  }
  let text: string;
  try {
    const { engine } = loadDocument(file);
    const state = engine.states().find((s) => s.name === name);
    if (state === undefined) {
      o.err(`furrow sheet: ${file} has no cell named "${name}".`);
      return 2;
    }
    const v = state.value;
    if (isError(v)) {
      o.err(`furrow sheet: "${name}" holds an error: ${v.message}`);
      return 2;
    }
    if (!isTable(v)) {
      o.err(`furrow sheet: "${name}" is ${describeType(v)}, not a table; a run sheet is made from a layout such as random_layout(...).`);
      return 2;
    }
    text = runSheet(v, columns);
  } catch (err) {
    if (err instanceof RunSheetError) {
      o.err(`furrow sheet: ${err.message}`);
      return 2;
    }
    if (err instanceof CliFailure) {
      o.err(`furrow: ${err.message}`);
      return 2;
    }
    throw err;
  }
  if (outPath === null) {
    o.out(text.replace(/\n$/, ''));
    return 0;
  }
  try {
    writeFileSync(outPath, text);
  } catch (err) {
    o.err(`furrow sheet: cannot write ${outPath}: ${(err as Error).message}`);
    return 2;
  }
  return 0;
}
