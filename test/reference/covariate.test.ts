/**
 * Analysis of covariance through documents, against statsmodels 0.13.5 (figures produced by
 * test/reference/fixtures/covariate.py: ols + anova_lm typ 2, adjusted means predicted at the
 * covariate's mean and averaged over blocks).
 */
import { describe, expect, it } from 'vitest';
import { doc, run } from '../helpers.ts';
import { expectRelative } from '../stats/designs/support.ts';
import { num, nums, rec, tab } from './record-helpers.ts';


/** Each figure to a relative 1e-10 (statsmodels prints 16 or 17 digits). */
function near(actual: readonly number[], want: readonly number[], label: string, tol = 1e-10): void {
  expect(actual.length, label).toBe(want.length);
  want.forEach((w, i) => expectRelative(actual[i]!, w, tol, `${label}[${i}]`));
}

// source: Montgomery, Design and Analysis of Experiments, breaking strength of monofilament
// fibre from three machines, fibre diameter as covariate (from memory).
const FIBRE = {
  y: [36, 41, 39, 42, 49, 40, 48, 39, 45, 44, 35, 37, 42, 34, 32],
  x: [20, 25, 24, 25, 32, 22, 28, 22, 30, 28, 21, 23, 26, 21, 15],
};

describe('one_way with a covariate: the fibre-strength example', () => {
  const rows = FIBRE.y.map((y, i) => `m${Math.floor(i / 5) + 1},${FIBRE.x[i]},${y}`);
  const { engine } = run(
    doc('--- table fibre', 'machine,diameter,strength', ...rows, '', '--- formula', 'fit = one_way(fibre.strength, fibre.machine, covariate: fibre.diameter)', '--- formula', 'checks = residual_checks(fit)', '--- formula', 'd = difference(fit, "m2", "m3")'),
  );
  const fit = rec(engine.valueOf('fit'));
  const t = tab(fit.fields.get('table'));
  it('gives the adjusted analysis of variance', () => {
    expect(Array.from(t.columns[0]!.values as string[])).toEqual(['machine', 'diameter', 'error', 'total']);
    expect(nums(t, 'df')).toEqual([2, 1, 11, 14]);
    // source: statsmodels 0.13.5 (anova_lm typ 2); Montgomery prints 13.28, 178.01, 27.99
    near(nums(t, 'ss').slice(0, 3), [13.283850623029092, 178.01411042944792, 27.985889570552146], 'ss');
    near(nums(t, 'f').slice(0, 2), [2.6106434188012324, 69.9693754521341], 'F');
    near(nums(t, 'p').slice(0, 2), [0.11808387514741604, 4.264464150675361e-6], 'p', 1e-8);
    expectRelative(num(fit, 'mse'), 2.544171779141104, 1e-12, 'mse');
    expect(num(fit, 'df_error')).toBe(11);
  });
  it('gives the slope, its standard error and the adjusted means', () => {
    // source: statsmodels 0.13.5; Montgomery prints slope 0.954, adjusted means 40.38, 41.42, 38.80
    expectRelative(num(fit, 'slope'), 0.9539877300613501, 1e-12, 'slope');
    expectRelative(num(fit, 'slope_se'), 0.11404829321736022, 1e-12, 'slope se');
    const m = tab(fit.fields.get('means'));
    near(nums(m, 'mean'), [40.382413087934566, 41.41922290388549, 38.798364008179966], 'adjusted means', 1e-12);
    near(nums(m, 'se'), [0.7236252112704975, 0.7444169333527265, 0.7878784666263778], 'adjusted se', 1e-10);
    // comparisons use the adjusted means
    const d = rec(engine.valueOf('d'));
    expectRelative(num(d, 'estimate'), 41.41922290388549 - 38.798364008179966, 1e-11, 'difference');
    // source: statsmodels 0.13.5, the contrast m2 - m3 of the adjusted means on the parameters
    expectRelative(num(d, 'estimate'), 2.6208588957055223, 1e-11, 'difference, as a contrast');
    expectRelative(num(d, 'se'), 1.1477588141491721, 1e-10, 'se of the difference');
    expect(num(d, 'df')).toBe(11);
  });
  it('tests that the slopes are parallel', () => {
    const ps = rec(rec(engine.valueOf('checks')).fields.get('parallel_slopes'));
    // source: statsmodels 0.13.5, y ~ C(machine) * x, anova_lm typ 2, row C(machine):x
    expectRelative(num(ps, 'ss'), 2.7371774257608026, 1e-10, 'ss');
    expectRelative(num(ps, 'f'), 0.48783868045582474, 1e-10, 'F');
    expectRelative(num(ps, 'p'), 0.6292895461515713, 1e-9, 'p');
    expect([num(ps, 'df1'), num(ps, 'df2')]).toEqual([2, 9]);
  });
});

