/**
 * `<furrow-chart>`: a chart value drawn with vega-embed, loaded only when a chart is first
 * shown. Every spec goes through chart-safety.ts: cleaned, locked loader, interpreted
 * expressions, warnings shown under the chart.
 */
import { css, html, LitElement, nothing, type PropertyValues } from 'lit';
import type { Chart } from '../../lang/values.ts';
import { shared } from '../theme.ts';
import { cleanSpec, collectingLogger, lockedLoader, safeEmbedOptions } from './chart-safety.ts';

type Phase = 'idle' | 'loading' | 'drawn' | 'failed';

/** What embedding returns that the element keeps: a way to let the view go. */
interface Embedded {
  finalize(): void;
}

/** A vega-lite chart with its caption and any warnings vega gave. */
export class FurrowChart extends LitElement {
  static override properties = {
    value: { attribute: false },
    phase: { state: true },
    messages: { state: true },
    failure: { state: true },
  };

  /** The chart to draw. */
  declare value: Chart | null;
  declare private phase: Phase;
  declare private messages: readonly string[];
  declare private failure: string | null;

  private embedded: Embedded | null = null;
  // Each draw takes a number; a draw that finishes after a newer one began is thrown away.
  private drawn = 0;

  constructor() {
    super();
    this.value = null;
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

  protected override updated(changed: PropertyValues<this>): void {
    if (changed.has('value')) void this.draw();
  }

  override connectedCallback(): void {
    super.connectedCallback();
    // Moved in the page (disconnected and connected again): draw afresh.
    if (this.hasUpdated && this.embedded === null && this.value !== null) void this.draw();
  }

  override disconnectedCallback(): void {
    super.disconnectedCallback();
    this.drawn++;
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

  private async draw(): Promise<void> {
    const ticket = ++this.drawn;
    this.release();
    this.messages = [];
    this.failure = null;
    const value = this.value;
    if (value === null) {
      this.phase = 'idle';
      return;
    }
    const spec = cleanSpec(value.spec);
    if (spec === null) {
      this.phase = 'failed';
      this.failure = 'This chart cannot be drawn: its description is not plain data.';
      return;
    }
    this.phase = 'loading';
    await this.updateComplete;
    const frame = this.renderRoot.querySelector<HTMLElement>('.frame');
    if (frame === null || ticket !== this.drawn) return;
    try {
      const [embedModule, interpreter] = await Promise.all([import('vega-embed'), import('vega-interpreter')]);
      if (ticket !== this.drawn) return;
      const logger = collectingLogger(() => {
        if (ticket === this.drawn) this.messages = [...logger.messages];
      });
      const options = safeEmbedOptions(lockedLoader(embedModule.vega.loader()), logger, interpreter.expressionInterpreter);
      // The element itself, not a selector: selectors do not reach into shadow roots.
      const result = await embedModule.default(frame, spec as Parameters<typeof embedModule.default>[1], options);
      if (ticket !== this.drawn) {
        result.finalize();
        return;
      }
      this.embedded = result;
      this.messages = [...logger.messages];
      this.phase = 'drawn';
    } catch (err) {
      if (ticket !== this.drawn) return;
      this.phase = 'failed';
      this.failure = `This chart could not be drawn: ${err instanceof Error ? err.message : String(err)}`;
    }
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
