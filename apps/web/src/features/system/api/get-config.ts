import { useSuspenseQuery } from '@tanstack/react-query';
import { configQueryOptions } from '@/api/resources/config';

export function useConfig() {
  return useSuspenseQuery(configQueryOptions());
}
