import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { CloseHazardRequest, CreateHazardRequest, Hazard } from '@/api/contract';
import { closeHazard, createHazard, hazardsChanged, hazardsQueryOptions } from '@/api/resources/hazards';
import { resourceKeys } from '@/api/resources/keys';

export type { Hazard };

export function useHazards(projectId: string, headingId: string) {
  return useQuery(hazardsQueryOptions(projectId, headingId));
}

export function useRaiseHazard(projectId: string, headingId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationKey: [...resourceKeys.headingHazards(projectId, headingId), 'raise'],
    mutationFn: (body: CreateHazardRequest) => createHazard({ projectId, headingId }, body),
    onSuccess: () => hazardsChanged(queryClient, { projectId, headingId }),
  });
}

export function useCloseHazard(projectId: string, headingId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationKey: [...resourceKeys.headingHazards(projectId, headingId), 'close'],
    mutationFn: ({ hazardId, body }: { hazardId: string; body: CloseHazardRequest }) =>
      closeHazard({ projectId, headingId }, hazardId, body),
    // Read the list again either way: a 409 means someone else changed or closed it first.
    onSettled: () => hazardsChanged(queryClient, { projectId, headingId }),
  });
}
