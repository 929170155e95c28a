/**
 * Which cells to draw first. A wave of new values renders the cells on screen (or near it)
 * at once; cells off screen keep the state they were last drawn with until the next frame,
 * so that an edit in a long document shows its visible consequences at once.
 */
import type { ReactiveController, ReactiveControllerHost } from 'lit';
import type { CellViewState } from '../../cells/view-api.ts';

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

  /** `latest` gives a cell's newest state; sections to watch carry `data-cell`. */
  constructor(host: ReactiveControllerHost & HTMLElement, latest: (id: string) => CellViewState | null) {
    this.host = host;
    this.latest = latest;
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
    const root = this.host.shadowRoot ?? this.host;
    for (const sec of root.querySelectorAll<HTMLElement>('section.cell:not([data-watched])')) {
      sec.dataset.watched = '';
      this.observer.observe(sec);
    }
  }

  hostDisconnected(): void {
    this.observer?.disconnect();
    this.observer = null;
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
