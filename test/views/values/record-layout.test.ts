import { describe, expect, it } from 'vitest';
import { anovaRows, fieldLabel, fitLayout, meansRows, nonadditivityText, pairRows, pairsLayout, recordLines, scalarText } from '../../../src/views/values/record-layout.ts';
import { BUILTINS } from '../../../src/functions/index.ts';
import type { CallContext } from '../../../src/lang/builtins.ts';
import { booleanColumn, isRecord, numberColumn, record, table, textColumn, type Value } from '../../../src/lang/values.ts';

// Layout rules (blank cells, digits, p written as the trade writes it): common practice, no source.
// The numbers below are made up for the layout; they are not an analysis of real data.

const nums = (xs: number[], name: string | null = null) => numberColumn(new Float64Array(xs), null, name);

function anovaTable(p: number[]) {
  return table(
    ['source', 'df', 'ss', 'ms', 'f', 'p'],
    [
      textColumn(['method', 'row', 'error', 'total']),
      nums([2, 7, 14, 23]),
      nums([84.5, 30.1, 42.7, 157.3]),
      nums([42.25, 4.3, 3.05, NaN]),
      nums([13.8525, 1.4098, NaN, NaN]),
      nums(p, 'p'),
    ],
  );
}

describe('anovaRows', () => {
  it('writes one row per source with blanks where a number does not apply', () => {
    const rows = anovaRows(anovaTable([0.0004789, 0.2751, NaN, NaN]))!;
    expect(rows.map((r) => r.role)).toEqual(['term', 'term', 'error', 'total']);
    expect(rows.map((r) => r.source)).toEqual(['method', 'row', 'error', 'total']);
    expect(rows.map((r) => r.df)).toEqual(['2', '7', '14', '23']);
    // the digits policy: SS and MS to four significant digits (whole digits kept), F to
    // three, p to two or "< 0.001" (common practice, no source)
    expect(rows.map((r) => r.ss)).toEqual(['84.50', '30.10', '42.70', '157.3']);
    expect(rows.map((r) => r.ms)).toEqual(['42.25', '4.300', '3.050', '']);
    expect(rows.map((r) => r.f)).toEqual(['13.9', '1.41', '', '']);
    expect(rows.map((r) => r.p)).toEqual(['< 0.001', '0.28', '', '']);
  });

  it('writes a very small p as < 0.001 and leaves the error and total p blank even if given', () => {
    const rows = anovaRows(anovaTable([0.0000001, 0.0019, 0.5, 0.5]))!;
    expect(rows.map((r) => r.p)).toEqual(['< 0.001', '0.0019', '', '']);
  });

  it('leaves missing numbers blank', () => {
    const t = table(
      ['source', 'df', 'ss', 'ms', 'f', 'p'],
      [
        textColumn(['a', 'error', 'total']),
        nums([1, 0, 1]),
        nums([2, 0, 2]),
        numberColumn(new Float64Array([2, NaN, NaN]), new Uint8Array([0, 1, 1])),
        numberColumn(new Float64Array([NaN, NaN, NaN]), new Uint8Array([1, 1, 1])),
        numberColumn(new Float64Array([NaN, NaN, NaN]), new Uint8Array([1, 1, 1])),
      ],
    );
    const rows = anovaRows(t)!;
    expect(rows[0]).toMatchObject({ ms: '2.000', f: '', p: '' });
    expect(rows[1]).toMatchObject({ df: '0', ms: '' });
  });

  it('returns null for a table that is not an analysis of variance', () => {
    expect(anovaRows(table(['x'], [nums([1])]))).toBeNull();
  });
});

describe('meansRows', () => {
  it('writes means, standard errors and interval ends to four significant digits', () => {
    const t = table(
      ['level', 'n', 'mean', 'se', 'low', 'high'],
      [textColumn(['open', 'spindle']), nums([8, 8]), nums([41.25, 38.5]), nums([0.6174, 0.6174]), nums([39.926, 37.176]), nums([42.574, 39.824])],
    );
    const rows = meansRows(t)!;
    expect(rows[0]).toEqual({ level: 'open', n: '8', mean: '41.25', se: '0.6174', low: '39.93', high: '42.57' });
    expect(rows[1]!.mean).toBe('38.50');
  });
});

