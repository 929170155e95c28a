/**
 * Every message the language, the graph and the document reader show to a user, in one
 * catalogue, so that wording changes in one place and tests can refer to these builders.
 * Messages are plain words: what is wrong, where, and what to do about it.
 */
import { countText } from '../format/digits.ts';
import { plural, quote } from './words.ts';

export const msg = {
  // ---- lexer ---------------------------------------------------------------------------
  unterminatedText: () => 'This text is never closed: add a closing double quote (") before the end of the line.',
  badEscape: (seq: string) =>
    `Unknown escape ${seq} in text: inside double quotes only \\" (a quote) and \\\\ (a backslash) are escapes.`,
  singleQuote: () => "Text goes in double quotes (\"like this\"), not single quotes.",
  unexpectedCharacter: (ch: string) => `The character ${quote(ch)} has no meaning in a formula.`,
  badNumber: (text: string) => `${quote(text)} is not a number: write numbers like 12, 0.5 or 1e-3.`,
  formulaTooLong: (length: number, limit: number) =>
    `This formula is ${plural(length, 'character')} long; formulas are limited to ${countText(limit)}. Put large data in a table cell instead.`,

  // ---- parser --------------------------------------------------------------------------
  emptyFormula: () => 'This formula cell is empty: write an expression, or NAME = EXPRESSION to name a value.',
  expectedExpression: (found: string) => `A value was expected here, but the formula has ${found}.`,
  expectedAfterOperator: (op: string) => `The operator ${quote(op)} needs a value after it.`,
  unclosed: (open: string, close: string) => `This ${quote(open)} is never closed: add a matching ${quote(close)}.`,
  missingAfterComma: (what: 'argument' | 'element', where: string) =>
    `An ${what} is missing after this comma in the ${where}: write one, or remove the comma.`,
  unmatchedClose: (close: string) => `This ${quote(close)} has no matching opening bracket.`,
  expectedCloseAfter: (close: string, what: string) => `Expected ${quote(close)} to close the ${what} here.`,
  chainedComparison: () => 'Comparisons cannot be chained: write (a < b) and (b < c) instead of a < b < c.',
  notNeedsBrackets: () => 'Put "not ..." in brackets here, for example -(not x) or (not a) == b.',
  trailingInput: (found: string) =>
    `The formula should end here, but it goes on with ${found}. A formula cell holds one statement.`,
  tooDeep: (limit: number) =>
    `This formula is nested more than ${limit} levels deep. Split it into several cells with names.`,
  callOnlyNames: () => 'Only built-in functions can be called, by name, as in mean(x).',
  namedBeforePositional: (name: string) =>
    `The argument after ${quote(`${name}:`)} has no name: positional arguments come before named ones.`,
  duplicateNamedArgument: (name: string) => `The argument ${quote(name)} is given twice.`,
  memberNeedsName: () => 'A field or column name is expected after the dot.',
  assignToNonName: () => 'Only a name can be defined: write NAME = EXPRESSION.',
  reservedName: (name: string) => `${quote(name)} is a reserved word and cannot be used as a name.`,
  singleEquals: () => 'A single = defines a name and may appear only once, at the start (NAME = ...). To compare, write ==.',

  // ---- evaluation ----------------------------------------------------------------------
  unknownName: (name: string, suggestion: string | null) =>
    `There is no cell or table called ${quote(name)}.${suggestion ? ` Did you mean ${suggestion}?` : ''}`,
  functionAsValue: (name: string) => `${quote(name)} is a built-in function: call it, as in ${name}(...).`,
  unknownFunction: (name: string, suggestion: string | null) =>
    `There is no function called ${quote(name)}.${suggestion ? ` Did you mean ${suggestion}?` : ''}`,
  notAFunction: (name: string) => `${quote(name)} is a cell's value, not a function: only built-in functions can be called.`,
  upstream: (name: string) => `This cell reads ${quote(name)}, which has an error.`,
  duplicateUpstream: (name: string) => `${quote(name)} is defined by more than one cell, so this cell cannot tell which to read.`,
  cycleUpstream: (name: string) => `${quote(name)} is part of a cycle, so it has no value.`,
  duplicateDefinition: (name: string, count: number) =>
    `The name ${quote(name)} is defined by ${count} cells. Give each a different name.`,
  /** `path` is the whole cycle, or its first cells when `size` (the cells in it) is given. */
  cycle: (path: readonly string[], size: number | null = null) =>
    `These cells depend on each other in a cycle (${path.join(' → ')}${size === null ? '' : ` → … ${size} cells in all`}), so none of them can be computed. Break the cycle by changing one of them.`,
  lengthMismatch: (op: string, a: number, b: number) =>
    `The two sides of ${quote(op)} are columns of different lengths (${a} and ${b}); element by element work needs equal lengths.`,
  operatorTypes: (op: string, left: string, right: string) =>
    `${quote(op)} cannot combine ${left} with ${right}.`,
  operatorType: (op: string, operand: string) => `${quote(op)} cannot be applied to ${operand}.`,
  compareTypes: (left: string, right: string) => `Cannot compare ${left} with ${right}.`,
  noField: (name: string, fields: readonly string[], suggestion: string | null) =>
    `This record has no field ${quote(name)}.${suggestion ? ` Did you mean ${suggestion}?` : ''} Its fields are: ${fields.join(', ')}.`,
  noColumn: (table: string, name: string, suggestion: string | null) =>
    `The table${table ? ` ${quote(table)}` : ''} has no column ${quote(name)}.${suggestion ? ` Did you mean ${suggestion}?` : ''}`,
  memberOf: (what: string) => `${what} has no fields or columns to pick with a dot.`,
  indexOutOfRange: (i: number, n: number) =>
    `Position ${i} is outside this column, which has ${plural(n, 'element')} (positions count from 1).`,
  indexNotWhole: (i: number) => `Positions are whole numbers counted from 1; ${i} is not one.`,
  maskLength: (mask: number, n: number) =>
    `The condition has ${plural(mask, 'element')} but the values it picks from have ${n}; they must be the same length.`,
  cannotIndex: (what: string, by: string) => `Cannot pick from ${what} with ${by}.`,
  mixedList: () => 'A list holds values of one kind: all numbers, all texts or all booleans.',
  listElement: (what: string) => `A list can hold numbers, texts or booleans, not ${what}.`,
  missingCondition: () => 'The condition is missing, so it is neither true nor false.',

  // ---- calls ---------------------------------------------------------------------------
  tooManyArguments: (fn: string, max: number, given: number, params: readonly string[]) =>
    `${fn} takes at most ${plural(max, 'argument')} (${params.join(', ')}), but ${given} were given.`,
  missingArgument: (fn: string, param: string, signature: string) =>
    `${fn} needs the argument ${quote(param)}: ${signature}.`,
  unknownArgument: (fn: string, name: string, params: readonly string[], suggestion: string | null) =>
    `${fn} has no argument called ${quote(name)}.${suggestion ? ` Did you mean ${suggestion}?` : ''} Its arguments are ${params.join(', ')}.`,
  argumentTwice: (fn: string, name: string) => `${fn}: the argument ${quote(name)} is given both by position and by name.`,
  /** `got` is a noun phrase ("a text"), or a whole clause when it starts with "the column". */
  wrongType: (fn: string, param: string, expected: string, got: string) =>
    got.startsWith('the column ') ? `${fn}: ${param} must be ${expected}, but ${got}.` : `${fn}: ${param} must be ${expected}, but it is ${got}.`,
  internal: (fn: string, detail: string) =>
    `${fn} failed unexpectedly (${detail}). This is a fault in Furrow, not in the document; please report it.`,

  // ---- tables --------------------------------------------------------------------------
  raggedRow: (row: number, got: number, expected: number) =>
    `Row ${row} has ${plural(got, 'field')}, but the header has ${expected}. Every row needs one field per column.`,
  duplicateHeader: (name: string, first: number, again: number) =>
    `The header names the column ${quote(name)} twice (columns ${first} and ${again}). Give each column its own name.`,
  emptyHeader: (column: number) => `Column ${column} has no name in the header row.`,
  emptyTable: () => 'This table has no header row.',
  csvQuote: (row: number) => `Row ${row} has a quoted field that is never closed.`,
  csvProblem: (row: number, detail: string) => `Row ${row} cannot be read as CSV: ${detail}.`,
  badTableName: (name: string) =>
    `${quote(name)} cannot name a table: a name starts with a letter or _, followed by letters, digits or _.`,
  missingTableName: () => 'This table has no name: write --- table NAME.',
  csvFileMissing: (file: string) => `The CSV file ${quote(file)} that this table names is not beside the document.`,
  csvFileUnsafe: (file: string) =>
    `The CSV file name ${quote(file)} is not allowed: a table may only name a file in the document's own folder.`,
  notNumbers: (column: string, row: number, text: string) =>
    `the column ${quote(column)} holds text: row ${row} is ${quote(text)}, which is not a number`,
  notNumbersUnnamed: (row: number, text: string) =>
    `the column holds text: element ${row} is ${quote(text)}, which is not a number`,

  // ---- documents -----------------------------------------------------------------------
  notADocument: () => 'This is not a Furrow document: its first line must be "furrow 1".',
  lookalikeColumns: (shown: string, codes: readonly string[]) =>
    `Columns that read the same, ${quote(shown)}, differ by ${codes.length > 0 ? `an invisible character (${codes.join(', ')})` : 'how their letters are encoded'}. Rename one, so a reader can tell them apart.`,
  invisibleInColumn: (shown: string, codes: readonly string[]) =>
    `The column ${quote(shown)} holds an invisible character (${codes.join(', ')}) in its name; to use it, write the name with that character, or rename the column.`,
  tooManyLevelsToDraw: (levels: number, limit: number) =>
    `this fit has ${countText(levels)} levels; a chart draws at most ${countText(limit)} (more cannot be read, and would stall the drawing). The fit's means table lists them all.`,
  tooManyPairsToDraw: (pairs: number, limit: number) =>
    `there are ${countText(pairs)} pairs; a chart draws at most ${countText(limit)} (about 63 levels). The pairs table lists them all, and means_chart shows the levels side by side.`,
  levelNotInOrder: (column: string, levels: readonly string[]) =>
    `${quote(column)} has ${levels.length === 1 ? 'a level' : 'levels'} that its level_order does not list: ${levels.map((l) => quote(l)).join(', ')}. List every level.`,
  orderRepeats: (level: string) => `${quote(level)} is listed twice; list each level once.`,
  orderUnknown: (column: string, levels: readonly string[]) =>
    `${quote(column)} has no level ${levels.map((l) => quote(l)).join(', ')}; list only levels that appear in it.`,
  exactFit: () =>
    'The model fits every observation exactly (the error sum of squares is zero to rounding); there is no error to test against, so F, p, standard errors and intervals are not available.',
  allMeasurementsEqual: () =>
    'Every measurement is the same; there is no variation to analyse, so F, p, standard errors and intervals are not available.',
  exactFitNoComparison: () =>
    'this fit leaves no error to compare against (it fits every observation exactly), so a difference has no standard error or interval. The means themselves are in the fit.',
  exactFitResiduals: () =>
    'The residuals are all zero (to rounding): the model fits every observation exactly, so there is nothing to check.',
  pairedAllEqual: (n: number, value: string) =>
    `All ${n} differences are ${value}: with no variation among them there is nothing to test against, so t, p and the interval are not available.`,
  tooManyRows: (rows: number, limit: number) =>
    `This table has ${countText(rows)} rows; a table holds at most ${countText(limit)}. Keep the rows the analysis needs, or summarize them first.`,
  tooManyColumns: (cols: number, limit: number) =>
    `This table has ${countText(cols)} columns; a table holds at most ${countText(limit)}. Keep the columns the analysis needs.`,
  tooManyPlaceholders: (count: number, limit: number) =>
    `This note has ${countText(count)} placeholders (a { opens each); a note shows at most ${countText(limit)} live values. Split it into several notes, or write \\{ for a brace that is not a placeholder. It is shown as plain text until then.`,
  tooManyCells: (cells: number, limit: number) =>
    `This document has ${countText(cells)} cells; Furrow reads at most ${countText(limit)}. Split it into several documents.`,
  firstLineSpacing: (line: string) =>
    `The first line must be exactly "furrow 1"; this one is ${JSON.stringify(line)}, with extra spaces or tabs. Remove them and open the file again.`,
  wrongVersion: (version: string) =>
    `This document is in format version ${version}; this version of Furrow reads version 1.`,
  unknownCellKind: (kind: string) => `Unknown cell kind ${quote(kind)}: the cell is kept as it is and not evaluated.`,
  unknownHeaderKey: (key: string) => `Unknown header key ${quote(key)}: kept as it is.`,
  headerLine: (line: number) => `Line ${line} of the header is not of the form key: value; it is kept as it is.`,
  badMarker: (marker: string) => `The cell line ${quote(`--- ${marker}`)} has extra words; they are kept but ignored.`,
  // ---- units (convert) ---------------------------------------------------------------------
  unknownUnit: (unit: string) =>
    `${quote(unit)} is not a unit Furrow knows. Write units as in the SI, joined by / * and ^ (for example "t/ha", "kg/m^2", "MPa", "degC"); a header's unit goes in parentheses at its end, such as "yield (t/ha)".`,
  unitWithNumber: (unit: string) =>
    `${quote(unit)} holds a number; give only the unit (for example "kg/ha"), and the values as the first argument.`,
  incompatibleUnits: (from: string, to: string) =>
    `${quote(from)} cannot be converted to ${quote(to)}: they measure different quantities. Check both units (for example a mass per area, "t/ha", converts to "kg/ha" or "g/m^2", not to "kg").`,
  noTargetUnit: () =>
    'Say which unit to convert to: convert(x, "t/ha", "kg/ha"), or convert(x, to: "kg/ha") when x is a column whose header ends with its unit in parentheses.',
  noSourceUnit: (column: string | null) =>
    `${column === null ? 'These values carry' : `The column ${quote(column)} carries`} no unit: give the unit they are in, as in convert(x, "t/ha", "kg/ha") (a header can also carry it, as "yield (t/ha)").`,
  headerUnitDiffers: (column: string, header: string, given: string) =>
    `The header of ${quote(column)} says its unit is ${quote(header)}, but convert was told ${quote(given)}. Leave the unit out to use the header's, or correct the one that is wrong.`,
  unitsUnavailable: () =>
    'The unit tables are not loaded in this place, so convert cannot run here. Run the document with the furrow command line or in the page.',
} as const;
