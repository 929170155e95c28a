/**
 * Small helpers every catalogue of words uses: quoting a piece of text, listing words,
 * counting things in words.
 */
import { countText } from '../format/digits.ts';

/** Shows a piece of source text in a message, shortened when long. */
export function quote(text: string, max = 40): string {
  const one = text.replace(/\s+/g, ' ');
  return one.length > max ? `"${one.slice(0, max - 1)}…"` : `"${one}"`;
}

/** Joins words as "a, b and c". */
export function listWords(words: readonly string[], conj = 'and'): string {
  if (words.length <= 1) return words.join('');
  return `${words.slice(0, -1).join(', ')} ${conj} ${words[words.length - 1]}`;
}

/** "1 thing" / "2 things". */
export function plural(n: number, one: string, many = `${one}s`): string {
  return `${countText(n)} ${n === 1 ? one : many}`;
}

/**
 * Said under every trial, in the page and in the report: the one sentence, kept in one place
 * so the two never drift apart.
 */
export const JUDGEMENT = 'A statistical result supports, and does not replace, the judgement of qualified people and the rules that govern the work.';
