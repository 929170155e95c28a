/**
 * NIST StRD one-way analysis of variance, all eleven datasets, through a document: the data
 * go into a table cell as decimal text, as a user would paste them, and `one_way` runs in
 * the engine. Every certified value must reach a log relative error of at least 11.
 *
 * source: NIST Statistical Reference Datasets, ANOVA (https://www.itl.nist.gov/div898/strd/anova/),
 * files copied byte for byte into test/reference/fixtures/nist-anova/ (public domain).
 */
import { afterAll, describe, expect, it } from 'vitest';
import { isRecord, isTable, type Value } from '../../src/lang/values.ts';
import { doc, run } from '../helpers.ts';
import { NAMES as SETS, lre, readDataset, type Certified } from './fixtures/nist.ts';

const report: string[] = [];
afterAll(() => {
  console.log(`NIST StRD one-way ANOVA through a document, LRE of each certified value (cap 15):\n${report.join('\n')}`);
});

function num(v: Value | undefined): number {
  if (typeof v !== 'number') throw new Error(`expected a number, got ${JSON.stringify(v)}`);
  return v;
}

describe('NIST StRD one-way ANOVA, data typed into a table', () => {
  for (const name of SETS) {
    it(`${name}: every certified value at LRE >= 11`, () => {
      const { certified: c, groups, texts } = readDataset(name);
      const table = ['--- table nist', 'group,response', ...texts.map((y, i) => `${groups[i]},${y}`), ''];
      const { engine } = run(doc(...table, '--- formula', 'fit = one_way(nist.response, nist.group)'));
      const fit = engine.valueOf('fit');
      if (fit === undefined || !isRecord(fit)) throw new Error(`${name}: no fit (${JSON.stringify(fit)})`);
      const t = fit.fields.get('table');
      if (t === undefined || !isTable(t)) throw new Error('no table');
      const col = (n: string): Float64Array => (t.columns[t.names.indexOf(n)] as { values: Float64Array }).values;
      const got = {
        dfBetween: col('df')[0]!,
        ssBetween: col('ss')[0]!,
        msBetween: col('ms')[0]!,
        f: col('f')[0]!,
        dfWithin: col('df')[1]!,
        ssWithin: col('ss')[1]!,
        msWithin: col('ms')[1]!,
        r2: num(fit.fields.get('r2')),
        sd: num(fit.fields.get('sd')),
      };
      expect(num(fit.fields.get('mse'))).toBe(got.msWithin);
      const scores = (Object.keys(c) as (keyof Certified)[]).map((k) => [k, lre(got[k], c[k])] as const);
      report.push(`  ${name.padEnd(8)} ${scores.map(([k, s]) => `${k} ${s.toFixed(1)}`).join(', ')}`);
      for (const [k, s] of scores) expect(s, `${name} ${k}: got ${got[k]}, certified ${c[k]}`).toBeGreaterThanOrEqual(11);
    });
  }
});
