/**
 * The one row-window model of every grid on the page (the table cell's editing grid and the
 * value grid): which rows of a long list to draw for a scroll position, where they sit, and
 * which scroll position brings a row into view. Pure numbers, tested in Node.
 *
 * Rows have one fixed height. While the rows' full height fits in `maxHeight`, row i lies at
 * i * rowHeight. Past it, browsers refuse to make an element that tall (Chromium and WebKit
 * lay out in 1/64 px units in 32 bits, about 33.5 million px; Firefox stops near 17.9
 * million (from memory)), so the scroll range is `maxHeight` and the scroll position maps to a
 * row in proportion: scrolled to the end, the last row's bottom meets the viewport's bottom.
 * The drawn rows then sit where the viewport is, the (fractional) top row exactly at the
 * viewport's top, so every row from the first to the last can be reached and shown.
 */

/**
 * The scroll height a grid may use: below the caps above, with room to spare (a 1,000,000-row
 * table of 26 px rows, 26 million px, is scaled in every browser, so the scaled path is the
 * one the browser test exercises).
 */
export const MAX_SCROLL_HEIGHT = 15_000_000;

/** Rows drawn beyond each edge of the viewport, so that a quick scroll shows no gap. */
export const OVERSCAN = 8;

/** Rows drawn when the viewport's height is not known yet (no layout). */
export const ROWS_WITHOUT_LAYOUT = 40;

/** The rows of a grid and the room they are shown in. */
export interface RowFrame {
  /** Number of rows. */
  readonly rows: number;
  /** Height of every row, in pixels. */
  readonly rowHeight: number;
  /** Height of the part of the scroll box that shows rows (sticky names excluded). */
  readonly viewport: number;
  /** Largest scroll height to use (default MAX_SCROLL_HEIGHT). */
  readonly maxHeight?: number;
}

/** Which rows to draw, and the empty space above and below them. */
export interface RowWindow {
  /** First row drawn (0-based, inclusive). */
  readonly first: number;
  /** One past the last row drawn. */
  readonly last: number;
  /** Where the first drawn row's top lies: the height of the empty space above the rows. */
  readonly padTop: number;
  /** Height of the empty space below the drawn rows. */
  readonly padBottom: number;
}

const NONE: RowWindow = { first: 0, last: 0, padTop: 0, padBottom: 0 };

function capOf(f: RowFrame): number {
  return f.maxHeight ?? MAX_SCROLL_HEIGHT;
}

/** The height the rows take in the scroll box: their full height, or the cap. */
export function scrollHeightOf(f: RowFrame): number {
  if (f.rows <= 0 || !(f.rowHeight > 0)) return 0;
  return Math.min(f.rows * f.rowHeight, capOf(f));
}

/** True when the rows are taller than the cap and the scroll position maps to rows in proportion. */
export function isScaled(f: RowFrame): boolean {
  return f.rows * f.rowHeight > capOf(f);
}

/**
 * Scaled: the scroll range (`room`), the rows it spans (`span`: the top row at the end), the
 * scroll position within the range (`at`) and the length of the two ends (`edge`) where the
 * rows move pixel for pixel.
 *
 * The mapping is in three pieces. Over the first `edge` pixels, row i lies at i * rowHeight;
 * over the last `edge`, the rows lie at a fixed offset that puts the last row's bottom at
 * the bottom of the scroll height; in between, the top row moves in proportion. So no row is
 * ever drawn above the top or below the bottom of the rows while it is in view (a single
 * proportional mapping would put row 0 above the top, half in view, for the first pixels).
 */
function scaling(scrollTop: number, f: RowFrame): { room: number; span: number; at: number; edge: number } {
  const height = scrollHeightOf(f);
  const v = Math.max(0, f.viewport);
  const room = Math.max(1, height - v);
  const span = Math.max(0, f.rows - v / f.rowHeight);
  const at = Math.min(room, Math.max(0, scrollTop));
  const edge = Math.min(Math.max(f.rowHeight, v), room / 4);
  return { room, span, at, edge };
}

/** Scaled: the top row (fractional) at scroll position `at` (within the range). */
function scaledTop(at: number, room: number, span: number, edge: number, rh: number): number {
  if (at <= edge) return at / rh;
  if (at >= room - edge) return span - (room - at) / rh;
  return edge / rh + ((at - edge) / (room - 2 * edge)) * (span - (2 * edge) / rh);
}

