/**
 * The page's copy of the document, with undo and redo of every edit, structural ones
 * included. Edits are values (src/doc/edits.ts); each step of the history keeps the edit's
 * inverse. Typing in one editor arrives as many edits with the same merge key: those that
 * follow each other within a second become one step.
 */
import type { Document } from '../doc/document.ts';
import { applyEdit, type Edit } from '../doc/edits.ts';

interface Step {
  readonly forward: Edit;
  readonly inverse: Edit;
  readonly mergeKey: string | null;
  readonly at: number;
}

/** Why the document changed, for listeners. */
export type ChangeReason = 'edit' | 'undo' | 'redo' | 'load';

/**
 * Hears each change: the new document, why, and the edit that made it (the edit applied,
 * which for an undo is the inverse); null when a whole document was loaded.
 */
export type Listener = (doc: Document, reason: ChangeReason, edit: Edit | null) => void;

const MERGE_WINDOW_MS = 1000;
const HISTORY_LIMIT = 500;

/** The document and its history. */
export class DocumentStore {
  private current: Document;
  private undoStack: Step[] = [];
  private redoStack: Step[] = [];
  private readonly listeners = new Set<Listener>();
  private readonly now: () => number;

  constructor(doc: Document, now: () => number = () => Date.now()) {
    this.current = doc;
    this.now = now;
  }

  get document(): Document {
    return this.current;
  }

  get canUndo(): boolean {
    return this.undoStack.length > 0;
  }

  get canRedo(): boolean {
    return this.redoStack.length > 0;
  }

  subscribe(listener: Listener): () => void {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  }

  private emit(reason: ChangeReason, edit: Edit | null): void {
    for (const l of this.listeners) l(this.current, reason, edit);
  }

  /** Applies an edit as a new step of history (or merged into the last one). */
  apply(edit: Edit, mergeKey: string | null = null): void {
    const { document, inverse } = applyEdit(this.current, edit);
    const t = this.now();
    const last = this.undoStack[this.undoStack.length - 1];
    if (mergeKey !== null && last !== undefined && last.mergeKey === mergeKey && t - last.at < MERGE_WINDOW_MS) {
      // keep the oldest inverse: undo goes back to before the run of typing
      this.undoStack[this.undoStack.length - 1] = { forward: { type: 'batch', edits: [last.forward, edit] }, inverse: last.inverse, mergeKey, at: t };
    } else {
      this.undoStack.push({ forward: edit, inverse, mergeKey, at: t });
      if (this.undoStack.length > HISTORY_LIMIT) this.undoStack.shift();
    }
    this.redoStack = [];
    this.current = document;
    this.emit('edit', edit);
  }

  undo(): boolean {
    const step = this.undoStack.pop();
    if (step === undefined) return false;
    this.current = applyEdit(this.current, step.inverse).document;
    this.redoStack.push(step);
    this.emit('undo', step.inverse);
    return true;
  }

  redo(): boolean {
    const step = this.redoStack.pop();
    if (step === undefined) return false;
    const { document, inverse } = applyEdit(this.current, step.forward);
    this.current = document;
    this.undoStack.push({ ...step, inverse, mergeKey: null });
    this.emit('redo', step.forward);
    return true;
  }

  /** Replaces the whole document (open a file, reload); history starts afresh. */
  load(doc: Document): void {
    this.current = doc;
    this.undoStack = [];
    this.redoStack = [];
    this.emit('load', null);
  }
}
