import { useCallback, useLayoutEffect, useRef } from 'react';

/**
 * A function that never changes identity and always calls the latest `handler`: for handlers
 * passed to memoised children (grid rows, connector faces) that must not redraw them.
 */
export function useStableHandler<A extends unknown[]>(handler: (...args: A) => void) {
  const latest = useRef(handler);
  useLayoutEffect(() => {
    latest.current = handler;
  });
  return useCallback((...args: A) => latest.current(...args), []);
}
