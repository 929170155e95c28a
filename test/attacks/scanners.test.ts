/**
 * Every scanner over user text is linear: each one here reads a 1 MB adversarial input within a
 * time bound (generous: CI shares two cores) and ends in a value or a plain error. The note
 * splitter, the Markdown bounds, the chart-title reader and the decimal patterns have theirs
 * beside their own tests and in the attack table.
 */
import { describe, expect, it } from 'vitest';
import { parseCsv } from '../../src/doc/csv.ts';
import { CsvError } from '../../src/doc/csv-error.ts';
import { DocumentError, readDocument } from '../../src/doc/format.ts';
import { headerFields } from '../../src/doc/document.ts';
import { LangError } from '../../src/lang/errors.ts';
import { tokenize } from '../../src/lang/lexer.ts';
import { parseStatement } from '../../src/lang/parser.ts';

const MB = 1_000_000;
const BOUND_MS = 5000;

function bounded(f: () => void): void {
  const t0 = performance.now();
  f();
  expect(performance.now() - t0).toBeLessThan(BOUND_MS);
}

/** Runs a reader that may throw one of the expected errors. */
function endsPlainly(f: () => unknown, ...errors: (new (...a: never[]) => Error)[]): void {
  bounded(() => {
    try {
      f();
    } catch (err) {
      if (!errors.some((e) => err instanceof e)) throw err;
    }
  });
}

describe('the formula lexer and parser', () => {
  const inputs: [string, string][] = [
    ['digits', `x = ${'9'.repeat(MB - 4)}`],
    ['a name', `x = ${'a'.repeat(MB - 4)}`],
    ['an unclosed text', `x = "${'a'.repeat(MB - 5)}`],
    ['escapes', `x = "${'\\"'.repeat(MB / 2 - 3)}"`],
    ['operators', `x = 1${' +1'.repeat(MB / 3 - 2)}`],
    ['a number glued to letters', `x = ${'1e'.repeat(MB / 2 - 2)}`],
    ['comments', `x = 1 ${'#'.repeat(MB - 6)}`],
    ['dots', `x = a${'.b'.repeat(MB / 2 - 3)}`],
  ];
  for (const [what, text] of inputs) {
    it(`1 MB of ${what}`, () => {
      endsPlainly(() => tokenize(text), LangError);
      endsPlainly(() => parseStatement(text), LangError);
    });
  }
});

describe('the document reader', () => {
  const inputs: [string, string][] = [
    ['marker-like lines', `furrow 1\n${'--- formula\n'.repeat(MB / 12)}`],
    ['escaped marker lines', `furrow 1\n--- note\n${'\\\\\\--- x\n'.repeat(MB / 9)}`],
    ['header lines', `furrow 1\n${'key: value\n'.repeat(MB / 11)}`],
    ['carriage returns', `furrow 1\n--- note\n${'\r'.repeat(MB)}`],
    ['one long line', `furrow 1\n--- note\n${'-'.repeat(MB)}`],
    ['no first line', `${'furrow '.repeat(MB / 7)}`],
  ];
  for (const [what, text] of inputs) {
    it(`1 MB of ${what}`, () => {
      endsPlainly(() => readDocument(text), DocumentError);
      bounded(() => headerFields({ bom: false, firstLine: 'furrow 1', firstEol: '\n', header: text, cells: [] }));
    });
  }
});

describe('the CSV reader', () => {
  const inputs: [string, string][] = [
    ['an unclosed quote', `a,b\n"${'x'.repeat(MB)}`],
    ['quotes', `a\n${'""'.repeat(MB / 2)}`],
    ['commas', `a\n${','.repeat(MB)}`],
    ['short rows', `a,b\n${'1\n'.repeat(MB / 2)}`],
    ['blank lines', `a\n${'\n'.repeat(MB)}`],
    ['one huge field', `a\n${'9'.repeat(MB)}x`],
  ];
  for (const [what, text] of inputs) {
    it(`1 MB of ${what}`, () => endsPlainly(() => parseCsv(text), CsvError));
  }
});
