/**
 * Marks on the sheet from the hand-off: cells whose value differs from their seal, claims
 * that do not hold, and live numbers in notes that a failing claim reads. Set as data
 * attributes (which the sheet's own rendering never binds, so it leaves them alone), styled
 * by a stylesheet adopted into the shadow roots concerned; nothing is inserted into the
 * cells' DOM.
 */
import type { NoteDoubt } from '../../seal/doubt.ts';
import { handOffWords } from '../../messages/page.ts';

/** What to mark on one cell. */
export interface CellMark {
  /** 'changed' | 'missing' | 'new' from a verification; null for none. */
  readonly verify: string | null;
  /** One line shown under the cell. */
  readonly note: string | null;
}

const SHEET_CSS = `
section.cell[data-verify] { outline: 2px solid #a3261b; outline-offset: 3px; border-radius: 2px; }
section.cell[data-verify]::after { content: attr(data-verify-note); grid-column: 1 / -1; display: block; margin: 0.3rem 0 0.1rem;
  padding: 0.25rem 0.5rem; font-size: 0.8rem; color: #7d1d14; background: #fbeae8; border-left: 4px solid #a3261b; white-space: pre-wrap; }
section.cell[data-doubt] { box-shadow: inset 4px 0 0 #c77d00; }
section.cell[data-kind="sealed"] pre { white-space: pre-wrap; overflow-wrap: anywhere; max-height: 12rem; overflow: auto; font-size: 0.72rem; }
@media print { section.cell[data-verify]::after { border: 1px solid #a3261b; } }
`;

const NOTE_CSS = `
.slot[data-doubt] { color: #a3261b !important; background: #fbeae8 !important; outline: 1px solid #a3261b; text-decoration: underline wavy #a3261b; }
`;

const sheets = new Map<string, CSSStyleSheet>();
function sheet(css: string): CSSStyleSheet {
  let s = sheets.get(css);
  if (s === undefined) {
    s = new CSSStyleSheet();
    s.replaceSync(css);
    sheets.set(css, s);
  }
  return s;
}

function adopt(root: ShadowRoot | Document, css: string): void {
  const s = sheet(css);
  if (!root.adoptedStyleSheets.includes(s)) root.adoptedStyleSheets = [...root.adoptedStyleSheets, s];
}

/** The cells marked under each root by the last {@link applyMarks}. */
const markedBefore = new WeakMap<ShadowRoot | Document, ReadonlySet<string>>();

/**
 * Puts the marks on the sheet under `root`, clearing the ones no longer due. Only the cells
 * marked now or the last time are touched: marks are put again after every edit, and most
 * documents have none (in a 200-cell document, visiting every cell took about 1 ms of the
 * frame that draws the edit).
 */
export function applyMarks(root: ShadowRoot | Document, marks: ReadonlyMap<string, CellMark>, doubts: ReadonlyMap<string, NoteDoubt>): void {
  adopt(root, SHEET_CSS);
  const due = new Set([...marks.keys(), ...doubts.keys()]);
  const before = markedBefore.get(root) ?? new Set<string>();
  markedBefore.set(root, due);
  if (due.size === 0 && before.size === 0) return;
  for (const section of root.querySelectorAll<HTMLElement>('section.cell[data-cell]')) {
    const id = section.dataset.cell ?? '';
    if (!due.has(id) && !before.has(id)) continue;
    const m = marks.get(id);
    if (m?.verify) {
      section.dataset.verify = m.verify;
      section.dataset.verifyNote = m.note ?? '';
    } else {
      delete section.dataset.verify;
      delete section.dataset.verifyNote;
    }
    const doubt = doubts.get(id);
    if (doubt !== undefined) {
      section.dataset.doubt = '';
      section.title = handOffWords.noteInDoubt(doubt.claims);
    } else if (section.dataset.doubt !== undefined) {
      delete section.dataset.doubt;
      section.removeAttribute('title');
    }
    const note = section.querySelector('furrow-note-cell');
    const noteRoot = note?.shadowRoot;
    if (noteRoot) {
      adopt(noteRoot, NOTE_CSS);
      for (const slot of noteRoot.querySelectorAll<HTMLElement>('[data-slot]')) {
        if (doubt?.slots.has(Number(slot.dataset.slot))) slot.dataset.doubt = '';
        else delete slot.dataset.doubt;
      }
    }
  }
}
