/**
 * The words of the numeric code (src/stats) outside the designs and planning: what a summary,
 * a two-group comparison, a rank test or a residual check says when its input cannot give an
 * answer. The built-ins pass them on to the cell (src/functions/records.ts, `guarded`).
 */
export const statsMsg = {
  // summaries
  groupLength: (what: string, got: number, n: number) => `the ${what} column has ${got} values but the data have ${n}`,
  pairLengths: (what: string, a: number, b: number) => `${what} must have the same length (one value each per pair), got ${a} and ${b}`,
  codeNamesNoLevel: (what: string, code: number, position: number) => `the ${what} code ${code} at position ${position} names no level`,
  quantileProbability: (p: number) => `a quantile needs a probability from 0 to 1, got ${p}`,
  // two groups
  pooledTooFew: () => 'the pooled comparison needs at least three values in all',
  badLevel: (level: number) => `a confidence level must lie between 0 and 1, got ${level}`,
  pairedTooFew: (n: number) => `a paired comparison needs at least two pairs, got ${n}`,
  twoGroupsOnly: (k: number) => `a two-group comparison needs exactly two groups, got ${k}`,
  emptyGroup: (first: string, n1: number, second: string, n2: number) =>
    `each group needs at least one value; "${first}" has ${n1}, "${second}" has ${n2}`,
  separateTooFew: (first: string, n1: number, second: string, n2: number) =>
    `the separate-variance comparison needs at least two values in each group; "${first}" has ${n1}, "${second}" has ${n2}`,
  // rank tests
  friedmanTreatments: (k: number) => `Friedman's test needs at least two treatments, got ${k}`,
  friedmanBlocks: (b: number) => `Friedman's test needs at least two blocks, got ${b}`,
  friedmanTwice: (block: string, treatment: string) =>
    `block "${block}" has more than one value for treatment "${treatment}"; Friedman's test needs exactly one`,
  friedmanMissing: (block: string, treatment: string) =>
    `block "${block}" has no value for treatment "${treatment}"; Friedman's test needs a complete layout (one value of every treatment in every block)`,
  allDifferencesZero: (pairs: number) =>
    `every one of the ${pairs} pairs has a difference of zero; the signed rank test needs at least one that is not`,
  rankSumTwoGroups: (k: number) => `the rank sum test compares exactly two groups, got ${k}`,
  blocksAllTied: () => 'every block has all its values equal, so there is nothing to rank',
  kruskalGroups: (used: number) => `the Kruskal-Wallis test needs at least two groups with data, got ${used}`,
  allTied: () => 'all values are equal, so there is nothing to rank',
  // residual checks
  normalityAllEqual: () => 'all values are equal, so normality cannot be checked',
  shapiroWilkSize: (least: number, most: number, n: number) => `the Shapiro-Wilk test covers samples of ${least} to ${most} values, got ${n}`,
  spreadConstant: () => 'the deviations from the group medians do not vary within any group, so their spread cannot be compared',
  spreadGroups: (used: number) => `the spread comparison needs at least two groups with data, got ${used}`,
  spreadTooFew: () => 'the spread comparison needs more observations than groups',
} as const;
