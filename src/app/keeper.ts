/**
 * Keeps the open document in its own slot of this browser (src/app/autosave.ts), says
 * which slot this tab holds (so a reload reopens it), and decides what opens when the page
 * starts or a sample is asked for. Opening a document never replaces another one's slot;
 * a sample edited before is offered as the edited copy or the original.
 */
import { pageMsg } from '../messages/page.ts';
import { Autosaver, LAST_KEY, loadSaved, newKey, sampleKey, saveNow, type SavedState } from './autosave.ts';
import { TabWatch } from './tabs.ts';

/** A document about to open, and what to tell the user about it. */
export interface Opening {
  readonly key: string;
  readonly text: string;
  readonly fileName: string | null;
  readonly files: ReadonlyArray<readonly [string, string]>;
  readonly notice?: string;
  /** An edited sample: the original, offered instead. */
  readonly original?: { readonly name: string; readonly text: string };
}

/** What the keeper needs from the page. */
export interface KeeperHost {
  /** The open document's state to keep (built only when saving). */
  state(): Omit<SavedState, 'key' | 'savedAt'>;
  saved(ok: boolean, error?: string): void;
  shared(): void;
  savedElsewhere(): void;
}

const THIS_TAB = 'furrow-open';

function remembered(storage: () => Storage, name: string): string | null {
  try {
    return storage().getItem(name);
  } catch {
    return null;
  }
}

function remember(storage: () => Storage, name: string, value: string): void {
  try {
    storage().setItem(name, value);
  } catch {
    // storage refused: a reload then opens the last document kept, or a sample
  }
}

export class DocumentKeeper {
  private slot: string = newKey();
  private readonly autosaver: Autosaver;
  private readonly tabs: TabWatch;

  constructor(host: KeeperHost) {
    this.autosaver = new Autosaver(() => ({ ...host.state(), key: this.slot, savedAt: Date.now() }));
    this.autosaver.onSaved = (ok, state, error) => {
      if (ok) this.tabs.saved(state.savedAt);
      host.saved(ok, error);
    };
    this.tabs = new TabWatch({ onShared: () => host.shared(), onSavedElsewhere: () => host.savedElsewhere() });
  }

  /** The slot of the open document. */
  get key(): string {
    return this.slot;
  }

  /**
   * This tab now holds the document in `key`. What the last document was waiting for is
   * built now, under its own slot, and written; the promise settles when it is.
   */
  take(key: string): Promise<void> {
    const writing = this.autosaver.flush();
    this.slot = key;
    remember(() => sessionStorage, THIS_TAB, key);
    remember(() => localStorage, LAST_KEY, key);
    this.tabs.holding(key);
    return writing;
  }

  /** The open document changed. */
  touch(): void {
    this.autosaver.touch();
  }

  /** Writes what waits now. */
  flush(): Promise<void> {
    return this.autosaver.flush();
  }

  /** The page is hidden or going away. */
  leave(): void {
    this.autosaver.leave();
  }

  /**
   * A slot's kept state, read after what waits to be written is written: typing not yet saved
   * is in it, so an opening that reads the slot never misses it.
   */
  async readKept(key: string): Promise<SavedState | null> {
    await this.flush();
    return loadSaved(key);
  }

  /** Moves a kept state to a slot of its own (a new document); returns its title. */
  async keepAside(state: SavedState): Promise<string> {
    const copy: SavedState = { ...state, key: newKey(), savedAt: Date.now() };
    await saveNow(copy);
    return copy.title;
  }

  /** What a sample opens as: the edited copy kept (with the original offered), or the original. */
  static async sample(name: string, original: string, read: (key: string) => Promise<SavedState | null> = loadSaved): Promise<Opening> {
    const kept = await read(sampleKey(name));
    if (kept !== null && kept.text !== original) {
      return { key: kept.key, text: kept.text, fileName: name, files: kept.files, notice: pageMsg.editedSampleOpen(name), original: { name, text: original } };
    }
    // the sample as it came, with any data files attached to it since
    return { key: sampleKey(name), text: original, fileName: name, files: kept?.files ?? [] };
  }

  /**
   * What opens when the page starts: `?sample=NAME` that sample; `?fresh` the first sample
   * as a new document; otherwise the document this tab (or, in a new tab, the browser)
   * held last, or the first sample.
   */
  static async initial(params: URLSearchParams, samples: ReadonlyMap<string, string>, firstSample: string): Promise<Opening> {
    const asked = params.get('sample');
    if (asked !== null && samples.has(asked)) return DocumentKeeper.sample(asked, samples.get(asked)!);
    const first = samples.get(firstSample) ?? 'furrow 1\ntitle: Untitled trial\n';
    if (params.has('fresh')) return { key: newKey(), text: first, fileName: null, files: [] };
    const last = remembered(() => sessionStorage, THIS_TAB) ?? remembered(() => localStorage, LAST_KEY);
    const kept = last === null ? null : await loadSaved(last);
    if (kept !== null) return { key: kept.key, text: kept.text, fileName: kept.fileName, files: kept.files };
    return DocumentKeeper.sample(firstSample, first);
  }
}
