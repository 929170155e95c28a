/**
 * The margin beside each cell: its kind, the name it goes by (a button that renames it,
 * for kinds renamed from the margin), how it stands, and the tools to move or delete it.
 * The words come from the kind's own description and the page's catalogue.
 */
import { html, nothing, type TemplateResult } from 'lit';
import type { CellViewState } from '../../cells/view-api.ts';
import type { CellKind } from '../graph/cell-kind.ts';
import { pageMsg, STATUS_WORDS, shellWords } from '../messages/page.ts';

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
      aria-label=${shellWords.newName}
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
    <span class="tools" role="toolbar" aria-label=${shellWords.cellTools}>
      <button title=${shellWords.moveUp} aria-label=${shellWords.moveUp} ?disabled=${m.first} @click=${() => a.move(-1)}>↑</button>
      <button title=${shellWords.moveDown} aria-label=${shellWords.moveDown} ?disabled=${m.last} @click=${() => a.move(1)}>↓</button>
      <button title=${shellWords.deleteTip} aria-label=${shellWords.delete} @click=${() => a.remove()}>✕</button>
      <button title=${shellWords.whereThisValueComesFrom} aria-label=${shellWords.whereThisValueComesFrom} @click=${() => a.trace()}>⇡</button>
    </span>
  </div>`;
}
