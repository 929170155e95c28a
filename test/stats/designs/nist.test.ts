/**
 * NIST StRD one-way analysis of variance: all eleven datasets, fed as decimal text through the
 * exact decimal shift, scored by the log relative error of every certified value.
 */
import { describe, expect, it } from 'vitest';
import { shiftDecimals } from '../../../src/stats/decimal/index.ts';
import { oneWay } from '../../../src/stats/designs/index.ts';
import { readDataset, NAMES, type Dataset } from '../../reference/fixtures/nist.ts';
import { factorOf, lre } from './support.ts';

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
