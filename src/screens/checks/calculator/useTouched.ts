import { useCallback, useState } from 'react';

/** Which fields a person has left at least once (see visibleError in ./input). */
export function useTouched<K extends string>() {
  const [touched, setTouched] = useState<Partial<Record<K, true>>>({});
  const touch = useCallback((key: K) => setTouched((t) => (t[key] ? t : { ...t, [key]: true })), []);
  return { touched: (key: K) => touched[key] === true, touch };
}
