/** Residual diagnostics: normality, equal spread across groups, and large residuals. */
export {
  shapiroWilk,
  shapiroWilkCoefficients,
  type ShapiroWilkResult,
  SHAPIRO_WILK_MIN_N,
  SHAPIRO_WILK_MAX_N,
} from './shapiro-wilk.ts';
export { brownForsythe, type BrownForsytheResult } from './brown-forsythe.ts';
export { studentizedFlags, type ResidualFlags } from './flags.ts';
