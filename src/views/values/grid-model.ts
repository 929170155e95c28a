/**
 * What a grid of columns shows, worked out without a DOM: the text of each cell and which
 * rows are on screen. A column may hold a million elements, so the text of a cell is made
 * only when its row is drawn, and the rows drawn are a window around the scroll position.
 */
import { decimalAt, isMissingAt, type Column } from '../../lang/values.ts';
import { fixedText, pText, sharedDecimals } from './digits.ts';

/** How one column is written, decided once per column. */
export interface ColumnPlan {
  /** Numbers align right in tabular figures; texts and booleans align left. */
  readonly align: 'num' | 'text';
  /** Shared decimals for a computed number column (null: each number on its own). */
  readonly decimals: number | null;
  /** The column keeps the decimal text that was typed: show that, not a reformatted double. */
  readonly typed: boolean;
  /** A column of p-values, written as the trade writes them. */
  readonly asP: boolean;
}

const plans = new WeakMap<Column, ColumnPlan>();

/**
 * The plan for a column. Columns are immutable values, so a plan is worked out once per
 * column object (one pass over the elements) and kept.
 */
export function planColumn(c: Column): ColumnPlan {
  const known = plans.get(c);
  if (known !== undefined) return known;
  let plan: ColumnPlan;
  if (c.type !== 'number') plan = { align: 'text', decimals: null, typed: false, asP: false };
  else if (c.decimals !== null) plan = { align: 'num', decimals: null, typed: true, asP: false };
  else if (c.name === 'p') plan = { align: 'num', decimals: null, typed: false, asP: true };
  else {
    const missing = c.missing;
    const decimals = sharedDecimals(c.values, undefined, missing === null ? undefined : (i) => missing[i] === 1);
    plan = { align: 'num', decimals, typed: false, asP: false };
  }
  plans.set(c, plan);
  return plan;
}

/** The text of one cell of a grid. */
export interface CellText {
  readonly text: string;
  readonly missing: boolean;
}

const MISSING_CELL: CellText = { text: 'missing', missing: true };

/** The text of element i of a column under its plan. */
export function cellText(c: Column, i: number, plan: ColumnPlan = planColumn(c)): CellText {
  if (isMissingAt(c, i)) return MISSING_CELL;
  switch (c.type) {
    case 'text':
      return { text: c.values[i] ?? '', missing: false };
    case 'boolean':
      return { text: c.values[i] === 1 ? 'true' : 'false', missing: false };
    case 'number': {
      const x = c.values[i]!;
      if (plan.typed) {
        const typed = c.decimals === null ? undefined : decimalAt(c.decimals, i);
        if (typed !== undefined && typed !== '') return { text: typed, missing: false };
      }
      if (plan.asP) return { text: pText(x) || 'NaN', missing: false };
      return { text: fixedText(x, plan.decimals), missing: false };
    }
  }
}

/** Which rows of a long grid to draw, and how much room to leave above and below them. */
export interface RowWindow {
  /** First row drawn (0-based, inclusive). */
  readonly first: number;
  /** One past the last row drawn. */
  readonly last: number;
  /** Height of the empty space above the drawn rows, in pixels. */
  readonly padTop: number;
  /** Height of the empty space below them. */
  readonly padBottom: number;
}

/**
 * Browsers cap the height of an element (about 17 million pixels in some); a grid taller
 * than this maps its scroll position onto the rows instead of giving each row its pixels.
 */
export const MAX_SCROLL_HEIGHT = 8_000_000;

/**
 * The rows to draw for a scroll position. Rows have one fixed height; `overscan` rows are
 * drawn beyond each edge so that a quick scroll does not show blank space.
 */
export function rowWindow(
  scrollTop: number,
  viewport: number,
  rowHeight: number,
  rows: number,
  overscan = 8,
  maxHeight = MAX_SCROLL_HEIGHT,
): RowWindow {
  if (rows <= 0 || rowHeight <= 0) return { first: 0, last: 0, padTop: 0, padBottom: 0 };
  const onScreen = Math.max(1, Math.ceil(viewport / rowHeight));
  const full = rows * rowHeight;
  const top = Math.max(0, scrollTop);
  if (full <= maxHeight) {
    const start = Math.min(rows - 1, Math.floor(top / rowHeight));
    const first = Math.max(0, start - overscan);
    const last = Math.min(rows, start + onScreen + overscan);
    return { first, last, padTop: first * rowHeight, padBottom: (rows - last) * rowHeight };
  }
  // Scaled: the scroll bar's range covers all rows, and the drawn block sits where the
  // viewport is, with the row at the scroll fraction at its top.
  const room = Math.max(1, maxHeight - viewport);
  const fraction = Math.min(1, top / room);
  const topRow = fraction * Math.max(0, rows - onScreen);
  const start = Math.floor(topRow);
  const first = Math.max(0, start - overscan);
  const last = Math.min(rows, start + onScreen + overscan);
  const drawn = (last - first) * rowHeight;
  const padTop = Math.max(0, Math.min(maxHeight - drawn, Math.min(top, room) - (topRow - first) * rowHeight));
  return { first, last, padTop, padBottom: Math.max(0, maxHeight - padTop - drawn) };
}
