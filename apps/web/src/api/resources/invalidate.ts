import type { QueryClient, QueryKey } from '@tanstack/react-query';

/**
 * Marks a resource stale and refetches it where it is on screen. `exact` touches that resource only;
 * without it everything below the key goes too (e.g. every round of a project).
 */
export function invalidateResource(
  queryClient: QueryClient,
  queryKey: QueryKey,
  { exact = false }: { exact?: boolean } = {},
): Promise<void> {
  return queryClient.invalidateQueries({ queryKey, exact });
}
