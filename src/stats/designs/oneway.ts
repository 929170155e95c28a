/**
 * One-way analysis of variance (completely randomized design). Closed form whether or not
 * the groups are equal in size: group means and centred two-pass sums on the shifted data,
 * O(n) time.
 */
import { centredSumOfSquares, groupMeans, mean } from '../linear/sums.ts';
import { anovaTable, diagonalCovariance, factorMeans, errorFields } from './assemble.ts';
import { checkFactor, checkResponse, requireAllLevels, resolveOptions } from './check.ts';
import { DesignError } from './errors.ts';
import { designMsg } from '../../messages/designs.ts';
import type { DesignFit, DesignOptions, Factor } from './types.ts';

/**
 * One-way analysis of variance of `y` by `treatment`.
 *
 * @param y - response, already shifted by `options.offset` (complete cases only).
 * @param treatment - the treatment factor; every level must have observations.
 * @param options - offset, confidence level (default 0.95), rows dropped upstream.
 * @returns a fit record; `means` holds the group means with standard errors sqrt(mse / n_i).
 * @throws DesignError when a level has no data, there are fewer than two levels, or no
 *   observations.
 */
export function oneWay(y: Float64Array, treatment: Factor, options?: DesignOptions): DesignFit {
  const opts = resolveOptions(options);
  checkResponse(y);
  const n = y.length;
  const counts = checkFactor(treatment, n, 'treatment');
  requireAllLevels(treatment, counts, 'treatment');
  const k = counts.length;
  if (n <= k) throw new DesignError(designMsg.tooFewObservations(n, k));

  const grand = mean(y);
  const { mean: m } = groupMeans(y, treatment.codes, k);
  let ssb = 0;
  for (let g = 0; g < k; g++) {
    const d = m[g]! - grand;
    ssb += counts[g]! * d * d;
  }
  const residuals = new Float64Array(n);
  const fitted = new Float64Array(n);
  const leverage = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const g = treatment.codes[i]!;
    residuals[i] = y[i]! - m[g]!;
    fitted[i] = m[g]! + opts.offset;
    leverage[i] = 1 / counts[g]!;
  }
  const sse = centredSumOfSquares(residuals, 0);
  const sst = centredSumOfSquares(y, grand);
  const dfError = n - k;
  const mse = sse / dfError;

  const table = anovaTable([{ source: treatment.name, df: k - 1, ss: ssb }], sse, dfError, sst, n - 1);
  const means = factorMeans(
    treatment.name,
    treatment.levels,
    counts,
    m,
    opts.offset,
    diagonalCovariance(counts),
    mse,
    dfError,
    opts.level,
  );
  let balanced = true;
  for (let g = 1; g < k; g++) if (counts[g] !== counts[0]) balanced = false;
  const notes: string[] = [];
  if (opts.dropped > 0) notes.push(designMsg.dropped(opts.dropped));
  return {
    design: 'completely randomized (one-way)',
    kind: 'one_way',
    factors: [treatment.name],
    treatment: treatment.name,
    n,
    level: opts.level,
    table,
    ss_method: 'between and within groups, from group means (exact whether or not the groups are equal in size)',
    means: means.table,
    factor_means: [means],
    ...errorFields({ mse, dfError, sse, sst, grand, offset: opts.offset, residuals, leverage }),
    fitted,
    balanced,
    notes,
  };
}
