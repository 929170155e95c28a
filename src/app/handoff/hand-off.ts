/**
 * `<furrow-hand-off>`: what a reviewer needs first, at the top of the sheet.
 *
 * - The claims of the document with their state, each a link to its cell.
 * - When the document carries a sealed section: the verification of the current values
 *   against it (the same code as `furrow verify`), a banner with the verdict, and the
 *   differences marked on their cells; live numbers of notes that a failing claim reads
 *   are marked too.
 * - The report of the document as one HTML file (the same as `furrow report`).
 *
 * It takes the document and the cells' states from the shell and changes nothing in them.
 */
import { handOffWords as w, shellWords } from '../../messages/page.ts';
import { LitElement, css, html, nothing, type PropertyValues } from 'lit';
import type { CellViewState } from '../../../cells/view-api.ts';
import { documentTitle, type Cell, type Document as FurrowDocument } from '../../doc/document.ts';
import { writeDocument } from '../../doc/format.ts';
import type { CellState } from '../../graph/engine.ts';
import { notesInDoubt, type NoteDoubt } from '../../seal/doubt.ts';
import { isSealedCell } from '../../seal/fingerprint.ts';
import { claimsOf, type SealedClaim } from '../../seal/section.ts';
import { verificationText } from '../../seal/verify-text.ts';
import { verifyDocument, type Verification } from '../../seal/verify.ts';
import { sealMsg } from '../../messages/seal.ts';
import { shared } from '../../views/theme.ts';
import { formatInline, formatNumber } from '../../lang/format.ts';
import type { Value } from '../../lang/values.ts';
import { applyMarks, type CellMark } from './marks.ts';
import { dependencyChain } from './provenance.ts';
import { storedBytes } from '../data-files.ts';
import { namesReadBy, settledStates } from './page-states.ts';

const encoder = new TextEncoder();

/** The event the sheet sends (from its own element) to show where a cell's value comes from; detail: the cell id. */
export const TRACE_EVENT = 'furrow-trace';

/** A value in a few words for a step of a chain: scalars, a table's size, a record's main numbers. */
function stepValue(v: Value | null | undefined): string {
  if (v === null || v === undefined) return '…';
  if (typeof v === 'object' && v.kind === 'record') {
    const shown: string[] = [];
    for (const [k, x] of v.fields) {
      if (typeof x === 'number' && shown.length < 5) shown.push(`${k} ${formatNumber(x)}`);
      if (typeof x === 'string' && k === 'design') shown.unshift(x);
    }
    return shown.join(', ') || formatInline(v);
  }
  return formatInline(v);
}

/** The hand-off panel. */
export class HandOffPanel extends LitElement {
  static override properties = {
    doc: { attribute: false },
    stateOf: { attribute: false },
    files: { attribute: false },
    fileName: { attribute: false },
    building: { state: true },
    failure: { state: true },
    tracing: { state: true },
  };

  declare doc: FurrowDocument | null;
  declare stateOf: (cell: Cell) => CellViewState | null;
  declare files: ReadonlyMap<string, string>;
  declare fileName: string | null;
  declare building: boolean;
  declare failure: string | null;
  /** The cell whose chain of dependencies is shown, or null. */
  declare tracing: string | null;

  private states: CellState[] | null = null;
  private claims: SealedClaim[] = [];
  private verification: Verification | null = null;
  private doubts = new Map<string, NoteDoubt>();
  private lastInputs: unknown[] = [];
  /** The marks on the sheet are out of date (set when the verdict or the doubts change). */
  private marksDue = false;

  constructor() {
    super();
    this.doc = null;
    this.stateOf = () => null;
    this.files = new Map();
    this.fileName = null;
    this.building = false;
    this.failure = null;
    this.tracing = null;
  }

  /** Shows where the value of a cell comes from (the sheet asks with a `furrow-trace` event). */
  trace(cellId: string): void {
    this.tracing = cellId;
  }

  private readonly onTrace = (e: Event): void => {
    const id = (e as CustomEvent<string>).detail;
    if (typeof id === 'string') this.trace(id);
  };

  override connectedCallback(): void {
    super.connectedCallback();
    const root = this.getRootNode();
    if (root instanceof ShadowRoot) root.host.addEventListener(TRACE_EVENT, this.onTrace);
  }

  override disconnectedCallback(): void {
    super.disconnectedCallback();
    const root = this.getRootNode();
    if (root instanceof ShadowRoot) root.host.removeEventListener(TRACE_EVENT, this.onTrace);
  }

