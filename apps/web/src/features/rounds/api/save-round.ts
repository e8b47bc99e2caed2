import type { Round, SaveRoundRequest } from '@/features/rounds/api/types';
import { apiClient, unwrap } from '@/lib/api-client';

/** The whole editable record with the version last read; 409 STALE_VERSION when someone saved first. */
export function saveRound(projectId: string, roundId: string, body: SaveRoundRequest): Promise<Round> {
  return unwrap(
    apiClient.PUT('/api/projects/{projectId}/rounds/{roundId}', {
      params: { path: { projectId, roundId } },
      body,
    }),
  );
}

/** Draft → Submitted; a 400 names in `fields` what is missing (joints, ratings, recommendation). */
export function submitRound(projectId: string, roundId: string, version: number): Promise<Round> {
  return unwrap(
    apiClient.POST('/api/projects/{projectId}/rounds/{roundId}/submit', {
      params: { path: { projectId, roundId } },
      body: { version },
    }),
  );
}
