/**
 * The words of the command line: its usage, its complaints about arguments and files, and
 * the lines `furrow run`, `seal`, `report` and `sheet` print. Plain words: what is wrong,
 * where, and what to do. (The verdict `verify` prints is worded in ./seal.ts.)
 */
import { listWords } from './words.ts';
const MB = 1024 * 1024;
const size = (bytes: number): string => (bytes >= MB ? `${(bytes / MB).toFixed(bytes >= 10 * MB ? 0 : 1)} MB` : `${bytes} bytes`);
const capital = (s: string): string => s.charAt(0).toUpperCase() + s.slice(1);
const lower = (s: string): string => s.charAt(0).toLowerCase() + s.slice(1);
const count = (n: number, one: string, many: string): string => `${n} ${n === 1 ? one : many}`;

const USAGE = `Usage: furrow run FILE [--json]
       furrow seal FILE
       furrow verify FILE
       furrow report FILE -o OUT.html
       furrow sheet FILE NAME [-o plan.csv]

  run FILE          evaluate a .furrow document and print every cell
  run FILE --json   the same, as one JSON object (see the README)
  seal FILE         append (or replace) the sealed section: every named value,
                    the claims, the engine's version and the fingerprint
  verify FILE       recompute a sealed document and say what differs
  report FILE -o OUT.html
                    write one self-contained HTML report of the document (a file
                    at OUT.html that is not a report is kept unless --replace)
  sheet FILE NAME   a layout as a run sheet (CSV); furrow sheet --help for more

Exit status: 0 when every cell evaluated (seal), everything matches (verify)
or the report was written; 1 when a cell holds an error, or verify finds a
difference; 2 when the file cannot be read as a document.`;

