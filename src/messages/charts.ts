/**
 * The words and figures of chart titles and captions, in one place so that every chart
 * says things the same way.
 */
import { countText, numberText, percentText, pPhrase, type Quantity } from '../format/digits.ts';

/** A figure for a caption, by the one digits policy for its quantity (an estimate unless said). */
export function fig(x: number, quantity: Quantity = 'estimate'): string {
  return numberText(x, quantity);
}

/** A count with thousands separated by commas (readable in a caption): 100,000. */
export function count(n: number): string {
  return countText(n);
}

/** `1 residual`, `23 residuals`. */
export function counted(n: number, one: string, many = `${one}s`): string {
  return `${count(n)} ${n === 1 ? one : many}`;
}

/** A p-value for a caption, by the digits policy: `p = 0.66`, `p < 0.001`. */
export function pText(p: number): string {
  return pPhrase(p);
}

/** A list of row numbers, the first few shown: `rows 3, 17 and 40`, `rows 3, 17, 40 and 12 more`. */
export function rowList(rows: readonly number[], shown = 5): string {
  if (rows.length === 0) return '';
  const word = rows.length === 1 ? 'row' : 'rows';
  if (rows.length <= shown) {
    const list = rows.map(String);
    const last = list.pop()!;
    return `${word} ${list.length === 0 ? last : `${list.join(', ')} and ${last}`}`;
  }
  return `${word} ${rows.slice(0, shown).join(', ')} and ${count(rows.length - shown)} more`;
}

/** The line on studentized residuals beyond the cut-off. */
export function flaggedWords(rows: readonly number[], cut: number): string {
  if (rows.length === 0) return `none beyond ${cut} studentized units`;
  return `${count(rows.length)} beyond ${cut} studentized units (${rowList(rows)})`;
}

/** A level as it reads in a title: the confidence level as a percentage. */
export function percent(level: number): string {
  return percentText(level);
}

/** `1st`, `2nd`, `3rd`, `20th`, `21st`. */
export function ordinal(k: number): string {
  const teen = k % 100 >= 11 && k % 100 <= 13;
  const last = k % 10;
  const suffix = teen ? 'th' : last === 1 ? 'st' : last === 2 ? 'nd' : last === 3 ? 'rd' : 'th';
  return `${count(k)}${suffix}`;
}

/** The first letter in capitals (titles). */
export function capital(s: string): string {
  return s.length === 0 ? s : s[0]!.toUpperCase() + s.slice(1);
}
