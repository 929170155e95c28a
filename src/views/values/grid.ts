/**
 * `<furrow-grid>`: columns shown as a compact table. Short grids are drawn whole; long ones
 * draw only the rows in view (plus a margin) inside a scroll box, so a column of a million
 * elements costs a few dozen table rows.
 */
import { countText } from '../../format/digits.ts';
import { css, html, LitElement, nothing, type PropertyValues } from 'lit';
import { columnLength, type Column } from '../../lang/values.ts';
import { shared } from '../theme.ts';
import { cellText, planColumn } from './grid-model.ts';
import { rowWindow, type RowWindow } from './row-window.ts';
import { tableStyles } from './styles.ts';

/** Grids with at most this many rows are drawn whole (and print whole). */
export const OPEN_ROWS = 60;
/** Rows a long grid shows at once. */
export const VIEW_ROWS = 16;
// A first guess of one row's height in pixels; measured after the first draw.
const GUESS_ROW_HEIGHT = 25;

/** A table of equal-length columns with row numbers. */
export class FurrowGrid extends LitElement {
  static override properties = {
    columns: { attribute: false },
    names: { attribute: false },
    label: { type: String },
    scrollPos: { state: true },
    rowHeight: { state: true },
    viewport: { state: true },
  };

  /** The columns, all of one length. */
  declare columns: readonly Column[];
  /** Their headers, in order. */
  declare names: readonly string[];
  /** What the grid is, for assistive technology ("table trees"). */
  declare label: string;
  declare private scrollPos: number;
  declare private rowHeight: number;
  /** Height of the box below its sticky names, measured after a draw (0: not yet). */
  declare private viewport: number;

  private frame = 0;
  private backToTop = false;

  constructor() {
    super();
    this.columns = [];
    this.names = [];
    this.label = '';
    this.scrollPos = 0;
    this.rowHeight = GUESS_ROW_HEIGHT;
    this.viewport = 0;
  }

  static override styles = [
    shared,
    tableStyles,
    css`
      :host {
        display: block;
        max-width: 100%;
      }
      .box {
        overflow-x: auto;
        max-width: 100%;
      }
      .box.long {
        overflow-y: auto;
        border-bottom: 1px solid var(--rule);
      }
      thead th {
        position: sticky;
        top: 0;
        background: var(--sheet, #fff);
        z-index: 1;
      }
      tbody td,
      tbody th {
        height: 1.2rem;
      }
      /* a little room under the last row: table rows lay out in fractions of a pixel, and
         scrolled to the end the last row's bottom edge must still be in reach */
      .end-room {
        height: 2px;
      }
      tr.pad td {
        padding: 0;
        border: 0;
        height: auto;
      }
      .count {
        margin: 0.25rem 0 0;
        font-size: 0.75rem;
        color: var(--muted);
      }
      .print-only {
        display: none;
      }
      @media print {
        .box.long {
          max-height: none !important;
          overflow: visible;
        }
        tr.pad,
        .end-room {
          display: none;
        }
        .print-only {
          display: inline;
        }
      }
    `,
  ];

  /** The number of rows (the length of the first column). */
  get rows(): number {
    const first = this.columns[0];
    return first === undefined ? 0 : columnLength(first);
  }

  private onScroll(e: Event): void {
    const box = e.currentTarget as HTMLElement;
    if (this.frame !== 0) return;
    // One redraw per animation frame, however many scroll events arrive.
    this.frame = requestAnimationFrame(() => {
      this.frame = 0;
      this.scrollPos = box.scrollTop;
    });
  }

  override disconnectedCallback(): void {
    super.disconnectedCallback();
    if (this.frame !== 0) cancelAnimationFrame(this.frame);
    this.frame = 0;
  }

  protected override willUpdate(changed: PropertyValues<this>): void {
    if (changed.has('columns')) {
      const old = changed.get('columns') as readonly Column[] | undefined;
      // A new value of another length starts at the top again.
      if (old === undefined || (old[0] === undefined ? 0 : columnLength(old[0])) !== this.rows) {
        this.scrollPos = 0;
        this.backToTop = true;
      }
    }
  }

