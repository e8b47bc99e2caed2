import type { VersionDifference } from '@roundbook/ui';
import { useState } from 'react';
import { differencesBetween, staleVersionOf } from '@/lib/form-errors';

interface Versioned {
  version: number;
}

interface StaleState<V> {
  message: string;
  theirs: V;
  theirVersion: number;
  differences: VersionDifference[];
  state: 'choose' | 'loaded' | 'kept';
}

export interface StaleVersionOptions<T extends Versioned, V extends object> {
  /** The version the form was opened with. */
  initialVersion: number;
  toValues: (saved: T) => V;
  labels: Partial<Record<keyof V, string>>;
  /** Reads the saved record when the 409 does not carry it. */
  reload?: () => Promise<T>;
}

/**
 * The 409 STALE_VERSION flow of an edit form: keeps the version to send, and when someone else saved
 * first, shows what differs and lets the person load theirs or keep their own typing.
 */
export function useStaleVersion<T extends Versioned, V extends object>({
  initialVersion,
  toValues,
  labels,
  reload,
}: StaleVersionOptions<T, V>) {
  const [version, setVersion] = useState(initialVersion);
  const [stale, setStale] = useState<StaleState<V> | null>(null);

  /** True when the error was a stale version (and the notice is now shown). */
  const handle = async (error: unknown, yours: V): Promise<boolean> => {
    const found = staleVersionOf<T>(error);
    if (found === null) return false;
    const saved = found.current ?? (reload === undefined ? null : await reload().catch(() => null));
    if (saved === null) {
      setStale({
        message: found.message,
        theirs: yours,
        theirVersion: version,
        differences: [],
        state: 'choose',
      });
      return true;
    }
    const theirs = toValues(saved);
    setStale({
      message: found.message,
      theirs,
      theirVersion: saved.version,
      differences: differencesBetween(yours, theirs, labels),
      state: 'choose',
    });
    return true;
  };

  return {
    version,
    stale,
    handle,
    /** Their version goes into the form (via `reset`); the table still shows what was typed. */
    loadTheirs: (reset: (values: V) => void) => {
      if (stale === null) return;
      reset(stale.theirs);
      setVersion(stale.theirVersion);
      setStale({ ...stale, state: 'loaded' });
    },
    /** The typing stays; the next save is made against their version. */
    keepMine: () => {
      if (stale === null) return;
      setVersion(stale.theirVersion);
      setStale({ ...stale, state: 'kept' });
    },
    dismiss: () => setStale(null),
    /** After a successful save. */
    saved: (next: number) => {
      setVersion(next);
      setStale(null);
    },
  };
}
