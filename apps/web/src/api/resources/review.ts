import type { QueryClient } from '@tanstack/react-query';
import { queryOptions } from '@tanstack/react-query';
import type { components } from '@/api/generated/schema';
import { invalidateResource } from '@/api/resources/invalidate';
import { resourceKeys } from '@/api/resources/keys';
import { apiClient, isApiError, unwrap } from '@/lib/api-client';

// GET /review/queue; GET /projects/{projectId}/rounds/{roundId}/review and …/revisions; POST …/confirm, …/return,
// …/correct, …/review/comments/{commentId}/resolve, …/triggers/{ruleId}/acknowledge; GET …/sketch/render.

type Schemas = components['schemas'];
export type RoundReview = Schemas['RoundReviewDto'];
export type ReviewQueue = Schemas['ReviewQueueDto'];

export function getReviewQueue(headingId: string | null): Promise<ReviewQueue> {
  return unwrap(apiClient.GET('/api/review/queue', { params: { query: headingId ? { headingId } : {} } }));
}

export const reviewQueueQueryOptions = (headingId: string | null) =>
  queryOptions({
    queryKey: resourceKeys.reviewQueue(headingId),
    queryFn: () => getReviewQueue(headingId),
    // Time waiting and time left move on: read again every minute while the page is open.
    refetchInterval: 60_000,
  });

export function getRoundReview(projectId: string, roundId: string): Promise<RoundReview> {
  return unwrap(
    apiClient.GET('/api/projects/{projectId}/rounds/{roundId}/review', {
      params: { path: { projectId, roundId } },
    }),
  );
}

export const roundReviewQueryOptions = (projectId: string, roundId: string) =>
  queryOptions({
    queryKey: resourceKeys.roundReview(projectId, roundId),
    queryFn: () => getRoundReview(projectId, roundId),
  });

export type RoundRevision = Schemas['RoundRevisionDto'];

export function getRoundRevisions(projectId: string, roundId: string): Promise<RoundRevision[]> {
  return unwrap(
    apiClient.GET('/api/projects/{projectId}/rounds/{roundId}/revisions', {
      params: { path: { projectId, roundId } },
    }),
  );
}

/** Revisions never change once written; new ones come with a decision (the round's key is invalidated). */
export const roundRevisionsQueryOptions = (projectId: string, roundId: string) =>
  queryOptions({
    queryKey: resourceKeys.roundRevisions(projectId, roundId),
    queryFn: () => getRoundRevisions(projectId, roundId),
  });

export function confirmRound(
  projectId: string,
  roundId: string,
  body: Schemas['ConfirmRoundDto'],
): Promise<RoundReview> {
  return unwrap(
    apiClient.POST('/api/projects/{projectId}/rounds/{roundId}/confirm', {
      params: { path: { projectId, roundId } },
      body,
    }),
  );
}

export function returnRound(
  projectId: string,
  roundId: string,
  body: Schemas['ReturnRoundDto'],
): Promise<RoundReview> {
  return unwrap(
    apiClient.POST('/api/projects/{projectId}/rounds/{roundId}/return', {
      params: { path: { projectId, roundId } },
      body,
    }),
  );
}

export function correctRound(
  projectId: string,
  roundId: string,
  body: Schemas['CorrectRoundDto'],
): Promise<RoundReview> {
  return unwrap(
    apiClient.POST('/api/projects/{projectId}/rounds/{roundId}/correct', {
      params: { path: { projectId, roundId } },
      body,
    }),
  );
}

export function resolveComment(projectId: string, roundId: string, commentId: string): Promise<RoundReview> {
  return unwrap(
    apiClient.POST('/api/projects/{projectId}/rounds/{roundId}/review/comments/{commentId}/resolve', {
      params: { path: { projectId, roundId, commentId } },
    }),
  );
}

/** A fired rule acknowledged by its owner role, with what was done. */
export function acknowledgeRule(
  projectId: string,
  roundId: string,
  ruleId: string,
  body: Schemas['AcknowledgeRuleDto'],
): Promise<RoundReview> {
  return unwrap(
    apiClient.POST('/api/projects/{projectId}/rounds/{roundId}/triggers/{ruleId}/acknowledge', {
      params: { path: { projectId, roundId, ruleId } },
      body,
    }),
  );
}

/** An engineer accepts a fired rule's standing condition for a chainage range or until a date. */
export function acceptCondition(
  projectId: string,
  roundId: string,
  ruleId: string,
  body: Schemas['AcceptConditionDto'],
): Promise<RoundReview> {
  return unwrap(
    apiClient.POST('/api/projects/{projectId}/rounds/{roundId}/triggers/{ruleId}/accept', {
      params: { path: { projectId, roundId, ruleId } },
      body,
    }),
  );
}

/** An engineer withdraws an acceptance: the rule raises the level again. */
export function withdrawAcceptance(
  projectId: string,
  roundId: string,
  acceptanceId: string,
): Promise<RoundReview> {
  return unwrap(
    apiClient.POST('/api/projects/{projectId}/rounds/{roundId}/acceptances/{acceptanceId}/withdraw', {
      params: { path: { projectId, roundId, acceptanceId } },
    }),
  );
}

/**
 * After a review decision: the answer is the review; the round itself (status, revision, lock), the
 * queue and the Board's counts are read again.
 */
export async function reviewChanged(
  queryClient: QueryClient,
  projectId: string,
  review: RoundReview,
): Promise<void> {
  queryClient.setQueryData(resourceKeys.roundReview(projectId, review.roundId), review);
  await Promise.all([
    invalidateResource(queryClient, resourceKeys.round(projectId, review.roundId), { exact: true }),
    invalidateResource(queryClient, resourceKeys.roundRevisions(projectId, review.roundId)),
    invalidateResource(queryClient, resourceKeys.reviewQueueAll()),
    invalidateResource(queryClient, resourceKeys.projects(), { exact: true }),
  ]);
}

export type SketchRender = Schemas['SketchRenderDto'];

/** The picture of the sketch as last submitted; null when no submit had a sketch (404). */
export async function getSketchRender(projectId: string, roundId: string): Promise<SketchRender | null> {
  try {
    return await unwrap(
      apiClient.GET('/api/projects/{projectId}/rounds/{roundId}/sketch/render', {
        params: { path: { projectId, roundId } },
      }),
    );
  } catch (e) {
    if (isApiError(e) && e.status === 404) return null;
    throw e;
  }
}

/** Signed addresses last five minutes: read again after four, and every 3 s while the picture is being made. */
export const sketchRenderQueryOptions = (projectId: string, roundId: string) =>
  queryOptions({
    queryKey: [...resourceKeys.roundReview(projectId, roundId), 'sketch-render'] as const,
    queryFn: () => getSketchRender(projectId, roundId),
    staleTime: 240_000,
    refetchInterval: (query) => (query.state.data?.state === 'rendering' ? 3000 : 240_000),
  });
