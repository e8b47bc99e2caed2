import { FluentProvider, makeStaticStyles, makeStyles, tokens } from '@fluentui/react-components';
import { getRoundbookTheme } from '@roundbook/ui';
import type { QueryClient } from '@tanstack/react-query';
import { QueryClientProvider } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { ThemePreferenceProvider, useThemePreference } from '@/app/theme-preference';

const useStaticStyles = makeStaticStyles({
  body: { margin: 0 },
  // Every plain link in the theme's link colour (the browser's default blue is 2.2:1 on the high-contrast
  // theme's black, found by the accessibility scan); a component's own colour still wins (class > element).
  a: { color: tokens.colorBrandForegroundLink },
});

const useStyles = makeStyles({
  root: {
    minHeight: '100dvh',
    display: 'flex',
    flexDirection: 'column',
    backgroundColor: tokens.colorNeutralBackground3,
  },
});

function ThemedRoot({ children }: { children: ReactNode }) {
  useStaticStyles();
  const styles = useStyles();
  const { mode } = useThemePreference();
  return (
    <FluentProvider theme={getRoundbookTheme(mode)} className={styles.root} data-theme-mode={mode}>
      {children}
    </FluentProvider>
  );
}

export interface AppProviderProps {
  queryClient: QueryClient;
  children: ReactNode;
}

export function AppProvider({ queryClient, children }: AppProviderProps) {
  return (
    <QueryClientProvider client={queryClient}>
      <ThemePreferenceProvider>
        <ThemedRoot>{children}</ThemedRoot>
      </ThemePreferenceProvider>
    </QueryClientProvider>
  );
}
