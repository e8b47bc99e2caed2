import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { NoticeSettings, UpdateNoticeSettingsRequest } from '@/api/contract';
import { resourceKeys } from '@/api/resources/keys';
import { noticeSettingsQueryOptions, saveNoticeSettings } from '@/api/resources/notice-settings';

export type { NoticeSettings };

export function useNoticeSettings(projectId: string) {
  return useQuery(noticeSettingsQueryOptions(projectId));
}

/** Saves the whole choice; the server's answer becomes the cached settings. */
export function useSaveNoticeSettings(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationKey: [...resourceKeys.noticeSettings(projectId), 'save'],
    mutationFn: (body: UpdateNoticeSettingsRequest) => saveNoticeSettings(projectId, body),
    onSuccess: (saved) => queryClient.setQueryData(resourceKeys.noticeSettings(projectId), saved),
  });
}
