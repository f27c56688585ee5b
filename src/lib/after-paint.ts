/**
 * Resolves once the browser has had the chance to paint what the current event changed: work
 * that can wait (starting a save's request) then runs after the frame rather than before it.
 * Where no frame comes (a hidden tab draws nothing), it resolves after `fallbackMs` all the same.
 */
export function afterNextPaint(fallbackMs = 50): Promise<void> {
  return new Promise((resolve) => {
    if (typeof requestAnimationFrame !== 'function') {
      setTimeout(resolve, 0);
      return;
    }
    const fallback = setTimeout(resolve, fallbackMs);
    requestAnimationFrame(() =>
      setTimeout(() => {
        clearTimeout(fallback);
        resolve();
      }, 0),
    );
  });
}
