/**
 * The columnar CSV reader (src/doc/csv-fields.ts, src/doc/csv-columns.ts) against the reader
 * it replaces for tables (parseCsv through papaparse, columns from one string per field), on
 * generated texts: quotes, doubled quotes, line breaks and commas inside quotes, CRLF, lone
 * carriage returns, empty fields and lines, ragged rows, unclosed and malformed quotes, spaces
 * after a closing quote, a byte-order mark. Same fields and row ranges, or the same error
 * (same words, so the same kind and the same row) at the same range; then the same table,
 * bit for bit, with the same decimal texts.
 *
 * Seeded with the project's generator, so a failure names an input that can be replayed.
 */
import { describe, expect, it } from 'vitest';
import { parseCsv } from '../../src/doc/csv.ts';
import { CsvError, type CsvGrid } from '../../src/doc/csv-error.ts';
import { fieldText, readFieldGrid, rowRange, type FieldGrid } from '../../src/doc/csv-fields.ts';
import { tableOfGrid } from '../../src/doc/csv-columns.ts';
import { tableFromGrid } from '../../cells/table/model.ts';
import { Draws } from '../../src/stats/planning/draws.ts';
import { decimalAt, type Column, type Table } from '../../src/lang/values.ts';

const FIELDS = [
  '', '', '1', '2.5', '-0', '+.5', '1e3', '-2.5E-3', '007', '1.', '.', 'x', 'a b', 'true', 'false', ' true ', 'TRUE',
  ' 7 ', '\t3', '1000000000000.4', '12345678901234567890.5', '1e400', 'NaN', '0x10', '1,5', '\u00a02\u00a0', 'é',
  '"q"', '"a,b"', '"x""y"', '""', '"line\nbreak"', '"cr\r\nlf"', '"2.5"', '"open', '"closed"junk', '"sp"  ', '"sp" \t',
  '"', 'a"b', ' "lead"', '"""', '"a""', '"true"',
];
const BREAKS = ['\n', '\n', '\n', '\r\n', '\r\n', '\r'];

/** A generated CSV text: a header and rows, mostly one shape, sometimes ragged or broken. */
function generate(d: Draws): string {
  const pick = <T>(xs: readonly T[]): T => xs[d.below(xs.length)]!;
  const width = 1 + d.below(4);
  const rows = d.below(8);
  const mainBreak = pick(BREAKS);
  const lines: string[] = [];
  const names = Array.from({ length: width }, (_, j) => (d.below(20) === 0 ? pick(['', 'c0', ' c1 ', '"h,1"']) : `c${j}`));
  lines.push(names.join(','));
  for (let r = 0; r < rows; r++) {
    if (d.below(12) === 0) {
      lines.push('');
      continue;
    }
    const w = d.below(10) === 0 ? 1 + d.below(5) : width;
    const fields = Array.from({ length: w }, () => (d.below(3) === 0 ? pick(FIELDS) : randomField(d)));
    lines.push(fields.join(','));
  }
  let text = '';
  for (const line of lines) text += line + (d.below(10) === 0 ? pick(BREAKS) : mainBreak);
  if (d.below(3) === 0) text = text.slice(0, text.length - d.below(3));
  if (d.below(25) === 0) text = `\ufeff${text}`;
  return text;
}

/** A short field of characters that matter to a CSV reader. */
function randomField(d: Draws): string {
  const alphabet = ['1', '2', '.', '-', 'e', ' ', 'a', '"', ',', '\n', '\r', '0', 't', '\t'];
  const n = d.below(5);
  let s = '';
  for (let i = 0; i < n; i++) s += alphabet[d.below(d.below(4) === 0 ? alphabet.length : 7)]!;
  return s;
}

type Reading<G> = { grid: G } | { error: CsvError };

function read<G>(f: () => G): Reading<G> {
  try {
    return { grid: f() };
  } catch (e) {
    if (e instanceof CsvError) return { error: e };
    throw e;
  }
}

/** Fails unless two columns hold the same type, values (bit for bit), missing marks and texts. */
function expectSameColumn(a: Column, b: Column, where: string): void {
  expect(b.type, where).toBe(a.type);
  expect(b.name, where).toBe(a.name);
  expect(Array.from(b.missing ?? []), where).toEqual(Array.from(a.missing ?? []));
  if (a.type === 'number' && b.type === 'number') {
    expect(b.values.length, where).toBe(a.values.length);
    for (let i = 0; i < a.values.length; i++) {
      if (!Object.is(a.values[i], b.values[i])) throw new Error(`${where}: value ${i} is ${b.values[i]}, not ${a.values[i]}`);
      expect(decimalAt(b.decimals!, i), where).toBe(decimalAt(a.decimals!, i));
    }
  } else {
    expect(Array.from(b.values as ArrayLike<unknown>), where).toEqual(Array.from(a.values as ArrayLike<unknown>));
  }
}

