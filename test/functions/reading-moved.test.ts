/**
 * The decimal reading of a column that an edit made from another takes over the other's
 * arrays (src/functions/columns.ts `readingOf`, src/stats/decimal/shift.ts
 * `readDecimalsAgainInPlace`): the edited column must read as if read afresh, and the column
 * it came from, analysed again afterwards, must still give its own values.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { responseOf } from '../../src/functions/columns.ts';
import { noteColumnChange } from '../../src/lang/column-changes.ts';
import { numberColumn } from '../../src/lang/values.ts';
import { readDecimals, readDecimalsAgainInPlace, shiftDecimals, shiftReading, shiftReadingBorrowed, type DecimalReading } from '../../src/stats/decimal/index.ts';

const text = fc.oneof(
  fc.constantFrom('0', '-0', '1.5', '1000000000000.4', '1e-7', ' 42 ', '12345678901234567890123', '40.10', '40.1'),
  fc.integer({ min: -10_000_000, max: 10_000_000 }).map((k) => (k / 1000).toString()),
);

/** The texts with the changes made, and the rows changed, in the order of the changes. */
function edited(texts: readonly string[], changes: readonly (readonly [number, string])[]): { next: string[]; rows: number[] } {
  const next = texts.slice();
  const rows = changes.map(([at, t]) => {
    next[at % texts.length] = t;
    return at % texts.length;
  });
  return { next, rows };
}

/** Expects a reading read again to be the reading of the texts read afresh. */
function expectSameReading(moved: DecimalReading, full: DecimalReading): void {
  expect(Array.from(moved.values)).toEqual(Array.from(full.values));
  expect(Array.from(moved.significand)).toEqual(Array.from(full.significand));
  expect(Array.from(moved.scale)).toEqual(Array.from(full.scale));
}

describe('a reading taken over by the edited column', () => {
  it('reads the edited column as a fresh reading would', () => {
    fc.assert(
      fc.property(fc.array(text, { minLength: 1, maxLength: 30 }), fc.array(fc.tuple(fc.nat(), text), { maxLength: 4 }), (texts, changes) => {
        const { next, rows } = edited(texts, changes);
        expectSameReading(readDecimalsAgainInPlace(readDecimals(texts), next, rows), readDecimals(next));
      }),
      { numRuns: 300, seed: 20261202 },
    );
  });

  it('reads the changed texts from where the edit gives them, when it gives them apart', () => {
    fc.assert(
      fc.property(fc.array(text, { minLength: 1, maxLength: 30 }), fc.array(fc.tuple(fc.nat(), text), { maxLength: 4 }), (texts, changes) => {
        const { next, rows } = edited(texts, changes);
        // the changed texts as ranges of a short text of their own, in the order of rows
        let source = '#';
        const from: number[] = [];
        const to: number[] = [];
        for (const r of rows) {
          from.push(source.length);
          source += next[r]!;
          to.push(source.length);
          source += '|';
        }
        const changed = { source, from: Int32Array.from(from), to: Int32Array.from(to) };
        // the column's own texts are never read for the changed rows: spoil them there
        const spoiled = next.map((t, i) => (rows.includes(i) ? 'not read' : t));
        expectSameReading(readDecimalsAgainInPlace(readDecimals(texts), spoiled, rows, changed), readDecimals(next));
      }),
      { numRuns: 300, seed: 20261203 },
    );
  });

  it('lends a sum its reading without copying it, and gives the same values as a copy', () => {
    fc.assert(
      fc.property(fc.array(text, { minLength: 1, maxLength: 30 }), (texts) => {
        const reading = readDecimals(texts);
        const scratch = new Float64Array(texts.length);
        const lent = shiftReadingBorrowed(reading, scratch);
        const copied = shiftReading(reading);
        expect(lent.offset).toBe(copied.offset);
        expect(Array.from(lent.shifted)).toEqual(Array.from(copied.shifted));
        // nothing new: the reading's own values, or the scratch array when shifted
        expect(lent.shifted).toBe(lent.offset === 0 ? reading.values : scratch);
        // and the reading is left as it was
        expect(Array.from(reading.values)).toEqual(Array.from(readDecimals(texts).values));
      }),
      { numRuns: 300, seed: 11 },
    );
    expect(() => shiftReadingBorrowed(readDecimals(['1', '2']), new Float64Array(3))).toThrow(RangeError);
  });

  it('leaves the column it came from giving its own values when analysed again', () => {
    fc.assert(
      fc.property(fc.array(text, { minLength: 2, maxLength: 30 }), fc.nat(), text, (texts, at, t) => {
        const row = at % texts.length;
        const next = texts.slice();
        next[row] = t;
        const values = (xs: string[]) => Float64Array.from(xs, (x) => Number(x));
        const base = numberColumn(values(texts), null, 'y', texts);
        const edited = numberColumn(values(next), null, 'y', next);
        noteColumnChange(edited, base, Int32Array.of(row));
        const first = responseOf(base, null); // the base's reading is now cached
        const after = responseOf(edited, null); // takes it over
        const direct = shiftDecimals(next);
        expect(after.offset).toBe(direct.offset);
        expect(Array.from(after.y)).toEqual(Array.from(direct.shifted));
        // the base, analysed again, is read afresh: the same as the first time
        const again = responseOf(base, null);
        expect(again.offset).toBe(first.offset);
        expect(Array.from(again.y)).toEqual(Array.from(first.y));
        expect(Array.from(again.y)).toEqual(Array.from(shiftDecimals(texts).shifted));
      }),
      { numRuns: 300, seed: 7 },
    );
  });
});
