import type { RoundbookThemeMode } from '@roundbook/ui';
import { createContext, useCallback, useContext, useMemo, useState } from 'react';
import type { ReactNode } from 'react';

const STORAGE_KEY = 'roundbook.theme';

interface ThemePreference {
  mode: RoundbookThemeMode;
  setMode: (mode: RoundbookThemeMode) => void;
}

const ThemePreferenceContext = createContext<ThemePreference | null>(null);

function readStoredMode(): RoundbookThemeMode {
  try {
    return window.localStorage.getItem(STORAGE_KEY) === 'high-contrast' ? 'high-contrast' : 'light';
  } catch {
    return 'light';
  }
}

export interface ThemePreferenceProviderProps {
  children: ReactNode;
}

/** Holds the light / high-contrast choice and remembers it on this device. */
export function ThemePreferenceProvider({ children }: ThemePreferenceProviderProps) {
  const [mode, setModeState] = useState<RoundbookThemeMode>(readStoredMode);
  const setMode = useCallback((next: RoundbookThemeMode) => {
    setModeState(next);
    try {
      window.localStorage.setItem(STORAGE_KEY, next);
    } catch {
      // Storage may be unavailable (private mode); the choice then lasts for this visit only.
    }
  }, []);
  const value = useMemo(() => ({ mode, setMode }), [mode, setMode]);
  return <ThemePreferenceContext.Provider value={value}>{children}</ThemePreferenceContext.Provider>;
}

export function useThemePreference(): ThemePreference {
  const value = useContext(ThemePreferenceContext);
  if (value === null) throw new Error('useThemePreference must be used inside ThemePreferenceProvider');
  return value;
}
