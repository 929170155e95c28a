/**
 * How many digits a number gets on the page. A column of numbers reads best when its
 * decimal points line up, so a column gets one count of decimals chosen from its largest and
 * smallest magnitudes; a number on its own uses formatNumber, so it reads the same as in a
 * note or on the command line.
 */
import { formatNumber, formatP } from '../../lang/format.ts';

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
  if (!Number.isFinite(x) || decimals === null) return formatNumber(x);
  const s = x.toFixed(decimals);
  // toFixed(-0.0001, 2) gives "-0.00": a sign on a zero says something the number does not
  return /^-0(\.0*)?$/.test(s) ? s.slice(1) : s;
}

/** A p-value for a table: blank where there is none, else as the trade writes it. */
export function pText(p: number): string {
  return Number.isNaN(p) ? '' : formatP(p);
}

/** A confidence level as a percentage: 0.95 gives "95%". */
export function levelText(level: number): string {
  return `${formatNumber(level * 100, 6)}%`;
}
