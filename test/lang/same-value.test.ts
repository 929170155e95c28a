/**
 * sameValue (src/lang/values.ts), which the engine uses to stop re-evaluating at a value
 * that did not change: two distinct columns that share one array of values are not taken
 * for the same, because a table's column typed over in place (cells/table/model-rows.ts)
 * shares its array with the column it replaced, whose values are then gone.
 */
import { describe, expect, it } from 'vitest';
import { numberColumn, sameValue, table } from '../../src/lang/values.ts';

describe('sameValue', () => {
  it('compares columns element by element, bit for bit', () => {
    const a = numberColumn(Float64Array.of(1, NaN, 3), null, 'y');
    expect(sameValue(a, numberColumn(Float64Array.of(1, NaN, 3), null, 'y'))).toBe(true);
    expect(sameValue(a, numberColumn(Float64Array.of(1, NaN, -3), null, 'y'))).toBe(false);
    expect(sameValue(numberColumn(Float64Array.of(0), null, 'y'), numberColumn(Float64Array.of(-0), null, 'y'))).toBe(false);
  });

  it('does not take two columns that share one array of values for the same', () => {
    const values = Float64Array.of(1, 2, 3);
    const before = numberColumn(values, null, 'y');
    const after = numberColumn(values, null, 'y');
    expect(sameValue(before, before)).toBe(true);
    expect(sameValue(after, before)).toBe(false);
    expect(sameValue(table(['y'], [after]), table(['y'], [before]))).toBe(false);
  });
});
