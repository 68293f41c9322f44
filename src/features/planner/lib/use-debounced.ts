import { useEffect, useState } from 'react';

/** The value, once it has stopped changing for `ms`: typing does not send a request per key. */
export function useDebounced<T>(value: T, ms = 300, same: (a: T, b: T) => boolean = Object.is): T {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    if (same(value, settled)) return;
    const timer = setTimeout(() => setSettled(value), ms);
    return () => clearTimeout(timer);
  }, [value, settled, ms, same]);
  return settled;
}
