import { describe, expect, it } from 'vitest';
import { isRecord, record, type RecordValue, type Value } from '../../../src/lang/values.ts';
import { recordSummary, testLine } from '../../../src/views/values/record-summary.ts';
import { doc, run, valueOf } from '../../helpers.ts';

// Invented data: two coatings on eight panels in four batches. The statistics themselves are
// checked against their sources in test/stats and test/reference; here only what the
// summaries say, and that every number in them is written by the digits policy.
const { engine } = run(
  doc(
    '--- table t',
    'g,b,y,x',
    'a,1,5.1,4.0',
    'b,1,6.2,5.1',
    'a,2,4.8,4.4',
    'b,2,6.9,5.0',
    'a,3,5.5,4.9',
    'b,3,6.1,5.3',
    'a,4,5.0,4.1',
    'b,4,6.6,5.9',
    '',
    '--- formula',
    'fit = blocked(t.y, t.g, t.b)',
    '--- formula',
    'd = difference(fit, "b", "a")',
    '--- formula',
    'ts = two_sample(t.y, t.g, equal_variance: false)',
    '--- formula',
    'pr = paired(t.y, t.x)',
    '--- formula',
    'rs = rank_sum(t.y, t.g)',
    '--- formula',
    'sr = signed_rank(t.y, t.x)',
    '--- formula',
    'kw = kruskal_wallis(t.y, t.g)',
    '--- formula',
    'fr = friedman(t.y, t.g, t.b)',
    '--- formula',
    'ch = residual_checks(fit)',
    '--- formula',
    'pw = power_blocked(1, 0.5, 4, 4)',
    '--- formula',
    'c = contrast(fit, [1, -1])',
  ),
);

function rec(name: string): RecordValue {
  const v: Value = valueOf(engine, name);
  if (!isRecord(v)) throw new Error(`${name} is not a record`);
  return v;
}

function summary(name: string) {
  const s = recordSummary(rec(name));
  if (s === null) throw new Error(`${name} has no summary`);
  return s;
}

describe('record summaries', () => {
  it('reads a difference as one line: estimate, interval and p', () => {
    const s = summary('d');
    expect(s.headline).toBe('b − a: 1.350 (95% interval 0.3229 to 2.377), p = 0.025');
    expect(s.details).toEqual(['The interval leaves out 0.', 't = 4.18 on 3 df; standard error 0.3227']);
  });

  it('says what an interval through zero leaves open', () => {
    const r = record([['a', 'x'], ['b', 'y'], ['estimate', 0.2], ['low', -0.5], ['high', 0.9], ['p', 0.61], ['level', 0.9]], 'comparison');
    const s = recordSummary(r)!;
    expect(s.headline).toBe('x − y: 0.2000 (90% interval -0.5000 to 0.9000), p = 0.61');
    expect(s.details[0]).toBe('The interval includes 0: no difference is detected, and a difference as large as 0.9000 is not ruled out.');
  });

  it('reads two_sample with each group, and names Welch’s form', () => {
    const s = summary('ts');
    expect(s.headline).toBe('a − b: -1.350 (95% interval -1.935 to -0.7647), p = 0.0015');
    expect(s.details[1]).toMatch(/^Welch’s t = -5\.71 on \d+(\.\d+)? df; standard error 0\.2363$/);
    expect(s.details[2]).toBe('a: mean 5.100, sd 0.2944, n 4; b: mean 6.450, sd 0.3697, n 4');
  });

  it('reads paired as the mean difference of the pairs', () => {
    const s = summary('pr');
    expect(s.headline).toBe('Mean difference of the pairs: 0.9375 (95% interval 0.5559 to 1.319), p < 0.001');
    expect(s.details).toContain('8 pairs; standard deviation of the differences 0.4565');
  });

  it('reads a contrast with its weights', () => {
    const s = summary('c');
    expect(s.headline).toBe('Contrast: -1.350 (95% interval -2.377 to -0.3229), p = 0.025');
    expect(s.details).toContain('weights a 1, b -1');
  });

  it('reads the rank tests as their statistic, p and what they ran on', () => {
    expect(summary('rs').headline).toBe('a against b: U = 0, p = 0.029 (exact)');
    expect(summary('rs').details).toEqual(['rank sum of a 10; 4 and 4 observations']);
    expect(summary('sr').headline).toBe('Signed ranks of the paired differences: 36, p = 0.014 (normal approximation)');
    expect(summary('sr').details).toEqual(['8 pairs; 1 group of tied values']);
    expect(summary('kw').headline).toBe('Rank test across groups: H = 5.33 on 1 df, p = 0.021');
    expect(summary('kw').details).toEqual(['mean ranks: a 2.500, b 6.500', '8 observations']);
    expect(summary('fr').headline).toBe('Ranks within blocks: chi-square = 4 on 1 df, p = 0.046');
    expect(summary('fr').details).toEqual(['2 treatments in 4 blocks', 'rank sums: a 4, b 8']);
  });

  it('reads residual checks as one verdict per check with its numbers', () => {
    const s = summary('ch');
    expect(s.checks.map((c) => [c.check, c.verdict])).toEqual([
      ['Residuals look normal', 'clear'],
      ['Spread equal across treatments', 'clear'],
      ['Blocks and treatments add up', 'clear'],
      ['No plot stands out', 'clear'],
    ]);
    expect(s.checks[0]!.numbers).toBe('Shapiro-Wilk W = 0.897, p = 0.27 (8 residuals)');
    expect(s.checks[2]!.numbers).toBe('Tukey, 1 df F(1, 2) = 0.500, p = 0.55');
    expect(s.checks[3]!.numbers).toBe('studentized residuals beyond 3: none');
    expect(s.headline).toBe('Residual checks: nothing flagged in 4 checks.');
  });

  it('flags a check whose p is below 0.05 and counts it in the headline', () => {
    const r = record(
      [
        ['shapiro_wilk', record([['w', 0.81], ['p', 0.004], ['n', 20]], 'test')],
        ['brown_forsythe', { kind: 'missing' }],
        ['notes', 'No Brown-Forsythe test: one group.'],
      ],
      'checks',
    );
    const s = recordSummary(r)!;
    expect(s.checks.map((c) => c.verdict)).toEqual(['flag', 'none']);
    expect(s.checks[0]!.words).toBe('flagged (p below 0.05)');
    expect(s.headline).toBe('Residual checks: 1 of 1 flagged; look before believing the F tests.');
    expect(s.notes).toEqual(['No Brown-Forsythe test: one group.']);
  });

  it('reads a power record as the plan it describes', () => {
    const s = summary('pw');
    expect(s.headline).toBe('Power 0.460 with 4 blocks, 4 treatments, 16 plots');
    expect(s.details).toEqual(['to detect a difference of 1 when the standard deviation is 0.5']);
  });

  it('leaves records it does not know to the field list', () => {
    expect(recordSummary(record([['x', 1]]))).toBeNull();
    expect(testLine(record([['x', 1], ['p', 0.5]]))).toBeNull();
  });
});
