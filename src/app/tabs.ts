/**
 * Tabs of this browser that have the same document open are told about each other, so
 * that one does not silently overwrite what the other saved. Each tab says which document
 * it holds when it opens one and each time it saves it; a tab holding the same document
 * answers, and both show it.
 */
const CHANNEL = 'furrow-tabs';

type TabMessage =
  | { readonly type: 'holding'; readonly tab: string; readonly key: string }
  | { readonly type: 'here'; readonly tab: string; readonly key: string; readonly to: string }
  | { readonly type: 'saved'; readonly tab: string; readonly key: string; readonly savedAt: number };

/** What a tab hears about others holding its document. */
export interface TabEvents {
  /** Another tab has this document open too. */
  onShared(): void;
  /** Another tab saved this document (its state is in storage now). */
  onSavedElsewhere(savedAt: number): void;
}

let tabs = 0;

export class TabWatch {
  private readonly channel: BroadcastChannel | null;
  private readonly tab = `${Date.now().toString(36)}-${(tabs++).toString(36)}-${Math.floor(performance.now() * 1000).toString(36)}`;
  private key: string | null = null;
  private readonly events: TabEvents;

  constructor(events: TabEvents) {
    this.events = events;
    this.channel = typeof BroadcastChannel === 'function' ? new BroadcastChannel(CHANNEL) : null;
    if (this.channel !== null) this.channel.onmessage = (e: MessageEvent<TabMessage>) => this.hear(e.data);
  }

  /** This tab now holds the document in slot `key`. */
  holding(key: string): void {
    this.key = key;
    this.say({ type: 'holding', tab: this.tab, key });
  }

  /** This tab saved its document. */
  saved(savedAt: number): void {
    if (this.key !== null) this.say({ type: 'saved', tab: this.tab, key: this.key, savedAt });
  }

  close(): void {
    this.channel?.close();
  }

  private say(m: TabMessage): void {
    this.channel?.postMessage(m);
  }

  private hear(m: TabMessage): void {
    if (m.tab === this.tab || m.key !== this.key) return;
    if (m.type === 'holding') {
      this.say({ type: 'here', tab: this.tab, key: m.key, to: m.tab });
      this.events.onShared();
    } else if (m.type === 'here') {
      if (m.to === this.tab) this.events.onShared();
    } else this.events.onSavedElsewhere(m.savedAt);
  }
}
