/**
 * NIST StRD one-way analysis of variance, all eleven datasets, through a document: the data
 * go into a table cell as decimal text, as a user would paste them, and `one_way` runs in
 * the engine. Every certified value must reach a log relative error of at least 11.
 *
 * source: NIST Statistical Reference Datasets, ANOVA (https://www.itl.nist.gov/div898/strd/anova/),
 * files copied byte for byte into test/reference/fixtures/nist-anova/ (public domain).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { isRecord, isTable, type Value } from '../../src/lang/values.ts';
import { doc, run } from '../helpers.ts';

const DIR = join(__dirname, 'fixtures', 'nist-anova');
const SETS = ['SiRstv', 'SmLs01', 'SmLs02', 'SmLs03', 'AtmWtAg', 'SmLs04', 'SmLs05', 'SmLs06', 'SmLs07', 'SmLs08', 'SmLs09'];

interface Certified {
  dfBetween: number;
  ssBetween: number;
  msBetween: number;
  f: number;
  dfWithin: number;
  ssWithin: number;
  msWithin: number;
  r2: number;
  sd: number;
}

function readSet(name: string): { certified: Certified; rows: [string, string][] } {
  const lines = readFileSync(join(DIR, `${name}.dat`), 'utf8').split('\n');
  const num = (s: string | undefined): number => Number(s);
  const between = lines.find((l) => /^Between /.test(l))!.trim().split(/\s+/);
  const within = lines.find((l) => /^Within /.test(l))!.trim().split(/\s+/);
  const r2 = lines.find((l) => /Certified R-Squared/.test(l))!.trim().split(/\s+/).pop();
  const sdLine = lines.findIndex((l) => /Certified Residual/.test(l));
  const sd = lines[sdLine + 1]!.trim().split(/\s+/).pop();
  // fields: "Between Treatment df ss ms f" / "Within Treatment df ss ms"
  const certified = {
    dfBetween: num(between[2]),
    ssBetween: num(between[3]),
    msBetween: num(between[4]),
    f: num(between[5]),
    dfWithin: num(within[2]),
    ssWithin: num(within[3]),
    msWithin: num(within[4]),
    r2: num(r2),
    sd: num(sd),
  };
  // data from line 61 on: group label, then the response, as printed
  const rows = lines
    .slice(60)
    .map((l) => l.trim())
    .filter((l) => l !== '')
    .map((l) => l.split(/\s+/) as [string, string]);
  return { certified, rows };
}

/** Log relative error, capped at 15 (references.md section 1). */
function lre(x: number, c: number): number {
  if (x === c) return 15;
  return Math.min(15, -Math.log10(Math.abs(x - c) / Math.abs(c)));
}

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
      const { certified: c, rows } = readSet(name);
      const table = ['--- table nist', 'group,response', ...rows.map(([g, y]) => `${g},${y}`), ''];
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
