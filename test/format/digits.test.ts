import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { formatLocale } from 'vega';
import { describe, expect, it } from 'vitest';
import { chartFormat, countText, decimalsText, numberText, percentText, pPhrase, pValueText, quantityOf } from '../../src/format/digits.ts';
import { sourceFiles } from '../architecture/stairs.ts';

// The digits policy is the project's own choice of how results read: common practice, no source.
describe('the digits policy', () => {
  it('writes p-values by one rule: < 0.001, else two significant digits', () => {
    expect(pValueText(0.0004789)).toBe('< 0.001');
    expect(pValueText(0.001)).toBe('0.0010');
    expect(pValueText(0.0019)).toBe('0.0019');
    expect(pValueText(0.0496)).toBe('0.050');
    expect(pValueText(0.6625)).toBe('0.66');
    expect(pValueText(0.994)).toBe('0.99');
    expect(pValueText(0.996)).toBe('> 0.99');
    expect(pValueText(1)).toBe('> 0.99');
    expect(pValueText(NaN)).toBe('NaN');
    expect(pPhrase(0.6625)).toBe('p = 0.66');
    expect(pPhrase(0.00001)).toBe('p < 0.001');
    expect(pPhrase(NaN)).toBe('p not available');
  });

  it('writes estimates, sums of squares and mean squares to four significant digits, keeping whole digits', () => {
    expect(numberText(0.477706, 'squares')).toBe('0.4777');
    expect(numberText(38.5, 'estimate')).toBe('38.50');
    expect(numberText(1234.56, 'estimate')).toBe('1235');
    expect(numberText(123456.7, 'squares')).toBe('123457');
    expect(numberText(-0.00001234, 'estimate')).toBe('-1.234e-5');
    expect(numberText(-0.00004, 'estimate')).toBe('-4.000e-5');
  });

  it('writes statistics to three digits, whole ones whole; degrees of freedom whole or to three digits', () => {
    expect(numberText(13.8525, 'statistic')).toBe('13.9');
    expect(numberText(0.89712, 'statistic')).toBe('0.897');
    expect(numberText(36, 'statistic')).toBe('36');
    expect(numberText(14, 'df')).toBe('14');
    expect(numberText(17.8123, 'df')).toBe('17.8');
  });

  it('writes counts with commas, levels as percentages, plain numbers to six digits', () => {
    expect(countText(1234567)).toBe('1,234,567');
    expect(countText(-1200)).toBe('-1,200');
    expect(numberText(12400, 'count')).toBe('12,400');
    expect(percentText(0.95)).toBe('95%');
    expect(numberText(0.999, 'level')).toBe('99.9%');
    expect(numberText(Math.PI)).toBe('3.14159');
    expect(numberText(0.6)).toBe('0.6');
    expect(numberText(12)).toBe('12');
    expect(numberText(NaN, 'estimate')).toBe('NaN');
    expect(numberText(-Infinity, 'squares')).toBe('-∞');
  });

  it('knows quantities by the names the built-ins give their results', () => {
    expect(['p', 'mse', 'f', 'df_error', 'n', 'level', 'estimate', 'first_mean', 'some_column'].map(quantityOf)).toEqual([
      'p',
      'squares',
      'statistic',
      'df',
      'count',
      'level',
      'estimate',
      'estimate',
      'plain',
    ]);
  });

  it('writes fixed decimals with trailing zeros, rounding half away from zero as the number reads', () => {
    expect(decimalsText(0.6, 2)).toBe('0.60');
    expect(decimalsText(2.675, 2)).toBe('2.68');
    expect(decimalsText(1.005, 2)).toBe('1.01');
    expect(decimalsText(-2.5, 0)).toBe('-3');
    expect(decimalsText(-0.001, 2)).toBe('0.00');
    expect(decimalsText(123.456, 0)).toBe('123');
    expect(decimalsText(5e-7, 3)).toBe('0.000');
    expect(decimalsText(1e21, 1)).toBe('1000000000000000000000.0');
    expect(decimalsText(NaN, 2)).toBe('NaN');
  });

  it('gives charts d3 formats that write as numberText does in the range charts show', () => {
    // source: vega 6.4.0, formatLocale().format (the number formats a chart's tooltip uses)
    // (vega's typings say formatLocale returns nothing; called with no locale it returns the default formatters)
    const locale = (formatLocale as unknown as () => { format: (spec: string) => (x: number) => string })();
    const d3format = (spec: string): ((x: number) => string) => locale.format(spec);
    const cases: [number, 'estimate' | 'statistic' | 'power' | 'plain'][] = [];
    for (const x of [0.0001234, 0.012345, 0.5, 1.23456, 38.5, 123.456, 987.654, 2]) for (const q of ['estimate', 'statistic', 'power', 'plain'] as const) cases.push([x, q]);
    // the one known difference, stated in chartFormat: a whole statistic reads 2 in text, 2.00 in a tooltip
    expect(d3format(chartFormat('statistic'))(2)).toBe('2.00');
    cases.splice(cases.findIndex(([x, q]) => x === 2 && q === 'statistic'), 1);
    for (const [x, q] of cases) expect(`${q} ${d3format(chartFormat(q))(x).replace('−', '-')}`).toBe(`${q} ${numberText(x, q)}`);
  });
});

/**
 * Every place that turns a number into digits outside the policy: the methods that choose
 * digits, locale formatting, and d3 format strings written into chart specs.
 */
const FORMATTING = /\.(toFixed|toPrecision|toExponential|toLocaleString)\(|Intl\.NumberFormat|\bformat:\s*'[^']*'/g;

/**
 * Numbers that are not results and not counts (counts go through countText): a file's size,
 * a progress bar's width, and two places that write digits to keep a value exact. Each
 * entry must still be there (a stale entry fails), and nothing else may appear.
 */
const NOT_RESULTS: ReadonlyMap<string, number> = new Map([
  ['src/messages/cli.ts', 1], // a file's size in megabytes
  ['cells/formula/view.ts', 1], // the width of a progress bar, in CSS
  ['src/doc/field-text.ts', 1], // the shortest text that reads back as a stored 32-bit float: exactness, not display
  ['src/functions/units.ts', 1], // a conversion factor recognised as a short decimal: exactness, not display
]);

describe('one digits function is used everywhere', () => {
  it('finds no other formatting of numbers in the product', () => {
    const root = join(__dirname, '..', '..');
    const found = new Map<string, string[]>();
    for (const file of sourceFiles(root, ['src', 'cells'])) {
      if (file === 'src/format/digits.ts') continue;
      const text = readFileSync(join(root, file), 'utf8');
      const hits = [...text.matchAll(FORMATTING)].map((m) => `${file}:${text.slice(0, m.index).split('\n').length} ${m[0]}`);
      if (hits.length > 0) found.set(file, hits);
    }
    const unexpected = [...found].filter(([f]) => !NOT_RESULTS.has(f)).flatMap(([, h]) => h);
    expect(unexpected).toEqual([]);
    for (const [file, n] of NOT_RESULTS) expect(`${file}: ${found.get(file)?.length ?? 0}`).toBe(`${file}: ${n}`);
  });

  it('would catch a stray toFixed (the pattern is live)', () => {
    expect('x.toFixed(2)'.match(FORMATTING)).not.toBeNull();
    expect("axis: { format: '.2f' }".match(FORMATTING)).not.toBeNull();
    expect('numberText(x, "estimate")'.match(FORMATTING)).toBeNull();
  });
});
