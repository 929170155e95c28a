/**
 * The command line: `furrow run FILE [--json]` evaluates a document and prints every cell
 * (docs/language.md section 9). Exit status: 0 when every cell evaluated, 1 when any cell holds
 * an error (all cells are still printed), 2 when the file cannot be read as a document.
 */
import { basename } from 'node:path';
import { documentTitle, headerFields, isSafeFileName, type Document } from '../doc/document.ts';
import { DocumentError, readDocument } from '../doc/format.ts';
import { BuiltinsNeeded, WatchedRegistry, loadBuiltins, loadedBuiltins, mayCall } from './builtins.ts';
import type { Registry } from '../lang/builtins.ts';
import { Engine, type CellState } from '../graph/engine.ts';
import { dataFileText, needsPreload, preloadParquet } from './data-text.ts';
import { COLUMN_SLICE, reportPieces, writePieces, type PieceSink } from './json-stream.ts';
import { ColumnTextHelper } from './column-text-helper.ts';
import { DOCUMENT_LIMIT_BYTES, FileProblem, readText } from './files.ts';
import { CELL_KINDS } from '../../cells/kinds.ts';
import type { CellKinds } from '../graph/kinds.ts';
import { valueText, visible } from './text.ts';
import { loadCommands, loadedCommands } from './lazy-commands.ts';
import { cliMsg } from '../messages/cli.ts';

const USAGE = cliMsg.usage();

/** A failure that ends the command with status 2 and one line on standard error. */
export class CliFailure extends Error {}

/** Where a command writes: standard output and standard error, one line per call. */
export interface Output {
  out: (s: string) => void;
  err: (s: string) => void;
  /**
   * Standard output as a stream (bin/furrow.js passes process.stdout): `run --json` then
   * writes as it goes, with backpressure, and `main` returns a promise. Without it the JSON
   * is handed to `out` in one piece.
   */
  stream?: PieceSink;
  /**
   * The built helper thread for `run --json` (build/cli/column-text-worker.mjs; bin/furrow.js
   * passes it when it runs the build): long number columns are then turned into text on two
   * threads. Without it, on one; the output is the same.
   */
  helperScript?: string | URL;
}

/** Runs a read, turning a file problem into the command's failure. */
function readFile<T>(read: () => T): T {
  try {
    return read();
  } catch (err) {
    if (err instanceof FileProblem) throw new CliFailure(err.message);
    throw err;
  }
}

/**
 * Loads a document and the CSV files its tables name, and evaluates it. The registry is the
 * built-ins, which must be loaded first (`main` does, src/cli/builtins.ts), or a
 * {@link WatchedRegistry} for a document that calls none: BuiltinsNeeded is thrown when the
 * evaluation asked it anything.
 */
export function loadDocument(
  path: string,
  kinds: CellKinds = CELL_KINDS,
  registry: Registry = builtinsNow(),
): { doc: Document; engine: Engine; warnings: string[] } {
  const text = readFile(() => readText(path, cliMsg.theDocument(), DOCUMENT_LIMIT_BYTES));
  let doc: Document;
  const warnings: string[] = [];
  try {
    const r = readDocument(text, { kinds });
    doc = r.document;
    for (const w of r.warnings) warnings.push(cliMsg.atLine(w.line, w.message));
  } catch (err) {
    if (err instanceof DocumentError) throw new CliFailure(cliMsg.documentProblem(path, err.message));
    throw err;
  }
  const engine = new Engine({ registry, kinds });
  for (const cell of doc.cells) {
    for (const file of kinds.filesRead(cell)) {
      // a name that leaves the document's folder is never opened: the cell itself reports it
      if (!isSafeFileName(file)) continue;
      try {
        engine.setFile(file, dataFileText(path, file));
      } catch (err) {
        if (err instanceof FileProblem) {
          const heading = kinds.of(cell)!.printing.heading(kinds.nameOf(cell));
          throw new CliFailure(cliMsg.tableFileProblem(path, heading, file, err.message));
        }
        throw err;
      }
    }
  }
  engine.update(doc);
  if (registry instanceof WatchedRegistry && registry.asked) throw new BuiltinsNeeded();
  return { doc, engine, warnings };
}

/** The loaded built-ins (main loads them before any command that reads a document). */
function builtinsNow(): Registry {
  const r = loadedBuiltins();
  if (r === null) throw new Error('the built-ins are not loaded: main() loads them before a document is read');
  return r;
}

/**
 * For `run`: the registry to evaluate the document at `path` against without loading the
 * built-ins, when its text shows it calls none; null when it may call one (or cannot be read
 * now: loading it reports that).
 */
