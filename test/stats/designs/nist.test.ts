/**
 * NIST StRD one-way analysis of variance: all eleven datasets, fed as decimal text through the
 * exact decimal shift, scored by the log relative error of every certified value.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { shiftDecimals } from '../../../src/stats/decimal/index.ts';
import { oneWay } from '../../../src/stats/designs/index.ts';
import { factorOf, lre } from './support.ts';

const FIXTURES = new URL('../../reference/fixtures/nist-anova/', import.meta.url);
const NAMES = ['SiRstv', 'SmLs01', 'SmLs02', 'SmLs03', 'AtmWtAg', 'SmLs04', 'SmLs05', 'SmLs06', 'SmLs07', 'SmLs08', 'SmLs09'];

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

interface Dataset {
  certified: Certified;
  groups: string[];
  texts: string[];
}

/** Parse a NIST file by fields: certified block, then data from line 61. */
function readDataset(name: string): Dataset {
  const lines = readFileSync(new URL(`${name}.dat`, FIXTURES), 'utf8').split('\n');
  const fields = (prefix: string): number[] => {
    const line = lines.find((l) => l.trimStart().startsWith(prefix));
    if (line === undefined) throw new Error(`${name}: no line starting with ${prefix}`);
    return line.trim().split(/\s+/).filter((w) => /^[-+]?[\d.]+(E[-+]?\d+)?$/i.test(w)).map(Number);
  };
  const between = fields('Between');
  const within = fields('Within');
  const r2 = fields('Certified R-Squared');
  const sd = fields('Standard Deviation');
  const groups: string[] = [];
  const texts: string[] = [];
  for (const line of lines.slice(60)) {
    const parts = line.trim().split(/\s+/);
    if (parts.length !== 2) continue;
    groups.push(parts[0]!);
    texts.push(parts[1]!);
  }
  return {
    certified: {
      dfBetween: between[0]!,
      ssBetween: between[1]!,
      msBetween: between[2]!,
      f: between[3]!,
      dfWithin: within[0]!,
      ssWithin: within[1]!,
      msWithin: within[2]!,
      r2: r2[0]!,
      sd: sd[0]!,
    },
    groups,
    texts,
  };
}

function scores(d: Dataset, y: Float64Array, offset: number): Record<string, number> {
  const fit = oneWay(y, factorOf('treatment', d.groups), { offset });
  const c = d.certified;
  return {
    dfBetween: lre(fit.table.df[0]!, c.dfBetween),
    dfWithin: lre(fit.df_error, c.dfWithin),
    ssBetween: lre(fit.table.ss[0]!, c.ssBetween),
    ssWithin: lre(fit.table.ss[1]!, c.ssWithin),
    msBetween: lre(fit.table.ms[0]!, c.msBetween),
    msWithin: lre(fit.mse, c.msWithin),
    f: lre(fit.table.f[0]!, c.f),
    r2: lre(fit.r2, c.r2),
    sd: lre(fit.sd, c.sd),
  };
}

describe('NIST StRD one-way analysis of variance', () => {
  const rows: string[] = [];
  for (const name of NAMES) {
    it(`${name}: every certified value to LRE >= 11`, () => {
      // source: NIST StRD, one-way ANOVA dataset `name` (certified values in the file)
      const d = readDataset(name);
      expect(d.texts.length).toBe(d.certified.dfBetween + d.certified.dfWithin + 1);
      const { offset, shifted } = shiftDecimals(d.texts);
      const s = scores(d, shifted, offset);
      // For contrast only (not asserted here): the same analysis on plain binary doubles.
      const plain = scores(d, Float64Array.from(d.texts, Number), 0);
      const worst = Math.min(...Object.values(s));
      const worstPlain = Math.min(...Object.values(plain));
      rows.push(
        `${name.padEnd(8)} ${Object.values(s).map((v) => v.toFixed(1).padStart(5)).join(' ')}   worst ${worst.toFixed(1)}  (plain doubles: worst ${worstPlain.toFixed(1)})`,
      );
      for (const [key, v] of Object.entries(s)) expect(v, `${name} ${key}`).toBeGreaterThanOrEqual(11);
    });
  }
  it('prints the scores', () => {
    console.log(
      `LRE (capped at 15)  dfB   dfW   SSB   SSW   MSB   MSW     F    R2    SD\n${rows.join('\n')}`,
    );
    expect(rows.length).toBe(NAMES.length);
  });
});
