/**
 * The formula as static coloured text: what a cell shows before its editor exists (at first
 * paint, off screen, in print). Same lexer, same colours as the editor, and the problem's
 * characters underlined as the editor would underline them.
 */
import { highlightSegments, type TokenClass } from './editor-language.ts';

/** A run of text with one colour, underlined or not. */
export interface StaticPiece {
  readonly text: string;
  readonly cls: TokenClass | null;
  /** Inside the range of a problem. */
  readonly marked: boolean;
}

/**
 * Cuts `text` into pieces for display. `mark` is a problem's range; an empty range (an
 * error at the end, "expected a value here") marks a single space drawn after the text.
 */
export function staticPieces(text: string, builtins: ReadonlySet<string>, mark: { from: number; to: number } | null): StaticPiece[] {
  const out: StaticPiece[] = [];
  const from = mark === null ? -1 : mark.from;
  const to = mark === null ? -1 : mark.to;
  for (const seg of highlightSegments(text, builtins)) {
    // split the segment where the marked range starts and ends
    const cuts = [seg.from];
    if (from > seg.from && from < seg.to) cuts.push(from);
    if (to > seg.from && to < seg.to && to !== from) cuts.push(to);
    cuts.push(seg.to);
    for (let i = 0; i + 1 < cuts.length; i++) {
      const a = cuts[i]!;
      const b = cuts[i + 1]!;
      out.push({ text: text.slice(a, b), cls: seg.cls, marked: mark !== null && a >= from && b <= to && from < to });
    }
  }
  if (mark !== null && from === to) {
    // a point: mark the character there, or a space after the end
    const at = out.findIndex((_, i) => piecesStart(out, i) === from);
    if (at >= 0 && out[at]!.text.length > 0) {
      const p = out[at]!;
      out.splice(at, 1, { text: p.text.slice(0, 1), cls: p.cls, marked: true }, ...(p.text.length > 1 ? [{ text: p.text.slice(1), cls: p.cls, marked: false }] : []));
    } else out.push({ text: ' ', cls: null, marked: true });
  }
  return out;
}

function piecesStart(pieces: readonly StaticPiece[], index: number): number {
  let n = 0;
  for (let i = 0; i < index; i++) n += pieces[i]!.text.length;
  return n;
}
