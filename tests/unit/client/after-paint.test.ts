/**
 * A pin save starts its request after the frame that shows the change: not before the browser's
 * next frame, right after it, and after a short wait where no frame comes (a hidden tab).
 */
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { afterNextPaint } from '@/lib/after-paint.ts';

describe('afterNextPaint', () => {
  let frames: Array<() => void>;

  beforeEach(() => {
    vi.useFakeTimers();
    frames = [];
    vi.stubGlobal('requestAnimationFrame', (cb: () => void) => frames.push(cb));
  });
  afterEach(() => {
    vi.useRealTimers();
    vi.unstubAllGlobals();
  });

  const settled = (promise: Promise<void>) => {
    const state = { done: false };
    void promise.then(() => (state.done = true));
    return state;
  };

  it('waits for the next frame, then resolves in the task after it', async () => {
    const state = settled(afterNextPaint());
    await vi.advanceTimersByTimeAsync(10);
    expect(state.done).toBe(false);
    frames.shift()!();
    expect(state.done).toBe(false);
    await vi.advanceTimersByTimeAsync(0);
    expect(state.done).toBe(true);
  });

  it('resolves after the fallback wait when no frame comes', async () => {
    const state = settled(afterNextPaint(50));
    await vi.advanceTimersByTimeAsync(49);
    expect(state.done).toBe(false);
    await vi.advanceTimersByTimeAsync(1);
    expect(state.done).toBe(true);
    expect(frames).toHaveLength(1);
  });

  it('does not wait for a frame where the page has none to give', async () => {
    vi.stubGlobal('requestAnimationFrame', undefined);
    const state = settled(afterNextPaint());
    await vi.advanceTimersByTimeAsync(0);
    expect(state.done).toBe(true);
  });
});
