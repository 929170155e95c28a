/**
 * The CSV writer (src/doc/csv-write.ts) against papaparse's `unparse`, which wrote table
 * bodies, run sheets and converted Parquet files before: the same text for the same fields,
 * on generated tables of awkward fields (seeded, bounded). One column is held by reading the
 * text back instead: there the writer quotes an empty field so that its line does not read
 * as a separator between cells.
 */
import fc from 'fast-check';
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { parseCsv } from '../../src/doc/csv.ts';
import { csvField, writeCsv } from '../../src/doc/csv-write.ts';

// the characters that decide quoting, and a few that must pass through untouched
const field = fc.array(fc.constantFrom('a', 'b', '1', '.', ' ', ',', '"', '\n', '\r', '\uFEFF', '\t', 'é', '—', '=', '-', "'"), { maxLength: 6 }).map((cs) => cs.join(''));

const papa = (header: string[], rows: string[][]): string => `${Papa.unparse([header, ...rows], { newline: '\n', quotes: false, delimiter: ',' })}\n`;

describe('writing CSV', () => {
  it('writes what papaparse wrote, field for field, for two columns and more', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 2, max: 5 }).chain((width) =>
          fc.tuple(fc.array(field, { minLength: width, maxLength: width }), fc.array(fc.array(field, { minLength: width, maxLength: width }), { maxLength: 8 })),
        ),
        ([header, rows]) => {
          expect(writeCsv(header, rows)).toBe(papa(header, rows));
        },
      ),
      { seed: 20261202, numRuns: 2000 },
    );
  });

  it('quotes a field as papaparse does', () => {
    for (const f of ['', 'plain', ' lead', 'trail ', 'in side', 'a,b', 'say "hi"', 'two\nlines', 'cr\r', '\uFEFFmark', '=1+2']) {
      expect(csvField(f), JSON.stringify(f)).toBe(Papa.unparse([[f, 'x']], { quotes: false }).slice(0, -2));
    }
  });

  it('reads back what it wrote, one column included (an empty field is written "")', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 4 }), fc.array(fc.array(field.filter((s) => !s.includes('\r') && !s.includes('\uFEFF')), { minLength: 4, maxLength: 4 }), { minLength: 1, maxLength: 8 }), (width, wide) => {
        const header = ['h1', 'h2', 'h3', 'h4'].slice(0, width);
        const rows = wide.map((r) => r.slice(0, width));
        expect(parseCsv(writeCsv(header, rows)).rows).toEqual(rows);
      }),
      { seed: 7, numRuns: 1000 },
    );
    // a blank line inside a quoted field of a one-column table stays the field's own
    expect(parseCsv(writeCsv(['note'], [['first\n\nsecond'], ['']])).rows).toEqual([['first\n\nsecond'], ['']]);
  });
});
