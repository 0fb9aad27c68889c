import { useEffect, useState } from 'react';

/** `value`, settled: changes reach the result `ms` after the last one (keeps typing and dragging cheap). */
export function useDebounced<T>(value: T, ms = 200): T {
  const [v, setV] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setV(value), ms);
    return () => clearTimeout(t);
  }, [value, ms]);
  return v;
}
