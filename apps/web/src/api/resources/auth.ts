import { queryOptions } from '@tanstack/react-query';
import type { ChangePasswordRequest, CurrentUser, LoginRequest, LoginResponse } from '@/api/contract';
import { resourceKeys } from '@/api/resources/keys';
import { apiClient, unwrap } from '@/lib/api-client';

// GET /auth/me, POST /auth/login, POST /auth/password, POST /auth/sign-out-everywhere.

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

/** A new password; the API ends every other session and answers with a new token for this one. */
export function changePassword(body: ChangePasswordRequest): Promise<LoginResponse> {
  return unwrap(apiClient.POST('/api/auth/password', { body }));
}

/** Ends every session of the account, this one included. */
export async function signOutEverywhere(): Promise<void> {
  await unwrap(apiClient.POST('/api/auth/sign-out-everywhere'));
}
