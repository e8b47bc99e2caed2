import { queryOptions } from '@tanstack/react-query';
import type { AppConfig } from '@/api/contract';
import { resourceKeys } from '@/api/resources/keys';
import { apiClient, unwrap } from '@/lib/api-client';

// GET /config (public).

/**
 * The OpenAPI document describes the config body as an empty object (AppInfoDto has no properties
 * yet), so the fetcher checks the two fields itself.
 */
export async function getConfig(): Promise<AppConfig> {
  const body: Record<string, unknown> = await unwrap(apiClient.GET('/api/config'));
  return {
    localMode: body.localMode === true,
    version: typeof body.version === 'string' ? body.version : 'unknown',
  };
}

export const configQueryOptions = () =>
  queryOptions({
    queryKey: resourceKeys.config(),
    queryFn: getConfig,
    staleTime: Infinity,
  });
