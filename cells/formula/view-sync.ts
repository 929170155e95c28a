/**
 * Taking the document's text into an open editor (after undo, redo, another view) as the
 * smallest change, so the cursor and the scroll position stay where the user left them.
 */

/** The smallest change that turns `a` into `b` (common start and end kept), so the cursor stays put. */
export function textChange(a: string, b: string): { from: number; to: number; insert: string } {
  let start = 0;
  const max = Math.min(a.length, b.length);
  while (start < max && a.charCodeAt(start) === b.charCodeAt(start)) start++;
  let endA = a.length;
  let endB = b.length;
  while (endA > start && endB > start && a.charCodeAt(endA - 1) === b.charCodeAt(endB - 1)) {
    endA--;
    endB--;
  }
  return { from: start, to: endA, insert: b.slice(start, endB) };
}
