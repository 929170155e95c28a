/**
 * Fits with no error to test against. When the error sum of squares is zero, or zero to
 * rounding beside the total, every observation sits on the model: an F ratio would divide by
 * (almost) nothing and print Infinity or 5e32, intervals would have no width and every
 * comparison would look "significant". Such a fit keeps its sums of squares and means, and
 * shows F, p, standard errors and intervals as not available, with a note that says why;
 * comparisons and residual checks say the same instead of testing noise.
 */
import { msg } from '../messages/language.ts';
import type { DesignFit, MeansTable } from '../stats/designs/index.ts';

/**
 * The error sum of squares, relative to the total, below which it is rounding: sums of
 * squares formed from double-precision data carry relative errors of about n * 1e-16, so a
 * ratio under 1e-12 cannot tell a real error from none (common practice, no source).
 */
export const EXACT_FIT_RELATIVE = 1e-12;

/** True when a fit has error degrees of freedom but no error to speak of. */
export function isExactFit(fit: DesignFit): boolean {
  if (!(fit.df_error > 0)) return false;
  const t = fit.table;
  const e = t.source.indexOf('error');
  const total = t.source.indexOf('total');
  if (e < 0 || total < 0) return false;
  const sse = t.ss[e]!;
  const sst = t.ss[total]!;
  return !(sse > EXACT_FIT_RELATIVE * sst);
}

function blankIntervals(m: MeansTable): MeansTable {
  const nan = (): number[] => m.level.map(() => NaN);
  return { ...m, se: nan(), low: nan(), high: nan() };
}

/** The fit as shown when it is exact: no F, p, standard errors or intervals, and a note. */
export function withoutErrorTests(fit: DesignFit): DesignFit {
  if (!isExactFit(fit)) return fit;
  const t = fit.table;
  const rows = t.source.length;
  const f = t.f.slice();
  const p = t.p.slice();
  for (let i = 0; i < rows; i++) {
    f[i] = NaN;
    p[i] = NaN;
  }
  const sst = t.ss[t.source.indexOf('total')]!;
  return {
    ...fit,
    table: { ...t, f, p },
    means: blankIntervals(fit.means),
    factor_means: fit.factor_means.map((m) => ({ ...m, table: blankIntervals(m.table) })),
    studentized_residuals: new Float64Array(fit.residuals.length).fill(NaN),
    // an efficiency against a design with no error either is 0 / 0
    ...(fit.relative_efficiency !== undefined ? { relative_efficiency: NaN, relative_efficiency_uncorrected: NaN } : {}),
    // the test for nonadditivity and the test of parallel slopes divide by the error too:
    // on rounding dust they would give an F of noise
    ...(fit.nonadditivity !== undefined ? { nonadditivity: { ...fit.nonadditivity, f: NaN, p: NaN } } : {}),
    ...(fit.covariate !== undefined ? { covariate: { ...fit.covariate, slope_se: NaN, parallel: { ...fit.covariate.parallel, f: NaN, p: NaN } } } : {}),
    notes: [...fit.notes, sst > 0 ? msg.exactFit() : msg.allMeasurementsEqual()],
  };
}
