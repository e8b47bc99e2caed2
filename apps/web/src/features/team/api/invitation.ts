import { useMutation, useQuery } from '@tanstack/react-query';
import type { AcceptInvitationRequest } from '@/api/contract';
import { resourceKeys } from '@/api/resources/keys';
import { acceptInvitation, invitationQueryOptions } from '@/api/resources/team';

export type { AcceptedInvitation } from '@/api/resources/team';

export function useInvitation(token: string) {
  return useQuery(invitationQueryOptions(token));
}

export function useAcceptInvitation(token: string) {
  return useMutation({
    mutationKey: [...resourceKeys.invitation(token), 'accept'],
    mutationFn: (body: AcceptInvitationRequest) => acceptInvitation(token, body),
  });
}
