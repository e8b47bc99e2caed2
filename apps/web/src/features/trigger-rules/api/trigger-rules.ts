import { queryOptions, useMutation, useQueryClient, useSuspenseQuery } from '@tanstack/react-query';
import type { CreateTriggerRuleRequest, TriggerRule, UpdateTriggerRuleRequest } from '@/api/contract';
import { apiClient, unwrap } from '@/lib/api-client';

export const triggerRuleKeys = {
  all: ['trigger-rules'] as const,
  list: (projectId: string) => [...triggerRuleKeys.all, projectId, 'list'] as const,
};

export function getTriggerRules(projectId: string): Promise<TriggerRule[]> {
  return unwrap(
    apiClient.GET('/api/projects/{projectId}/trigger-rules', { params: { path: { projectId } } }),
  );
}

export const triggerRulesQueryOptions = (projectId: string) =>
  queryOptions({ queryKey: triggerRuleKeys.list(projectId), queryFn: () => getTriggerRules(projectId) });

export function useTriggerRules(projectId: string) {
  return useSuspenseQuery(triggerRulesQueryOptions(projectId));
}

export type TriggerRuleChange =
  | { kind: 'create'; body: CreateTriggerRuleRequest }
  | { kind: 'update'; ruleId: string; body: UpdateTriggerRuleRequest }
  | { kind: 'delete'; ruleId: string };

export async function changeTriggerRule(
  projectId: string,
  change: TriggerRuleChange,
): Promise<TriggerRule | null> {
  switch (change.kind) {
    case 'create':
      return unwrap(
        apiClient.POST('/api/projects/{projectId}/trigger-rules', {
          params: { path: { projectId } },
          body: change.body,
        }),
      );
    case 'update':
      return unwrap(
        apiClient.PATCH('/api/projects/{projectId}/trigger-rules/{ruleId}', {
          params: { path: { projectId, ruleId: change.ruleId } },
          body: change.body,
        }),
      );
    case 'delete':
      await unwrap(
        apiClient.DELETE('/api/projects/{projectId}/trigger-rules/{ruleId}', {
          params: { path: { projectId, ruleId: change.ruleId } },
        }),
      );
      return null;
  }
}

export function useChangeTriggerRule(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationKey: [...triggerRuleKeys.all, projectId, 'change'],
    mutationFn: (change: TriggerRuleChange) => changeTriggerRule(projectId, change),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: triggerRuleKeys.list(projectId) }),
  });
}

/** How a rule (saved or not) would have fired on each heading's latest rounds; nothing is saved. */
export function previewTriggerRule(projectId: string, body: CreateTriggerRuleRequest) {
  return unwrap(
    apiClient.POST('/api/projects/{projectId}/trigger-rules/preview', {
      params: { path: { projectId } },
      body,
    }),
  );
}

export type TriggerPreview = Awaited<ReturnType<typeof previewTriggerRule>>;
export type TriggerPreviewMatch = TriggerPreview['matches'][number];

export function usePreviewTriggerRule(projectId: string) {
  return useMutation({
    mutationKey: [...triggerRuleKeys.all, projectId, 'preview'],
    mutationFn: (body: CreateTriggerRuleRequest) => previewTriggerRule(projectId, body),
  });
}
