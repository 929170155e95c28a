/**
 * A number column read again in a few rows (src/doc/csv-columns.ts `patchNumberColumn`):
 * from a part of the text that holds the changed rows, in place or as a copy, it gives what a
 * full reading of the new text gives; a field that is no longer a number gives null and
 * leaves the column it came from as it was, even in place.
 */
import { describe, expect, it } from 'vitest';
import { readFieldGrid } from '../../src/doc/csv-fields.ts';
import { columnOfGrid, patchNumberColumn } from '../../src/doc/csv-columns.ts';
import { decimalAt, type NumberColumn, type TextRanges } from '../../src/lang/values.ts';

const OLD = 'k,y\n1,2.5\n2,3\n3,4.25\n';

function texts(c: NumberColumn): (string | undefined)[] {
  return Array.from({ length: c.values.length }, (_, i) => decimalAt(c.decimals!, i));
}

/** Row 1's y typed over with `field`: the new text, its grid, and the base column. */
function typedOver(field: string) {
  const base = columnOfGrid(readFieldGrid(OLD), 1, 'y') as NumberColumn;
  const from = OLD.indexOf('2,3') + 2;
  const text = OLD.slice(0, from) + field + OLD.slice(from + 1);
  const grid = readFieldGrid(text);
  // the changed line alone, as the table's reader cuts it from the old text and the splice
  const lineStart = from - 2;
  const part = { text: text.slice(lineStart, text.indexOf('\n', lineStart)), at: lineStart };
  return { base, text, grid, part, shift: field.length - 1 };
}

describe('a number column read again in a few rows', () => {
  it('reads the changed rows from the part, in place, as a full reading would', () => {
    const { base, grid, part, shift } = typedOver('30.75');
    const values = base.values;
    const ranges = base.decimals as TextRanges;
    const patched = patchNumberColumn(grid, 1, 'y', base, OLD, 1, 2, shift, part, true)!;
    const full = columnOfGrid(grid, 1, 'y') as NumberColumn;
    expect(Array.from(patched.column.values)).toEqual(Array.from(full.values));
    expect(texts(patched.column)).toEqual(texts(full));
    // in place: the base's values are the new column's; its ranges, which moved for the
    // longer text, are copied (whoever shares the base's texts still reads them there)
    expect(patched.column.values).toBe(values);
    expect((patched.column.decimals as TextRanges).from).not.toBe(ranges.from);
    expect(Array.from(ranges.from)).toEqual([6, 12, 16]);
    // the changed texts, as ranges of the part
    expect(patched.texts.source.slice(patched.texts.from[0], patched.texts.to[0])).toBe('30.75');
  });

  it('copies when not in place, and leaves the base as it was', () => {
    const { base, grid, part, shift } = typedOver('-7');
    const patched = patchNumberColumn(grid, 1, 'y', base, OLD, 1, 2, shift, part)!;
    expect(patched.column.values).not.toBe(base.values);
    expect(Array.from(base.values)).toEqual([2.5, 3, 4.25]);
    expect(Array.from(patched.column.values)).toEqual([2.5, -7, 4.25]);
  });

  it('marks an emptied field missing', () => {
    const { base, grid, part, shift } = typedOver('');
    const patched = patchNumberColumn(grid, 1, 'y', base, OLD, 1, 2, shift, part, true)!;
    expect(Array.from(patched.column.missing!)).toEqual([0, 1, 0]);
    expect(Number.isNaN(patched.column.values[1])).toBe(true);
  });

  it('gives null for a field that is not a number, and the base keeps its values even in place', () => {
    const { base, grid, part, shift } = typedOver('n/a');
    expect(patchNumberColumn(grid, 1, 'y', base, OLD, 1, 2, shift, part, true)).toBeNull();
    expect(Array.from(base.values)).toEqual([2.5, 3, 4.25]);
    expect(base.missing).toBeNull();
  });
});
