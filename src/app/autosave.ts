/**
 * Autosave, one slot per document. Each document (a file by its name, a sample by its
 * name, a new document by an id of its own) keeps its own latest state in IndexedDB, so
 * opening one never replaces another.
 *
 * Saving is lazy: an edit only marks the document changed and restarts a short timer; the
 * text is written when typing pauses, and at once when the page is hidden or goes away.
 * Because IndexedDB may not finish a write started while the page unloads, that last write
 * also leaves a synchronous copy in localStorage, which the next visit takes when it is
 * newer (`rescued`), so the last edit is never lost. A write still under way when the page
 * goes away (started when typing paused) leaves the same copy, for the same reason.
 */
const DB = 'furrow';
const STORE = 'documents';
const OLD_STORE = 'saved';
const RESCUE_PREFIX = 'furrow-rescue:';
/** The slot the browser held last (a new tab reopens it). */
export const LAST_KEY = 'furrow-last';

/** What a document's slot keeps between visits. */
export interface SavedState {
  /** The slot: "file:NAME", "sample:NAME" or "new:ID". */
  readonly key: string;
  readonly text: string;
  readonly title: string;
  /** The file name it was opened from or saved to, if any. */
  readonly fileName: string | null;
  readonly files: ReadonlyArray<readonly [string, string]>;
  readonly savedAt: number;
}

/** The slot of a document opened from (or saved to) a file. */
export const fileKey = (name: string): string => `file:${name}`;
/** The slot of a sample. */
export const sampleKey = (name: string): string => `sample:${name}`;

let newIds = 0;
/** The slot of a new document: the time it was made, and a count within this page. */
export const newKey = (now = Date.now()): string => `new:${now.toString(36)}-${(newIds++).toString(36)}`;

function open(): Promise<IDBDatabase> {
  return new Promise((resolve, reject) => {
    const req = indexedDB.open(DB, 2);
    req.onupgradeneeded = () => {
      const db = req.result;
      if (!db.objectStoreNames.contains(STORE)) db.createObjectStore(STORE, { keyPath: 'key' });
      // version 1 kept one slot for everything: its document moves to a slot of its own
      if (db.objectStoreNames.contains(OLD_STORE)) {
        const tx = req.transaction!;
        const get = tx.objectStore(OLD_STORE).get('current');
        get.onsuccess = () => {
          const old = get.result as { text?: unknown; fileName?: unknown; files?: unknown; savedAt?: unknown } | undefined;
          if (old !== undefined && typeof old.text === 'string') {
            const fileName = typeof old.fileName === 'string' ? old.fileName : null;
            const state: SavedState = {
              key: fileName !== null ? fileKey(fileName) : newKey(),
              text: old.text,
              title: /^title:[ \t]?(.*)$/m.exec(old.text)?.[1]?.trim() || 'Untitled trial',
              fileName,
              files: Array.isArray(old.files) ? (old.files as [string, string][]) : [],
              savedAt: typeof old.savedAt === 'number' ? old.savedAt : Date.now(),
            };
            tx.objectStore(STORE).put(state);
            try {
              localStorage.setItem(LAST_KEY, state.key);
            } catch {
              // storage refused: the document is still listed under "Kept in this browser"
            }
          }
          db.deleteObjectStore(OLD_STORE);
        };
      }
    };
    req.onsuccess = () => resolve(req.result);
    req.onerror = () => reject(req.error ?? new Error('IndexedDB unavailable'));
  });
}

/** A document's saved state (the newer of IndexedDB's and a rescue copy), or null. */
export async function loadSaved(key: string): Promise<SavedState | null> {
  let stored: SavedState | null = null;
  try {
    const db = await open();
    stored = await new Promise((resolve, reject) => {
      const req = db.transaction(STORE, 'readonly').objectStore(STORE).get(key);
      req.onsuccess = () => resolve((req.result as SavedState | undefined) ?? null);
      req.onerror = () => reject(req.error);
    });
  } catch {
    stored = null;
  }
  const rescue = rescued(key);
  return rescue !== null && (stored === null || rescue.savedAt > stored.savedAt) ? rescue : stored;
}

/**
 * Every saved document, newest first: the slots in IndexedDB, and any rescue copy left by a
 * page that went away before its write finished (the newer of the two for a slot).
 */
export async function listSaved(): Promise<SavedState[]> {
  const byKey = new Map<string, SavedState>();
  try {
    const db = await open();
    const all = await new Promise<SavedState[]>((resolve, reject) => {
      const req = db.transaction(STORE, 'readonly').objectStore(STORE).getAll();
      req.onsuccess = () => resolve(req.result as SavedState[]);
      req.onerror = () => reject(req.error);
    });
    for (const s of all) byKey.set(s.key, s);
  } catch {
    // storage unavailable: only rescue copies, if any
  }
  for (const key of rescueKeys()) {
    const r = rescued(key);
    const s = byKey.get(key);
    if (r !== null && (s === undefined || r.savedAt > s.savedAt)) byKey.set(key, r);
  }
  return [...byKey.values()].sort((a, b) => b.savedAt - a.savedAt);
}