/** The generated blocked trial of covariate.py, by its rule, as table rows. */
function generatedRows(skip?: string): string[] {
  const rows: string[] = [];
  for (let k = 0; k < 5; k++) {
    for (let i = 0; i < 4; i++) {
      const xt = 100 + ((7 * i + 3 * k) % 11) * 5;
      const yt = 200 + 20 * i + 10 * k + Math.floor((8 * xt) / 10) + (((13 * i + 7 * k) % 5) - 2) * 3;
      const key = `t${i + 1},b${k + 1}`;
      if (key !== skip) rows.push(`${key},${(xt / 10).toFixed(1)},${(yt / 10).toFixed(1)}`);
    }
  }
  return rows;
}

describe('blocked with a covariate: generated trial (rule in covariate.py)', () => {
  const cases = [
    {
      label: 'complete',
      skip: undefined,
      // source: statsmodels 0.13.5 (y ~ C(block) + C(trt) + x, anova_lm typ 2)
      ss: [99.66833908406494, 42.220585699797255, 28.383749999999974, 3.3712500000000136],
      f: [108.40209911503744, 34.44022563572621, 92.612903225806],
      p: [1.8871146019396483e-8, 3.662894510819457e-6, 1.083296749321852e-6],
      df: [3, 4, 1, 11, 19],
      slope: 0.7909090909090903,
      slopeSe: 0.08218467046904311,
      means: [31.974772727272715, 33.986590909090886, 35.97840909090909, 37.98022727272724],
      se: [0.25204880800219454, 0.2546481769560667, 0.24799658384198583, 0.2475877137409933],
      parallel: { ss: 0.8641224910424402, f: 0.9191102704377125, p: 0.4741411595016908, df2: 8 },
      difference: { estimate: -1.991818181818192, se: 0.3578573854758274 },
    },
    {
      label: 'one plot missing',
      skip: 't2,b3',
      // source: statsmodels 0.13.5, the same model without the plot of t2 in block b3
      ss: [98.42882680579001, 42.10000279694198, 21.365818548386496, 3.350806451612927],
      f: [97.91555975866727, 31.41035106390354, 63.76321299638765],
      p: [1.0325084902408036e-7, 1.2264603831021288e-5, 1.1967605973534847e-5],
      df: [3, 4, 1, 10, 18],
      slope: 0.7794721407624519,
      slopeSe: 0.09761476232899288,
      means: [32.02870813397114, 34.097329834850896, 36.03691927766616, 38.041024849513654],
      se: [0.2665982823953355, 0.33168009243249247, 0.26004667431198925, 0.258925711666427],
      parallel: { ss: 2.4627857141464387, f: 6.471132663039036, p: 0.019868774634241314, df2: 7 },
      difference: { estimate: -1.9395894428152634, se: 0.42979603601138583 },
    },
  ];
  for (const c of cases) {
    it(`matches statsmodels (${c.label})`, () => {
      const { engine } = run(
        doc('--- table trial', 'trt,block,x,y', ...generatedRows(c.skip), '', '--- formula', 'fit = blocked(trial.y, trial.trt, trial.block, covariate: trial.x)', '--- formula', 'checks = residual_checks(fit)', '--- formula', 'd = difference(fit, "t2", "t3")'),
      );
      const fit = rec(engine.valueOf('fit'));
      const t = tab(fit.fields.get('table'));
      expect(Array.from(t.columns[0]!.values as string[])).toEqual(['trt', 'block', 'x', 'error', 'total']);
      expect(nums(t, 'df')).toEqual(c.df);
      near(nums(t, 'ss').slice(0, 4), c.ss, 'ss');
      near(nums(t, 'f').slice(0, 3), c.f, 'F');
      near(nums(t, 'p').slice(0, 3), c.p, 'p', 1e-8);
      expectRelative(num(fit, 'slope'), c.slope, 1e-12, 'slope');
      expectRelative(num(fit, 'slope_se'), c.slopeSe, 1e-10, 'slope se');
      const m = tab(fit.fields.get('means'));
      near(nums(m, 'mean'), c.means, 'adjusted means', 1e-12);
      near(nums(m, 'se'), c.se, 'adjusted se', 1e-10);
      const ps = rec(rec(engine.valueOf('checks')).fields.get('parallel_slopes'));
      expectRelative(num(ps, 'ss'), c.parallel.ss, 1e-9, 'parallel ss');
      expectRelative(num(ps, 'f'), c.parallel.f, 1e-9, 'parallel F');
      expectRelative(num(ps, 'p'), c.parallel.p, 1e-8, 'parallel p');
      expect(num(ps, 'df2')).toBe(c.parallel.df2);
      // comparisons use the adjusted means and their covariance
      // source: statsmodels 0.13.5, the contrast t2 - t3 of the adjusted means on the parameters
      const d = rec(engine.valueOf('d'));
      expectRelative(num(d, 'estimate'), c.difference.estimate, 1e-11, 'difference');
      expectRelative(num(d, 'se'), c.difference.se, 1e-10, 'se of the difference');
      expect(num(d, 'df')).toBe(c.df[3]);
    });
  }
});
