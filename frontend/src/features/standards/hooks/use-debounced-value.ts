import { useEffect, useState } from 'react';

/** The value once it has not changed for `delay` ms; compared by content, so a new but equal object does not restart the wait. */
export function useDebouncedValue<T>(value: T, delay: number): T {
  const key = JSON.stringify(value);
  const [debounced, setDebounced] = useState(value);
  useEffect(() => {
    const timer = setTimeout(() => setDebounced(JSON.parse(key) as T), delay);
    return () => clearTimeout(timer);
  }, [key, delay]);
  return debounced;
}
