/**
 * Median and quantiles.
 *
 * The quantile is definition 7 of Hyndman and Fan: with the values sorted, x(1) <= ... <=
 * x(n), and h = (n - 1) p + 1, Q(p) = x(floor h) + (h - floor h) (x(floor h + 1) - x(floor h)).
 * It interpolates linearly between order statistics, gives the minimum at p = 0, the maximum
 * at p = 1 and the usual median at p = 0.5.
 * source: R. J. Hyndman, Y. Fan (1996), "Sample quantiles in statistical packages",
 * The American Statistician 50, 361-365.
 */
import { StatsInputError } from './groups.ts';
import { statsMsg } from '../../messages/stats.ts';

/** A sorted copy (ascending); NaN values, if any, end up last. */
export function sortedCopy(x: Float64Array): Float64Array {
  return Float64Array.from(x).sort();
}

/**
 * Quantile of already sorted values by Hyndman and Fan's definition 7 (see the module note).
 * NaN for empty input.
 */
export function quantileSorted(sorted: Float64Array, p: number): number {
  checkProbability(p);
  const n = sorted.length;
  if (n === 0) return NaN;
  const h = (n - 1) * p; // zero-based position
  const lo = Math.floor(h);
  const xlo = sorted[lo]!;
  if (lo >= n - 1) return sorted[n - 1]!;
  const frac = h - lo;
  if (frac === 0) return xlo;
  const xhi = sorted[lo + 1]!;
  return xlo + frac * (xhi - xlo);
}

/**
 * The p-quantile of x (Hyndman and Fan definition 7). NaN for empty input or when any value
 * is NaN.
 *
 * @param p - probability in [0, 1]
 * @throws StatsInputError when p lies outside [0, 1]
 */
export function quantile(x: Float64Array, p: number): number {
  checkProbability(p);
  const s = sortedCopy(x);
  if (s.length > 0 && Number.isNaN(s[s.length - 1]!)) return NaN;
  return quantileSorted(s, p);
}

/** The median: the mean of the two middle values when n is even. NaN for empty input. */
export function median(x: Float64Array): number {
  return quantile(x, 0.5);
}

function checkProbability(p: number): void {
  if (!(p >= 0 && p <= 1)) {
    throw new StatsInputError(statsMsg.quantileProbability(p));
  }
}