/** The slots that have a rescue copy in localStorage. */
function rescueKeys(): string[] {
  const out: string[] = [];
  try {
    for (let i = 0; i < localStorage.length; i++) {
      const k = localStorage.key(i);
      if (k !== null && k.startsWith(RESCUE_PREFIX)) out.push(k.slice(RESCUE_PREFIX.length));
    }
  } catch {
    // storage unavailable
  }
  return out;
}

/** Writes a state now. */
export async function saveNow(state: SavedState): Promise<void> {
  const db = await open();
  await new Promise<void>((resolve, reject) => {
    const tx = db.transaction(STORE, 'readwrite');
    tx.objectStore(STORE).put(state);
    tx.oncomplete = () => resolve();
    tx.onerror = () => reject(tx.error);
  });
  // the slot holds this state now: an older rescue copy would only mislead
  try {
    const r = rescued(state.key);
    if (r !== null && r.savedAt <= state.savedAt) localStorage.removeItem(RESCUE_PREFIX + state.key);
  } catch {
    // storage unavailable: nothing to clear
  }
}

/** Empties a slot (its document is kept elsewhere now). */
export async function forget(key: string): Promise<void> {
  try {
    localStorage.removeItem(RESCUE_PREFIX + key);
  } catch {
    // storage unavailable: nothing to clear
  }
  const db = await open();
  await new Promise<void>((resolve, reject) => {
    const tx = db.transaction(STORE, 'readwrite');
    tx.objectStore(STORE).delete(key);
    tx.oncomplete = () => resolve();
    tx.onerror = () => reject(tx.error);
  });
}

/** The rescue copy of a slot, if one was left when a page went away. */
function rescued(key: string): SavedState | null {
  try {
    const raw = localStorage.getItem(RESCUE_PREFIX + key);
    if (raw === null) return null;
    const s = JSON.parse(raw) as SavedState;
    return typeof s.text === 'string' && s.key === key ? s : null;
  } catch {
    return null;
  }
}

/**
 * Lazy saving of the open document. `touch()` costs a timer; the state is built (the
 * document written to text) only when saving.
 */
export class Autosaver {
  private timer: ReturnType<typeof setTimeout> | null = null;
  private dirty = false;
  private writing: Promise<void> = Promise.resolve();
  /** The state of the last write started and not yet finished, if any. */
  private inFlight: SavedState | null = null;
  private readonly build: () => SavedState;
  private readonly delayMs: number;
  /** Called after each write with its outcome and the state written. */
  onSaved: (ok: boolean, state: SavedState, error?: string) => void = () => {};

  constructor(build: () => SavedState, delayMs = 400) {
    this.build = build;
    this.delayMs = delayMs;
  }

  /** True while a change waits to be written. */
  get waiting(): boolean {
    return this.dirty;
  }

  /** The document changed: write it when typing pauses. */
  touch(): void {
    this.dirty = true;
    if (this.timer !== null) clearTimeout(this.timer);
    this.timer = setTimeout(() => void this.flush(), this.delayMs);
  }

  /** Writes what is waiting, now. */
  flush(built?: SavedState): Promise<void> {
    if (this.timer !== null) clearTimeout(this.timer);
    this.timer = null;
    if (!this.dirty) return this.writing;
    this.dirty = false;
    const s = built ?? this.build();
    this.inFlight = s;
    this.writing = this.writing.then(() =>
      saveNow(s).then(
        () => this.written(true, s),
        (e: unknown) => this.written(false, s, e instanceof Error ? e.message : String(e)),
      ),
    );
    return this.writing;
  }

  private written(ok: boolean, s: SavedState, error?: string): void {
    if (this.inFlight === s) this.inFlight = null;
    this.onSaved(ok, s, error);
  }

  /**
   * The page is going away: start the write, and leave a synchronous copy in localStorage
   * in case the write does not finish before the page is gone.
   */
  leave(): void {
    // a write started when typing paused may not finish either: it gets a copy too
    const s = this.dirty ? this.build() : this.inFlight;
    if (s === null) return;
    try {
      localStorage.setItem(RESCUE_PREFIX + s.key, JSON.stringify(s));
    } catch {
      // too large for localStorage, or storage refused: the IndexedDB write still runs
    }
    if (this.dirty) void this.flush(s);
  }
}
