/**
 * Lenth's pseudo standard error for unreplicated factorials, where no error term exists.
 * source: Lenth, R. V. (1989), "Quick and easy analysis of unreplicated factorials",
 * Technometrics 31, 469-473:
 *   s0  = 1.5 * median |c_j|
 *   PSE = 1.5 * median of the |c_j| that are below 2.5 s0
 *   ME  = t(0.975; d) * PSE,  SME = t(gamma; d) * PSE,  gamma = (1 + 0.95^(1/m)) / 2,
 * with d = m / 3 degrees of freedom for m effects. At another level the same construction
 * is used with 0.95 replaced by the level.
 */
import { tCritical } from '../distributions/index.ts';
import type { LenthMargins } from './types.ts';
import * as pm from '../math/portable.ts';

function median(sorted: readonly number[]): number {
  const k = sorted.length;
  if (k === 0) return NaN;
  const mid = Math.floor(k / 2);
  return k % 2 === 1 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2;
}

/**
 * Lenth's margins for the effect estimates `effects` (each "+ mean minus - mean").
 * @param level - confidence level of the margins, default 0.95.
 */
export function lenthMargins(effects: readonly number[], level = 0.95): LenthMargins {
  const m = effects.length;
  const abs = effects.map((c) => Math.abs(c)).sort((a, b) => a - b);
  const s0 = 1.5 * median(abs);
  const trimmed = abs.filter((c) => c < 2.5 * s0);
  const pse = 1.5 * median(trimmed.length > 0 ? trimmed : abs);
  const df = m / 3;
  const me = tCritical(level, df) * pse;
  // Two-sided simultaneous level level^(1/m): its upper quantile is gamma = (1 + level^(1/m)) / 2.
  const sme = tCritical(pm.pow(level, 1 / m), df) * pse;
  return {
    pse,
    me,
    sme,
    df,
    level,
    beyond_me: effects.map((c) => Math.abs(c) > me),
    beyond_sme: effects.map((c) => Math.abs(c) > sme),
  };
}
