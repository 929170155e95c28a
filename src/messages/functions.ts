/**
 * The words the built-ins (src/functions) put on a cell: errors for a bad call, warnings
 * about what was left out, and the notes of a residual check. The words of the designs and
 * of planning are in ./designs.ts and ./planning.ts; the evaluator's in ./language.ts.
 */
import { plural } from './words.ts';

const q = (s: string): string => `"${s}"`;
/** "is" or "are", "has" or "have", and the like, by count. */
const by = (n: number, one: string, many: string): string => (n === 1 ? one : many);

export const fnMsg = {
  // ---- columns and rows ----------------------------------------------------------------
  lengthsDiffer: (a: string, n: number, b: string, m: number) =>
    `${a} has ${n} values but ${b} has ${m}; they must be the same length.`,
  rowsLeftOut: (k: number) => `${plural(k, 'row')} with a missing value ${by(k, 'was', 'were')} left out.`,
  allMissing: () => 'every value of the column is missing.',

  // ---- fits ----------------------------------------------------------------------------
  notAFit: () => 'this record is not a fit made in this document.',
  levelsLost: (factor: string, lost: readonly string[]) => {
    const one = lost.length === 1;
    return `${factor} ${lost.map(q).join(', ')} ${by(lost.length, 'has', 'have')} no measurement left (every ${one ? 'one of its rows has' : 'row of them has'} a missing value), so ${one ? 'it' : 'they'} cannot be estimated. Measure ${one ? 'it' : 'them'}, or remove ${one ? 'its rows' : 'their rows'} from the table.`;
  },
  factorsShareName: (name: string) => `two factors are both called ${q(name)}; each factor needs its own column.`,
  covariateLength: (got: number, n: number) =>
    `the covariate has ${got} values but the response has ${n}; they must be the same length.`,
  covariateMissing: (name: string | null, k: number) =>
    `the covariate ${name === null ? '' : `${q(name)} `}is missing in ${k} plot${by(k, '', 's')} that ${by(k, 'has', 'have')} a response; a covariate must be measured on every plot analysed (fill it in, or leave ${by(k, 'that plot', 'those plots')} out of the table).`,
  tukeyTooManyMeans: (limit: number, k: number) =>
    `Tukey intervals use the studentized range, computed here for up to ${limit} means; this fit has ${k}. Use method: "bonferroni".`,
  weightMissing: () => 'a weight is missing.',

  // ---- residual checks -----------------------------------------------------------------
  shapiroWilkSize: (n: number) =>
    `The Shapiro-Wilk test needs 3 to 5000 residuals; this fit has ${n}. Look at the normal probability plot instead.`,
  noBrownForsythe: (detail: string) => `No Brown-Forsythe test: ${detail}.`,
  /** `rows` are 1-based row numbers, already written as text. */
  rowsFlagged: (rows: readonly string[]) => {
    const one = rows.length === 1;
    return `Row${one ? '' : 's'} ${rows.join(', ')} ha${one ? 's a' : 've'} studentized residual${one ? '' : 's'} beyond 3 in size (a rule of thumb): check ${one ? 'that plot' : 'those plots'} in the table.`;
  },
  slopesDiffer: (covariate: string, pWords: string) =>
    `The slope on ${covariate} differs between treatments (test of parallel slopes, ${pWords}): adjusted means then depend on the covariate value chosen, so compare the treatments at several values of ${covariate} rather than at its mean alone.`,
  withinWholePlots: (dfError: number, dfWhole: string) =>
    `These are the residuals within whole plots (the error stratum, ${dfError} df). The whole-plot error has only ${dfWhole} df of its own; look at the whole-plot means in the interaction chart for anything odd there.`,

  // ---- distributions -------------------------------------------------------------------
  notPositive: (name: string, v: number) => `${name} must be more than 0, but it is ${v}.`,
  groupsNotWhole: (v: number) => `groups must be a whole number of at least 2, but it is ${v}.`,
  tooManyGroups: (limit: number, v: number) =>
    `the studentized range is computed for up to ${limit} groups, and ${v} were asked for.`,

  // ---- claims --------------------------------------------------------------------------
  conditionMissing: () => 'the condition is missing, so the claim cannot be checked.',
  conditionPartlyMissing: () => 'part of the condition is missing, so the claim cannot be checked.',
  conditionNotBoolean: () =>
    'the condition must be true or false (or a column of them, which holds when every element is true).',

  // ---- charts --------------------------------------------------------------------------
  noResidualsToPlot: (design: string, factorialEffects: boolean) =>
    `this fit (${design}) leaves no degrees of freedom for error, so its residuals are all zero and there is nothing to plot${factorialEffects ? '; judge an unreplicated two-level factorial by its effects (fit.effects, fit.lenth)' : ''}.`,
  noBlocksToPlot: (design: string) =>
    `against: "block" needs a fit with blocks (from blocked); this ${design} fit has none. Use "fitted", "order" or "treatment".`,
  unknownAxis: (against: string) => `against must be "fitted", "order", "treatment" or "block", not ${q(against)}.`,
  interactionNeedsTwo: (design: string) =>
    `an interaction chart needs a fit with two or more factors; this fit (${design}) has one. means_chart(fit) draws its means.`,
  pairsLacksColumn: (name: string) => `this pairs record has no column ${name}; make it with pairwise(fit).`,
  pairsColumnNotNumbers: (name: string) => `the column ${name} of this pairs record is not numbers; make it with pairwise(fit).`,
  pairsLacksField: (name: string) => `this pairs record has no field ${name}; make it with pairwise(fit).`,
  pairsLacksTable: () => 'this pairs record has no table; make it with pairwise(fit).',
  noPairsToDraw: () => 'there are no pairs to draw: the fit has fewer than two treatments.',
  nothingToDraw: () => 'there is no row with both values present, so there is nothing to draw.',
  errorTermWholePlot: () => 'whole-plot error mean square',
  errorTermSites: () => 'treatment-by-site mean square',
} as const;
