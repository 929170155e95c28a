/** Two-group comparisons of means: independent groups and paired units. */
export { twoSample, type TwoSampleResult } from './two_sample.ts';
export { paired, type PairedResult } from './paired.ts';
