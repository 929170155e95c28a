/**
 * The margin beside each cell: its kind, the name it goes by (a button that renames it,
 * for kinds renamed from the margin), how it stands, and the tools to move or delete it.
 * The words come from the kind's own description and the page's catalogue.
 */
import { html, nothing, type TemplateResult } from 'lit';
import type { CellViewState } from '../../cells/view-api.ts';
import type { CellKind } from '../graph/cell-kind.ts';
import { pageMsg, STATUS_WORDS } from '../messages/page.ts';

export interface MarginInput {
  readonly word: string;
  readonly kind: CellKind | undefined;
  readonly name: string | null;
  readonly state: CellViewState | null;
  readonly status: string;
  readonly renaming: boolean;
  readonly first: boolean;
  readonly last: boolean;
}

export interface MarginActions {
  startRename(): void;
  rename(name: string): void;
  cancelRename(): void;
  move(by: number): void;
  remove(): void;
  /** Shows where the cell's value comes from (the chain of cells back to the data). */
  trace(): void;
}

function nameSlot(m: MarginInput, a: MarginActions): TemplateResult | typeof nothing {
  const { kind, name } = m;
  if (kind === undefined || (kind.rename === undefined && name === null)) return nothing;
  if (kind.rename === undefined) return html`<span class="name" title=${pageMsg.renameInCell()}>${name ?? pageMsg.unnamed()}</span>`;
  if (m.renaming) {
    return html`<input
      class="name-input"
      aria-label="New name"
      .value=${name ?? ''}
      @keydown=${(e: KeyboardEvent) => {
        if (e.key === 'Enter') a.rename((e.target as HTMLInputElement).value.trim());
        if (e.key === 'Escape') a.cancelRename();
      }}
      @blur=${(e: Event) => a.rename((e.target as HTMLInputElement).value.trim())}
    />`;
  }
  return html`<button class="name" title=${pageMsg.rename()} @click=${() => a.startRename()}>${name ?? pageMsg.unnamed()}</button>`;
}

/** The margin of one cell. */
export function cellMargin(m: MarginInput, a: MarginActions): TemplateResult {
  const words = STATUS_WORDS.get(m.status) ?? '';
  const upstreamName = m.status === 'upstream' ? (m.state?.error?.upstream ?? null) : null;
  return html`<div class="margin">
    <span class="kind">${m.kind?.label ?? (m.word || 'cell')}</span>
    ${nameSlot(m, a)}
    ${words
      ? html`<span class="state-word" title=${m.state?.error?.message ?? ''}>${words}${upstreamName ? html`: <code>${upstreamName}</code>` : nothing}</span>`
      : nothing}
    <span class="tools" role="toolbar" aria-label="Cell tools">
      <button title="Move up" aria-label="Move up" ?disabled=${m.first} @click=${() => a.move(-1)}>↑</button>
      <button title="Move down" aria-label="Move down" ?disabled=${m.last} @click=${() => a.move(1)}>↓</button>
      <button title="Delete this cell (undo brings it back)" aria-label="Delete" @click=${() => a.remove()}>✕</button>
      <button title="Where this value comes from" aria-label="Where this value comes from" @click=${() => a.trace()}>⇡</button>
    </span>
  </div>`;
}
