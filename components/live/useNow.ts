/**
 * The clock, re-read every so often, so ages on screen grow between server updates. It only
 * re-renders; it asks the server nothing.
 */
import { useEffect, useState } from 'react';

/**
 * @param intervalMs how often to re-read the clock
 * @returns milliseconds since the epoch, as of the last tick
 */
export function useNow(intervalMs: number): number {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    const timer = setInterval(() => setNow(Date.now()), intervalMs);
    return () => clearInterval(timer);
  }, [intervalMs]);
  return now;
}
