/** Two-group comparisons of means: independent groups and paired units. */
export { twoSample, type TwoSampleResult } from './two-sample.ts';
export { paired, type PairedResult } from './paired.ts';