export const cliMsg = {
  // ---- files ---------------------------------------------------------------------------
  /** How the messages below name the document itself and a CSV file beside it. */
  theDocument: () => 'the file',
  theCsvFile: () => 'the CSV file',
  noSuchFile: (what: string, path: string) => `${capital(what)} ${path} does not exist.`,
  permissionDenied: (what: string, path: string) => `${capital(what)} ${path} cannot be read (permission denied).`,
  isFolder: (what: string, path: string) => `${capital(what)} ${path} is a folder, not a file.`,
  unreadable: (what: string, path: string, detail: string) => `${capital(what)} ${path} cannot be read: ${detail}`,
  notRegular: (what: string, path: string) =>
    `${capital(what)} ${path} is not a regular file (a device, a pipe or a socket), so it is not read.`,
  tooLarge: (what: string, path: string, limit: number) =>
    `${capital(what)} ${path} is larger than the ${size(limit)} that Furrow reads. Split the data, or keep the measurements the analysis needs.`,
  notUtf8: (what: string, path: string) => `${capital(what)} ${path} is not UTF-8 text.`,
  outsideFolder: (name: string) =>
    `${name} leads outside the document's folder (through a link), so it is not read: a document may read only files in its own folder.`,
  /** A document that cannot be read: the reader's message, after the path. */
  documentProblem: (path: string, detail: string) => `${path}: ${detail}`,
  /** A table's file beside the document that cannot be read (`problem` is a file message above). */
  tableFileProblem: (path: string, heading: string, file: string, problem: string) =>
    `${path}: ${heading} names ${file}, but ${lower(problem)}`,
  /** A warning of the reader, with the line it is about. */
  atLine: (line: number, message: string) => `line ${line}: ${message}`,

  // ---- arguments -----------------------------------------------------------------------
  usage: () => USAGE,
  /** Every failure of a command: one line on standard error. */
  failure: (detail: string) => `furrow: ${detail}`,
  /** A reader's warning on standard error (with --json, where standard output is the JSON). */
  warning: (detail: string) => `furrow: warning, ${detail}`,
  unknownOption: (option: string, usage: string) => `furrow: unknown option ${option}\n\n${usage}`,
  unknownCommand: (command: string, usage: string) => `furrow: unknown command "${command}".\n\n${usage}`,
  takesOneFile: (command: string, usage: string) => `furrow: ${command} takes one file.\n\n${usage}`,
  needsFileName: (option: string, usage: string) => `furrow: ${option} needs a file name.\n\n${usage}`,

  // ---- furrow run ----------------------------------------------------------------------
  documentHeading: (title: string, file: string) => `${title}  (${file})`,
  caution: (text: string) => `Caution: ${text}`,
  headerWarning: (detail: string) => `  warning, ${detail}`,
  cellHeading: (index: number, label: string) => `[${index}] ${label}`,
  cellInert: (index: number, label: string) => `[${index}] ${label}: kept as it is, not evaluated`,
  cellError: (index: number, label: string, upstream: boolean, where: string) =>
    `[${index}] ${label}: ${upstream ? 'depends on an error' : 'error'} at ${where}`,
  placeholderError: (where: readonly string[], message: string) =>
    where.length === 1 ? `placeholder error at ${where[0]}: ${message}` : `placeholder errors at ${listWords(where)}: ${message}`,
  cellNote: (detail: string) => `note: ${detail}`,
  line: (line: number) => `line ${line}`,
  lineColumn: (line: number, column: number) => `line ${line}, column ${column}`,
  runSummary: (cells: number, withError: number) =>
    withError === 0 ? `${cells} cells, all evaluated.` : `${cells} cells, ${withError} with an error.`,
  moreRows: (hidden: number, total: number) => `… ${hidden} more rows (${total} in all)`,
  inAll: (total: number) => `… ${total} in all`,

  // ---- furrow seal ---------------------------------------------------------------------
  sealed: (path: string, values: number, claims: number) =>
    `Sealed ${path}: ${count(values, 'named value', 'named values')} and ${count(claims, 'claim', 'claims')}.`,
  sealedWithErrors: (names: readonly string[]) =>
    `${names.length === 1 ? '1 cell holds an error; it is' : `${names.length} cells hold errors; they are`} sealed as ${names.length === 1 ? 'an error' : 'errors'}: ${names.join(', ')}.`,
  sealedFailingClaims: (statements: readonly string[]) =>
    `${statements.length === 1 ? '1 claim does not hold; it is' : `${statements.length} claims do not hold; they are`} sealed as not holding, and furrow verify will say so: ${statements.map((x) => `"${x}"`).join(', ')}.`,
  /** How a cell without a name is called in a list of cells. */
  unnamedCell: (index: number, kind: string) => `cell ${index} (${kind})`,

  // ---- furrow report -------------------------------------------------------------------
  reportArguments: (usage: string) => `furrow: report takes one file and -o OUT.html.\n\n${usage}`,
  reportOverDocument: () => 'furrow: the report would overwrite the document; name another file after -o.',
  reportWouldOverwrite: (out: string) =>
    `furrow: ${out} already exists and is not a report made by furrow; nothing was written. Name another file after -o, or add --replace to write over it.`,
  reportNotWritten: (out: string, detail: string) => `the report cannot be written to ${out}: ${detail}`,
  reportWritten: (out: string, kilobytes: number) => `Wrote ${out} (${kilobytes} kB).`,

  // ---- furrow sheet --------------------------------------------------------------------
  sheetUsage: (defaults: readonly string[]) => `Usage: furrow sheet FILE NAME [-o plan.csv] [--columns a,b] [--replace]

  Writes the layout NAME of the document FILE (a table, for example one made by
  random_layout) as a run sheet: its columns, then empty columns for the measurements
  (by default: ${defaults.join(', ')}).

  -o FILE          write to FILE instead of standard output
  --columns a,b    the measurement columns, comma-separated
  --replace        write over the file at -o even when it holds something else
                   (without it, a run sheet already filled in is never written over)`,
  sheetFailure: (detail: string) => `furrow sheet: ${detail}`,
  sheetNeedsValue: (option: string, usage: string) => `furrow sheet: ${option} needs a value.\n\n${usage}`,
  sheetUnknownOption: (option: string, usage: string) => `furrow sheet: unknown option ${option}\n\n${usage}`,
  sheetArguments: (usage: string) => `furrow sheet: give one document and the name of one layout in it.\n\n${usage}`,
  sheetNoCell: (file: string, name: string) => `furrow sheet: ${file} has no cell named "${name}".`,
  sheetHoldsError: (name: string, detail: string) => `furrow sheet: "${name}" holds an error: ${detail}`,
  sheetNotTable: (name: string, type: string) =>
    `furrow sheet: "${name}" is ${type}, not a table; a run sheet is made from a layout such as random_layout(...).`,
  sheetNotWritten: (path: string, detail: string) => `furrow sheet: cannot write ${path}: ${detail}`,
  sheetWouldOverwrite: (path: string) =>
    `furrow sheet: ${path} already exists and holds something other than this run sheet (perhaps measurements typed into it); nothing was written. Name another file after -o, or add --replace to write over it.`,
  sheetOverDocument: () => 'furrow sheet: the run sheet would overwrite the document; name another file after -o.',
} as const;
