/**
 * The toolbar along the top of the page: documents (new, open, save, attach data, the
 * samples, the ones kept in this browser), undo and redo, the help, and the status line
 * that says how the evaluation stands and whether the document is kept.
 */
import { html, nothing, type TemplateResult } from 'lit';
import { CELL_KINDS } from '../../cells/kinds.ts';
import type { Document } from '../doc/document.ts';
import { pageMsg, startMsg, shellWords } from '../messages/page.ts';
import type { SavedState } from './autosave.ts';
import type { EvaluationBridge } from './bridge.ts';

/** What the toolbar shows. */
export interface ToolbarState {
  readonly samples: ReadonlyMap<string, string>;
  /** Other documents kept in this browser, newest first. */
  readonly kept: readonly SavedState[];
  readonly canUndo: boolean;
  readonly canRedo: boolean;
  readonly helpOpen: boolean;
  readonly status: string;
}

/** What the toolbar's controls do. */
export interface ToolbarActions {
  newDocument(): void;
  openFile(): void;
  saveFile(): void;
  attachData(): void;
  openSample(name: string): void;
  /** The list of kept documents is about to be read (it may have changed in another tab). */
  refreshKept(): void;
  reopenKept(key: string): void;
  undo(): void;
  redo(): void;
  toggleHelp(): void;
}

/** A list that runs an action for the entry chosen, then shows its heading again. */
function choose(run: (value: string) => void): (e: Event) => void {
  return (e: Event) => {
    const s = e.target as HTMLSelectElement;
    if (s.value) run(s.value);
    s.value = '';
  };
}

export function toolbar(t: ToolbarState, a: ToolbarActions): TemplateResult {
  return html`<nav class="bar" aria-label=${shellWords.toolbarLabel}>
    <span class="mark">FURROW</span>
    <button @click=${() => a.newDocument()} title=${shellWords.newTip}>${shellWords.newDocument}</button>
    <button @click=${() => a.openFile()} title=${shellWords.openTip}>${shellWords.open}</button>
    <button @click=${() => a.saveFile()} title=${shellWords.saveTip}>${shellWords.save}</button>
    <button @click=${() => a.attachData()} title=${shellWords.attachTip}>${shellWords.attachData}</button>
    ${t.samples.size > 0
      ? html`<select aria-label=${shellWords.samplesLabel} @change=${choose((name) => a.openSample(name))}>
          <option value="">${shellWords.samples}</option>
          ${[...t.samples.keys()].map((k) => html`<option value=${k}>${k.replace(/\.furrow$/, '')}</option>`)}
        </select>`
      : nothing}
    ${t.kept.length > 0
      ? html`<select class="kept" aria-label=${shellWords.keptListLabel} @focus=${() => a.refreshKept()} @change=${choose((key) => a.reopenKept(key))}>
          <option value="">${pageMsg.keptList()}</option>
          ${t.kept.map((k) => html`<option value=${k.key}>${pageMsg.keptEntry(k.title, pageMsg.keptWhere(k.key))}</option>`)}
        </select>`
      : nothing}
    <span class="sep"></span>
    <button @click=${() => a.undo()} ?disabled=${!t.canUndo} title=${shellWords.undoTip}>${shellWords.undo}</button>
    <button @click=${() => a.redo()} ?disabled=${!t.canRedo} title=${shellWords.redoTip}>${shellWords.redo}</button>
    <button class="help-toggle" aria-pressed=${t.helpOpen ? 'true' : 'false'} @click=${() => a.toggleHelp()} title=${startMsg.helpButtonTitle()}>${startMsg.helpButton()}</button>
    <span class="status" role="status" aria-live="polite">${t.status}</span>
  </nav>`;
}

/**
 * The status line: evaluation under way (cell by cell for a long update), cells in error,
 * or all up to date; then whether the document is kept in this browser.
 */
export function statusLine(doc: Document, bridge: EvaluationBridge, saveProblem: string | null): string {
  let errors = 0;
  let upstream = 0;
  let pending = 0;
  for (const c of doc.cells) {
    const s = bridge.state(c.id)?.status;
    if (s === 'error') errors++;
    if (s === 'upstream') upstream++;
    if (s === 'pending') pending++;
  }
  const parts: string[] = [];
  const step = bridge.step;
  if (step !== null && pending > 0) {
    const cell = doc.cells.find((c) => c.id === step.id);
    parts.push(pageMsg.evaluatingStep(cell ? CELL_KINDS.nameOf(cell) : null, step.done, step.total));
  } else if (pending > 0) parts.push(pageMsg.reEvaluating(pending));
  else if (errors > 0) parts.push(pageMsg.cellsWithErrors(errors, upstream));
  else parts.push(pageMsg.allUpToDate());
  parts.push(saveProblem ? pageMsg.notKept(saveProblem) : pageMsg.kept());
  return parts.join(' · ');
}
