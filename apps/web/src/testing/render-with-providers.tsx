import { FluentProvider } from '@fluentui/react-components';
import { roundbookLightTheme } from '@roundbook/ui';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { render } from '@testing-library/react';
import type { ReactElement } from 'react';

/** Renders one component with the theme and a fresh query client (no router). */
export function renderWithProviders(ui: ReactElement) {
  const queryClient = new QueryClient({
    defaultOptions: { queries: { retry: false, staleTime: Infinity }, mutations: { retry: false } },
  });
  const view = render(
    <QueryClientProvider client={queryClient}>
      <FluentProvider theme={roundbookLightTheme}>{ui}</FluentProvider>
    </QueryClientProvider>,
  );
  return { ...view, queryClient };
}
