/**
 * One cell as the sheet draws it: the margin (what it is, its name, how it stands), the
 * kind's own view of its body (or the raw text, for a kind the page has no view of), and
 * the row of buttons that add a cell below it.
 */
import { html, type TemplateResult } from 'lit';
import { CELL_KINDS } from '../../cells/kinds.ts';
import type { CellViewState } from '../../cells/view-api.ts';
import { CELL_VIEWS } from '../../cells/views.ts';
import { markerKind, type Cell } from '../doc/document.ts';
import type { CellKind } from '../graph/cell-kind.ts';
import { pageMsg, shellWords } from '../messages/page.ts';
import type { EvaluationBridge } from './bridge.ts';
import { cellMargin, type MarginActions } from './cell-margin.ts';
import { ADDABLE } from './new-cells.ts';

/** Where a cell stands in the sheet, and the state to draw it with. */
export interface CellPlace {
  readonly index: number;
  readonly count: number;
  readonly state: CellViewState | null;
  /** Whether its name is being edited in the margin. */
  readonly renaming: boolean;
  readonly catalogue: ReturnType<EvaluationBridge['catalogue']>;
}

/** The margin's actions, and adding a cell of a kind at a place in the document. */
export interface CellSectionActions extends MarginActions {
  add(kind: CellKind, index: number): void;
}

export function cellSection(cell: Cell, p: CellPlace, a: CellSectionActions): TemplateResult {
  const word = markerKind(cell.marker);
  const kind = CELL_KINDS.get(word);
  const state = p.state;
  const status = state?.status ?? 'pending';
  const view = CELL_VIEWS.get(word);
  const name = CELL_KINDS.nameOf(cell);
  return html`<section class="cell ${status}" data-cell=${cell.id} data-kind=${word} data-name=${name ?? ''} data-status=${status} aria-label="${word} ${name ?? ''}">
    ${cellMargin({ word, kind, name, state, status, renaming: p.renaming, first: p.index === 0, last: p.index === p.count - 1 }, a)}
    <div class="body">
      ${view ? view(cell, state, p.catalogue) : html`<div class="inert"><pre>--- ${cell.marker}\n${cell.body}</pre></div>`}
    </div>
    <div class="insert" role="toolbar" aria-label=${shellWords.addACellBelow}>
      ${ADDABLE.map((k) => html`<button title=${pageMsg.addBelow(k.label)} @click=${() => a.add(k, p.index + 1)}>+ ${k.label}</button>`)}
    </div>
  </section>`;
}