  protected override updated(): void {
    const row = this.renderRoot.querySelector<HTMLElement>('tbody tr.row');
    const h = row?.getBoundingClientRect().height ?? 0;
    if (h > 0 && Math.abs(h - this.rowHeight) > 0.5) this.rowHeight = h;
    const box = this.renderRoot.querySelector<HTMLElement>('.box');
    if (box !== null && this.rows > OPEN_ROWS) {
      const head = box.querySelector<HTMLElement>('thead');
      const room = box.clientHeight - (head?.offsetHeight ?? 0);
      if (room > 0 && Math.abs(room - this.viewport) > 0.5) this.viewport = room;
    }
    if (this.backToTop) {
      this.backToTop = false;
      if (box !== null) box.scrollTop = 0;
    }
  }

  /** The rows drawn now (exposed for tests and for the shell's print preview). */
  currentWindow(): RowWindow {
    const rows = this.rows;
    if (rows <= OPEN_ROWS) return { first: 0, last: rows, padTop: 0, padBottom: 0 };
    // one model for every grid: past the browsers' height cap it maps the scroll onto the rows
    return rowWindow(this.scrollPos, { rows, rowHeight: this.rowHeight, viewport: this.viewport > 0 ? this.viewport : VIEW_ROWS * this.rowHeight });
  }

  protected override render() {
    const rows = this.rows;
    const long = rows > OPEN_ROWS;
    const w = this.currentWindow();
    const plans = this.columns.map((c) => planColumn(c));
    const span = this.columns.length + 1;
    const drawn: number[] = [];
    for (let i = w.first; i < w.last; i++) drawn.push(i);
    const height = `${Math.round(VIEW_ROWS * this.rowHeight + this.rowHeight * 1.2)}px`;
    return html`
      <div class="box ${long ? 'long' : ''}" style=${long ? `max-height:${height}` : ''} @scroll=${long ? this.onScroll : nothing}>
        <table aria-label=${this.label || nothing} aria-rowcount=${rows + 1}>
          <thead>
            <tr aria-rowindex="1">
              <th class="rowno num" scope="col"><span class="print-only">#</span></th>
              ${this.names.map((n, j) => html`<th scope="col" class=${plans[j]?.align === 'num' ? 'num' : ''}>${n}</th>`)}
            </tr>
          </thead>
          <tbody>
            ${w.padTop > 0 ? html`<tr class="pad" aria-hidden="true"><td colspan=${span} style="height:${w.padTop}px"></td></tr>` : nothing}
            ${drawn.map(
              (i) => html`<tr class="row" aria-rowindex=${i + 2}>
                <th class="rowno num" scope="row">${i + 1}</th>
                ${this.columns.map((c, j) => {
                  const plan = plans[j]!;
                  const t = cellText(c, i, plan);
                  const cls = `${plan.align === 'num' ? 'num' : 'text-cell'}${t.missing ? ' missing' : ''}`;
                  return html`<td class=${cls} title=${plan.align === 'text' && t.text.length > 30 ? t.text : nothing}>${t.text}</td>`;
                })}
              </tr>`,
            )}
            ${w.padBottom > 0 ? html`<tr class="pad" aria-hidden="true"><td colspan=${span} style="height:${w.padBottom}px"></td></tr>` : nothing}
          </tbody>
        </table>
        ${long ? html`<div class="end-room" aria-hidden="true"></div>` : nothing}
      </div>
      ${long
        ? html`<p class="count">
            ${countText(rows)} rows<span class="print-only">; rows ${countText(w.first + 1)} to
              ${countText(w.last)} printed</span>
          </p>`
        : nothing}
    `;
  }
}

if (!customElements.get('furrow-grid')) customElements.define('furrow-grid', FurrowGrid);

declare global {
  interface HTMLElementTagNameMap {
    'furrow-grid': FurrowGrid;
  }
}
