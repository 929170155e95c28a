import { describe, expect, it } from 'vitest';
import { fixedText, levelText, pText, sharedDecimals } from '../../../src/views/values/digits.ts';

// The digit rules are the project's own layout choices: common practice, no source.
describe('sharedDecimals', () => {
  it('gives whole numbers no decimals', () => {
    expect(sharedDecimals([1, 20, 300])).toBe(0);
  });

  it('gives the largest value six significant digits', () => {
    // 123.456789 has 3 digits before the point: 6 - 3 = 3 decimals
    expect(sharedDecimals([123.456789, 100.5])).toBe(3);
    expect(sharedDecimals([0.123456789])).toBe(6);
  });

  it('keeps three significant digits of the smallest non-zero value', () => {
    // 1234.5 wants 2 decimals; 0.00123 needs 5 to show "0.00123"
    expect(sharedDecimals([1234.5, 0.00123])).toBe(5);
  });

  it('ignores zeros, NaN and infinities when choosing', () => {
    expect(sharedDecimals([0, 12.5, NaN, Infinity])).toBe(4);
  });

  it('gives up (null) when the magnitudes are too far apart for one layout', () => {
    expect(sharedDecimals([1e6, 1e-9])).toBeNull();
    expect(sharedDecimals([1e16, 0.5])).toBeNull();
  });

  it('skips elements the caller marks (missing ones)', () => {
    expect(sharedDecimals([1.5, 0.000001], undefined, (i) => i === 1)).toBe(5);
  });

  it('gives 0 for a column with nothing finite', () => {
    expect(sharedDecimals([NaN, NaN])).toBe(0);
    expect(sharedDecimals([])).toBe(0);
  });
});

describe('fixedText', () => {
  it('writes the shared decimals, rounding half away as toFixed does', () => {
    expect(fixedText(2.5, 3)).toBe('2.500');
    expect(fixedText(1234.56789, 2)).toBe('1234.57');
  });

  it('drops the sign of a zero that rounds to nothing', () => {
    expect(fixedText(-0.0001, 2)).toBe('0.00');
    expect(fixedText(-0, 0)).toBe('0');
    expect(fixedText(-0.5, 1)).toBe('-0.5');
  });

  it('falls back to formatNumber for null decimals and non-finite numbers', () => {
    expect(fixedText(1 / 3, null)).toBe('0.333333');
    expect(fixedText(NaN, 2)).toBe('NaN');
    expect(fixedText(-Infinity, 2)).toBe('-∞');
  });
});

describe('pText and levelText', () => {
  it('writes p as the trade does, blank where there is none', () => {
    expect(pText(0.0019)).toBe('0.0019');
    expect(pText(0.00001)).toBe('< 0.001');
    expect(pText(NaN)).toBe('');
  });

  it('writes levels as percentages', () => {
    expect(levelText(0.95)).toBe('95%');
    expect(levelText(0.999)).toBe('99.9%');
  });
});
