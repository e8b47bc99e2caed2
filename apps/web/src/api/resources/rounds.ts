import type { QueryClient } from '@tanstack/react-query';
import { keepPreviousData, queryOptions } from '@tanstack/react-query';
import type { components } from '@/api/generated/schema';
import { invalidateResource } from '@/api/resources/invalidate';
import type { JointWindow, RoundListFilters } from '@/api/resources/keys';
import { resourceKeys } from '@/api/resources/keys';
import { apiClient, unwrap } from '@/lib/api-client';

// GET/POST /projects/{projectId}/headings/{headingId}/rounds, GET …/rounds/next, GET …/joints;
// GET/PUT /projects/{projectId}/rounds/{roundId}, POST …/submit.

type Schemas = components['schemas'];
type Round = Schemas['RoundDto'];

export function getRounds(
  projectId: string,
  headingId: string,
  filters: RoundListFilters,
): Promise<Schemas['RoundPageDto']> {
  return unwrap(
    apiClient.GET('/api/projects/{projectId}/headings/{headingId}/rounds', {
      params: { path: { projectId, headingId }, query: filters },
    }),
  );
}

export const roundsQueryOptions = (projectId: string, headingId: string, filters: RoundListFilters) =>
  queryOptions({
    queryKey: resourceKeys.roundPage(projectId, headingId, filters),
    queryFn: () => getRounds(projectId, headingId, filters),
    // Paging and sorting keep the last page on screen until the next one arrives.
    placeholderData: keepPreviousData,
  });

export function getNextRound(
  projectId: string,
  headingId: string,
  stage: Schemas['Stage'],
): Promise<Schemas['NextRoundDto']> {
  return unwrap(
    apiClient.GET('/api/projects/{projectId}/headings/{headingId}/rounds/next', {
      params: { path: { projectId, headingId }, query: { stage } },
    }),
  );
}

export const nextRoundQueryOptions = (projectId: string, headingId: string, stage: Schemas['Stage']) =>
  queryOptions({
    queryKey: resourceKeys.nextRound(projectId, headingId, stage),
    queryFn: () => getNextRound(projectId, headingId, stage),
    staleTime: 0,
  });

/** Readable joints of the heading's earlier rounds between two chainages (this round left out). */
export function getNearbyJoints(
  projectId: string,
  headingId: string,
  window: JointWindow,
): Promise<Schemas['NearbyJointDto'][]> {
  return unwrap(
    apiClient.GET('/api/projects/{projectId}/headings/{headingId}/joints', {
      params: { path: { projectId, headingId }, query: window },
    }),
  );
}

export const nearbyJointsQueryOptions = (projectId: string, headingId: string, window: JointWindow) =>
  queryOptions({
    queryKey: resourceKeys.nearbyJoints(projectId, headingId, window),
    queryFn: () => getNearbyJoints(projectId, headingId, window),
  });

export function getRound(projectId: string, roundId: string): Promise<Round> {
  return unwrap(
    apiClient.GET('/api/projects/{projectId}/rounds/{roundId}', { params: { path: { projectId, roundId } } }),
  );
}

export const roundQueryOptions = (projectId: string, roundId: string) =>
  queryOptions({
    queryKey: resourceKeys.round(projectId, roundId),
    queryFn: () => getRound(projectId, roundId),
    // Read again only when something it depends on changes (invalidation), never on focus: the form
    // keeps the typing either way, and the autosave keeps the version it saves against.
    staleTime: Infinity,
  });

export function createRound(
  projectId: string,
  headingId: string,
  body: Schemas['CreateRoundDto'],
): Promise<Round> {
  return unwrap(
    apiClient.POST('/api/projects/{projectId}/headings/{headingId}/rounds', {
      params: { path: { projectId, headingId } },
      body,
    }),
  );
}

/** The whole editable record with the version last read; 409 STALE_VERSION when someone saved first. */
export function saveRound(projectId: string, roundId: string, body: Schemas['SaveRoundDto']): Promise<Round> {
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

/**
 * After a round is created, saved or submitted: the answer is the round (a fetch of it still under way
 * is dropped, so an older copy cannot land on top), and its heading's round pages and next-round
 * proposal are read again; the Board's projects too, when `board` is set (a new or submitted round).
 */
export async function roundSaved(
  queryClient: QueryClient,
  projectId: string,
  round: Round,
  { board = false, waitForLists = true }: { board?: boolean; waitForLists?: boolean } = {},
): Promise<void> {
  const key = resourceKeys.round(projectId, round.id);
  await queryClient.cancelQueries({ queryKey: key, exact: true });
  queryClient.setQueryData(key, round);
  const lists = Promise.all([
    invalidateResource(queryClient, resourceKeys.headingRounds(projectId, round.headingId)),
    board ? invalidateResource(queryClient, resourceKeys.projects(), { exact: true }) : null,
  ]);
  // A sync sending many rounds does not wait for the lists after each one: every invalidation cancels the
  // refetch before it, so the lists are fetched once more when the last round is in, not fifty times.
  if (waitForLists) await lists;
}
