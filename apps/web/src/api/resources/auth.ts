import { queryOptions } from '@tanstack/react-query';
import type { CurrentUser, LoginRequest, LoginResponse } from '@/api/contract';
import { resourceKeys } from '@/api/resources/keys';
import { apiClient, unwrap } from '@/lib/api-client';

// GET /auth/me, POST /auth/login.

export function getCurrentUser(): Promise<CurrentUser> {
  return unwrap(apiClient.GET('/api/auth/me'));
}

export const currentUserQueryOptions = () =>
  queryOptions({
    queryKey: resourceKeys.currentUser(),
    queryFn: getCurrentUser,
    staleTime: 5 * 60_000,
  });

export function login(body: LoginRequest): Promise<LoginResponse> {
  return unwrap(apiClient.POST('/api/auth/login', { body }));
}
