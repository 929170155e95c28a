/**
 * Which rows of the table cell's grid are drawn: the row window over the scroll position
 * (src/views/values/row-window.ts, the model every grid uses, which also handles the
 * browser's height cap), the viewport's height as it is laid out, redraws when the window
 * moves, scrolling the focused field into view, and every row (up to a limit) when printing.
 */
import type { ReactiveController } from 'lit';
import { rowTopIn, rowWindow, scrollHeightOf, scrollToShowRow, type RowFrame, type RowWindow } from '../../src/views/values/row-window.ts';
import type { GridHost } from './grid-host.ts';
import { ROW_HEIGHT } from './grid-layout.ts';

/** Rows laid out in full when the page is printed. */
export const PRINT_LIMIT = 2000;

export class GridRows implements ReactiveController {
  private readonly host: GridHost;
  private viewTop = 0;
  /** Height of the scroll box below the row of names (0 before layout). */
  private windowHeight = 0;
  private drawn: RowWindow = { first: 0, last: 0, padTop: 0, padBottom: 0 };
  private revealPending = false;
  private resizeObserver: ResizeObserver | null = null;

  constructor(host: GridHost) {
    this.host = host;
    host.addController(this);
  }

  hostConnected(): void {
    window.addEventListener('beforeprint', this.onBeforePrint);
    window.addEventListener('afterprint', this.onAfterPrint);
  }

  hostDisconnected(): void {
    window.removeEventListener('beforeprint', this.onBeforePrint);
    window.removeEventListener('afterprint', this.onAfterPrint);
    this.resizeObserver?.disconnect();
    this.resizeObserver = null;
  }

  hostUpdated(): void {
    const scroller = this.scroller;
    if (scroller === null) return;
    if (this.resizeObserver === null && typeof ResizeObserver !== 'undefined') {
      this.resizeObserver = new ResizeObserver(() => this.measure());
      this.resizeObserver.observe(scroller);
    }
    if (this.windowHeight === 0 && scroller.clientHeight > 0) this.measure();
    if (this.revealPending) {
      this.revealPending = false;
      this.revealFocus();
    }
  }

  private readonly onBeforePrint = (): void => {
    this.host.printing = true;
  };
  private readonly onAfterPrint = (): void => {
    this.host.printing = false;
  };

  private get scroller(): HTMLElement | null {
    return this.host.renderRoot.querySelector<HTMLElement>('.scroller');
  }

  private frame(viewport = this.windowHeight): RowFrame {
    return { rows: this.host.extent.rows, rowHeight: ROW_HEIGHT, viewport };
  }

  /** The rows to draw now (kept, so that the editor and a redraw check use the same window). */
  window(): RowWindow {
    const n = this.host.extent.rows;
    this.drawn = this.host.printing
      ? { first: 0, last: Math.min(n, PRINT_LIMIT), padTop: 0, padBottom: 0 }
      : rowWindow(this.viewTop, this.frame());
    return this.drawn;
  }

  /** The height the rows take in the scroll box (at most the browsers' cap). */
  bodyHeight(): number {
    return scrollHeightOf(this.frame());
  }

  /** Where row r lies in the rows drawn last (any row: rows are evenly spaced). */
  rowTop(r: number): number {
    return rowTopIn(this.drawn, r, ROW_HEIGHT);
  }

  /** Rows a Page Up or Page Down moves. */
  pageRows(): number {
    return Math.max(1, Math.floor((this.windowHeight || 10 * ROW_HEIGHT) / ROW_HEIGHT) - 1);
  }

  /** Scroll the focused field into view after the next draw. */
  revealAfterUpdate(): void {
    this.revealPending = true;
  }

  readonly onScroll = (e: Event): void => {
    this.viewTop = (e.currentTarget as HTMLElement).scrollTop;
    this.redrawIfMoved();
  };

  private measure(): void {
    const s = this.scroller;
    if (s === null) return;
    const head = s.querySelector<HTMLElement>('.head');
    const h = s.clientHeight - (head?.offsetHeight ?? 0);
    if (h !== this.windowHeight) {
      this.windowHeight = h;
      this.redrawIfMoved();
    }
  }

  /** Draws again when the window of rows has moved (past the cap, rows move with every scroll). */
  private redrawIfMoved(): void {
    if (this.host.printing) return;
    const want = rowWindow(this.viewTop, this.frame());
    const d = this.drawn;
    if (want.first !== d.first || want.last !== d.last || want.padTop !== d.padTop) this.host.requestUpdate();
  }

  /** Scrolls so that the focused field is in view. */
  revealFocus(): void {
    const s = this.scroller;
    if (s === null) return;
    const { r, c } = this.host.sel.focus;
    const head = s.querySelector<HTMLElement>('.head');
    const viewport = s.clientHeight - (head?.offsetHeight ?? 0);
    const top = scrollToShowRow(r, s.scrollTop, this.frame(viewport));
    if (top !== s.scrollTop) s.scrollTop = top;
    const name = s.querySelector<HTMLElement>(`#h-${c}`);
    const corner = s.querySelector<HTMLElement>('.corner');
    if (name !== null) {
      const stuck = corner?.offsetWidth ?? 0;
      const left = name.offsetLeft;
      const right = left + name.offsetWidth;
      if (left - stuck < s.scrollLeft) s.scrollLeft = Math.max(0, left - stuck);
      else if (right > s.scrollLeft + s.clientWidth) s.scrollLeft = right - s.clientWidth;
    }
    this.viewTop = s.scrollTop;
    this.redrawIfMoved();
  }
}
