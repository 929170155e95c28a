/**
 * Autosave: every change of the document is written to IndexedDB (debounced), and the
 * page reopens the last state. CSV files that tables name are kept beside it.
 */
const DB = 'furrow';
const STORE = 'saved';
const KEY = 'current';

/** What is kept between visits. */
export interface SavedState {
  readonly text: string;
  /** The file name it was opened from or saved to, if any. */
  readonly fileName: string | null;
  readonly files: ReadonlyArray<readonly [string, string]>;
  readonly savedAt: number;
}

function open(): Promise<IDBDatabase> {
  return new Promise((resolve, reject) => {
    const req = indexedDB.open(DB, 1);
    req.onupgradeneeded = () => req.result.createObjectStore(STORE);
    req.onsuccess = () => resolve(req.result);
    req.onerror = () => reject(req.error ?? new Error('IndexedDB unavailable'));
  });
}

/** Reads the saved state, or null when there is none (or storage is unavailable). */
export async function loadSaved(): Promise<SavedState | null> {
  try {
    const db = await open();
    return await new Promise((resolve, reject) => {
      const req = db.transaction(STORE, 'readonly').objectStore(STORE).get(KEY);
      req.onsuccess = () => resolve((req.result as SavedState | undefined) ?? null);
      req.onerror = () => reject(req.error);
    });
  } catch {
    return null;
  }
}

/** Writes the state now. */
export async function saveNow(state: SavedState): Promise<void> {
  const db = await open();
  await new Promise<void>((resolve, reject) => {
    const tx = db.transaction(STORE, 'readwrite');
    tx.objectStore(STORE).put(state, KEY);
    tx.oncomplete = () => resolve();
    tx.onerror = () => reject(tx.error);
  });
}

/** Debounced saving: the last state wins; `flush` writes what is waiting. */
export class Autosaver {
  private timer: ReturnType<typeof setTimeout> | null = null;
  private waiting: SavedState | null = null;
  private writing: Promise<void> = Promise.resolve();
  /** Called after each write with its outcome. */
  onSaved: (ok: boolean, error?: string) => void = () => {};

  schedule(state: SavedState, delayMs = 250): void {
    this.waiting = state;
    if (this.timer !== null) clearTimeout(this.timer);
    this.timer = setTimeout(() => void this.flush(), delayMs);
  }

  async flush(): Promise<void> {
    if (this.timer !== null) clearTimeout(this.timer);
    this.timer = null;
    const s = this.waiting;
    this.waiting = null;
    if (s === null) return this.writing;
    this.writing = this.writing.then(() =>
      saveNow(s).then(
        () => this.onSaved(true),
        (e: unknown) => this.onSaved(false, e instanceof Error ? e.message : String(e)),
      ),
    );
    return this.writing;
  }
}
