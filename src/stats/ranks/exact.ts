/**
 * Exact null distributions of the two Wilcoxon statistics for samples without ties.
 */
import { powerOfTwo } from '../math/portable.ts';

/**
 * Number of subsets of {1, ..., n} with each rank sum s = 0 .. n(n+1)/2: under the null
 * hypothesis every one of the 2^n sign patterns is equally likely, so P(V = s) =
 * counts[s] / 2^n for the sum V of the ranks of the positive differences.
 *
 * Counting recurrence: adding rank k to the ranks 1 .. k-1 gives
 * c_k(s) = c_{k-1}(s) + c_{k-1}(s - k) (the subset either leaves k out or takes it).
 * Counts stay exact integers in binary floating point while 2^n <= 2^53, so n is limited
 * to 53.
 * source: F. Wilcoxon (1945), "Individual comparisons by ranking methods", Biometrics
 * Bulletin 1, 80-83 (the statistic); the recurrence is the subset-sum count.
 */
export function signedRankCounts(n: number): Float64Array {
  if (!Number.isInteger(n) || n < 0 || n > 53) {
    throw new RangeError(`signedRankCounts: n must be an integer from 0 to 53, got ${n}`);
  }
  const top = (n * (n + 1)) / 2;
  const c = new Float64Array(top + 1);
  c[0] = 1;
  for (let k = 1; k <= n; k++) {
    const reach = (k * (k + 1)) / 2;
    for (let s = reach; s >= k; s--) c[s]! += c[s - k]!;
  }
  return c;
}

/**
 * Two-sided exact p-value of the signed rank sum v for n non-zero differences without ties:
 * twice the smaller tail, at most 1.
 */
export function signedRankExactP(v: number, n: number): number {
  const c = signedRankCounts(n);
  const top = c.length - 1;
  const s = Math.round(v);
  let lower = 0; // P(V <= s) * 2^n
  let upper = 0; // P(V >= s) * 2^n
  for (let i = 0; i <= top; i++) {
    if (i <= s) lower += c[i]!;
    if (i >= s) upper += c[i]!;
  }
  const total = powerOfTwo(n);
  return Math.min(1, (2 * Math.min(lower, upper)) / total);
}

/**
 * Probabilities P(U = u), u = 0 .. m n, of the Mann-Whitney count U (the number of pairs in
 * which the value from the sample of size m exceeds the value from the sample of size n)
 * when all (m + n)! orderings are equally likely.
 *
 * Recurrence of Mann and Whitney: the largest of the m + n values comes from the first
 * sample with probability m / (m + n), and then beats all n values of the second, so
 *   p_{m,n}(u) = m / (m + n) p_{m-1,n}(u - n) + n / (m + n) p_{m,n-1}(u),
 * with p_{0,n}(0) = p_{m,0}(0) = 1. It is the counting recurrence of the frequencies,
 * c_{m,n}(u) = c_{m-1,n}(u - n) + c_{m,n-1}(u), divided through by the binomial coefficient
 * (m + n choose m), which keeps every term a probability and so never overflows.
 * source: H. B. Mann, D. R. Whitney (1947), "On a test of whether one of two random
 * variables is stochastically larger than the other", Annals of Mathematical Statistics 18,
 * 50-60.
 *
 * Cost: about m^2 n^2 / 4 operations and m^2 n / 2 numbers of memory.
 */
export function mannWhitneyProbabilities(m: number, n: number): Float64Array {
  if (!Number.isInteger(m) || !Number.isInteger(n) || m < 0 || n < 0) {
    throw new RangeError(`mannWhitneyProbabilities: sizes must be integers >= 0, got ${m}, ${n}`);
  }
  // row[i] holds p_{i,j} for the current j, i = 0 .. m.
  const row: Float64Array[] = [];
  for (let i = 0; i <= m; i++) row.push(Float64Array.of(1));
  for (let j = 1; j <= n; j++) {
    for (let i = 1; i <= m; i++) {
      const prev = row[i - 1]!; // p_{i-1,j}, already updated for this j
      const old = row[i]!; // p_{i,j-1}
      const next = new Float64Array(i * j + 1);
      const wa = i / (i + j);
      const wb = j / (i + j);
      for (let u = 0; u < old.length; u++) next[u] = wb * old[u]!;
      for (let u = 0; u < prev.length; u++) next[u + j]! += wa * prev[u]!;
      row[i] = next;
    }
  }
  return row[m]!;
}

/**
 * Two-sided exact p-value of the Mann-Whitney count u for samples of sizes m and n without
 * ties: twice the smaller tail, at most 1.
 */
export function rankSumExactP(u: number, m: number, n: number): number {
  // The distribution of U is the same for (m, n) and (n, m); the smaller first size is
  // cheaper in memory.
  const p = m <= n ? mannWhitneyProbabilities(m, n) : mannWhitneyProbabilities(n, m);
  const s = Math.round(u);
  let lower = 0;
  let upper = 0;
  for (let i = 0; i < p.length; i++) {
    if (i <= s) lower += p[i]!;
    if (i >= s) upper += p[i]!;
  }
  return Math.min(1, 2 * Math.min(lower, upper));
}
