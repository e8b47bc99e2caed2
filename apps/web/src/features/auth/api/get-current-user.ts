import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import type { CurrentUser } from '@/api/contract';
import { apiClient, unwrap } from '@/lib/api-client';

export function getCurrentUser(): Promise<CurrentUser> {
  return unwrap(apiClient.GET('/api/auth/me'));
}

export const currentUserQueryOptions = () =>
  queryOptions({
    queryKey: ['auth', 'me'],
    queryFn: getCurrentUser,
    staleTime: 5 * 60_000,
  });

export function useCurrentUser() {
  return useSuspenseQuery(currentUserQueryOptions());
}
