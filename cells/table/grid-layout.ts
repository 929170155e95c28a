/**
 * The grid's geometry as numbers: which rows a scrolled window shows (virtual scrolling
 * with a fixed row height) and how wide each column is. Pure, so it is tested in Node.
 */
import type { FieldSource } from './grid-model.ts';

/** The height of every data row, in CSS pixels. Fixed, so that row i lies at i * ROW_HEIGHT. */
export const ROW_HEIGHT = 26;

/** Rows drawn above and below the window, so that a quick scroll does not show a gap. */
export const OVERSCAN = 8;

/** Rows drawn when the window's height is unknown (no layout yet). */
export const ROWS_WITHOUT_LAYOUT = 40;

/** The rows [first, last) to draw for a window scrolled to `scrollTop` over the data rows. */
export function visibleRows(
  scrollTop: number,
  windowHeight: number,
  rowCount: number,
  rowHeight = ROW_HEIGHT,
  overscan = OVERSCAN,
): { first: number; last: number } {
  if (rowCount <= 0) return { first: 0, last: 0 };
  if (!(windowHeight > 0)) return { first: 0, last: Math.min(rowCount, ROWS_WITHOUT_LAYOUT) };
  const top = Math.max(0, Math.floor(scrollTop / rowHeight));
  const first = Math.max(0, Math.min(rowCount - 1, top - overscan));
  const last = Math.min(rowCount, top + Math.ceil(windowHeight / rowHeight) + 1 + overscan);
  return { first, last };
}

/**
 * The scroll position that brings a row into a window (unchanged when it is already in
 * view). `headerHeight` is the sticky row of names that covers the top of the window.
 */
export function scrollToShowRow(row: number, scrollTop: number, windowHeight: number, headerHeight: number, rowHeight = ROW_HEIGHT): number {
  if (row < 0) return scrollTop;
  const top = headerHeight + row * rowHeight;
  const bottom = top + rowHeight;
  if (top - headerHeight < scrollTop) return top - headerHeight;
  if (bottom > scrollTop + windowHeight) return Math.max(0, bottom - windowHeight);
  return scrollTop;
}

/** Narrowest and widest column, in characters. */
export const MIN_COLUMN_CH = 8;
export const MAX_COLUMN_CH = 28;
/** Width of one letter of a column name, in ch (bold proportional letters against figures). */
export const HEADER_CH_PER_LETTER = 1.2;
const SAMPLE = 400;

/** How a field is shown on one line: line breaks as a visible mark. */
export function oneLine(field: string): string {
  return /[\r\n]/.test(field) ? field.replace(/\r\n|\r|\n/g, ' ↵ ') : field;
}

/**
 * Column widths in characters, from the names and a sample of fields (the first rows and
 * rows spread over the rest), so that a table of any length is measured in the same time.
 */
export function columnWidths(src: FieldSource): number[] {
  const n = src.rowCount;
  const picks: number[] = [];
  for (let i = 0; i < Math.min(n, SAMPLE); i++) picks.push(i);
  if (n > SAMPLE) {
    const step = (n - SAMPLE) / SAMPLE;
    for (let k = 0; k < SAMPLE; k++) picks.push(SAMPLE + Math.floor(k * step));
  }
  return src.header.map((name, c) => {
    // a name is set in bold proportional type, about 1.2 times as wide per letter as the
    // figures the ch unit measures (measured at 800 px: "compound" was cut at 1.0)
    let w = Math.ceil(name.length * HEADER_CH_PER_LETTER) + 1;
    for (const r of picks) w = Math.max(w, oneLine(src.field(r, c)).length);
    return Math.max(MIN_COLUMN_CH, Math.min(MAX_COLUMN_CH, w + 2));
  });
}

/** Width of the row-number column, in characters. */
export function rowNumberWidth(rowCount: number): number {
  return Math.max(3, String(Math.max(1, rowCount)).length) + 2;
}
