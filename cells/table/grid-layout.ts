/**
 * The grid's geometry as numbers: the fixed row height and how wide each column is. Which
 * rows a scrolled window shows is the row-window model's job (src/views/values/row-window.ts,
 * shared by every grid). Pure, so it is tested in Node.
 */
import type { FieldSource } from './grid-model.ts';

/** The height of every data row, in CSS pixels. Fixed, so that the row window can place any row. */
export const ROW_HEIGHT = 26;

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
 * Column widths in characters, from the names and a sample of fields (the first rows, rows
 * spread over the rest, and the last), so that a table of any length is measured in the same
 * time.
 */
export function columnWidths(src: FieldSource): number[] {
  const n = src.rowCount;
  const picks: number[] = [];
  for (let i = 0; i < Math.min(n, SAMPLE); i++) picks.push(i);
  if (n > SAMPLE) {
    const step = (n - SAMPLE) / SAMPLE;
    for (let k = 0; k < SAMPLE; k++) picks.push(SAMPLE + Math.floor(k * step));
    // the last row too: running numbers (plot, sample, batch) are widest there
    picks.push(n - 1);
  }
  return src.header.map((name, c) => {
    // a name is set in bold proportional type, about 1.2 times as wide per letter as the
    // figures the ch unit measures (measured at 800 px: "compound" was cut at 1.0)
    let w = Math.ceil(name.length * HEADER_CH_PER_LETTER) + 1;
    for (const r of picks) w = Math.max(w, oneLine(src.field(r, c)).length);
    return fieldsToWidth(w);
  });
}

/**
 * Widths `widths` widened, where need be, to fit rows [from, to) of `src`: what an edit of
 * those rows asks of widths that never narrow while the columns stay (the table view), in
 * the time of the rows edited rather than of a sample of the table.
 */
export function widenForRows(widths: readonly number[], src: FieldSource, from: number, to: number): number[] {
  return widths.map((w, c) => {
    let most = 0;
    for (let r = from; r < to; r++) most = Math.max(most, oneLine(src.field(r, c)).length);
    return Math.max(w, fieldsToWidth(most));
  });
}

/** A column's width for its widest field (or name), in characters. */
function fieldsToWidth(chars: number): number {
  return Math.max(MIN_COLUMN_CH, Math.min(MAX_COLUMN_CH, chars + 2));
}

/** Width of the row-number column, in characters. */
export function rowNumberWidth(rowCount: number): number {
  return Math.max(3, String(Math.max(1, rowCount)).length) + 2;
}
