// The last edit survives a page that goes away while a write is under way. IndexedDB is a
// stand-in here whose writes never finish (as when the page is torn down mid-transaction);
// what must be left is the synchronous copy the next visit takes.
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { Autosaver, type SavedState } from '../../src/app/autosave.ts';

class MemoryStorage {
  private readonly items = new Map<string, string>();
  get length(): number {
    return this.items.size;
  }
  key(i: number): string | null {
    return [...this.items.keys()][i] ?? null;
  }
  getItem(k: string): string | null {
    return this.items.get(k) ?? null;
  }
  setItem(k: string, v: string): void {
    this.items.set(k, v);
  }
  removeItem(k: string): void {
    this.items.delete(k);
  }
}

/** An IndexedDB whose open request never answers: every write stays under way. */
const stalledIndexedDb = { open: () => ({}) };

function state(text: string): SavedState {
  return { key: 'new:test-0', text, title: 'A trial', fileName: null, files: [], savedAt: Date.now() };
}

describe('autosave when the page goes away', () => {
  let storage: MemoryStorage;
  beforeEach(() => {
    storage = new MemoryStorage();
    Object.assign(globalThis, { localStorage: storage, indexedDB: stalledIndexedDb });
  });
  afterEach(() => {
    delete (globalThis as Record<string, unknown>).localStorage;
    delete (globalThis as Record<string, unknown>).indexedDB;
  });

  it('leaves a copy of an edit not yet written', () => {
    let text = 'first';
    const saver = new Autosaver(() => state(text), 60_000);
    text = 'typed';
    saver.touch();
    saver.leave();
    expect(JSON.parse(storage.getItem('furrow-rescue:new:test-0')!).text).toBe('typed');
  });

  it('leaves a copy of an edit whose write started when typing paused and has not finished', () => {
    let text = 'first';
    const saver = new Autosaver(() => state(text), 60_000);
    text = 'typed';
    saver.touch();
    void saver.flush(); // typing paused: the write starts, and never finishes here
    expect(saver.waiting).toBe(false);
    saver.leave();
    expect(JSON.parse(storage.getItem('furrow-rescue:new:test-0')!).text).toBe('typed');
  });

  it('leaves nothing when nothing was edited', () => {
    const saver = new Autosaver(() => state('first'), 60_000);
    saver.leave();
    expect(storage.length).toBe(0);
  });
});