  static override styles = [
    shared,
    css`
      :host {
        display: block;
        margin: 0 0 1rem;
      }
      .verdict {
        padding: 0.55rem 0.8rem;
        border-radius: var(--radius);
        margin: 0 0 0.6rem;
        font-size: 0.9rem;
      }
      .verdict.ok {
        background: #e6f3ea;
        border-left: 6px solid #23663a;
      }
      .verdict.bad {
        background: #fbeae8;
        border-left: 6px solid #a3261b;
      }
      .verdict ul {
        margin: 0.3rem 0 0;
        padding-left: 1.2rem;
        font-family: var(--font-code);
        font-size: 0.78rem;
        max-height: 14rem;
        overflow: auto;
      }
      .strip {
        display: flex;
        flex-wrap: wrap;
        gap: 0.35rem;
        align-items: center;
        font-size: 0.85rem;
      }
      .strip .lead {
        color: var(--muted);
        margin-right: 0.2rem;
      }
      .claim {
        border: 1px solid #23663a;
        background: #e6f3ea;
        color: var(--ink);
        border-radius: 999px;
        padding: 0.1rem 0.6rem;
        cursor: pointer;
        font: inherit;
        text-align: left;
      }
      .claim b {
        margin-right: 0.3rem;
      }
      .claim.fails {
        border: 2px solid #a3261b;
        background: #fbeae8;
      }
      .claim.fails b {
        color: #a3261b;
        text-transform: uppercase;
      }
      .report {
        margin-left: auto;
      }
      .failure {
        color: #a3261b;
        font-size: 0.8rem;
      }
      .chain {
        position: fixed;
        right: 1rem;
        bottom: 1rem;
        z-index: 20;
        width: min(34rem, calc(100vw - 2rem));
        max-height: 60vh;
        overflow: auto;
        background: var(--sheet, #fff);
        border: 1px solid var(--rule-strong, #999);
        border-radius: var(--radius);
        box-shadow: 0 6px 24px rgba(0, 0, 0, 0.18);
        padding: 0.6rem 0.8rem;
        font-size: 0.85rem;
      }
      .chain header {
        display: flex;
        justify-content: space-between;
        align-items: center;
      }
      .chain ol {
        margin: 0.4rem 0 0;
        padding-left: 1.3rem;
      }
      .chain li {
        margin: 0.3rem 0;
      }
      .chain .step {
        font-family: var(--font-code);
        font-weight: 600;
      }
      .chain .reads {
        color: var(--muted);
        margin: 0 0.4rem;
      }
      .chain .value {
        display: block;
        font-family: var(--font-code);
        font-size: 0.78rem;
      }
      @media print {
        .report {
          display: none;
        }
      }
    `,
  ];

  override willUpdate(changed: PropertyValues): void {
    super.willUpdate(changed);
    const doc = this.doc;
    if (doc === null) return;
    const states = settledStates(doc, this.stateOf);
    if (states === null) return; // keep the last verdict while cells are recomputed
    const inputs = [doc, this.files, ...states.map((s) => s.value), ...states.map((s) => s.parts)];
    if (inputs.length === this.lastInputs.length && inputs.every((x, i) => x === this.lastInputs[i])) return;
    this.lastInputs = inputs;
    this.states = states;
    this.claims = claimsOf(states);
    const byId = new Map(doc.cells.map((c) => [c.id, c] as const));
    this.doubts = notesInDoubt(doc.cells, states, (id) => namesReadBy(byId.get(id)));
    this.verification = doc.cells.some((c) => isSealedCell(c.marker)) ? verifyDocument(doc, states, this.fileBytes()) : null;
    this.marksDue = true;
  }

  private fileBytes(): Map<string, Uint8Array> {
    return new Map([...this.files].map(([n, t]) => [n, storedBytes(n, t)] as const));
  }

  override updated(changed: PropertyValues): void {
    super.updated(changed);
    const root = this.getRootNode();
    if (!this.marksDue || !(root instanceof ShadowRoot || root instanceof Document) || this.doc === null) return;
    this.marksDue = false;
    const marks = new Map<string, CellMark>();
    const v = this.verification;
    if (v !== null) {
      for (const x of v.values) {
        if (x.state === 'same' || x.cell === null) continue;
        const cell = this.doc.cells[x.cell - 1];
        if (cell === undefined) continue;
        const note = x.state === 'new' ? w.notInSeal() : w.differsFromSeal(x.details);
        marks.set(cell.id, { verify: x.state, note });
      }
    }
    // wait for the cells to draw (their views render after this panel) before marking
    requestAnimationFrame(() => applyMarks(root, marks, this.doubts));
  }

