/**
 * `<furrow-formula-cell>`: a formula cell on the page. The formula is edited in CodeMirror
 * (created when the cell first scrolls into view; until then the same text is drawn as
 * static coloured text), its problems are underlined under the exact characters and said in
 * words below, and its value is drawn underneath with `<furrow-value>`.
 *
 * The view never changes the document: typing becomes `body` edits (debounced, one undo
 * step per burst of typing through the merge key), and a new `cell` from the shell whose
 * text differs (undo, redo) replaces the editor's text without being sent back.
 */
import { setDiagnostics, type Diagnostic } from '@codemirror/lint';
import { EditorState } from '@codemirror/state';
import { EditorView } from '@codemirror/view';
import { css, html, LitElement, nothing, unsafeCSS, type PropertyValues } from 'lit';
import { guard } from 'lit/directives/guard.js';
import { shared } from '../../src/views/theme.ts';
import '../../src/views/values/value.ts';
import { freshBody, visibleBody, type Cell } from '../../src/doc/document.ts';
import { FLUSH_EVENT, emitEdit, type CellViewState, type NameCatalogue } from '../view-api.ts';
import { builtinNames, staticTokenCss } from './editor-language.ts';
import { editorHost, formulaExtensions, formulaSetup, fromDocument, type FormulaEditorHost } from './editor-setup.ts';
import type { BuiltinInfo } from '../view-api.ts';
import { secondNameFix, type FormulaFix } from './model.ts';
import { startMsg } from '../../src/messages/page.ts';
import { formulaProblems, parseVisible, type FormulaProblem } from './view-problems.ts';
import { staticPieces } from './view-static.ts';
import { textChange } from './view-sync.ts';

/** Milliseconds of quiet after typing before the text is sent as an edit. */
export const EDIT_DELAY_MS = 150;

/** Events the cell dispatches for the shell's undo stack. */
export const UNDO_EVENT = 'furrow-undo';
export const REDO_EVENT = 'furrow-redo';

const EMPTY_CATALOGUE: NameCatalogue = { builtins: [], cells: [] };

function toDiagnostic(p: FormulaProblem, fix: FormulaFix | null): Diagnostic {
  const d: Diagnostic = { from: p.from, to: p.to, severity: p.source === 'upstream' ? 'warning' : 'error', message: p.message };
  if (fix === null) return d;
  return { ...d, actions: [{ name: startMsg.secondNameFix(fix.name), apply: (view) => view.dom.dispatchEvent(new CustomEvent(FIX_EVENT, { detail: fix, bubbles: true, composed: true })) }] };
}

/** Sent from the editor's own problem tooltip to the cell, which applies the fix as the button does. */
const FIX_EVENT = 'furrow-formula-fix';

/** The fix the page offers for a formula's problem: only for a parse problem it solves. */
function fixFor(text: string, p: FormulaProblem | null): FormulaFix | null {
  return p !== null && p.source === 'parse' ? secondNameFix(text) : null;
}

/** A formula cell: editor, problems, value. */
export class FurrowFormulaCell extends LitElement implements FormulaEditorHost {
  static override properties = {
    cell: { attribute: false },
    state: { attribute: false },
    catalogue: { attribute: false },
    text: { state: true },
    hasEditor: { state: true },
  };

  /** The cell as the document holds it. */
  declare cell: Cell;
  /** What the worker last said about it. */
  declare state: CellViewState | null;
  /** Names for completion and highlighting. */
  declare catalogue: NameCatalogue;
  /** The text shown (the editor's, once it exists). */
  declare private text: string;
  declare private hasEditor: boolean;

  private view: EditorView | null = null;
  private observer: IntersectionObserver | null = null;
  private timer: ReturnType<typeof setTimeout> | null = null;
  /** Typed text not yet sent, and the cell it belongs to. */
  private pending: { id: string; text: string } | null = null;
  /** The body last sent: when it comes back from the shell it is not news. */
  private lastSent: string | null = null;
  /** The visible text the current `state` describes (its offsets index this text). */
  private stateText: string | null = null;
  private shownDiagnostics = '';
  /** The list of built-ins the editor's extensions were made for. */
  private editorBuiltins: readonly BuiltinInfo[] | null = null;

  constructor() {
    super();
    this.cell = { id: '', marker: 'formula', eol: '\n', body: '' };
    this.state = null;
    this.catalogue = EMPTY_CATALOGUE;
    this.text = '';
    this.hasEditor = false;
    // the fix chosen in the editor's own problem tooltip
    this.addEventListener(FIX_EVENT, (e) => {
      e.stopPropagation();
      this.applyFix((e as CustomEvent<FormulaFix>).detail);
    });
  }

