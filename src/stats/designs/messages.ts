/**
 * Every message the design analyses and comparisons show to a person, in one place, so the
 * wording is kept consistent and the tests can check against these builders.
 */

const q = (s: string): string => `"${s}"`;

/** Plain-words messages (errors and notes). */
export const messages = {
  lengthMismatch: (what: string, got: number, n: number) =>
    `${what} has ${got} values but the response has ${n}`,
  badCode: (what: string, code: number, at: number, levels: number) =>
    `${what} has level code ${code} at row ${at + 1}, but only ${levels} levels`,
  notFinite: (at: number) => `the response at row ${at + 1} is not a finite number`,
  noData: () => 'there are no observations to analyse',
  badLevel: (level: number) => `the confidence level must lie strictly between 0 and 1 (got ${level})`,
  tooFewLevels: (role: string, name: string, k: number) =>
    `${role} ${q(name)} has ${k} level${k === 1 ? '' : 's'}; at least 2 are needed`,
  levelWithoutData: (role: string, level: string) =>
    `${role} ${q(level)} has no observations, so its mean cannot be estimated`,
  blockWithOnePlot: (block: string) =>
    `block ${q(block)} has only one plot, so it says nothing about differences between treatments; remove it or add its missing plots`,
  disconnected: (a: string, b: string) =>
    `treatments ${q(a)} and ${q(b)} never meet in a block, directly or through other treatments, so they cannot be compared`,
  tooManyCells: (cells: number) =>
    `the design has ${cells} combinations of levels, too many for this analysis`,
  notSquare: (t: number, r: number, c: number) =>
    `a Latin square needs as many rows and columns as treatments; there are ${t} treatments, ${r} rows and ${c} columns`,
  twoPlotsInCell: (row: string, column: string) =>
    `row ${q(row)} and column ${q(column)} hold more than one plot; a Latin square has one plot in each`,
  repeatedInLine: (treatment: string, line: string, name: string) =>
    `treatment ${q(treatment)} appears more than once in ${line} ${q(name)}, so this is not a Latin square`,
  factorialNeedsTwo: (k: number) => `a factorial needs at least two factors (got ${k})`,
  emptyCell: (cell: string, term: string) =>
    `there are no observations for ${cell}, so the ${term} interaction cannot be estimated`,
  moreCellsThanData: (cells: number, n: number, term: string) =>
    `the factors make ${cells} combinations of levels but there are only ${n} observations, so the ${term} interaction cannot be estimated`,
  notEstimable: (detail: string) => `the model cannot be estimated from these data: ${detail}`,
  noErrorDf: () => 'the plots left leave no degrees of freedom for error',
  tooFewObservations: (n: number, groups: number) =>
    `${n} observations in ${groups} groups leave no degrees of freedom for error`,
  badOffset: () => 'the offset must be a finite number',
  smallLatin: () => 'a 2 x 2 Latin square leaves no degrees of freedom for error, so no F test can be made',
  // notes
  dropped: (k: number) => `${k} row${k === 1 ? ' was' : 's were'} left out for missing values`,
  missingPlot: (blockWord: string, block: string, treatment: string) =>
    `${blockWord} ${block} has no plot for treatment ${treatment}`,
  moreMissing: (k: number) => `and ${k} more missing plot${k === 1 ? '' : 's'}`,
  unequalCells: (what: string) =>
    `the ${what} do not all hold the same number of plots, so the design was fitted by least squares`,
  adjustedNote: () =>
    'with unequal numbers of plots, each sum of squares in the table is adjusted for every other term, and the means are least-squares means adjusted for the other factors',
  emptyBlockDropped: (block: string) => `block ${q(block)} has no observations and is not counted`,
  noErrorTerm: () =>
    'every cell holds one observation, so no error term exists and no F test can be made',
  lenthOffered: () =>
    "instead of F tests, the effects are judged against Lenth's pseudo standard error (margins me and sme)",
  nonadditivitySkipped: () =>
    "Tukey's test for nonadditivity needs exactly one plot in every cell and was not computed",
  efficiencyAdjusted: () =>
    'with missing plots, the relative efficiency uses the block mean square adjusted for treatments',
  twoLevelSigns: (names: string) =>
    `effects are the mean at each factor's second level minus the mean at its first (levels in order of first appearance: ${names})`,
  // comparisons
  unknownLevel: (factor: string, level: string, known: readonly string[]) =>
    `${q(factor)} has no level ${q(level)}; its levels are ${known.map(q).join(', ')}`,
  unknownFactor: (factor: string, known: readonly string[]) =>
    `the fit has no factor ${q(factor)}; its factors are ${known.map(q).join(', ')}`,
  sameLevel: (level: string) => `a difference needs two different levels (both are ${q(level)})`,
  noErrorForComparison: () =>
    'the fit has no error degrees of freedom, so no standard error or interval can be given',
  weightsCount: (got: number, want: number, factor: string) =>
    `a contrast needs one weight per level of ${q(factor)}: ${want} weights, got ${got}`,
  weightsSum: (sum: number) => `contrast weights must add up to zero; these add up to ${sum}`,
  weightsZero: () => 'contrast weights are all zero',
  weightsNotFinite: () => 'contrast weights must be finite numbers',
  unknownMethod: (method: string) =>
    `unknown comparison method ${q(method)}; use "tukey", "bonferroni" or "lsd"`,
  tooFewForPairs: () => 'pairwise comparisons need at least two levels',
  tooManyPairs: (factor: string, k: number) =>
    `"${factor}" has ${k} levels, too many to list every pair; compare chosen levels with difference() instead`,
} as const;
