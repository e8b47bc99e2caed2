import type { components } from '@/api/generated/schema';
import { apiClient, unwrap } from '@/lib/api-client';

// GET /projects/{projectId}/audit (any member): the project's audit trail, newest first.

export type AuditEvent = components['schemas']['AuditEventDto'];

export function getAuditEvents(
  projectId: string,
  query: { entityType?: string; entityId?: string; limit?: number },
): Promise<AuditEvent[]> {
  return unwrap(apiClient.GET('/api/projects/{projectId}/audit', { params: { path: { projectId }, query } }));
}
