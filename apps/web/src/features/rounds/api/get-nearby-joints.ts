import { queryOptions, useQuery } from '@tanstack/react-query';
import { roundKeys } from '@/features/rounds/api/keys';
import type { NearbyJoint } from '@/features/rounds/api/types';
import { apiClient, unwrap } from '@/lib/api-client';

/** Readable joints of the heading's earlier rounds between two chainages (this round left out). */
export function getNearbyJoints(
  projectId: string,
  headingId: string,
  fromChainage: number,
  toChainage: number,
  excludeRoundId: string,
): Promise<NearbyJoint[]> {
  return unwrap(
    apiClient.GET('/api/projects/{projectId}/headings/{headingId}/joints', {
      params: { path: { projectId, headingId }, query: { fromChainage, toChainage, excludeRoundId } },
    }),
  );
}

export const nearbyJointsQueryOptions = (
  projectId: string,
  headingId: string,
  from: number,
  to: number,
  excludeRoundId: string,
) =>
  queryOptions({
    queryKey: roundKeys.nearbyJoints(projectId, headingId, from, to, excludeRoundId),
    queryFn: () => getNearbyJoints(projectId, headingId, from, to, excludeRoundId),
  });

export function useNearbyJoints(
  projectId: string,
  headingId: string,
  from: number,
  to: number,
  excludeRoundId: string,
  enabled: boolean,
) {
  return useQuery({ ...nearbyJointsQueryOptions(projectId, headingId, from, to, excludeRoundId), enabled });
}
