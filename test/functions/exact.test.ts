/**
 * Degenerate data answered honestly: a model that fits every observation exactly has no error
 * to test against; paired differences that are all the same have no variation; and the
 * Brown-Forsythe check of a factorial compares the spreads of its cells.
 */
import { describe, expect, it } from 'vitest';
import { msg } from '../../src/messages/language.ts';
import { toJson } from '../../src/lang/json.ts';
import { isError, type RecordValue, type Value } from '../../src/lang/values.ts';
import { doc, evalFormula, run, valueOf } from '../helpers.ts';

const json = (v: Value): unknown => JSON.parse(toJson(v));
const field = (v: Value, name: string): Value => (v as RecordValue).fields.get(name)!;

// treatment b is exactly 2 above a in every block: additive, no error at all
const EXACT = ['--- table t', 'trt,block,y', 'a,1,10', 'b,1,12', 'a,2,11', 'b,2,13', 'a,3,9.5', 'b,3,11.5', ''];
// the same with decimals whose binary sums leave rounding dust in the error sum of squares
const DUST = ['--- table t', 'trt,block,y', 'a,1,0.1', 'b,1,0.3', 'a,2,0.7', 'b,2,0.9', 'a,3,1.3', 'b,3,1.5', 'c,1,0.7', 'c,2,1.3', 'c,3,1.9', ''];

describe('a fit with no error left', () => {
  for (const [what, data] of [['exact data', EXACT], ['rounding dust', DUST]] as const) {
    it(`shows no F, p, standard errors or intervals, and says why (${what})`, () => {
      const fit = evalFormula('blocked(t.y, t.trt, t.block)', ...data);
      if (isError(fit)) throw new Error(fit.message);
      const table = json(field(fit, 'table')) as { f: (number | null)[]; p: (number | null)[] };
      expect(table.f).toEqual([null, null, null, null]);
      expect(table.p).toEqual([null, null, null, null]);
      const means = json(field(fit, 'means')) as { se: unknown[]; low: unknown[]; high: unknown[]; mean: number[] };
      expect(means.se.every((x) => x === null)).toBe(true);
      expect(means.low.every((x) => x === null)).toBe(true);
      expect(json(field(fit, 'notes'))).toContain(msg.exactFit());
      // nothing else that divides by the error shows as NaN: it is not available either
      expect(json(field(fit, 'studentized'))).toEqual(data === EXACT ? [null, null, null, null, null, null] : Array(9).fill(null));
      expect(field(fit, 'relative_efficiency')).toEqual({ kind: 'missing' });
      const na = field(fit, 'nonadditivity');
      expect([field(na, 'f'), field(na, 'p')]).toEqual([{ kind: 'missing' }, { kind: 'missing' }]);
      expect(toJson(fit)).not.toMatch(/NaN|Infinity/);
    });
  }
  it('with a covariate: the slope kept, its standard error not available, no NaN anywhere', () => {
    // y = 2 x + 1 for a, 2 x + 4 for b: a common slope of 2 and no error
    const v = evalFormula('one_way(t.y, t.trt, covariate: t.x)', '--- table t', 'trt,x,y', 'a,1,3', 'a,2,5', 'a,4,9', 'b,1,6', 'b,3,10', 'b,5,14', '');
    if (isError(v)) throw new Error(v.message);
    expect(field(v, 'slope')).toBeCloseTo(2, 12);
    expect(field(v, 'slope_se')).toEqual({ kind: 'missing' });
    expect(json(field(v, 'notes'))).toContain(msg.exactFit());
    expect(toJson(v)).not.toMatch(/NaN|Infinity/);
  });
  it('keeps its sums of squares and means', () => {
    const fit = evalFormula('blocked(t.y, t.trt, t.block)', ...EXACT);
    const table = json(field(fit, 'table')) as { ss: number[] };
    // source: common practice, no source: treatment SS = b * sum((mean_i - grand)^2) = 3 * 2 * 1^2 = 6
    expect(table.ss[0]).toBeCloseTo(6, 12);
    expect((json(field(fit, 'means')) as { mean: number[] }).mean).toEqual([10.166666666666666, 12.166666666666666]);
  });
  it('comparisons say there is no error instead of zero-width intervals', () => {
    for (const call of ['difference(fit, "a", "b")', 'pairwise(fit)', 'contrast(fit, [1, -1])']) {
      const v = evalFormula(call, ...EXACT, '--- formula', 'fit = blocked(t.y, t.trt, t.block)');
      expect(isError(v) && v.message).toBe(`${call.slice(0, call.indexOf('('))}: ${msg.exactFitNoComparison()}`);
    }
  });
  it('residual checks report zero residuals instead of testing noise', () => {
    const v = evalFormula('residual_checks(blocked(t.y, t.trt, t.block))', ...DUST);
    if (isError(v)) throw new Error(v.message);
    expect(json(field(v, 'notes'))).toEqual([msg.exactFitResiduals()]);
    expect(field(v, 'shapiro_wilk')).toEqual({ kind: 'missing' });
  });
  it('every measurement the same: said so', () => {
    const v = evalFormula('one_way([5, 5, 5, 5], ["x", "x", "y", "y"])');
    if (isError(v)) throw new Error(v.message);
    expect(json(field(v, 'notes'))).toContain(msg.allMeasurementsEqual());
    expect((json(field(v, 'table')) as { f: unknown[] }).f).toEqual([null, null, null]);
  });
  it('a fit with real error is untouched', () => {
    const v = evalFormula('blocked(t.y, t.trt, t.block)', '--- table t', 'trt,block,y', 'a,1,10', 'b,1,12.5', 'a,2,11', 'b,2,13', 'a,3,9.5', 'b,3,11.2', '');
    const table = json(field(v, 'table')) as { f: (number | null)[] };
    expect(typeof table.f[0]).toBe('number');
  });
});

