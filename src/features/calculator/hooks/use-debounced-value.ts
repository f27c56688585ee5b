import { useEffect, useState } from 'react';

/** The value once it has stopped changing for `delayMs`. */
export function useDebouncedValue<T>(value: T, delayMs: number): T {
  const [settled, setSettled] = useState(value);
  const serialised = JSON.stringify(value);
  useEffect(() => {
    const timer = setTimeout(
      () => setSettled((serialised === undefined ? undefined : JSON.parse(serialised)) as T),
      delayMs,
    );
    return () => clearTimeout(timer);
  }, [serialised, delayMs]);
  return settled;
}
