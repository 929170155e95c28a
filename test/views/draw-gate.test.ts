/**
 * The page's drawing held for the worker's answer after a field is entered
 * (src/views/draw-gate.ts): held until the answer, or until the longest hold has passed,
 * or until the user goes on; never longer.
 */
import { afterEach, describe, expect, it } from 'vitest';
import { afterHeldDrawing, drawingHeld, holdDrawing, releaseDrawing } from '../../src/views/draw-gate.ts';

const tick = (ms: number) => new Promise((r) => setTimeout(r, ms));

afterEach(() => releaseDrawing());

describe('holding the page\'s drawing', () => {
  it('draws at once when nothing is held', () => {
    let drawn = 0;
    const r = afterHeldDrawing(() => {
      drawn++;
    });
    expect(r).toBeUndefined();
    expect(drawn).toBe(1);
    expect(drawingHeld()).toBeNull();
  });

  it('draws when the answer comes', async () => {
    let answer!: () => void;
    holdDrawing(new Promise<void>((r) => (answer = r)), 10_000);
    let drawn = 0;
    const waiting = afterHeldDrawing(() => {
      drawn++;
    });
    await tick(5);
    expect(drawn).toBe(0);
    answer();
    await waiting;
    expect(drawn).toBe(1);
    expect(drawingHeld()).toBeNull();
  });

  it('draws after the longest hold when the answer does not come', async () => {
    holdDrawing(new Promise(() => {}), 20);
    let drawn = 0;
    const t0 = performance.now();
    await afterHeldDrawing(() => {
      drawn++;
    });
    expect(drawn).toBe(1);
    expect(performance.now() - t0).toBeGreaterThanOrEqual(15);
    expect(drawingHeld()).toBeNull();
  });

  it('draws at once when the user goes on', async () => {
    holdDrawing(new Promise(() => {}), 10_000);
    let drawn = 0;
    const waiting = afterHeldDrawing(() => {
      drawn++;
    });
    releaseDrawing();
    expect(drawingHeld()).toBeNull();
    await waiting;
    expect(drawn).toBe(1);
  });

  it('a failed answer ends the hold too', async () => {
    holdDrawing(Promise.reject(new Error('the worker stopped')), 10_000);
    await afterHeldDrawing(() => {});
    expect(drawingHeld()).toBeNull();
  });
});