describe('paired differences that are all the same', () => {
  it('give the difference, with t, p and the interval not available and a note', () => {
    const { engine, states } = run(doc('--- formula', 'd = paired([10.1, 11.3, 9.8], [8.1, 9.3, 7.8])'));
    const v = valueOf(engine, 'd');
    if (isError(v)) throw new Error(v.message);
    expect(field(v, 'estimate')).toBeCloseTo(2, 12);
    for (const k of ['t', 'p', 'low', 'high']) expect(field(v, k)).toEqual({ kind: 'missing' });
    expect(states[0]!.warnings).toEqual([msg.pairedAllEqual(3, '2')]);
  });
});

describe('Brown-Forsythe in a factorial', () => {
  it('groups the residuals by cell', () => {
    const rows = [
      ['lo', 'x', [12.1, 13.4, 11.8, 12.9]],
      ['lo', 'y', [14.2, 15.9, 13.1, 14.8]],
      ['hi', 'x', [16.3, 16.0, 16.9, 15.2]],
      ['hi', 'y', [19.5, 22.4, 17.1, 20.2]],
    ] as const;
    const lines = rows.flatMap(([a, b, ys]) => ys.map((y) => `${a},${b},${y}`));
    const v = evalFormula('residual_checks(factorial(t.y, [t.a, t.b])).brown_forsythe', '--- table t', 'a,b,y', ...lines, '');
    if (isError(v)) throw new Error(v.message);
    // residuals are y minus the cell mean, so their median-centred spreads are those of y in each
    // cell: source: scipy 1.10.1, stats.levene(*cells, center='median') = 1.3467406380027729,
    // p = 0.3056425160567368 (3 and 12 df)
    expect(field(v, 'f')).toBeCloseTo(1.3467406380027729, 10);
    expect(field(v, 'p')).toBeCloseTo(0.3056425160567368, 10);
    expect(field(v, 'df1')).toBe(3);
    expect(field(v, 'df2')).toBe(12);
  });
});
