import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import type { AppConfig } from '@/api/contract';
import { apiClient, unwrap } from '@/lib/api-client';

export async function getConfig(): Promise<AppConfig> {
  const body: Record<string, unknown> = await unwrap(apiClient.GET('/api/config'));
  return {
    localMode: body.localMode === true,
    version: typeof body.version === 'string' ? body.version : 'unknown',
  };
}

export const configQueryOptions = () =>
  queryOptions({
    queryKey: ['system', 'config'],
    queryFn: getConfig,
    staleTime: Infinity,
  });

export function useConfig() {
  return useSuspenseQuery(configQueryOptions());
}
