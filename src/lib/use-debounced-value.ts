import { useEffect, useState } from 'react';

/** `value`, once it has stopped changing for `ms` milliseconds (search boxes that query the server). */
export function useDebouncedValue<T>(value: T, ms = 250): T {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    const timer = window.setTimeout(() => setSettled(value), ms);
    return () => window.clearTimeout(timer);
  }, [value, ms]);
  return settled;
}