function registryWithoutBuiltins(path: string): WatchedRegistry | null {
  let text: string;
  try {
    text = readText(path, cliMsg.theDocument(), QUICK_LOOK_BYTES);
  } catch {
    return null;
  }
  return mayCall(text) ? null : new WatchedRegistry();
}

/** Documents up to this size are looked at for calls before the built-ins load. */
const QUICK_LOOK_BYTES = 1 << 20;

/** Where each cell's body starts in the file (1-based line of the marker). */
function markerLines(doc: Document): number[] {
  let line = 1 + (doc.firstEol === '' ? 0 : 1) + count(doc.header, '\n');
  return doc.cells.map((c) => {
    const at = line;
    line += (c.eol === '' ? 0 : 1) + count(c.body, '\n');
    return at;
  });
}

function count(s: string, ch: string): number {
  let n = 0;
  for (let i = s.indexOf(ch); i >= 0; i = s.indexOf(ch, i + 1)) n++;
  return n;
}

/** Offsets where each line of a text starts, found once, so that many positions cost a search each. */
function lineStarts(body: string): number[] {
  const starts = [0];
  for (let i = body.indexOf('\n'); i >= 0; i = body.indexOf('\n', i + 1)) starts.push(i + 1);
  return starts;
}

/**
 * Line and column of an offset in a cell's body. A note may hold a hundred thousand failing
 * placeholders, so each one is found by binary search in the body's line starts rather than
 * by counting lines from the start (which made such a note quadratic: 80,000 took 53 s).
 */
function position(starts: readonly number[], offset: number, markerLine: number): string {
  const at = Math.max(0, offset);
  let lo = 0;
  let hi = starts.length - 1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (starts[mid]! <= at) lo = mid;
    else hi = mid - 1;
  }
  return cliMsg.lineColumn(markerLine + 1 + lo, at - starts[lo]! + 1);
}

function humanReport(path: string, doc: Document, states: CellState[], warnings: string[], kinds: CellKinds, output: Output): void {
  // every line a document can put on a terminal goes through `visible`
  const o: Output = { out: (s) => output.out(visible(s)), err: (s) => output.err(visible(s)) };
  o.out(cliMsg.documentHeading(documentTitle(doc), basename(path)));
  const caution = headerFields(doc).get('caution');
  if (caution) o.out(cliMsg.caution(caution));
  for (const w of warnings) o.out(cliMsg.headerWarning(w));
  o.out('');
  const lines = markerLines(doc);
  const starts = new Map<number, number[]>();
  const startsOf = (i: number): number[] => {
    let s = starts.get(i);
    if (s === undefined) starts.set(i, (s = lineStarts(doc.cells[i]!.body)));
    return s;
  };
  const where = (i: number, e: { from: number; to: number }): string =>
    e.from === 0 && e.to === 0 && kinds.of(doc.cells[i]!)?.printing.faultsOnMarker === true
      ? cliMsg.line(lines[i]!)
      : position(startsOf(i), e.from, lines[i]!);
  states.forEach((s, i) => {
    const cell = doc.cells[i]!;
    const kind = kinds.of(cell);
    const label = kind !== undefined ? kind.printing.heading(kind.nameOf(cell) ?? s.name) : s.kind;
    const v = s.value;
    const e = s.error;
    if (s.status === 'inert') {
      o.out(cliMsg.cellInert(i + 1, label));
    } else if (e !== null && e === v) {
      o.out(cliMsg.cellError(i + 1, label, s.status === 'upstream', where(i, e)));
      o.out(`    ${e.message}`);
    } else {
      o.out(cliMsg.cellHeading(i + 1, label));
      for (const l of valueText(v, '    ')) o.out(l);
      // one line per distinct error, with every placeholder it reaches (as the page shows them)
      const byMessage = new Map<string, string[]>();
      for (const p of s.parts ?? []) {
        if (typeof p !== 'object' || p.kind !== 'error') continue;
        const at = byMessage.get(p.message) ?? [];
        at.push(where(i, p));
        byMessage.set(p.message, at);
      }
      for (const [message, at] of byMessage) o.out(`    ${cliMsg.placeholderError(at, message)}`);
    }
    for (const w of s.warnings) o.out(`    ${cliMsg.cellNote(w)}`);
    o.out('');
  });
  const bad = states.filter((s) => s.status === 'error' || s.status === 'upstream').length;
  o.out(cliMsg.runSummary(states.length, bad));
}

