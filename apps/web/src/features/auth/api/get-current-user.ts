import { useSuspenseQuery } from '@tanstack/react-query';
import { currentUserQueryOptions } from '@/api/resources/auth';

export function useCurrentUser() {
  return useSuspenseQuery(currentUserQueryOptions());
}