/** Scaled: the scroll position at which `top` is the top row (the inverse of scaledTop). */
function scaledScroll(top: number, room: number, span: number, edge: number, rh: number): number {
  if (top <= edge / rh) return top * rh;
  if (top >= span - edge / rh) return room - (span - top) * rh;
  return edge + ((top - edge / rh) / (span - (2 * edge) / rh)) * (room - 2 * edge);
}

/** The row (fractional) at the top of the viewport for a scroll position. */
export function topRowAt(scrollTop: number, f: RowFrame): number {
  if (f.rows <= 0 || !(f.rowHeight > 0)) return 0;
  if (!isScaled(f)) return Math.max(0, scrollTop) / f.rowHeight;
  const s = scaling(scrollTop, f);
  return scaledTop(s.at, s.room, s.span, s.edge, f.rowHeight);
}

/**
 * Where row `row` lies (its top, in pixels from the top of the rows) while the box is scrolled
 * to `scrollTop`. Unscaled this is row * rowHeight whatever the scroll; scaled it depends on it.
 */
export function rowTopAt(row: number, scrollTop: number, f: RowFrame): number {
  if (!isScaled(f)) return row * f.rowHeight;
  const s = scaling(scrollTop, f);
  return s.at + (row - scaledTop(s.at, s.room, s.span, s.edge, f.rowHeight)) * f.rowHeight;
}

/** Where `row` lies in a window that was drawn (any row, drawn or not: rows are evenly spaced). */
export function rowTopIn(w: RowWindow, row: number, rowHeight: number): number {
  return w.padTop + (row - w.first) * rowHeight;
}

/** The rows to draw for a scroll position. */
export function rowWindow(scrollTop: number, f: RowFrame, overscan = OVERSCAN): RowWindow {
  const { rows, rowHeight } = f;
  if (rows <= 0 || !(rowHeight > 0)) return NONE;
  const height = scrollHeightOf(f);
  if (!(f.viewport > 0)) {
    const last = Math.min(rows, ROWS_WITHOUT_LAYOUT);
    return { first: 0, last, padTop: 0, padBottom: Math.max(0, height - last * rowHeight) };
  }
  const inView = f.viewport / rowHeight;
  if (!isScaled(f)) {
    const start = Math.min(rows - 1, Math.floor(Math.max(0, scrollTop) / rowHeight));
    const first = Math.max(0, start - overscan);
    const last = Math.min(rows, start + Math.ceil(inView) + 1 + overscan);
    return { first, last, padTop: first * rowHeight, padBottom: (rows - last) * rowHeight };
  }
  const s = scaling(scrollTop, f);
  const top = scaledTop(s.at, s.room, s.span, s.edge, rowHeight);
  // rows above the top of the rows (y < 0) or below their bottom (y > height) are never in view
  const EPS = 1e-9;
  const first = Math.max(0, Math.floor(top) - overscan, Math.ceil(top - s.at / rowHeight - EPS));
  const last = Math.max(first, Math.min(rows, Math.ceil(top + inView) + overscan, Math.floor(top + (height - s.at) / rowHeight + EPS)));
  const padTop = Math.max(0, s.at + (first - top) * rowHeight);
  const padBottom = Math.max(0, height - padTop - (last - first) * rowHeight);
  return { first, last, padTop, padBottom };
}

/**
 * The scroll position that shows row `row` whole (unchanged when it already is): just enough
 * to bring it to the top edge when it lies above, or to the bottom edge when below. Whole
 * pixels, rounded so that the row stays inside the viewport.
 */
export function scrollToShowRow(row: number, scrollTop: number, f: RowFrame): number {
  if (row < 0 || row >= f.rows || !(f.rowHeight > 0)) return scrollTop;
  const rh = f.rowHeight;
  const v = Math.max(0, f.viewport);
  if (!isScaled(f)) {
    const top = row * rh;
    if (top < scrollTop) return top;
    if (top + rh > scrollTop + v) return Math.max(0, top + rh - v);
    return scrollTop;
  }
  const s = scaling(scrollTop, f);
  const top = scaledTop(s.at, s.room, s.span, s.edge, rh);
  const inView = v / rh;
  if (row < top) return Math.max(0, Math.floor(scaledScroll(row, s.room, s.span, s.edge, rh)));
  if (row + 1 > top + inView) return Math.min(Math.ceil(s.room), Math.ceil(scaledScroll(row + 1 - inView, s.room, s.span, s.edge, rh)));
  return scrollTop;
}

/** The scroll position that shows the last row at the bottom of the viewport. */
export function scrollToEnd(f: RowFrame): number {
  return Math.max(0, Math.ceil(scrollHeightOf(f) - Math.max(0, f.viewport)));
}
