/**
 * Flags residuals that are large on the standardized scale.
 */

/** The result of {@link studentizedFlags}. */
export interface ResidualFlags {
  /** 1 where |r| > threshold, 0 elsewhere (NaN is never flagged), in input order. */
  readonly flagged: Uint8Array;
  /** Zero-based positions of the flagged residuals, ascending. */
  readonly indices: Int32Array;
  /** The threshold that was applied. */
  readonly threshold: number;
}

/**
 * Marks the residuals whose absolute value exceeds `threshold`. Meant for studentized (or
 * standardized) residuals, for which |r| > 3 is the usual line for a value worth a second
 * look at the field record: it flags a value for checking, it does not prove an error.
 * common practice, no source (the default of 3).
 *
 * @param r - studentized residuals
 * @param threshold - positive cut-off, 3 by default
 */
export function studentizedFlags(r: Float64Array, threshold = 3): ResidualFlags {
  if (!(threshold > 0)) throw new RangeError(`the threshold must be positive, got ${threshold}`);
  const flagged = new Uint8Array(r.length);
  const at: number[] = [];
  for (let i = 0; i < r.length; i++) {
    if (Math.abs(r[i]!) > threshold) {
      flagged[i] = 1;
      at.push(i);
    }
  }
  return { flagged, indices: Int32Array.from(at), threshold };
}
