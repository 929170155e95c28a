/**
 * Long texts made whole while nothing waits.
 *
 * A string made by joining pieces (`a.slice(0, i) + typed + a.slice(j)`, which is how an
 * edit makes a table's new body) is held as those pieces until something reads one of its
 * characters; that first read copies the whole text into one new piece of memory. For the
 * body of a 100,000-row table that is 1.2 MB and several milliseconds, and without this it
 * falls on the next keystroke, which reads the body to splice it again. Settling the text
 * once the keystroke's result is out moves that copy to a moment when nobody waits.
 */

/** Texts shorter than this are copied fast enough wherever it happens. */
export const SETTLE_MIN_LENGTH = 1 << 16;

/** Kept so that the read cannot be optimized away as unused. */
let lastRead = 0;

/** Makes `text` one piece of memory now (reading one character does it), when it is long. */
export function settleText(text: string): void {
  if (text.length >= SETTLE_MIN_LENGTH) lastRead ^= text.charCodeAt(0);
}

/** The last character code read (for tests; also keeps the reads alive). */
export function settledRead(): number {
  return lastRead;
}
