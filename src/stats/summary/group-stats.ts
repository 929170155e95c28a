/**
 * Per-level summaries of a response: the numbers behind a table of group means.
 */
import { type GroupCodes, levelCounts } from './groups.ts';
import { sumSquaredDeviations, mean } from './moments.ts';

/**
 * Column-oriented per-level summaries, one entry per level in the order of
 * `groups.levels` (first-seen order). A level with no observations has n = 0 and NaN for
 * the rest; a level with one observation has its mean and NaN for sd and se.
 */
export interface GroupStats {
  /** Level names. */
  readonly level: readonly string[];
  /** Observations per level. */
  readonly n: Int32Array;
  /** Mean per level. */
  readonly mean: Float64Array;
  /** Sample standard deviation per level (divisor n - 1). */
  readonly sd: Float64Array;
  /** Standard error of each mean, sd / sqrt(n), from that level's own sd. */
  readonly se: Float64Array;
}

/**
 * Splits y by level into contiguous blocks (a counting sort on the codes), so that each
 * level's values can be handed to the one-sample summaries without per-observation objects.
 * Returns the values and each level's start offset (length k + 1).
 */
export function splitByLevel(
  y: Float64Array,
  groups: GroupCodes,
  what = 'group',
): { values: Float64Array; start: Int32Array; counts: Int32Array } {
  const counts = levelCounts(y.length, groups, what);
  const k = counts.length;
  const start = new Int32Array(k + 1);
  for (let j = 0; j < k; j++) start[j + 1] = start[j]! + counts[j]!;
  const fill = start.slice(0, k);
  const values = new Float64Array(y.length);
  const codes = groups.codes;
  for (let i = 0; i < y.length; i++) {
    const c = codes[i]!;
    values[fill[c]!] = y[i]!;
    fill[c]!++;
  }
  return { values, start, counts };
}

/**
 * n, mean, sd and se of y within each level of `groups`.
 *
 * @throws StatsInputError when the grouping does not match y
 */
export function groupStats(y: Float64Array, groups: GroupCodes, what = 'group'): GroupStats {
  const { values, start, counts } = splitByLevel(y, groups, what);
  const k = counts.length;
  const m = new Float64Array(k);
  const s = new Float64Array(k);
  const se = new Float64Array(k);
  for (let j = 0; j < k; j++) {
    const part = values.subarray(start[j]!, start[j + 1]!);
    const nj = part.length;
    m[j] = mean(part);
    s[j] = nj >= 2 ? Math.sqrt(sumSquaredDeviations(part, m[j]!) / (nj - 1)) : NaN;
    se[j] = s[j]! / Math.sqrt(nj);
  }
  return { level: groups.levels.slice(), n: counts, mean: m, sd: s, se };
}
