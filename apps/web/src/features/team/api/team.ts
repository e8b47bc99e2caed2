import { useMutation, useQueryClient, useSuspenseQuery } from '@tanstack/react-query';
import type { InviteRequest, ProjectRole } from '@/api/contract';
import { resourceKeys } from '@/api/resources/keys';
import {
  changeMemberRole,
  invite,
  removeMember,
  resendInvitation,
  teamChanged,
  teamQueryOptions,
  withdrawInvitation,
} from '@/api/resources/team';

export function useTeam(projectId: string) {
  return useSuspenseQuery(teamQueryOptions(projectId));
}

export type TeamChange =
  | { kind: 'invite'; body: InviteRequest }
  | { kind: 'resend'; invitationId: string }
  | { kind: 'withdraw'; invitationId: string }
  | { kind: 'role'; memberId: string; role: ProjectRole }
  | { kind: 'remove'; memberId: string };

async function run(projectId: string, change: TeamChange) {
  switch (change.kind) {
    case 'invite':
      return invite(projectId, change.body);
    case 'resend':
      return resendInvitation(projectId, change.invitationId);
    case 'withdraw':
      await withdrawInvitation(projectId, change.invitationId);
      return null;
    case 'role':
      return changeMemberRole(projectId, change.memberId, change.role);
    case 'remove':
      await removeMember(projectId, change.memberId);
      return null;
  }
}

export function useChangeTeam(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationKey: [...resourceKeys.team(projectId), 'change'],
    mutationFn: (change: TeamChange) => run(projectId, change),
    onSuccess: () => teamChanged(queryClient, projectId),
  });
}