  static override styles = [
    shared,
    css`
      :host {
        display: block;
      }
      .editor {
        border: 1px solid var(--rule);
        border-radius: var(--radius);
        background: var(--sheet);
      }
      .editor[hidden] {
        display: none;
      }
      pre.static {
        margin: 0;
        padding: 6px 8px;
        border: 1px solid var(--rule);
        border-radius: var(--radius);
        background: var(--sheet);
        font-family: var(--font-code);
        font-size: 0.92rem;
        line-height: 1.5;
        white-space: pre-wrap;
        word-break: break-word;
        color: var(--ink);
        cursor: text;
        min-height: 1.5em;
      }
      pre.static:focus-visible {
        outline: 2px solid var(--accent);
      }
      pre.static .marked {
        text-decoration: underline wavy var(--error);
        text-decoration-skip-ink: none;
        text-underline-offset: 3px;
      }
      pre.static .marked.upstream {
        text-decoration-color: var(--upstream);
      }
      .placeholder {
        color: var(--muted);
        font-style: italic;
      }
      ${unsafeCSS(staticTokenCss().replace(/\.tok-/g, 'pre.static .tok-'))}
      p.empty {
        margin: 0.35rem 0 0;
        font-size: 0.8rem;
        color: var(--muted);
        font-style: italic;
      }
      .problem {
        margin: 0.35rem 0 0;
        font-size: 0.88rem;
        color: var(--error);
      }
      .problem.upstream {
        color: var(--upstream);
      }
      .problem button.fix {
        margin-left: 0.5rem;
        font: inherit;
        font-size: 0.82rem;
      }
      .status {
        display: flex;
        align-items: center;
        gap: 0.5rem;
        margin-top: 0.35rem;
        font-size: 0.75rem;
        color: var(--pending);
        min-height: 0;
      }
      .progress {
        flex: 0 0 10rem;
        height: 4px;
        border-radius: 2px;
        background: var(--pending-soft);
        overflow: hidden;
      }
      .progress > div {
        height: 100%;
        background: var(--pending);
      }
      ul.warnings {
        margin: 0.35rem 0 0;
        padding: 0;
        list-style: none;
        font-size: 0.8rem;
        color: var(--warn);
      }
      ul.warnings li::before {
        content: '⚑ ';
      }
      .result {
        margin-top: 0.5rem;
        transition: opacity 120ms ease-out;
      }
      .result.stale {
        opacity: 0.45;
      }
      @media print {
        .editor,
        pre.static {
          border-color: transparent;
          padding-left: 0;
        }
        .status {
          display: none;
        }
        .result.stale {
          opacity: 1;
        }
      }
    `,
  ];

  // ---- the host side of the editor (FormulaEditorHost) ----

  /** @internal The editor's text changed by the user. */
  edited(text: string): void {
    this.text = text;
    this.pending = { id: this.cell.id, text };
    if (this.timer !== null) clearTimeout(this.timer);
    this.timer = setTimeout(() => this.flush(), EDIT_DELAY_MS);
  }

  /** @internal */
  blurred(): void {
    this.flush();
  }

  /** @internal Sends what was typed first, so that undo undoes it too. */
  undo(): void {
    this.flush();
    this.dispatchEvent(new CustomEvent(UNDO_EVENT, { bubbles: true, composed: true }));
  }

  /** @internal */
  redo(): void {
    this.flush();
    this.dispatchEvent(new CustomEvent(REDO_EVENT, { bubbles: true, composed: true }));
  }

  /** Sends typed text now instead of after the pause (blur, undo, leaving the page). */
  flush(): void {
    if (this.timer !== null) clearTimeout(this.timer);
    this.timer = null;
    const p = this.pending;
    this.pending = null;
    if (p === null) return;
    const body = freshBody(p.text);
    if (p.id === this.cell.id && body === this.cell.body) return;
    this.lastSent = body;
    emitEdit(this, { type: 'body', id: p.id, body }, `body:${p.id}`);
  }

  /**
   * Creates the editor now (if it is not there yet) and puts the cursor in it: at the end of
   * the text when the editor did not have the focus (a new cell's `value1 = `, a cell reached
   * by a key), where it was otherwise.
   */
  async focusEditor(): Promise<void> {
    await this.ensureEditor();
    const view = this.view;
    if (view === null || view.hasFocus) return;
    view.dispatch({ selection: { anchor: view.state.doc.length } });
    view.focus();
  }

  /** Creates the editor now, whether or not the cell has scrolled into view. */
  async ensureEditor(): Promise<void> {
    if (!this.hasUpdated) await this.updateComplete;
    this.createEditor();
    await this.updateComplete;
  }

  /** The CodeMirror view, once created (for tests and the shell's focus handling). */
  get editorView(): EditorView | null {
    return this.view;
  }

