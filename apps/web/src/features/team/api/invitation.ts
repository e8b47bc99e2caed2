import { queryOptions, useMutation, useQuery } from '@tanstack/react-query';
import type { AcceptInvitationRequest, InvitationInfo, LoginResponse } from '@/api/contract';
import { apiClient, unwrap } from '@/lib/api-client';

export const invitationKeys = {
  all: ['invitation'] as const,
  detail: (token: string) => [...invitationKeys.all, token] as const,
};

/** What a (public) invitation link is for: project, role, e-mail, and whether the account exists. */
export function getInvitation(token: string): Promise<InvitationInfo> {
  return unwrap(apiClient.GET('/api/invitations/{token}', { params: { path: { token } } }));
}

export const invitationQueryOptions = (token: string) =>
  queryOptions({ queryKey: invitationKeys.detail(token), queryFn: () => getInvitation(token), retry: false });

export function useInvitation(token: string) {
  return useQuery(invitationQueryOptions(token));
}

export function acceptInvitation(token: string, body: AcceptInvitationRequest): Promise<LoginResponse> {
  return unwrap(apiClient.POST('/api/invitations/{token}/accept', { params: { path: { token } }, body }));
}

export function useAcceptInvitation(token: string) {
  return useMutation({
    mutationKey: [...invitationKeys.detail(token), 'accept'],
    mutationFn: (body: AcceptInvitationRequest) => acceptInvitation(token, body),
  });
}
