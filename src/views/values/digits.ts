/**
 * Digits on the page, on top of the one digits policy (src/format/digits.ts). Result
 * numbers (a field or column whose name says what it is: p, ss, mean, ...) are written by
 * that policy, one number at a time, so they read the same here as in a note, a chart, the
 * report and on the command line. A column of plain numbers (a formula's own column, whose
 * meaning the policy cannot know) reads best with its decimal points lined up, so it gets one
 * count of decimals chosen from its largest and smallest magnitudes.
 */
import { decimalsText, numberText, percentText, pValueText } from '../../format/digits.ts';

/** What {@link sharedDecimals} aims for. */
export interface DecimalsGoal {
  /** Significant digits the largest magnitude should show. */
  readonly sig: number;
  /** Significant digits the smallest non-zero magnitude should still show. */
  readonly minSig: number;
  /** Never more decimals than this; beyond it each number is formatted on its own. */
  readonly maxDecimals: number;
}

/** The goal for most columns: six digits for the largest, three for the smallest. */
export const DEFAULT_GOAL: DecimalsGoal = { sig: 6, minSig: 3, maxDecimals: 8 };

// Digits a double carries reliably; a fixed layout that would print more is a false promise.
const MAX_SHOWN_DIGITS = 15;

/**
 * One count of decimals for a set of numbers so that they line up: enough for the largest
 * to show `sig` significant digits and for the smallest non-zero one to show `minSig`.
 * Whole numbers get 0. Returns null when no single count works (magnitudes too far apart,
 * or too large or small for fixed notation); the caller then formats each number alone.
 * NaN and infinities are ignored (they print as words).
 */
export function sharedDecimals(values: ArrayLike<number>, goal: DecimalsGoal = DEFAULT_GOAL, skip?: (i: number) => boolean): number | null {
  let maxAbs = 0;
  let minAbs = Infinity;
  let whole = true;
  let any = false;
  for (let i = 0; i < values.length; i++) {
    if (skip !== undefined && skip(i)) continue;
    const x = values[i]!;
    if (!Number.isFinite(x)) continue;
    any = true;
    const a = Math.abs(x);
    if (a > maxAbs) maxAbs = a;
    if (a !== 0 && a < minAbs) minAbs = a;
    if (whole && !Number.isInteger(x)) whole = false;
  }
  if (!any) return 0;
  if (maxAbs >= 1e15) return null;
  if (whole) return 0;
  const eMax = Math.floor(Math.log10(maxAbs));
  const eMin = Math.floor(Math.log10(minAbs));
  const wanted = Math.max(goal.sig - 1 - eMax, goal.minSig - 1 - eMin, 0);
  if (wanted > goal.maxDecimals) return null;
  if (eMax + 1 + wanted > MAX_SHOWN_DIGITS) return null;
  return wanted;
}

/**
 * A number with a fixed count of decimals (null: formatNumber's own choice). NaN and the
 * infinities read as formatNumber writes them; -0 prints as 0.
 */
export function fixedText(x: number, decimals: number | null): string {
  if (!Number.isFinite(x) || decimals === null) return numberText(x, 'plain');
  return decimalsText(x, decimals);
}

/** A p-value for a table: blank where there is none, else as the trade writes it. */
export function pText(p: number): string {
  return Number.isNaN(p) ? '' : pValueText(p);
}

/** A confidence level as a percentage: 0.95 gives "95%". */
export function levelText(level: number): string {
  return percentText(level);
}
