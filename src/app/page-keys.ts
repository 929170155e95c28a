/**
 * The page's keys, heard on `window`: the cell keys (src/app/cell-keys.ts), in the capture
 * phase so that they work inside editors too, and undo, redo and save outside editors
 * (editors handle their own Mod-Z and send `furrow-undo` / `furrow-redo`).
 */
import type { ReactiveController, ReactiveControllerHost } from 'lit';
import { FLUSH_EVENT } from '../../cells/view-api.ts';
import type { Cell, Document } from '../doc/document.ts';
import type { CellKind } from '../graph/cell-kind.ts';
import { cellCommandFor, type CellCommand } from './cell-keys.ts';
import { ADDABLE } from './new-cells.ts';

/** What the keys do on the page. */
export interface PageKeyActions {
  /** The open document (undefined until the page has started). */
  doc(): Document | undefined;
  undo(): void;
  redo(): void;
  save(): void;
  toggleHelp(): void;
  addCell(kind: CellKind, index: number): void;
  moveCell(cell: Cell, by: number, keepFocus: boolean): void;
  deleteCell(cell: Cell): void;
  focusCell(id: string, write: boolean): void;
}

/**
 * Hands over what is being typed before a cell command moves, adds or deletes cells: views
 * send text still in their typing pause, and the focused field or editor is left (a table
 * field keeps its text when it loses the focus), so the command's edit comes after it.
 */
function keepTyping(): void {
  window.dispatchEvent(new Event(FLUSH_EVENT));
  let active: Element | null = document.activeElement;
  while (active?.shadowRoot?.activeElement) active = active.shadowRoot.activeElement;
  if (active instanceof HTMLElement) active.blur();
}

/** The cell an event came from (the one holding the focus), if any. */
function cellOf(e: Event, doc: Document): Cell | null {
  for (const t of e.composedPath()) {
    if (t instanceof HTMLElement && t.tagName === 'SECTION' && t.dataset.cell !== undefined) {
      return doc.cells.find((c) => c.id === t.dataset.cell) ?? null;
    }
  }
  return null;
}

export class PageKeys implements ReactiveController {
  private readonly host: PageKeyActions;

  /** Listens while `element` is on the page. */
  constructor(element: ReactiveControllerHost, actions: PageKeyActions) {
    this.host = actions;
    element.addController(this);
  }

  hostConnected(): void {
    // before any editor sees the key: the cell keys are chosen to mean nothing to them
    window.addEventListener('keydown', this.onCellKey, true);
    window.addEventListener('keydown', this.onKeydown);
  }

  hostDisconnected(): void {
    window.removeEventListener('keydown', this.onCellKey, true);
    window.removeEventListener('keydown', this.onKeydown);
  }

  private readonly onKeydown = (e: KeyboardEvent): void => {
    const mod = e.ctrlKey || e.metaKey;
    if (!mod) return;
    const target = e.composedPath()[0];
    // editors handle their own keys and send furrow-undo / furrow-redo
    if (target instanceof HTMLElement && (target.isContentEditable || target.tagName === 'TEXTAREA' || target.tagName === 'INPUT')) return;
    if (e.key === 'z' || e.key === 'Z') {
      e.preventDefault();
      if (e.shiftKey) this.host.redo();
      else this.host.undo();
    } else if (e.key === 'y') {
      e.preventDefault();
      this.host.redo();
    } else if (e.key === 's') {
      e.preventDefault();
      this.host.save();
    }
  };

  private readonly onCellKey = (e: KeyboardEvent): void => {
    const command = cellCommandFor(e);
    const doc = this.host.doc();
    if (command === null || doc === undefined) return;
    e.preventDefault();
    e.stopPropagation();
    const cell = cellOf(e, doc);
    if (command !== 'help') keepTyping();
    this.run(command, cell);
  };

  private run(command: CellCommand, cell: Cell | null): void {
    const host = this.host;
    const cells = host.doc()!.cells;
    const i = cell === null ? -1 : cells.findIndex((c) => c.id === cell.id);
    switch (command) {
      case 'help':
        host.toggleHelp();
        return;
      case 'add-below': {
        const formula = ADDABLE.find((k) => k.kind === 'formula') ?? ADDABLE[0];
        if (formula !== undefined) host.addCell(formula, i < 0 ? cells.length : i + 1);
        return;
      }
      case 'previous':
      case 'next': {
        const to = i < 0 ? (command === 'next' ? 0 : cells.length - 1) : i + (command === 'next' ? 1 : -1);
        const target = cells[to];
        if (target !== undefined) host.focusCell(target.id, false);
        return;
      }
      case 'move-up':
      case 'move-down':
        if (cell !== null) host.moveCell(cell, command === 'move-up' ? -1 : 1, true);
        return;
      case 'delete': {
        if (cell === null) return;
        const next = cells[i + 1] ?? cells[i - 1];
        host.deleteCell(cell);
        if (next !== undefined) host.focusCell(next.id, false);
        return;
      }
    }
  }
}
