/**
 * The shapes shared by every analysis in src/stats that takes a grouping, and the error that
 * an analysis throws when its input cannot be analysed.
 */
import { statsMsg } from '../../messages/stats.ts';

/**
 * A factor as the analyses see it: one integer code per observation (0 .. levels.length - 1)
 * and the level names in first-seen order. The wiring layer builds it from a column after
 * dropping incomplete cases, so a level may end up with no observations.
 */
export interface GroupCodes {
  readonly codes: Int32Array;
  readonly levels: readonly string[];
}

/**
 * Thrown when the data cannot be analysed as asked (too few observations, a wrong number of
 * groups, lengths that differ, an unbalanced block layout). The message is written for the
 * person reading the notebook, in plain words, and names what was expected.
 */
export class StatsInputError extends Error {
  override name = 'StatsInputError';
}

/**
 * Checks that `groups` has one valid code per observation and returns the number of
 * observations in each level.
 *
 * @param n - the number of observations the codes must cover
 * @param groups - the grouping to check
 * @param what - how the grouping is named in an error message (e.g. "treatment")
 * @throws StatsInputError when the lengths differ or a code lies outside the levels
 */
export function levelCounts(n: number, groups: GroupCodes, what = 'group'): Int32Array {
  const { codes, levels } = groups;
  if (codes.length !== n) {
    throw new StatsInputError(statsMsg.groupLength(what, codes.length, n));
  }
  const k = levels.length;
  const counts = new Int32Array(k);
  for (let i = 0; i < n; i++) {
    const c = codes[i]!;
    if (c < 0 || c >= k || !Number.isInteger(c)) {
      throw new StatsInputError(statsMsg.codeNamesNoLevel(what, c, i + 1));
    }
    counts[c]!++;
  }
  return counts;
}

/**
 * Checks that two paired samples have the same length.
 *
 * @throws StatsInputError when they differ
 */
export function checkSameLength(a: Float64Array, b: Float64Array, what = 'the two samples'): void {
  if (a.length !== b.length) {
    throw new StatsInputError(statsMsg.pairLengths(what, a.length, b.length));
  }
}
