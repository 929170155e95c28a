/**
 * Planning a trial: seeded layouts (draws.ts, layouts.ts), power and size (power.ts), the
 * comparison of data with their layout (check.ts) and the recognition of a blocking column
 * that an analysis ignores (blocking.ts). Pure numeric code: no values of the language here.
 */
export { ALGORITHM, Draws, GENERATOR, MAX_SEED, SplitMix64, checkSeed, permutation, shuffle } from './draws.ts';
export { PlanningError } from './errors.ts';
export {
  MAX_PLOTS,
  checkCount,
  checkTreatments,
  drawBlocks,
  drawCompletelyRandom,
  drawLatin,
  drawSplitPlot,
  type BlockLayout,
  type SplitLayout,
  type PlainLayout,
  type SquareLayout,
} from './layouts.ts';
export {
  blockedCurve,
  blockedPower,
  blocksForPower,
  replicatesForPower,
  twoGroupCurve,
  twoGroupPower,
  type BlockedPower,
  type TwoGroupPower,
} from './power.ts';
export { compareWithLayout, type KeyedPlots, type LayoutDifferences } from './check.ts';
export { isCompleteBlocking, type Codes } from './blocking.ts';