  private goTo(cellNumber: number): void {
    const cell = this.doc?.cells[cellNumber - 1];
    const root = this.getRootNode() as ShadowRoot | Document;
    const el = cell === undefined ? null : root.querySelector<HTMLElement>(`section.cell[data-cell="${cell.id}"]`);
    el?.scrollIntoView({ block: 'center', behavior: 'smooth' });
    el?.animate([{ backgroundColor: 'rgba(32, 95, 143, 0.18)' }, { backgroundColor: 'transparent' }], { duration: 1200 });
  }

  private async buildReport(): Promise<void> {
    if (this.doc === null || this.states === null) return;
    this.building = true;
    this.failure = null;
    try {
      const { buildReport } = await import('../../report/build.ts');
      const doc = this.doc;
      const byId = new Map(doc.cells.map((c) => [c.id, c] as const));
      const name = this.fileName ?? `${documentTitle(doc).toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '') || 'trial'}.furrow`;
      const text = await buildReport({
        name,
        bytes: encoder.encode(writeDocument(doc)),
        doc,
        states: this.states,
        readsOf: (id) => namesReadBy(byId.get(id)),
        files: this.fileBytes(),
      });
      const url = URL.createObjectURL(new Blob([text], { type: 'text/html;charset=utf-8' }));
      const a = document.createElement('a');
      a.href = url;
      a.download = name.replace(/\.furrow$/, '') + '-report.html';
      document.body.append(a);
      a.click();
      a.remove();
      setTimeout(() => URL.revokeObjectURL(url), 10_000);
    } catch (err) {
      this.failure = w.reportFailed(err instanceof Error ? err.message : String(err));
    } finally {
      this.building = false;
    }
  }

  override render() {
    const v = this.verification;
    const failing = this.claims.filter((c) => !c.holds).length;
    return html`
      ${v === null
        ? nothing
        : html`<div class="verdict ${v.matches ? 'ok' : 'bad'}" role=${v.matches ? 'status' : 'alert'} data-verdict=${v.matches ? 'verified' : 'differs'}>
            <strong>${v.matches ? w.verified() : w.notVerified()}</strong>
            ${v.matches
              ? nothing
              : html`<ul>
                  ${verificationText('', v)
                    .filter((l) => l.trim() !== '' && !/^ {2}same /.test(l) && l !== sealMsg.valuesHeading())
                    .map((l) => html`<li>${l.trim()}</li>`)}
                </ul>`}
          </div>`}
      <div class="strip" role="navigation" aria-label=${shellWords.claims}>
        ${this.claims.length === 0
          ? html`<span class="lead">${w.noClaimsLead()}<code>${w.claimExample()}</code>${w.noClaimsTail()}</span>`
          : html`<span class="lead">${failing === 0 ? w.allClaimsHold(this.claims.length) : w.claimsFail(failing, this.claims.length)}</span>
              ${this.claims.map(
                (c) =>
                  html`<button class="claim ${c.holds ? 'holds' : 'fails'}" title=${shellWords.goToItsCell} @click=${() => this.goTo(c.cell)}>
                    <b>${c.holds ? w.holds() : w.doesNotHold()}</b>${c.statement}
                  </button>`,
              )}`}
        <button class="report" ?disabled=${this.building || this.states === null} @click=${() => void this.buildReport()} title=${shellWords.reportTip}>
          ${this.building ? w.makingReport() : w.report()}
        </button>
      </div>
      ${this.failure ? html`<div class="failure" role="alert">${this.failure}</div>` : nothing}
      ${this.tracing === null ? nothing : this.renderChain(this.tracing)}
    `;
  }

  private renderChain(id: string) {
    const doc = this.doc;
    if (doc === null) return nothing;
    const chain = dependencyChain(doc.cells, id);
    const last = chain[chain.length - 1];
    return html`<section class="chain" role="dialog" aria-label=${shellWords.whereThisValueComesFrom}>
      <header>
        <strong>${w.whereFrom(last?.name ?? w.cellAt(last?.position ?? 0))}</strong>
        <button @click=${() => (this.tracing = null)} aria-label=${shellWords.close}>✕</button>
      </header>
      <ol>
        ${chain.map((step) => {
          const state = this.stateOf(step.cell);
          const label = step.name ?? w.stepOfKind(step.cell.marker.split(' ')[0] ?? '', step.position);
          return html`<li>
            <button class="step" title=${shellWords.goToTheCell} @click=${() => this.goTo(step.position)}>${label}</button>
            <span class="reads">${step.reads.length > 0 ? w.reads(step.reads) : w.fromData()}</span>
            <span class="value">${state?.status === 'error' || state?.status === 'upstream' ? w.stepError(state.error?.message ?? '') : stepValue(state?.value)}</span>
          </li>`;
        })}
      </ol>
    </section>`;
  }
}

if (!customElements.get('furrow-hand-off')) customElements.define('furrow-hand-off', HandOffPanel);
