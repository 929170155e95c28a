/**
 * One-sample and per-group summaries of complete cases (the wiring layer drops missing
 * values and counts them before calling these).
 */
export { count, sum, mean, variance, sd, min, max, sumSquaredDeviations } from './moments.ts';
export { quantile, quantileSorted, median, sortedCopy } from './quantile.ts';
export { groupStats, splitByLevel, type GroupStats } from './group-stats.ts';
export { type GroupCodes, StatsInputError, levelCounts, checkSameLength } from './groups.ts';
