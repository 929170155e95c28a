/**
 * Putting the caret in a cell on the page: a formula's editor, a new note's text, a table's
 * grid. Used after a cell is added or moved (its editor is made anew) and by the keys that
 * go from cell to cell.
 */
import type { LitElement } from 'lit';

/** A cell view that can take the caret itself (the formula's editor, a note's text). */
interface FocusableView extends HTMLElement {
  focusEditor?: () => Promise<void>;
}

/**
 * Focuses the cell `id` drawn in `root` (call it once the page has drawn). `write` opens a
 * note for writing (a new note); going to a note only focuses it (Enter edits).
 */
export async function focusCell(root: ParentNode, id: string, write: boolean): Promise<void> {
  const section = root.querySelector<HTMLElement>(`section[data-cell="${id}"]`);
  if (section === null) return;
  section.scrollIntoView({ block: 'nearest' });
  const view = section.querySelector<FocusableView>('.body > *');
  if (view === null) return;
  if (view.focusEditor !== undefined && (write || view.tagName !== 'FURROW-NOTE-CELL')) {
    await view.focusEditor();
    return;
  }
  if ('updateComplete' in view) await (view as unknown as LitElement).updateComplete;
  const shadow = view.shadowRoot ?? view;
  const target = shadow.querySelector<HTMLElement>('[role="grid"], [tabindex="0"]');
  target?.focus();
}
