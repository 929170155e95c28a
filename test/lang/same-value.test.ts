/**
 * sameValue (src/lang/values.ts), which the engine uses to stop re-evaluating at a value
 * that did not change: a column whose arrays an edit wrote in place (cells/table/model-rows.ts)
 * is not taken for the same as its successor, with which it shares them; other columns that
 * share an array are compared as ever.
 */
import { describe, expect, it } from 'vitest';
import { noteWrittenOver } from '../../src/lang/column-changes.ts';
import { numberColumn, sameValue, table } from '../../src/lang/values.ts';

describe('sameValue', () => {
  it('compares columns element by element, bit for bit', () => {
    const a = numberColumn(Float64Array.of(1, NaN, 3), null, 'y');
    expect(sameValue(a, numberColumn(Float64Array.of(1, NaN, 3), null, 'y'))).toBe(true);
    expect(sameValue(a, numberColumn(Float64Array.of(1, NaN, -3), null, 'y'))).toBe(false);
    expect(sameValue(numberColumn(Float64Array.of(0), null, 'y'), numberColumn(Float64Array.of(-0), null, 'y'))).toBe(false);
  });

  it('does not take a column written over in place for the same as its successor', () => {
    const values = Float64Array.of(1, 2, 3);
    const before = numberColumn(values, null, 'y');
    const after = numberColumn(values, null, 'y');
    // sharing an array alone says nothing (a column with its levels put in order does)
    expect(sameValue(after, before)).toBe(true);
    noteWrittenOver(before);
    expect(sameValue(before, before)).toBe(true);
    expect(sameValue(after, before)).toBe(false);
    expect(sameValue(before, after)).toBe(false);
    expect(sameValue(table(['y'], [after]), table(['y'], [before]))).toBe(false);
  });
});
