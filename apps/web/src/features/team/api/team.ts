import { queryOptions, useMutation, useQueryClient, useSuspenseQuery } from '@tanstack/react-query';
import type { Invitation, InviteRequest, ProjectRole, Team } from '@/api/contract';
import { apiClient, unwrap } from '@/lib/api-client';

export const teamKeys = {
  all: ['team'] as const,
  detail: (projectId: string) => [...teamKeys.all, projectId] as const,
};

export function getTeam(projectId: string): Promise<Team> {
  return unwrap(apiClient.GET('/api/projects/{projectId}/team', { params: { path: { projectId } } }));
}

export const teamQueryOptions = (projectId: string) =>
  queryOptions({ queryKey: teamKeys.detail(projectId), queryFn: () => getTeam(projectId) });

export function useTeam(projectId: string) {
  return useSuspenseQuery(teamQueryOptions(projectId));
}

export type TeamChange =
  | { kind: 'invite'; body: InviteRequest }
  | { kind: 'resend'; invitationId: string }
  | { kind: 'withdraw'; invitationId: string }
  | { kind: 'role'; memberId: string; role: ProjectRole }
  | { kind: 'remove'; memberId: string };

export async function changeTeam(projectId: string, change: TeamChange): Promise<Invitation | Team | null> {
  switch (change.kind) {
    case 'invite':
      return unwrap(
        apiClient.POST('/api/projects/{projectId}/invitations', {
          params: { path: { projectId } },
          body: change.body,
        }),
      );
    case 'resend':
      return unwrap(
        apiClient.POST('/api/projects/{projectId}/invitations/{invitationId}/resend', {
          params: { path: { projectId, invitationId: change.invitationId } },
        }),
      );
    case 'withdraw':
      await unwrap(
        apiClient.DELETE('/api/projects/{projectId}/invitations/{invitationId}', {
          params: { path: { projectId, invitationId: change.invitationId } },
        }),
      );
      return null;
    case 'role':
      return unwrap(
        apiClient.PATCH('/api/projects/{projectId}/members/{memberId}', {
          params: { path: { projectId, memberId: change.memberId } },
          body: { role: change.role },
        }),
      );
    case 'remove':
      await unwrap(
        apiClient.DELETE('/api/projects/{projectId}/members/{memberId}', {
          params: { path: { projectId, memberId: change.memberId } },
        }),
      );
      return null;
  }
}

export function useChangeTeam(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationKey: [...teamKeys.detail(projectId), 'change'],
    mutationFn: (change: TeamChange) => changeTeam(projectId, change),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: teamKeys.detail(projectId) }),
  });
}
