/**
 * The t interval and test of one estimate: the one shape that a difference of means, a
 * contrast, a two-sample comparison and a paired comparison all give (estimate, standard
 * error, degrees of freedom, t, two-sided p, interval at a level).
 */
import { tCritical, tTwoSided } from './central.ts';

export interface TInterval {
  readonly estimate: number;
  readonly se: number;
  readonly df: number;
  readonly t: number;
  readonly p: number;
  readonly low: number;
  readonly high: number;
  readonly level: number;
}

/** The estimate's t statistic, two-sided p, and interval estimate ± t(level, df) · se. */
export function tInterval(estimate: number, se: number, df: number, level: number): TInterval {
  const t = estimate / se;
  const half = tCritical(level, df) * se;
  return { estimate, se, df, t, p: tTwoSided(t, df), low: estimate - half, high: estimate + half, level };
}
