/**
 * Power and size of a trial.
 *
 * - Two groups of n plots each, two-sided pooled t test at level `level` (significance
 *   1 - level): the statistic is noncentral t on 2n - 2 df with noncentrality
 *   delta / (sd sqrt(2 / n)); power = P(T > t_c) + P(T < -t_c).
 * - Randomized complete blocks, k treatments in b blocks, the analysis-of-variance F test:
 *   F is noncentral F on k - 1 and (k - 1)(b - 1) df with noncentrality
 *   b sum(tau_i^2) / sd^2, where tau_i are the treatment effects about their mean. With two
 *   treatments delta apart and the rest midway, sum(tau_i^2) = delta^2 / 2: for a given
 *   largest difference that is the smallest noncentrality, so the power is the least one
 *   can count on.
 *
 * Distributions: src/stats/dist (our noncentral t and F, checked there against a seeded
 * Monte Carlo and the central functions).
 */
import { fCritical, noncentralFUpper, noncentralTCdf, noncentralTUpper, tCritical } from '../distributions/index.ts';
import { PlanningError } from './errors.ts';
import { MAX_PLOTS, checkCount } from './layouts.ts';
import { planningMsg as m } from '../../messages/planning.ts';

function checkScale(delta: number, sd: number): void {
  if (!Number.isFinite(delta)) throw new PlanningError(m.deltaNotFinite(delta));
  if (delta === 0) throw new PlanningError(m.deltaZero());
  if (!(sd > 0) || !Number.isFinite(sd)) throw new PlanningError(m.sdNotPositive(sd));
}

function checkUnit(what: string, v: number): void {
  if (!(v > 0 && v < 1)) throw new PlanningError(m.outsideUnit(what, v));
}

/** A two-group power and the numbers behind it. */
export interface TwoGroupPower {
  readonly power: number;
  /** Plots per group. */
  readonly n: number;
  readonly df: number;
  readonly noncentrality: number;
  readonly critical: number;
}

/** Power of the two-sided two-sample t test with n plots per group. */
export function twoGroupPower(delta: number, sd: number, n: number, level: number): TwoGroupPower {
  checkScale(delta, sd);
  checkUnit('the level', level);
  checkCount('n (plots per group)', n, 2);
  if (2 * n > MAX_PLOTS) throw new PlanningError(m.tooManyPlots(2 * n));
  return twoGroupAt(Math.abs(delta) / sd, n, level);
}

function twoGroupAt(effect: number, n: number, level: number): TwoGroupPower {
  const df = 2 * n - 2;
  const ncp = effect * Math.sqrt(n / 2);
  const critical = tCritical(level, df);
  const power = noncentralTUpper(critical, df, ncp) + noncentralTCdf(-critical, df, ncp);
  return { power, n, df, noncentrality: ncp, critical };
}

/** A blocked power and the numbers behind it. */
export interface BlockedPower {
  readonly power: number;
  readonly blocks: number;
  readonly treatments: number;
  readonly df_treatment: number;
  readonly df_error: number;
  readonly noncentrality: number;
  readonly critical: number;
}

/** Power of the blocked analysis-of-variance F test, least favourable configuration. */
export function blockedPower(delta: number, sd: number, treatments: number, blocks: number, level: number): BlockedPower {
  checkScale(delta, sd);
  checkUnit('the level', level);
  checkCount('treatments', treatments, 2);
  checkCount('blocks', blocks, 2);
  if (treatments * blocks > MAX_PLOTS) throw new PlanningError(m.tooManyPlots(treatments * blocks));
  return blockedAt(Math.abs(delta) / sd, treatments, blocks, level);
}

function blockedAt(effect: number, k: number, b: number, level: number): BlockedPower {
  const df1 = k - 1;
  const df2 = (k - 1) * (b - 1);
  const lambda = (b * effect * effect) / 2;
  const critical = fCritical(level, df1, df2);
  return { power: noncentralFUpper(critical, df1, df2, lambda), blocks: b, treatments: k, df_treatment: df1, df_error: df2, noncentrality: lambda, critical };
}

/**
 * The smallest whole m >= least with at(m) >= target, for an `at` that grows with m:
 * doubling until it is reached, then bisection. Throws when more than `most` would be needed.
 */
function smallest(least: number, most: number, target: number, at: (x: number) => number, plots: (x: number) => number): number {
  if (at(least) >= target) return least;
  let lo = least;
  let hi = least;
  for (;;) {
    hi = Math.min(hi * 2, most);
    if (at(hi) >= target) break;
    if (hi === most) throw new PlanningError(m.tooManyPlots(plots(most + 1)));
    lo = hi;
  }
  while (hi - lo > 1) {
    const mid = Math.floor((lo + hi) / 2);
    if (at(mid) >= target) hi = mid;
    else lo = mid;
  }
  return hi;
}

/** The smallest n per group with two-group power at least `power`. */
export function replicatesForPower(delta: number, sd: number, power: number, level: number): TwoGroupPower {
  checkScale(delta, sd);
  checkUnit('the power', power);
  checkUnit('the level', level);
  if (power <= 1 - level) throw new PlanningError(m.powerBelowLevel(power, level));
  const effect = Math.abs(delta) / sd;
  const n = smallest(2, MAX_PLOTS / 2, power, (x) => twoGroupAt(effect, x, level).power, (x) => 2 * x);
  return twoGroupAt(effect, n, level);
}

/** The smallest number of blocks with blocked power at least `power`. */
export function blocksForPower(delta: number, sd: number, treatments: number, power: number, level: number): BlockedPower {
  checkScale(delta, sd);
  checkCount('treatments', treatments, 2);
  checkUnit('the power', power);
  checkUnit('the level', level);
  if (power <= 1 - level) throw new PlanningError(m.powerBelowLevel(power, level));
  const effect = Math.abs(delta) / sd;
  const most = Math.floor(MAX_PLOTS / treatments);
  if (most < 2) throw new PlanningError(m.tooManyPlots(2 * treatments));
  const b = smallest(2, most, power, (x) => blockedAt(effect, treatments, x, level).power, (x) => x * treatments);
  return blockedAt(effect, treatments, b, level);
}

/** Two-group power at each n of a range (for the chart). */
export function twoGroupCurve(delta: number, sd: number, level: number, ns: readonly number[]): Float64Array {
  const effect = Math.abs(delta) / sd;
  return Float64Array.from(ns, (n) => twoGroupAt(effect, n, level).power);
}

/** Blocked power at each number of blocks of a range (for the chart). */
export function blockedCurve(delta: number, sd: number, treatments: number, level: number, bs: readonly number[]): Float64Array {
  const effect = Math.abs(delta) / sd;
  return Float64Array.from(bs, (b) => blockedAt(effect, treatments, b, level).power);
}