function fit(extra: [string, Value][] = []) {
  const means = table(
    ['level', 'n', 'mean', 'se', 'low', 'high'],
    [textColumn(['a', 'b', 'c']), nums([8, 8, 8]), nums([10, 12, 11]), nums([0.5, 0.5, 0.5]), nums([9, 11, 10]), nums([11, 13, 12])],
  );
  const long = nums(Array.from({ length: 24 }, (_, i) => i / 10));
  return record(
    [
      ['design', 'randomized complete block'],
      ['table', anovaTable([0.0019, 0.2751, NaN, NaN])],
      ['means', means],
      ['mse', 3.05],
      ['df_error', 14],
      ['sd', Math.sqrt(3.05)],
      ['grand_mean', 11],
      ['r2', 0.7285],
      ['fitted', long],
      ['residuals', long],
      ['balanced', true],
      ['level', 0.95],
      ['notes', textColumn(['2 rows with a missing yield were left out.'])],
      ...extra,
    ],
    'fit',
  );
}

describe('fitLayout', () => {
  it('places the table, the means, the labelled numbers and folds the long columns', () => {
    const l = fitLayout(fit());
    expect(l.design).toBe('randomized complete block');
    expect(l.balance).toMatch(/^Balanced/);
    expect(l.anova).toHaveLength(4);
    expect(l.means).toHaveLength(3);
    expect(l.intervalHeader).toBe('95% interval');
    expect(l.scalars.map((s) => s.field)).toEqual(['mse', 'df_error', 'sd', 'grand_mean', 'r2', 'level']);
    expect(l.scalars.find((s) => s.field === 'sd')!.text).toBe('1.746');
    expect(l.scalars.find((s) => s.field === 'level')!.text).toBe('95%');
    expect(l.scalars[0]!.label).toBe('error mean square');
    expect(l.folded.map((f) => f.field)).toEqual(['fitted', 'residuals']);
    expect(l.notes).toEqual(['2 rows with a missing yield were left out.']);
    expect(l.others).toEqual([]);
  });

  it('says when the design is not balanced', () => {
    const r = fit();
    const fields = new Map(r.fields);
    fields.set('balanced', false);
    const l = fitLayout({ ...r, fields });
    expect(l.balance).toMatch(/adjusted for the other factors/);
    // with the record's own words for the sums of squares, those words are used, as a sentence
    fields.set('ss_method', 'least squares: treatments adjusted for blocks');
    expect(fitLayout({ ...r, fields }).balance).toBe('Not balanced (unequal or missing cells). Least squares: treatments adjusted for blocks.');
  });

  it('shows blocked extras: relative efficiency and the nonadditivity test in one line', () => {
    const l = fitLayout(
      fit([
        ['relative_efficiency', 1.4213],
        ['nonadditivity', record([['ss', 0.512], ['f', 0.1601], ['p', 0.69571]])],
      ]),
    );
    expect(l.scalars.find((s) => s.field === 'relative_efficiency')!.text).toBe('1.421');
    expect(l.scalars.find((s) => s.field === 'nonadditivity')!.text).toBe('SS 0.5120, F 0.160, p = 0.70');
  });

  it('keeps fields it does not know, shown under their own names', () => {
    const effects = table(['term', 'estimate'], [textColumn(['A']), nums([1.5])]);
    const l = fitLayout(fit([['effects', effects], ['ss_kind', 'sequential']]));
    expect(l.others.map((o) => o.field)).toEqual(['effects']);
    expect(l.scalars.find((s) => s.field === 'ss_kind')).toEqual({ field: 'ss_kind', label: 'ss kind', text: 'sequential' });
  });

  it('falls back to showing an odd table as a value rather than dropping it', () => {
    const odd = table(['x'], [nums([1])]);
    const r = record([['design', 'one-way'], ['table', odd]], 'fit');
    const l = fitLayout(r);
    expect(l.anova).toBeNull();
    expect(l.others.map((o) => o.field)).toEqual(['table']);
  });
});

