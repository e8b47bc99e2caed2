import { useQueryClient, useSuspenseQuery } from '@tanstack/react-query';
import { headingQueryOptions, headingsQueryOptions } from '@/api/resources/headings';

export function useHeadings(projectId: string) {
  return useSuspenseQuery(headingsQueryOptions(projectId));
}

/** Reads one heading from the server now (into its one cache entry), e.g. after a 409. */
export function useReloadHeading(projectId: string) {
  const queryClient = useQueryClient();
  return (headingId: string) =>
    queryClient.fetchQuery({ ...headingQueryOptions(projectId, headingId), staleTime: 0 });
}
