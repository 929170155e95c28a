/**
 * `<furrow-chart>`: a chart value drawn with vega-embed, loaded only when a chart is first
 * shown. Every spec goes through chart-safety.ts: cleaned, locked loader, interpreted
 * expressions, warnings shown under the chart.
 */
import { css, html, LitElement, nothing, type PropertyValues } from 'lit';
import type { Chart } from '../../lang/values.ts';
import { shared } from '../theme.ts';
import { cleanSpec, collectingLogger, lockedLoader, safeEmbedOptions, type SpecObject } from './chart-safety.ts';
import { downloadBlob, downloadUrl, fileNameFor } from '../download.ts';
import { sheetWords } from '../../messages/page.ts';

type Phase = 'idle' | 'loading' | 'drawn' | 'failed';

/** What embedding returns that the element keeps: the view (to save it) and a way to let it go. */
interface Embedded {
  finalize(): void;
  readonly view: {
    toSVG(scale?: number): Promise<string>;
    toImageURL(type: string, scale?: number): Promise<string>;
  };
}

/** A vega-lite chart with its caption and any warnings vega gave. */
export class FurrowChart extends LitElement {
  static override properties = {
    value: { attribute: false },
    name: { type: String },
    phase: { state: true },
    messages: { state: true },
    failure: { state: true },
  };

  /** The chart to draw. */
  declare value: Chart | null;
  /** The name of the cell the chart is the value of (for the file names it saves under). */
  declare name: string | null;
  declare private phase: Phase;
  declare private messages: readonly string[];
  declare private failure: string | null;

  private embedded: Embedded | null = null;
  /** The cleaned spec of the current value (null: none, or not drawable). */
  private spec: SpecObject | null = null;
  // Each draw takes a number; a draw that finishes after a newer one began is thrown away.
  private ticket = 0;

  constructor() {
    super();
    this.value = null;
    this.name = null;
    this.phase = 'idle';
    this.messages = [];
    this.failure = null;
  }

  static override styles = [
    shared,
    css`
      :host {
        display: block;
      }
      .holder {
        min-height: 2rem;
        overflow-x: auto;
      }
      /* a chart wider than the column is drawn smaller rather than cut: the SVG keeps its
         proportions (it carries its own viewBox) */
      .holder .vega-embed {
        max-width: 100%;
      }
      .holder svg {
        max-width: 100%;
        height: auto;
      }
      .holder.loading {
        min-height: 12rem;
        background: repeating-linear-gradient(135deg, transparent 0 10px, var(--rule) 10px 11px);
        opacity: 0.5;
      }
      .caption {
        font-family: var(--font-text);
        font-size: 0.9rem;
        color: var(--ink-soft);
        margin: 0.35rem 0 0;
      }
      .warnings {
        margin: 0.35rem 0 0;
        padding: 0;
        list-style: none;
        font-size: 0.8rem;
        color: var(--warn);
      }
      .warnings li::before {
        content: 'chart warning: ';
        font-weight: 600;
      }
      .failed {
        color: var(--error);
        font-size: 0.9rem;
      }
      @media print {
        .holder {
          overflow: visible;
        }
        .holder.loading {
          background: none;
        }
      }
    `,
  ];

  protected override willUpdate(changed: PropertyValues<this>): void {
    // Reset in the same update that brings the new value, so the old chart's warnings and
    // failure never stand under the new one.
    if (changed.has('value')) {
      this.ticket++;
      this.release();
      this.messages = [];
      this.failure = null;
      this.spec = this.value === null ? null : cleanSpec(this.value.spec);
      if (this.value === null) this.phase = 'idle';
      else if (this.spec === null) {
        this.phase = 'failed';
        this.failure = 'This chart cannot be drawn: its description is not plain data.';
      } else this.phase = 'loading';
    }
  }

  protected override updated(changed: PropertyValues<this>): void {
    if (changed.has('value') && this.spec !== null) void this.draw(this.ticket, this.spec);
  }

  override connectedCallback(): void {
    super.connectedCallback();
    // Moved in the page (disconnected and connected again): draw afresh.
    if (this.hasUpdated && this.embedded === null && this.spec !== null) {
      this.ticket++;
      void this.draw(this.ticket, this.spec);
    }
  }

  override disconnectedCallback(): void {
    super.disconnectedCallback();
    this.ticket++;
    this.release();
  }

  private release(): void {
    const e = this.embedded;
    this.embedded = null;
    if (e !== null) {
      try {
        e.finalize();
      } catch {
        // a view that fails to let go must not take the page down
      }
    }
  }

  private async draw(ticket: number, spec: SpecObject): Promise<void> {
    const frame = this.renderRoot.querySelector<HTMLElement>('.frame');
    if (frame === null) return;
    try {
      const [embedModule, interpreter] = await Promise.all([import('vega-embed'), import('vega-interpreter')]);
      if (ticket !== this.ticket) return;
      const logger = collectingLogger(() => {
        if (ticket === this.ticket) this.messages = [...logger.messages];
      });
      const options = safeEmbedOptions(lockedLoader(embedModule.vega.loader()), logger, interpreter.expressionInterpreter);
      // The element itself, not a selector: selectors do not reach into shadow roots.
      const result = await embedModule.default(frame, spec as Parameters<typeof embedModule.default>[1], options);
      if (ticket !== this.ticket) {
        result.finalize();
        return;
      }
      this.embedded = result;
      this.messages = [...logger.messages];
      this.phase = 'drawn';
    } catch (err) {
      if (ticket !== this.ticket) return;
      this.phase = 'failed';
      this.failure = `This chart could not be drawn: ${err instanceof Error ? err.message : String(err)}`;
    }
  }

  /** Saves the drawn chart as SVG or PNG; made by the view itself, nothing is fetched. */
  private async save(kind: 'svg' | 'png'): Promise<void> {
    const view = this.embedded?.view;
    if (view === undefined) return;
    const file = fileNameFor(this.name, kind, 'chart');
    if (kind === 'svg') downloadBlob(file, new Blob([await view.toSVG()], { type: 'image/svg+xml' }));
    else downloadUrl(file, await view.toImageURL('png', 2));
  }

  protected override render() {
    const value = this.value;
    return html`
      <figure class="chart" style="margin:0">
        <div class="holder ${this.phase === 'loading' ? 'loading' : ''}" role="img" aria-label=${value?.caption || 'chart'}>
          <div class="frame"></div>
        </div>
        ${this.failure === null ? nothing : html`<p class="failed">${this.failure}</p>`}
        ${value === null || value.caption === '' ? nothing : html`<figcaption class="caption">${value.caption}</figcaption>`}
        ${this.phase !== 'drawn'
          ? nothing
          : html`<p class="saves">
              <button type="button" title=${sheetWords.saveSvgTitle()} @click=${() => void this.save('svg')}>${sheetWords.saveSvg()}</button>
              <button type="button" title=${sheetWords.savePngTitle()} @click=${() => void this.save('png')}>${sheetWords.savePng()}</button>
            </p>`}
        ${this.messages.length === 0 ? nothing : html`<ul class="warnings">${this.messages.map((m) => html`<li>${m}</li>`)}</ul>`}
      </figure>
    `;
  }
}

if (!customElements.get('furrow-chart')) customElements.define('furrow-chart', FurrowChart);

declare global {
  interface HTMLElementTagNameMap {
    'furrow-chart': FurrowChart;
  }
}
