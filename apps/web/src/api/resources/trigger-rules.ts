import type { QueryClient } from '@tanstack/react-query';
import { queryOptions } from '@tanstack/react-query';
import type { CreateTriggerRuleRequest, TriggerRule, UpdateTriggerRuleRequest } from '@/api/contract';
import { invalidateResource } from '@/api/resources/invalidate';
import { resourceKeys } from '@/api/resources/keys';
import { apiClient, unwrap } from '@/lib/api-client';

// GET/POST /projects/{projectId}/trigger-rules, PATCH/DELETE …/{ruleId}, POST …/preview.

export function getTriggerRules(projectId: string): Promise<TriggerRule[]> {
  return unwrap(
    apiClient.GET('/api/projects/{projectId}/trigger-rules', { params: { path: { projectId } } }),
  );
}

export const triggerRulesQueryOptions = (projectId: string) =>
  queryOptions({
    queryKey: resourceKeys.triggerRules(projectId),
    queryFn: () => getTriggerRules(projectId),
  });

export function createTriggerRule(projectId: string, body: CreateTriggerRuleRequest): Promise<TriggerRule> {
  return unwrap(
    apiClient.POST('/api/projects/{projectId}/trigger-rules', { params: { path: { projectId } }, body }),
  );
}

export function updateTriggerRule(
  projectId: string,
  ruleId: string,
  body: UpdateTriggerRuleRequest,
): Promise<TriggerRule> {
  return unwrap(
    apiClient.PATCH('/api/projects/{projectId}/trigger-rules/{ruleId}', {
      params: { path: { projectId, ruleId } },
      body,
    }),
  );
}

export async function deleteTriggerRule(projectId: string, ruleId: string): Promise<void> {
  await unwrap(
    apiClient.DELETE('/api/projects/{projectId}/trigger-rules/{ruleId}', {
      params: { path: { projectId, ruleId } },
    }),
  );
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

/** After a rule changes: the rules are read again. */
export function triggerRulesChanged(queryClient: QueryClient, projectId: string): Promise<void> {
  return invalidateResource(queryClient, resourceKeys.triggerRules(projectId), { exact: true });
}
