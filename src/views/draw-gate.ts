/**
 * Drawing held for a moment after a field is entered, so that the field and the values that
 * depend on it are drawn in the same frame.
 *
 * Why: Chromium, after a key whose handler changes the page (the DOM or the focus), draws
 * that change first and holds other work, the worker's answer included, until the frame is
 * out (scripts/answer-after-key.mjs measures it). A field entered in a 100,000-row table
 * was then drawn at once and its sum one frame later, although the worker answers within a
 * millisecond or two. So the page's own redraw after a field is entered waits for the
 * worker's answer, for at most DRAW_HOLD_MS: the key's handler changes nothing on the
 * page, the answer is heard at once, and one frame shows both.
 *
 * Only drawing waits: the edit is in the document, and sent, before the key's handler
 * returns, and keys that come while drawing is held are taken as they would be once drawn
 * (cells/table/grid-editor.ts). Elements that take part override `scheduleUpdate` with
 * {@link afterHeldDrawing}.
 */

/**
 * The longest the page's own redraw waits for the worker's answer: under one frame. (It
 * was 10 ms. In a chain of 2,000 cells the answer often came later than that, and the page
 * drew the field alone, then the answer after a frame of its own: medians of 46 to 56 ms
 * from Enter to the dependents drawn, against 34 to 38 ms in four of five runs at 16 ms;
 * scripts/field-edit-clock.mjs --cells 2000.)
 */
export const DRAW_HOLD_MS = 16;

let held: Promise<void> | null = null;
/** Ends the hold in force at once. */
let release: () => void = () => {};

/** Holds drawing until `until` settles, or `ms` have passed, whichever comes first. */
export function holdDrawing(until: Promise<unknown>, ms: number = DRAW_HOLD_MS): void {
  let timer: ReturnType<typeof setTimeout> | undefined;
  const now = new Promise<void>((resolve) => {
    timer = setTimeout(resolve, ms);
    release = resolve;
  });
  const p: Promise<void> = Promise.race([until.then(() => undefined, () => undefined), now]).then(() => {
    clearTimeout(timer);
    if (held === p) held = null;
  });
  held = p;
}

/**
 * Ends the hold now (the user went on before the answer came: what they do next must act
 * on the page as drawn). Elements held draw once the current task's code has run.
 */
export function releaseDrawing(): void {
  if (held === null) return;
  held = null;
  release();
}

/** The hold now in force, or null when drawing is free. */
export function drawingHeld(): Promise<void> | null {
  return held;
}

/**
 * For a Lit element's `scheduleUpdate`: runs `update` (the element's own
 * `super.scheduleUpdate()`) now, or once drawing is no longer held.
 */
export function afterHeldDrawing(update: () => void | Promise<unknown>): void | Promise<unknown> {
  const h = held;
  return h === null ? update() : h.then(update);
}
