/**
 * Does a table hold a blocking (or pairing) column that an analysis ignores?
 *
 * The rule: column C is a complete-block column for treatment column T when, over the rows
 * of the table where both C and T are filled in, C has at least two levels, T has at least
 * two, and every level of C holds every level of T exactly once. Rows count whatever the
 * response holds: a plot whose measurement is missing still stands in the table, so a trial
 * with a lost plot is still recognized as blocked (the analysis then needs least squares,
 * which `blocked` does). A column with an empty field in a row where T is filled in is not
 * read as a block column, since that row's block is unknown.
 */

/** A factor as level codes (-1 where the field is empty). */
export interface Codes {
  readonly codes: Int32Array;
  readonly levels: number;
}

/** True when `block` is a complete-block column for `treatment` (see the module note). */
export function isCompleteBlocking(treatment: Codes, block: Codes): boolean {
  const n = treatment.codes.length;
  if (block.codes.length !== n || treatment.levels < 2 || block.levels < 2) return false;
  const k = treatment.levels;
  const b = block.levels;
  if (k * b > 4_000_000) return false;
  const count = new Int32Array(k * b);
  const usedT = new Uint8Array(k);
  const usedB = new Uint8Array(b);
  let rows = 0;
  for (let i = 0; i < n; i++) {
    const t = treatment.codes[i]!;
    if (t < 0) continue;
    const c = block.codes[i]!;
    if (c < 0) return false;
    usedT[t] = 1;
    usedB[c] = 1;
    count[c * k + t]!++;
    rows++;
  }
  let tl = 0;
  let bl = 0;
  for (const u of usedT) tl += u;
  for (const u of usedB) bl += u;
  if (tl < 2 || bl < 2 || rows !== tl * bl) return false;
  for (let c = 0; c < b; c++) {
    if (usedB[c] === 0) continue;
    for (let t = 0; t < k; t++) if (usedT[t] === 1 && count[c * k + t] !== 1) return false;
  }
  return true;
}