describe('pairs', () => {
  const pairsTable = table(
    ['a', 'b', 'estimate', 'se', 'low', 'high', 'p', 'significant'],
    [
      textColumn(['a', 'a', 'b']),
      textColumn(['b', 'c', 'c']),
      nums([-2, -1, 1]),
      nums([0.7071, 0.7071, 0.7071]),
      nums([-3.85, -2.85, -0.85]),
      nums([-0.15, 0.85, 2.85]),
      nums([0.0321, 0.3561, 0.3561]),
      booleanColumn(new Uint8Array([1, 0, 0])),
    ],
  );

  it('writes each pair as first minus second with its interval and p', () => {
    const rows = pairRows(pairsTable)!;
    // estimates to four significant digits, p to two (the digits policy)
    expect(rows[0]).toEqual({ pair: 'a − b', estimate: '-2.000', se: '0.7071', low: '-3.850', high: '-0.1500', p: '0.032', excludesZero: 'yes' });
    expect(rows[1]!.excludesZero).toBe('no');
  });

  it('titles the table with the factor and the method', () => {
    const l = pairsLayout(record([['method', 'tukey'], ['level', 0.95], ['factor', 'variety'], ['df', 14], ['table', pairsTable]], 'pairs'));
    expect(l.title).toBe('Pairwise differences of variety means: Tukey (simultaneous intervals)');
    expect(l.intervalHeader).toBe('95% interval');
    expect(l.scalars.map((s) => s.field)).toEqual(['level', 'df']);
    expect(l.rows).toHaveLength(3);
  });
});

describe('scalars and other records', () => {
  it('labels fields in words and writes p as the trade does', () => {
    expect(fieldLabel('df_error')).toBe('error degrees of freedom');
    expect(fieldLabel('some_field')).toBe('some field');
    expect(scalarText('p', 0.00001)).toBe('< 0.001');
    expect(scalarText('estimate', 2.123456789)).toBe('2.123');
    expect(scalarText('some_field', 2.123456789)).toBe('2.12346');
    expect(scalarText('balanced', true)).toBe('yes');
    expect(scalarText('t', numberColumn(new Float64Array([1])))).toBeNull();
  });

  it('lists the fields of any record in order', () => {
    const lines = recordLines(record([['estimate', 1.5], ['p', 0.04], ['rows', nums([1, 2])]]));
    expect(lines.map((l) => [l.field, l.text])).toEqual([['estimate', '1.500'], ['p', '0.040'], ['rows', null]]);
  });

  it('reads a nonadditivity record, and nothing else, as one line', () => {
    expect(nonadditivityText(record([['ss', 1], ['f', 2], ['p', 0.2]]))).toBe('SS 1.000, F 2, p = 0.20');
    expect(nonadditivityText(record([['ss', 1], ['f', 2], ['p', 0.2], ['df1', 1], ['df2', 5]]))).toBe('SS 1.000, F(1, 5) 2, p = 0.20');
    expect(nonadditivityText(3)).toBeNull();
  });
});

