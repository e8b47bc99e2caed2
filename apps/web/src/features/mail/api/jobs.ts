import { queryOptions, useMutation, useQueryClient, useSuspenseQuery } from '@tanstack/react-query';
import type { components } from '@/api/generated/schema';
import { apiClient, unwrap } from '@/lib/api-client';

export type JobsOverview = components['schemas']['JobsOverviewDto'];
export type BackgroundJob = components['schemas']['JobDto'];

export const jobKeys = {
  all: ['local-jobs'] as const,
  overview: () => [...jobKeys.all, 'overview'] as const,
};

/** Background jobs not done yet (waiting, running, failed) and the count in each state. */
export function getJobs(): Promise<JobsOverview> {
  return unwrap(apiClient.GET('/api/local/jobs'));
}

export const jobsQueryOptions = () =>
  queryOptions({ queryKey: jobKeys.overview(), queryFn: getJobs, staleTime: 2_000 });

export function useJobs() {
  return useSuspenseQuery(jobsQueryOptions());
}

export function retryJob(jobId: string): Promise<BackgroundJob> {
  return unwrap(apiClient.POST('/api/local/jobs/{jobId}/retry', { params: { path: { jobId } } }));
}

export function useRetryJob() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationKey: [...jobKeys.all, 'retry'],
    mutationFn: retryJob,
    onSettled: () => queryClient.invalidateQueries({ queryKey: jobKeys.all }),
  });
}