/** Fails unless the two readers agree on `text`; returns what kind of outcome it was. */
function compare(text: string): 'table' | 'error' {
  const where = JSON.stringify(text);
  const before = read<CsvGrid>(() => parseCsv(text));
  const after = read<FieldGrid>(() => readFieldGrid(text));
  // papaparse drops a byte-order mark before reading, so the old ranges of a text that has
  // one count from the wrong place (and trim line breaks in the wrong text): ranges are
  // compared on texts without a mark only; ours point into the text as it is
  const bom = text.charCodeAt(0) === 0xfeff;
  const expectRange = (ours: readonly number[], old: readonly number[]): void => {
    if (!bom) expect(ours, where).toEqual(old);
  };
  if ('error' in before) {
    if (!('error' in after)) throw new Error(`${where}: papaparse refused it (${before.error.message}), ours read it`);
    expect(after.error.message, where).toBe(before.error.message);
    expectRange([after.error.from, after.error.to], [before.error.from, before.error.to]);
    return 'error';
  }
  if ('error' in after) throw new Error(`${where}: ours refused it (${after.error.message}), papaparse read it`);
  const a = before.grid;
  const b = after.grid;
  expect(b.header, where).toEqual(a.header);
  expect(b.rows, where).toBe(a.rows.length);
  for (let r = 0; r < a.rows.length; r++) {
    expectRange(rowRange(b, r), a.rowRanges[r]!);
    for (let j = 0; j < a.header.length; j++) expect(fieldText(b, r, j), where).toBe(a.rows[r]![j]);
  }
  const ta: Table = tableFromGrid(a);
  const tb: Table = tableOfGrid(b);
  for (let j = 0; j < ta.columns.length; j++) expectSameColumn(ta.columns[j]!, tb.columns[j]!, `${where}, column ${j}`);
  return 'table';
}

describe('the columnar CSV reader reads as papaparse does', () => {
  it('on 4,000 generated texts: same fields, same errors, same columns', () => {
    const d = new Draws(20261202);
    const seen = { table: 0, error: 0 };
    for (let k = 0; k < 4000; k++) seen[compare(generate(d))]++;
    // both outcomes must be well represented, or the comparison says little
    expect(seen.table).toBeGreaterThan(800);
    expect(seen.error).toBeGreaterThan(800);
    console.log(`    compared: ${seen.table} texts read as tables, ${seen.error} refused with the same error`);
  });

  it('on texts chosen by hand at the edges of the rules', () => {
    const texts = [
      '',
      '\ufeff',
      '\n\n',
      'a\n',
      'a',
      'a,b\n1,2',
      'a,b\r\n1,2\r\n',
      'a,b\r1,2\r',
      'a,b\n1,2\r\n3,4\n',
      'a,b\r\n1\n2,3\r\n',
      'a\n""\n\n1\n',
      'a,b\n"x"  ,2\n',
      'a,b\n"x"  \n',
      'a,b\n"x" y,2\n',
      'a,b\n"open,2\n',
      'a,b\n1,"a""b"\n',
      'a,b\n1,"a""\n',
      'a,b\n1,2,3\n4,"open\n',
      '"h""1",b\n1,2\n',
      'a,a\n1,2\n',
      ' ,b\n1,2\n',
      'x\n-0\n+0\n-0.0e5\n',
      'x\n1e-400\n',
      'x\n123456789012345678901234567890\n',
      'x\n true\n\tfalse \n',
      'x\n"1"\n2\n',
    ];
    for (const t of texts) compare(t);
  });
});

describe('the columnar CSV reader is linear', () => {
  // a generous bound (two shared cores): a reader that went quadratic on any of these takes minutes
  const MB = 1_000_000;
  const inputs: [string, string][] = [
    ['an unclosed quote', `a,b\n"${'x'.repeat(MB)}`],
    ['doubled quotes', `a\n${'""'.repeat(MB / 2)}`],
    ['commas', `a\n${','.repeat(MB)}`],
    ['short rows', `a,b\n${'1\n'.repeat(MB / 2)}`],
    ['blank lines', `a\n${'\n'.repeat(MB)}`],
    ['one huge field', `a\n${'9'.repeat(MB)}x`],
    ['quotes closed and followed by spaces and text', `a\n${'"x"   y'.repeat(MB / 7)}`],
    ['closing quotes with no comma or break after', `a\n"${'x" '.repeat(MB / 3)}`],
    ['quoted fields, no line break', `${'"1",'.repeat(MB / 4)}"1"`],
    ['carriage returns', `a,b\r${'1,2\r\n'.repeat(MB / 5)}`],
    ['many distinct texts', `a\n${Array.from({ length: MB / 8 }, (_, i) => `t${i}`).join('\n')}`],
  ];
  for (const [what, text] of inputs) {
    it(`1 MB of ${what}`, () => {
      const t0 = performance.now();
      try {
        tableOfGrid(readFieldGrid(text));
      } catch (err) {
        if (!(err instanceof CsvError)) throw err;
      }
      expect(performance.now() - t0).toBeLessThan(5000);
    });
  }
});