  // ---- lifecycle ----

  override connectedCallback(): void {
    super.connectedCallback();
    // text typed just before the cell was moved (disconnected, then connected again)
    if (this.pending !== null) this.flush();
    this.watchVisibility();
    window.addEventListener(FLUSH_EVENT, this.onFlush);
  }

  private readonly onFlush = (): void => this.flush();

  override disconnectedCallback(): void {
    super.disconnectedCallback();
    window.removeEventListener(FLUSH_EVENT, this.onFlush);
    // An event from a detached element reaches no one: keep what was typed for a
    // reconnection (a move); a cell that is gone for good takes it along.
    if (this.timer !== null) clearTimeout(this.timer);
    this.timer = null;
    this.observer?.disconnect();
    this.observer = null;
    if (this.view !== null) {
      this.view.destroy();
      this.view = null;
      this.hasEditor = false;
    }
  }

  private watchVisibility(): void {
    if (this.view !== null || this.observer !== null) return;
    if (typeof IntersectionObserver === 'undefined') {
      // no way to know what is on screen: make the editor as soon as the cell is drawn
      void this.ensureEditor();
      return;
    }
    this.observer = new IntersectionObserver(
      (entries) => {
        if (entries.some((e) => e.isIntersecting)) {
          this.observer?.disconnect();
          this.observer = null;
          void this.ensureEditor();
        }
      },
      // a little ahead of the viewport, so that the editor is ready when the cell arrives
      { rootMargin: '300px 0px' },
    );
    this.observer.observe(this);
  }

  private createEditor(): void {
    if (this.view !== null || !this.isConnected) return;
    const parent = this.renderRoot.querySelector<HTMLElement>('.editor');
    if (parent === null) return;
    this.view = new EditorView({
      parent,
      root: this.renderRoot as ShadowRoot,
      state: EditorState.create({
        doc: this.text,
        extensions: [formulaSetup.of(formulaExtensions(this.catalogue.builtins)), editorHost.of(this)],
      }),
    });
    this.editorBuiltins = this.catalogue.builtins;
    this.shownDiagnostics = '';
    this.hasEditor = true;
  }

  protected override willUpdate(changed: PropertyValues<this>): void {
    if (changed.has('cell')) this.takeCell(changed.get('cell') as Cell | undefined);
    if (changed.has('state') || changed.has('cell')) {
      // The state's offsets index the text the shell held when the state arrived; a new
      // body without a new state leaves the old state describing the old text.
      if (changed.has('state') || this.stateText === null) this.stateText = visibleBody(this.cell);
    }
  }

  private takeCell(previous: Cell | undefined): void {
    const cell = this.cell;
    const incoming = visibleBody(cell);
    const sameCell = previous !== undefined && previous.id === cell.id;
    if (!sameCell && this.pending !== null) this.flush();
    if (this.view === null) {
      if (this.pending === null) this.text = incoming;
      return;
    }
    if (sameCell && previous.body === cell.body) return;
    // our own edit coming back (perhaps while more has been typed since)
    if (sameCell && cell.body === this.lastSent) return;
    this.lastSent = null;
    const current = this.view.state.doc.toString();
    if (incoming === current) return;
    // undo, redo or another view: take the document's text, and drop what was not yet sent
    if (this.timer !== null) clearTimeout(this.timer);
    this.timer = null;
    this.pending = null;
    const change = textChange(current, incoming);
    this.view.dispatch({ changes: change, annotations: fromDocument.of(true) });
    this.text = incoming;
  }

  protected override updated(): void {
    const view = this.view;
    if (view === null) return;
    // the built-ins arrived (or changed) after the editor was made: same look as a new editor
    if (this.catalogue.builtins !== this.editorBuiltins) {
      this.editorBuiltins = this.catalogue.builtins;
      view.dispatch({ effects: formulaSetup.reconfigure(formulaExtensions(this.catalogue.builtins)) });
    }
    const text = view.state.doc.toString();
    const problems = formulaProblems(text, this.state, this.stateText);
    const key = JSON.stringify(problems);
    if (key === this.shownDiagnostics) return;
    this.shownDiagnostics = key;
    view.dispatch(setDiagnostics(view.state, problems.map((p) => toDiagnostic(p, fixFor(text, p)))));
  }

  private async activate(e: MouseEvent | FocusEvent): Promise<void> {
    // keep the browser from focusing the static text; the editor takes the focus instead
    if (e instanceof MouseEvent) e.preventDefault();
    await this.ensureEditor();
    const view = this.view;
    if (view === null) return;
    if (e instanceof MouseEvent) {
      const pos = view.posAtCoords({ x: e.clientX, y: e.clientY });
      if (pos !== null) view.dispatch({ selection: { anchor: pos } });
    }
    view.focus();
  }

