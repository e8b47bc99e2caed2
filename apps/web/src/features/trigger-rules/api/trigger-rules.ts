import { useMutation, useQueryClient, useSuspenseQuery } from '@tanstack/react-query';
import type { CreateTriggerRuleRequest, TriggerRule, UpdateTriggerRuleRequest } from '@/api/contract';
import { resourceKeys } from '@/api/resources/keys';
import type { TriggerPreview } from '@/api/resources/trigger-rules';
import {
  createTriggerRule,
  deleteTriggerRule,
  previewTriggerRule,
  triggerRulesChanged,
  triggerRulesQueryOptions,
  updateTriggerRule,
} from '@/api/resources/trigger-rules';

export type { TriggerPreview };
export type TriggerPreviewMatch = TriggerPreview['matches'][number];

export function useTriggerRules(projectId: string) {
  return useSuspenseQuery(triggerRulesQueryOptions(projectId));
}

export type TriggerRuleChange =
  | { kind: 'create'; body: CreateTriggerRuleRequest }
  | { kind: 'update'; ruleId: string; body: UpdateTriggerRuleRequest }
  | { kind: 'delete'; ruleId: string };

async function run(projectId: string, change: TriggerRuleChange): Promise<TriggerRule | null> {
  switch (change.kind) {
    case 'create':
      return createTriggerRule(projectId, change.body);
    case 'update':
      return updateTriggerRule(projectId, change.ruleId, change.body);
    case 'delete':
      await deleteTriggerRule(projectId, change.ruleId);
      return null;
  }
}

/** Reads the rules from the server now (into their one cache entry), e.g. after a 409. */
export function useReloadTriggerRules(projectId: string) {
  const queryClient = useQueryClient();
  return () => queryClient.fetchQuery({ ...triggerRulesQueryOptions(projectId), staleTime: 0 });
}

export function useChangeTriggerRule(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationKey: [...resourceKeys.triggerRules(projectId), 'change'],
    mutationFn: (change: TriggerRuleChange) => run(projectId, change),
    onSuccess: () => triggerRulesChanged(queryClient, projectId),
  });
}

export function usePreviewTriggerRule(projectId: string) {
  return useMutation({
    mutationKey: [...resourceKeys.triggerRules(projectId), 'preview'],
    mutationFn: (body: CreateTriggerRuleRequest) => previewTriggerRule(projectId, body),
  });
}