describe('the layout of records the engine makes', () => {
  // Invented trial: 3 treatments in 4 blocks, one plot each. Only the shape of the record
  // is checked here (the numbers themselves are checked in test/stats and test/functions).
  const y = nums([41.2, 38.9, 37.1, 40.8, 39.5, 36.9, 42.0, 39.1, 38.2, 40.1, 38.7, 36.4], 'yield');
  const treatment = textColumn(['open', 'spindle', 'vase', 'open', 'spindle', 'vase', 'open', 'spindle', 'vase', 'open', 'spindle', 'vase'], null, 'method');
  const block = textColumn(['1', '1', '1', '2', '2', '2', '3', '3', '3', '4', '4', '4'], null, 'row');
  const ctx: CallContext = { fn: 'blocked', warn: () => {}, progress: () => {} };
  const fitValue = BUILTINS.get('blocked')!.run(new Map<string, Value>([['y', y], ['treatment', treatment], ['block', block]]), ctx);

  it('lays out a blocked fit: terms, error, total, with the blanks in place', () => {
    expect(isRecord(fitValue) && fitValue.tag === 'fit').toBe(true);
    if (!isRecord(fitValue)) return;
    const l = fitLayout(fitValue);
    expect(l.anova).not.toBeNull();
    const rows = l.anova!;
    expect(rows.map((r) => r.role)).toEqual(['term', 'term', 'error', 'total']);
    expect(rows.map((r) => r.df)).toEqual(['2', '3', '6', '11']);
    for (const r of rows.slice(0, 2)) {
      expect(r.f).not.toBe('');
      // two significant digits, or the words for the ends (the digits policy)
      expect(r.p).toMatch(/^(0\.0*[1-9]\d|< 0\.001|> 0\.99)$/);
    }
    expect(rows[2]).toMatchObject({ f: '', p: '' });
    expect(rows[3]).toMatchObject({ ms: '', f: '', p: '' });
    expect(rows[2]!.ms).not.toBe('');
    expect(l.means!.map((m) => m.level)).toEqual(['open', 'spindle', 'vase']);
    expect(l.means!.every((m) => m.n === '4')).toBe(true);
    expect(l.meansTitle).toBe('Means of method');
    expect(l.intervalHeader).toBe('95% interval');
    expect(l.folded.map((f) => f.field)).toEqual(['fitted', 'residuals', 'studentized']);
    // one plot per cell: the nonadditivity test is on one labelled line
    expect(l.scalars.find((s) => s.field === 'nonadditivity')!.text).toMatch(/^SS .+, F\(1, 5\) .+, p /);
    for (const f of ['mse', 'df_error', 'sd', 'grand_mean', 'r2', 'relative_efficiency']) expect(l.scalars.some((s) => s.field === f)).toBe(true);
  });

  it('heads adjusted means and whole-plot means as what they are', () => {
    const x = nums([5, 6, 4, 6, 7, 5, 4, 5, 6, 7, 5, 6], 'start');
    const withCovariate = BUILTINS.get('blocked')!.run(new Map<string, Value>([['y', y], ['treatment', treatment], ['block', block], ['covariate', x]]), ctx);
    if (!isRecord(withCovariate)) throw new Error('expected a fit');
    expect(fitLayout(withCovariate).meansTitle).toBe("Adjusted means of method (at the covariate's mean)");
    const whole = textColumn(['dry', 'dry', 'dry', 'wet', 'wet', 'wet', 'dry', 'dry', 'dry', 'wet', 'wet', 'wet'], null, 'water');
    const reps = textColumn(['1', '1', '1', '1', '1', '1', '2', '2', '2', '2', '2', '2'], null, 'rep');
    const sub = textColumn(['a', 'b', 'c', 'a', 'b', 'c', 'a', 'b', 'c', 'a', 'b', 'c'], null, 'variety');
    const split = BUILTINS.get('split_plot')!.run(new Map<string, Value>([['y', y], ['whole', whole], ['sub', sub], ['block', reps]]), ctx);
    if (!isRecord(split)) throw new Error('expected a fit');
    expect(fitLayout(split).meansTitle).toBe('Means of water (whole plots)');
  });

  it('lays out the pairs that pairwise makes from it', () => {
    const pairs = BUILTINS.get('pairwise')!.run(new Map<string, Value>([['fit', fitValue], ['method', 'tukey'], ['level', 0.95]]), { ...ctx, fn: 'pairwise' });
    if (!isRecord(pairs)) throw new Error('pairwise did not give a record');
    const l = pairsLayout(pairs);
    expect(l.title).toBe('Pairwise differences of method means: Tukey (simultaneous intervals)');
    expect(l.rows!.map((r) => r.pair)).toEqual(['open − spindle', 'open − vase', 'spindle − vase']);
    expect(l.rows!.every((r) => r.excludesZero === 'yes' || r.excludesZero === 'no')).toBe(true);
  });
});