  // ---- drawing ----

  private problems(): FormulaProblem[] {
    return formulaProblems(this.text, this.state, this.stateText);
  }

  protected override render() {
    const problems = this.problems();
    const first = problems[0] ?? null;
    const state = this.state;
    const pending = state?.status === 'pending';
    const progress = state?.progress ?? null;
    const value = state?.value ?? null;
    // an error value is said in words above (with its range underlined); not drawn twice
    const showValue = value !== null && !(typeof value === 'object' && value.kind === 'error');
    const failedUpstream = state !== null && state.status === 'upstream';
    // a new cell, or one whose expression was deleted: nothing to show yet, and no error
    const empty = parseVisible(this.text).empty;
    return html`
      <div class="editor" ?hidden=${!this.hasEditor}></div>
      ${this.hasEditor
        ? nothing
        : // drawn again only when the text, the built-ins or the problem changes: each edit
          // gives every dependent a new state, and lexing 200 formulas again is a frame's
          // worth of work for nothing
          guard([this.text, this.catalogue.builtins, first?.from, first?.to, first?.source], () => this.renderStatic(first))}
      ${first === null
        ? nothing
        : html`<p class="problem ${first.source === 'upstream' ? 'upstream' : ''}" role="status" aria-live="polite">${first.message}${this.renderFix(fixFor(this.text, first))}</p>`}
      ${pending || progress !== null
        ? html`<div class="status" aria-live="polite">
            <span>${pending ? 'updating…' : 'working…'}</span>
            ${progress === null
              ? nothing
              : html`<div class="progress" role="progressbar" aria-valuemin="0" aria-valuemax="100" aria-valuenow=${Math.round(progress * 100)}>
                  <div style="width:${Math.max(0, Math.min(100, progress * 100)).toFixed(1)}%"></div>
                </div>`}
          </div>`
        : nothing}
      ${state === null || state.warnings.length === 0 ? nothing : html`<ul class="warnings">${state.warnings.map((w) => html`<li>${w}</li>`)}</ul>`}
      ${empty
        ? html`<p class="empty">${startMsg.formulaEmpty()}</p>`
        : showValue && !failedUpstream
        ? html`<div class="result ${pending ? 'stale' : ''}">
            <furrow-value .value=${value} name=${parseVisible(this.text).name ?? nothing}></furrow-value>
          </div>`
        : nothing}
    `;
  }

  private renderFix(fix: FormulaFix | null) {
    if (fix === null) return nothing;
    const offered = this.text.slice(fix.from, fix.to).split('=')[0]!.trim();
    return html` <button type="button" class="fix" title=${startMsg.secondNameFixTip(fix.name, offered)} @click=${() => this.applyFix(fix)}>${startMsg.secondNameFix(fix.name)}</button>`;
  }

  /**
   * Applies a fix as an edit of its own (one undo step that takes back the fix and nothing
   * typed before it): the typing waiting to be sent goes first, then the fixed text, which
   * comes back from the shell into the editor like an undo would.
   */
  private applyFix(fix: FormulaFix): void {
    this.flush();
    const text = this.view?.state.doc.toString() ?? this.text;
    // the text may have changed since the fix was drawn: offer it again on the text there is
    const now = secondNameFix(text);
    if (now === null || now.name !== fix.name) return;
    const fixed = text.slice(0, now.from) + now.insert + text.slice(now.to);
    emitEdit(this, { type: 'body', id: this.cell.id, body: freshBody(fixed) });
    this.view?.focus();
  }

  private renderStatic(problem: FormulaProblem | null) {
    const text = this.text;
    if (text.trim() === '') {
      return html`<pre class="static" tabindex="0" @mousedown=${this.activate} @focus=${this.activate}><span class="placeholder">a formula, e.g. total = sum(plots.yield)</span></pre>`;
    }
    const builtins = builtinNames(this.catalogue.builtins);
    const pieces = staticPieces(text, builtins, problem);
    const upstream = problem?.source === 'upstream' ? ' upstream' : '';
    return html`<pre class="static" tabindex="0" @mousedown=${this.activate} @focus=${this.activate}>${pieces.map(
      (p) => html`<span class="${p.cls === null ? '' : `tok-${p.cls}`}${p.marked ? ` marked${upstream}` : ''}">${p.text}</span>`,
    )}</pre>`;
  }
}

if (!customElements.get('furrow-formula-cell')) customElements.define('furrow-formula-cell', FurrowFormulaCell);

declare global {
  interface HTMLElementTagNameMap {
    'furrow-formula-cell': FurrowFormulaCell;
  }
}