/** Runs a command, turning a CliFailure into one line on standard error and status 2. */
function guarded(o: Output, command: () => number | Promise<number>): number | Promise<number> {
  const fail = (err: unknown): number => {
    if (!(err instanceof CliFailure)) throw err;
    o.err(visible(cliMsg.failure(err.message)));
    return 2;
  };
  try {
    const r = command();
    return typeof r === 'number' ? r : r.catch(fail);
  } catch (err) {
    return fail(err);
  }
}

/** The document a command works on: its first argument that is not an option or an option's value. */
function documentArgument(argv: readonly string[]): string | undefined {
  for (let i = 1; i < argv.length; i++) {
    const a = argv[i]!;
    if (a === '-o') i++;
    else if (!a.startsWith('-')) return a;
  }
  return undefined;
}

/**
 * Runs the command line with arguments; returns the exit status (a promise for `report`,
 * and for a document that names Parquet files, which are decoded before it is loaded).
 */
export function main(argv: readonly string[], o: Output, kinds: CellKinds = CELL_KINDS): number | Promise<number> {
  const path = documentArgument(argv);
  const preload = path !== undefined && needsPreload(path, kinds);
  const everything = (): Promise<number> =>
    Promise.all([loadBuiltins(), preload ? preloadParquet(path, kinds) : null]).then(() => mainNow(argv, o, kinds, loadedBuiltins()!));
  if (path === undefined) return mainNow(argv, o, kinds, null);
  const registry = loadedBuiltins();
  if (registry !== null && !preload) return mainNow(argv, o, kinds, registry);
  // a document run that calls no built-in is evaluated without loading them (src/cli/builtins.ts)
  const watched = argv[0] === 'run' && !preload ? registryWithoutBuiltins(path) : null;
  if (watched === null) return everything();
  try {
    return mainNow(argv, o, kinds, watched);
  } catch (err) {
    if (err instanceof BuiltinsNeeded) return everything();
    throw err;
  }
}

/** `registry` is the built-ins, or a watched empty one for `run`; null where no document is read. */
function mainNow(argv: readonly string[], o: Output, kinds: CellKinds, registry: Registry | null): number | Promise<number> {
  if (argv[0] === 'seal' || argv[0] === 'verify' || argv[0] === 'sheet') {
    // loaded when asked for: `run` never needs them (src/cli/lazy-commands.ts)
    const commands = loadedCommands();
    if (commands === null) return loadCommands().then(() => mainNow(argv, o, kinds, registry));
    if (argv[0] === 'seal') return guarded(o, () => commands.sealCommand(argv.slice(1), o, USAGE));
    if (argv[0] === 'verify') return guarded(o, () => commands.verifyCommand(argv.slice(1), o, USAGE));
    return commands.sheetCommand(argv.slice(1), o);
  }
  // the report draws charts: its libraries load only when a report is asked for
  if (argv[0] === 'report') return guarded(o, async () => (await import('./report.ts')).reportCommand(argv.slice(1), o, USAGE));
  const args = argv.filter((a) => a !== '--json');
  const json = argv.includes('--json');
  if (args.length === 0 || args[0] === 'help' || args[0] === '--help' || args[0] === '-h') {
    o.out(USAGE);
    return args.length === 0 ? 2 : 0;
  }
  const unknownFlag = args.find((a) => a.startsWith('-'));
  if (unknownFlag !== undefined) {
    o.err(cliMsg.unknownOption(unknownFlag, USAGE));
    return 2;
  }
  const [command, file, ...rest] = args;
  if (command !== 'run') {
    o.err(cliMsg.unknownCommand(command ?? '', USAGE));
    return 2;
  }
  if (file === undefined || rest.length > 0) {
    o.err(cliMsg.takesOneFile('run', USAGE));
    return 2;
  }
  try {
    const { doc, engine, warnings } = loadDocument(file, kinds, registry ?? undefined);
    const states = engine.states();
    const status = states.some((s) => s.status === 'error' || s.status === 'upstream') ? 1 : 0;
    if (!json) {
      humanReport(file, doc, states, warnings, kinds, o);
      return status;
    }
    const warn = (): number => {
      for (const w of warnings) o.err(cliMsg.warning(w));
      return status;
    };
    if (o.stream === undefined) {
      o.out([...reportPieces(states)].join(''));
      return warn();
    }
    // the same text and ending newline as `out` would print, written as it is made
    const helper = o.helperScript === undefined ? undefined : new ColumnTextHelper(o.helperScript);
    return writePieces(reportPieces(states, COLUMN_SLICE, helper), o.stream, '\n')
      .finally(() => helper?.close())
      .then(warn);
  } catch (err) {
    if (err instanceof CliFailure) {
      o.err(visible(cliMsg.failure(err.message)));
      return 2;
    }
    throw err;
  }
}
