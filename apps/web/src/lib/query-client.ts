import { QueryClient } from '@tanstack/react-query';
import { isApiError } from '@/lib/api-client';

/** One QueryClient per app (and per test): server state lives here and nowhere else. */
export function createQueryClient(): QueryClient {
  return new QueryClient({
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        // Retry only what may heal by itself: a dropped connection or a 5xx, never a 4xx.
        retry: (failureCount, error) =>
          failureCount < 2 && (!isApiError(error) || error.status === 0 || error.status >= 500),
      },
      mutations: { retry: false },
    },
  });
}
