import { useEffect, useState } from 'react';

/**
 * useState kept in this tab's sessionStorage under `key`: a reload finds it again, closing the tab
 * forgets it. `valid` checks what was read back (anything else falls back to `initial`).
 */
export function useSessionState<T>(key: string, initial: T, valid: (value: unknown) => boolean = () => true) {
  const [value, setValue] = useState<T>(() => {
    try {
      const raw = sessionStorage.getItem(key);
      if (raw === null) return initial;
      const parsed: unknown = JSON.parse(raw);
      return valid(parsed) ? (parsed as T) : initial;
    } catch {
      return initial;
    }
  });
  useEffect(() => {
    try {
      if (value === undefined) sessionStorage.removeItem(key);
      else sessionStorage.setItem(key, JSON.stringify(value));
    } catch {
      // Storage refused (private browsing, full): the value lives until the page goes.
    }
  }, [key, value]);
  return [value, setValue] as const;
}
