/**
 * Every message the design analyses and comparisons show to a person, in one place, so the
 * wording is kept consistent and the tests can check against these builders.
 */

import { numberText, pPhrase } from '../format/digits.ts';
const q = (s: string): string => `"${s}"`;

/** Plain-words messages (errors and notes). */
export const designMsg = {
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
  splitMissing: (blockName: string, wholeName: string, subName: string, block: string, whole: string, sub: string) =>
    `the whole plot at ${blockName} ${q(block)}, ${wholeName} ${q(whole)} has no plot for ${subName} ${q(sub)}; this version analyses split plots only with complete whole plots (every ${subName} level once in every whole plot): add the missing plot or leave that whole plot out`,
  splitTwice: (blockName: string, wholeName: string, subName: string, block: string, whole: string, sub: string, times: number) =>
    `the whole plot at ${blockName} ${q(block)}, ${wholeName} ${q(whole)} holds ${subName} ${q(sub)} ${times} times; in a split plot each ${subName} level appears once in every whole plot, so these data are not a split plot as given`,
  covariateConstant: (name: string) =>
    `the covariate ${q(name)} has the same value in every plot (after what the model already explains), so it cannot adjust anything; leave it out`,
  covariateMissing: (k: number, name: string) =>
    `the covariate ${q(name)} is missing in ${k} plot${k === 1 ? '' : 's'}; a covariate must be measured on every plot that is analysed`,
  covariateLength: (got: number, n: number) => `the covariate has ${got} values but the response has ${n}`,
  covariateNeedsComplete: () =>
    'this version adjusts for a covariate only in complete blocks (every treatment once in every block, or the same number of times); fill the missing plots or leave the covariate out',
  sitesOneBlock: (siteName: string, site: string, blockName: string) =>
    `${siteName} ${q(site)} has only one ${blockName}, so its error cannot be estimated; a series of trials needs at least two blocks at every site`,
  sitesAbsent: (treatment: string, siteName: string, site: string) =>
    `treatment ${q(treatment)} is absent at ${siteName} ${q(site)}; this version needs every treatment at every site, so that the treatment-by-site interaction is estimable: leave the treatment or the site out`,
  sitesIncomplete: (siteName: string, site: string, blockName: string, block: string, treatment: string, times: number) =>
    `at ${siteName} ${q(site)}, ${blockName} ${q(block)} holds treatment ${q(treatment)} ${times} times; each block of each site must hold every treatment exactly once`,
  sitesMissingPlot: (siteName: string, site: string, blockName: string, block: string, treatment: string) =>
    `at ${siteName} ${q(site)}, ${blockName} ${q(block)} has no plot for treatment ${q(treatment)}; this version of the combined analysis needs complete blocks at every site (analyse that site alone with blocked, which fits missing plots by least squares)`,
  sitesUnequalBlocks: (siteName: string, a: string, ka: number, b: string, kb: number) =>
    `${siteName} ${q(a)} has ${ka} blocks and ${siteName} ${q(b)} has ${kb}; this version of the combined analysis needs the same number of blocks at every site (analyse the sites one by one with blocked, or leave blocks out to match)`,
  // notes
  splitStrata: (block: string, whole: string) =>
    `two error strata: ${whole} varies only between whole plots and is tested against whole_error (blocks by whole plots); ${block}, the subplot factor, the interaction and whole_error against error`,
  splitOneWholeLevel: (whole: string) =>
    `${q(whole)} has one level, so each block is one whole plot and the analysis is the blocked analysis of the subplot factor`,
  splitWholeNote: () => 'whole-plot means are compared against whole_error (blocks by whole plots), on its degrees of freedom',
  splitSubNote: () => 'subplot means, averaged over the whole-plot levels, are compared against error (within whole plots)',
  splitSubAtWholeNote: (whole: string, level: string) =>
    `subplot means at ${whole} ${q(level)} are compared against error (within whole plots)`,
  splitWholeAtSubNote: (sub: string, level: string) =>
    `whole-plot means at ${sub} ${q(level)} combine whole_error and error, with Satterthwaite's degrees of freedom`,
  splitAtNeedsSplit: () => 'comparisons "at" a level of the other factor apply to split-plot fits only',
  splitAtFactor: (whole: string, sub: string) =>
    `with "at", compare levels of ${q(whole)} at a level of ${q(sub)}, or levels of ${q(sub)} at a level of ${q(whole)}`,
  covariateNote: (name: string) =>
    `adjusted for the covariate ${q(name)}: each sum of squares in the table is adjusted for the other terms, and the means are adjusted to the covariate's overall mean`,
  sitesNote: (treatment: string, site: string) =>
    `sites are taken as a sample of the places the result should hold for: ${q(treatment)} is tested against the ${treatment}:${site} mean square; its F against the pooled error is in f_against_error`,
  sitesBartlett: (stat: number, df: number, p: number) =>
    `Bartlett's test of equal error variances across sites before pooling: chi-square ${numberText(stat, 'statistic')} on ${df} df, ${pPhrase(p)}`,
  sitesExact: (siteName: string, sites: readonly string[]) =>
    `at ${siteName} ${sites.map(q).join(', ')} the data fit blocks and treatments exactly (no error left): ${sites.length === 1 ? 'that site has' : 'those sites have'} no F test of ${sites.length === 1 ? 'its' : 'their'} own, and Bartlett's test of equal error variances across sites cannot be made, so nothing checks the pooled error before pooling; look at the per-site analyses`,
  sitesBartlettWarn: () =>
    'the error variances differ between sites (Bartlett p < 0.05): the pooled error and the F tests against it are doubtful; look at the per-site analyses',
  sitesMeansNote: (treatment: string, site: string) =>
    `treatment means are compared against the ${treatment}:${site} mean square, on its degrees of freedom`,
  sitesOne: (site: string) => `only one ${site}: this is the blocked analysis of that site`,
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
  ownErrorZero: (which: string) =>
    `the error these means are judged against is zero, so a standard error, an interval or a test would be a number without meaning; ${which}`,
  splitWholeExact: (whole: string) =>
    `whole_error is zero: the whole-plot totals are exactly additive in blocks and ${whole}, so ${whole} has no F test and its means no standard errors`,
  sitesInteractionExact: (treatment: string, site: string) =>
    `the ${treatment}:${site} mean square is zero: the treatment differences are the same at every site, so ${q(treatment)} has no F test against it and its means no standard errors; f_against_error gives the test against the pooled error`,
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
