import { describe, expect, it } from 'vitest';
import { count, flaggedWords, ordinal, pText, rowList } from '../../src/messages/charts.ts';

describe('caption words', () => {
  it('writes counts, ordinals and p-values the same everywhere', () => {
    expect(count(100000)).toBe('100,000');
    expect(count(999)).toBe('999');
    expect(count(1234567)).toBe('1,234,567');
    expect([1, 2, 3, 4, 11, 12, 13, 21, 22, 23, 101, 111].map(ordinal)).toEqual(['1st', '2nd', '3rd', '4th', '11th', '12th', '13th', '21st', '22nd', '23rd', '101st', '111th']);
    expect(pText(0.6612)).toBe('p = 0.66');
    expect(pText(0.012)).toBe('p = 0.012');
    expect(pText(0.00002)).toBe('p < 0.001');
  });
  it('lists rows, the first five by number', () => {
    expect(rowList([17])).toBe('row 17');
    expect(rowList([3, 17])).toBe('rows 3 and 17');
    expect(rowList([1, 2, 3, 4, 5, 6, 7])).toBe('rows 1, 2, 3, 4, 5 and 2 more');
    expect(flaggedWords([], 3)).toBe('none beyond 3 studentized units');
    expect(flaggedWords([17], 3)).toBe('1 beyond 3 studentized units (row 17)');
  });
});
