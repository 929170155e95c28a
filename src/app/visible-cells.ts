/**
 * Which cells to draw first. A wave of new values renders the cells on screen (or near it)
 * at once; cells off screen keep the state they were last drawn with until the next frame,
 * so that an edit in a long document shows its visible consequences at once.
 */
import type { ReactiveController, ReactiveControllerHost } from 'lit';
import type { CellViewState } from '../../cells/view-api.ts';
import { sameTexts } from '../lang/values.ts';

/** How far beyond the screen a cell counts as on it. */
const NEAR = '300px 0px';

export class VisibleCells implements ReactiveController {
  private readonly host: ReactiveControllerHost & HTMLElement;
  private readonly latest: (id: string) => CellViewState | null;
  private readonly onScreen = new Set<string>();
  private readonly drawn = new Map<string, CellViewState | null>();
  private catchUp = false;
  private catchUpScheduled = false;
  private observer: IntersectionObserver | null = null;
  private readonly cellIds: () => readonly string[] | null;
  /** The cells whose sections were last looked for, in order. */
  private watchedIds: readonly string[] = [];
  private watchedSheet: Element | null = null;
  /** The sections the observer watches. */
  private watched = new WeakSet<Element>();

  /**
   * `latest` gives a cell's newest state; sections to watch carry `data-cell`; `cellIds`
   * gives the ids of the cells drawn, in order (null when none are).
   */
  constructor(host: ReactiveControllerHost & HTMLElement, latest: (id: string) => CellViewState | null, cellIds: () => readonly string[] | null) {
    this.host = host;
    this.latest = latest;
    this.cellIds = cellIds;
    host.addController(this);
  }

  /** The state to draw a cell with now. */
  stateFor(id: string): CellViewState | null {
    const latest = this.latest(id);
    if (this.catchUp || this.onScreen.has(id) || !this.drawn.has(id)) {
      this.drawn.set(id, latest);
      return latest;
    }
    const old = this.drawn.get(id)!;
    if (old !== latest) this.scheduleCatchUp();
    return old;
  }

  hostUpdated(): void {
    if (this.observer === null) {
      this.observer = new IntersectionObserver(
        (entries) => {
          for (const e of entries) {
            const id = (e.target as HTMLElement).dataset.cell;
            if (id === undefined) continue;
            if (e.isIntersecting) {
              this.onScreen.add(id);
              if (this.drawn.get(id) !== this.latest(id)) this.host.requestUpdate();
            } else this.onScreen.delete(id);
          }
        },
        { rootMargin: NEAR },
      );
    }
    // New sections come with new cells: the page is searched for them only then (each
    // search matched every section of the document, about 2.5 ms at each update of a
    // 2,000-cell document)
    const ids = this.cellIds();
    const root = this.host.shadowRoot ?? this.host;
    // (and when the sheet itself was drawn afresh, its sections with it)
    const sheet = root.querySelector('main');
    if (ids === null || (sheet === this.watchedSheet && sameTexts(ids, this.watchedIds))) return;
    this.watchedIds = ids;
    this.watchedSheet = sheet;
    for (const sec of root.querySelectorAll<HTMLElement>('section.cell')) {
      if (this.watched.has(sec)) continue;
      this.watched.add(sec);
      this.observer.observe(sec);
    }
  }

  hostConnected(): void {
    // put back in the page: its sections are looked for again (hostUpdated)
    this.host.requestUpdate();
  }

  hostDisconnected(): void {
    // the observer goes, and with it every section it watched
    this.observer?.disconnect();
    this.observer = null;
    this.watched = new WeakSet();
    this.watchedIds = [];
    this.watchedSheet = null;
  }

  private scheduleCatchUp(): void {
    if (this.catchUpScheduled) return;
    this.catchUpScheduled = true;
    // after this frame is painted, draw the rest
    requestAnimationFrame(() =>
      setTimeout(() => {
        this.catchUpScheduled = false;
        this.catchUp = true;
        this.host.requestUpdate();
        void this.host.updateComplete.then(() => {
          this.catchUp = false;
        });
      }, 0),
    );
  }
}
