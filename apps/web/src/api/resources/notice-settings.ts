import { queryOptions } from '@tanstack/react-query';
import type { NoticeSettings, UpdateNoticeSettingsRequest } from '@/api/contract';
import { resourceKeys } from '@/api/resources/keys';
import { apiClient, unwrap } from '@/lib/api-client';

// GET/PUT /projects/{projectId}/notice-settings: the signed-in person's own choice of review notices.

export function getNoticeSettings(projectId: string): Promise<NoticeSettings> {
  return unwrap(
    apiClient.GET('/api/projects/{projectId}/notice-settings', { params: { path: { projectId } } }),
  );
}

export const noticeSettingsQueryOptions = (projectId: string) =>
  queryOptions({
    queryKey: resourceKeys.noticeSettings(projectId),
    queryFn: () => getNoticeSettings(projectId),
  });

export function saveNoticeSettings(
  projectId: string,
  body: UpdateNoticeSettingsRequest,
): Promise<NoticeSettings> {
  return unwrap(
    apiClient.PUT('/api/projects/{projectId}/notice-settings', { params: { path: { projectId } }, body }),
  );
}
