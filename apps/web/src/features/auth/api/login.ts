import { useMutation } from '@tanstack/react-query';
import type { LoginRequest, LoginResponse } from '@/api/contract';
import { apiClient, unwrap } from '@/lib/api-client';

export function login(body: LoginRequest): Promise<LoginResponse> {
  return unwrap(apiClient.POST('/api/auth/login', { body }));
}

export function useLogin() {
  return useMutation({ mutationKey: ['auth', 'login'], mutationFn: login });
}
