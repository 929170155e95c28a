/**
 * "Did you mean": the closest known name to a misspelt one, by optimal string alignment
 * distance (Levenshtein with adjacent transpositions), allowing about one edit in three
 * characters so that a suggestion is a plausible typo and not a guess; a name that another
 * begins with (three characters at least) counts as close.
 */

/** Edit distance with transpositions, stopping early once it exceeds `limit`. */
export function editDistance(a: string, b: string, limit = Infinity): number {
  if (Math.abs(a.length - b.length) > limit) return limit + 1;
  const n = b.length;
  let prev2 = new Array<number>(n + 1).fill(0);
  let prev = Array.from({ length: n + 1 }, (_, j) => j);
  let cur = new Array<number>(n + 1).fill(0);
  for (let i = 1; i <= a.length; i++) {
    cur[0] = i;
    let rowMin = i;
    for (let j = 1; j <= n; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      let d = Math.min(prev[j]! + 1, cur[j - 1]! + 1, prev[j - 1]! + cost);
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) d = Math.min(d, prev2[j - 2]! + 1);
      cur[j] = d;
      if (d < rowMin) rowMin = d;
    }
    if (rowMin > limit) return limit + 1;
    [prev2, prev, cur] = [prev, cur, prev2];
  }
  return prev[n]!;
}

/** The best suggestion for `name` among `candidates`, or null when nothing is close. */
export function suggest(name: string, candidates: Iterable<string>): string | null {
  const limit = Math.max(1, Math.floor(name.length / 3));
  let best: string | null = null;
  let bestD = limit + 1;
  const lower = name.toLowerCase();
  for (const c of candidates) {
    if (c === name) continue;
    // a difference of case only is the likeliest typo of all; a name cut short
    // ("shear" for "shear_mpa") comes next
    const cl = c.toLowerCase();
    const d = cl === lower ? 0.5 : name.length >= 3 && cl.startsWith(lower) ? 0.75 : editDistance(name, c, limit);
    if (d < bestD || (d === bestD && best !== null && c < best)) {
      best = c;
      bestD = d;
    }
  }
  return best;
}
