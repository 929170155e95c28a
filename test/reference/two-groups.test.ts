/**
 * Two-group comparisons through documents, as a user writes them, against published values.
 */
import { describe, expect, it } from 'vitest';
import { isRecord, type RecordValue, type Value } from '../../src/lang/values.ts';
import { doc, run } from '../helpers.ts';

// source: Student (1908), "The probable error of a mean", Biometrika 6 (from memory),
// values confirmed with scipy 1.10.1 (stats.ttest_rel, stats.ttest_ind), docs/references.md section 2
const DRUG1 = [0.7, -1.6, -0.2, -1.2, -0.1, 3.4, 3.7, 0.8, 0.0, 2.0];
const DRUG2 = [1.9, 0.8, 1.1, 0.1, -0.1, 4.4, 5.5, 1.6, 4.6, 3.4];
const wide = ['--- table sleep', 'patient,drug_1,drug_2', ...DRUG1.map((x, i) => `${i + 1},${x.toFixed(1)},${DRUG2[i]!.toFixed(1)}`), ''];
const long = ['--- table trial', 'patient,drug,hours', ...DRUG1.map((x, i) => `${i + 1},one,${x.toFixed(1)}`), ...DRUG2.map((x, i) => `${i + 1},two,${x.toFixed(1)}`), ''];

function rec(v: Value | undefined): RecordValue {
  if (v === undefined || !isRecord(v)) throw new Error(`expected a record, got ${JSON.stringify(v)}`);
  return v;
}
function near(actual: Value | undefined, expected: number, rel: number): void {
  if (typeof actual !== 'number') throw new Error(`expected a number, got ${JSON.stringify(actual)}`);
  expect(Math.abs(actual - expected) / Math.abs(expected)).toBeLessThanOrEqual(rel);
}

describe("Student's sleep data", () => {
  const { engine } = run(
    doc(
      ...wide,
      ...long,
      '--- formula',
      'p = paired(sleep.drug_1, sleep.drug_2)',
      '--- formula',
      'u = two_sample(trial.hours, trial.drug)',
      '--- formula',
      'w = two_sample(trial.hours, trial.drug, equal_variance: false)',
    ),
  );
  it('paired: the pairs are blocks', () => {
    const p = rec(engine.valueOf('p'));
    near(p.fields.get('estimate'), -1.58, 1e-12);
    near(p.fields.get('sd'), 1.22999548, 1e-8);
    near(p.fields.get('t'), -4.0621277, 1e-7);
    expect(p.fields.get('df')).toBe(9);
    near(p.fields.get('p'), 0.0028329, 1e-4);
    near(p.fields.get('low'), -2.4598858, 1e-7);
    near(p.fields.get('high'), -0.7001142, 1e-6);
  });
  it('unpaired, pooled', () => {
    const u = rec(engine.valueOf('u'));
    near(u.fields.get('t'), -1.8608135, 1e-7);
    expect(u.fields.get('df')).toBe(18);
    near(u.fields.get('p'), 0.0791867, 1e-5);
    near(u.fields.get('pooled_variance'), 3.6047778, 1e-7);
    near(u.fields.get('low'), -3.363874, 1e-7);
    near(u.fields.get('high'), 0.203874, 1e-6);
    near(u.fields.get('first_mean'), 0.75, 1e-14);
  });
  it('unpaired, Welch', () => {
    const w = rec(engine.valueOf('w'));
    near(w.fields.get('t'), -1.8608135, 1e-7);
    near(w.fields.get('df'), 17.776474, 1e-7);
    near(w.fields.get('p'), 0.0793941, 1e-5);
    near(w.fields.get('low'), -3.3654832, 1e-7);
    near(w.fields.get('high'), 0.2054832, 1e-6);
  });
});
