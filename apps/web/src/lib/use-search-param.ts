import { useCallback } from 'react';
import { useSearchParams } from 'react-router-dom';

/**
 * One query parameter as screen state (a tab, a section): read from the address, written back replacing the
 * history entry (switching a tab is not navigation); the fallback value is left out of the address. Writing the
 * value already there does nothing, so an effect that reports the current value cannot loop.
 */
export function useSearchParam(key: string, fallback: string): [string | null, (next: string) => void] {
  const [search, setSearch] = useSearchParams();
  const value = search.get(key);
  const set = useCallback(
    (next: string) => {
      if ((value ?? fallback) === next) return;
      setSearch(
        (s) => {
          const n = new URLSearchParams(s);
          if (next === fallback) n.delete(key);
          else n.set(key, next);
          return n;
        },
        { replace: true },
      );
    },
    [key, fallback, value, setSearch],
  );
  return [value, set];
}
