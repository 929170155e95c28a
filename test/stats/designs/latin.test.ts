/**
 * Latin squares: a published worked example, closed form against least squares, the
 * missing-plot estimate, and the checks of the Latin property.
 */
import { describe, expect, it } from 'vitest';
import { DesignError, latinSquare } from '../../../src/stats/designs/index.ts';
import { fitFactorModel, leastSquaresMeans } from '../../../src/stats/linear/index.ts';
import { expectAbsolute, expectArrayNear, expectRelative, factorOf, subset } from './support.ts';
import { designMsg } from '../../../src/messages/designs.ts';

// source: Montgomery, Design and Analysis of Experiments, rocket-propellant Latin square
// (from memory): rows are batches of raw material, columns operators, letters formulations.
const SQUARE = [
  'A24 B20 C19 D24 E24',
  'B17 C24 D30 E27 A36',
  'C18 D38 E26 A27 B21',
  'D26 E31 A26 B23 C22',
  'E22 A30 B20 C29 D31',
];

function square() {
  const y: number[] = [];
  const t: string[] = [];
  const r: string[] = [];
  const c: string[] = [];
  SQUARE.forEach((line, i) => {
    line.split(' ').forEach((cell, j) => {
      t.push(cell[0]!);
      y.push(Number(cell.slice(1)));
      r.push(String(i + 1));
      c.push(String(j + 1));
    });
  });
  return { y: Float64Array.from(y), treatment: factorOf('formulation', t), row: factorOf('batch', r), column: factorOf('operator', c) };
}

describe('latinSquare', () => {
  const { y, treatment, row, column } = square();
  const fit = latinSquare(y, treatment, row, column);

  it('reproduces the published analysis', () => {
    // source: Montgomery, rocket-propellant example (from memory): SS formulations 330,
    // batches 68, operators 150, error 128, total 676; F = 7.73, p = 0.0025.
    expect(fit.table.source).toEqual(['formulation', 'batch', 'operator', 'error', 'total']);
    expect(fit.table.df).toEqual([4, 4, 4, 12, 24]);
    expectArrayNear(fit.table.ss, [330, 68, 150, 128, 676], 1e-12, 'sums of squares');
    expectAbsolute(fit.table.f[0]!, 7.73, 0.005, 'F');
    expectAbsolute(fit.table.p[0]!, 0.0025, 0.00005, 'p');
    expect(fit.design).toBe('Latin square');
  });

  it('has error df (t - 1)(t - 2) and sums of squares that add to the total', () => {
    // common practice, no source
    expect(fit.df_error).toBe(4 * 3);
    const s = fit.table.ss;
    expectRelative(s[0]! + s[1]! + s[2]! + s[3]!, s[4]!, 1e-14, 'sum of SS');
  });

  it('agrees with least squares on the complete square to 1e-10', () => {
    const ls = fitFactorModel({ y, factors: [treatment, row, column], terms: [[0], [1], [2]] });
    expectArrayNear(fit.table.ss.slice(0, 3), Array.from(ls.termSS), 1e-10, 'term SS');
    expectRelative(fit.table.ss[3]!, ls.sse, 1e-10, 'error SS');
    expectArrayNear(fit.fitted, ls.fitted, 1e-10, 'fitted');
    expectArrayNear(fit.leverage, ls.leverage, 1e-10, 'leverage');
    expectArrayNear(fit.studentized_residuals, Float64Array.from(ls.residuals, (e, i) => e / Math.sqrt((ls.sse / ls.dfError) * (1 - ls.leverage[i]!))), 1e-10, 'studentized');
    expectArrayNear(fit.means.mean, leastSquaresMeans(ls, 0).mean, 1e-10, 'means');
  });

  it('with a missing plot, matches the completed-data error SS of the missing-plot estimate', () => {
    // source: Montgomery, Latin-square missing value (from memory):
    // x = (t (R + C + T) - 2 G) / ((t - 1)(t - 2)); completing the square with x gives the
    // least-squares error SS of the incomplete square.
    const missing = 7; // batch 2, operator 3, formulation D
    const { y: y2, factors } = subset(y, [treatment, row, column], (i) => i !== missing);
    const mfit = latinSquare(y2, factors[0]!, factors[1]!, factors[2]!);
    expect(mfit.balanced).toBe(false);
    expect(mfit.df_error).toBe(11);
    expect(mfit.notes).toContain('row 2, column 3 has no plot');
    const t = 5;
    const tr = treatment.codes[missing]!;
    const ro = row.codes[missing]!;
    const co = column.codes[missing]!;
    let R = 0;
    let C = 0;
    let T = 0;
    let G = 0;
    for (let i = 0; i < 25; i++) {
      if (i === missing) continue;
      G += y[i]!;
      if (row.codes[i] === ro) R += y[i]!;
      if (column.codes[i] === co) C += y[i]!;
      if (treatment.codes[i] === tr) T += y[i]!;
    }
    const x = (t * (R + C + T) - 2 * G) / ((t - 1) * (t - 2));
    const completed = Float64Array.from(y, (v, i) => (i === missing ? x : v));
    const cfit = latinSquare(completed, treatment, row, column);
    expectRelative(mfit.table.ss[3]!, cfit.table.ss[3]!, 1e-11, 'error SS');
    // The adjusted sums agree with reduced-model differences from the general least squares.
    const ls = fitFactorModel({ y: y2, factors, terms: [[0], [1], [2]] });
    expectArrayNear(mfit.table.ss.slice(0, 3), Array.from(ls.termSS), 1e-12, 'adjusted SS');
  });

  it('refuses what is not a Latin square', () => {
    const five = (name: string, k: number) => factorOf(name, Array.from({ length: 25 }, (_, i) => String(i % k)));
    expect(() => latinSquare(y, treatment, row, five('operator', 4))).toThrow(DesignError);
    expect(() => latinSquare(y, treatment, row, five('operator', 4))).toThrow(designMsg.notSquare(5, 5, 4));
    const swapped = { ...treatment, codes: Int32Array.from(treatment.codes, (c, i) => (i === 0 ? treatment.codes[1]! : c)) };
    expect(() => latinSquare(y, swapped, row, column)).toThrow(/appears more than once in row "1"/);
    const { y: y3, factors: f3 } = subset(y, [treatment, row, column], (i) => row.codes[i] !== 4);
    expect(() => latinSquare(y3, f3[0]!, f3[1]!, f3[2]!)).toThrow(/row "5" has no observations/);
    const twice = { ...column, codes: Int32Array.from(column.codes, (c, i) => (i === 1 ? 0 : c)) };
    expect(() => latinSquare(y, treatment, row, twice)).toThrow(designMsg.twoPlotsInCell('1', '1'));
  });
});
