import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { components } from '@/api/generated/schema';
import { resourceKeys } from '@/api/resources/keys';
import {
  acceptCondition,
  acknowledgeRule,
  confirmRound,
  correctRound,
  resolveComment,
  returnRound,
  withdrawAcceptance,
  roundRevisionsQueryOptions,
  reviewChanged,
  reviewQueueQueryOptions,
  roundReviewQueryOptions,
} from '@/api/resources/review';

type Schemas = components['schemas'];
export type RoundReview = Schemas['RoundReviewDto'];
export type ReviewQueueItem = Schemas['ReviewQueueItemDto'];
export type RuleClock = Schemas['RuleClockDto'];
export type ReviewSection = Schemas['ReviewSection'];
export type ReviewDecision = Schemas['ReviewDecisionDto'];
export type RoundRule = Schemas['RoundRuleDto'];
export type AcceptedRule = Schemas['AcceptedRuleDto'];
export type LapsedAcceptance = Schemas['LapsedAcceptanceDto'];
export type RoundRevision = Schemas['RoundRevisionDto'];
export type SupportClassOption = Pick<
  Schemas['SupportClassDto'],
  'id' | 'code' | 'name' | 'maxRoundLength' | 'retired'
>;

export function useReviewQueue(headingId: string | null) {
  return useQuery(reviewQueueQueryOptions(headingId));
}

export function useRoundRevisions(projectId: string, roundId: string, enabled: boolean) {
  return useQuery({ ...roundRevisionsQueryOptions(projectId, roundId), enabled });
}

export function useRoundReview(projectId: string, roundId: string) {
  return useQuery(roundReviewQueryOptions(projectId, roundId));
}

export type ReviewAction =
  | { kind: 'confirm'; body: Schemas['ConfirmRoundDto'] }
  | { kind: 'return'; body: Schemas['ReturnRoundDto'] }
  | { kind: 'correct'; body: Schemas['CorrectRoundDto'] }
  | { kind: 'resolve'; commentId: string }
  | { kind: 'acknowledge'; ruleId: string; body: Schemas['AcknowledgeRuleDto'] }
  | { kind: 'accept'; ruleId: string; body: Schemas['AcceptConditionDto'] }
  | { kind: 'withdraw'; acceptanceId: string };

function run(projectId: string, roundId: string, action: ReviewAction) {
  switch (action.kind) {
    case 'confirm':
      return confirmRound(projectId, roundId, action.body);
    case 'return':
      return returnRound(projectId, roundId, action.body);
    case 'correct':
      return correctRound(projectId, roundId, action.body);
    case 'resolve':
      return resolveComment(projectId, roundId, action.commentId);
    case 'acknowledge':
      return acknowledgeRule(projectId, roundId, action.ruleId, action.body);
    case 'accept':
      return acceptCondition(projectId, roundId, action.ruleId, action.body);
    case 'withdraw':
      return withdrawAcceptance(projectId, roundId, action.acceptanceId);
  }
}

/** One review decision (confirm, return, correct, resolve a comment); the round and queue are read again. */
export function useReviewAction(projectId: string, roundId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationKey: [...resourceKeys.roundReview(projectId, roundId), 'decide'],
    mutationFn: (action: ReviewAction) => run(projectId, roundId, action),
    onSuccess: (review) => reviewChanged(queryClient, projectId, review),
  });
}
