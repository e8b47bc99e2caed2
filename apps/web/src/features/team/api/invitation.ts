import { queryOptions, useMutation, useQuery } from '@tanstack/react-query';
import type { AcceptInvitationRequest, InvitationInfo } from '@/api/contract';
import type { components } from '@/api/generated/schema';
import { apiClient, unwrap } from '@/lib/api-client';
import { getAccessToken } from '@/lib/session';

export const invitationKeys = {
  all: ['invitation'] as const,
  detail: (token: string) => [...invitationKeys.all, token] as const,
};

/** The answer to accepting: the project joined, and a session when the account was created just now. */
export type AcceptedInvitation = components['schemas']['AcceptedInvitationDto'];

/** What a (public) invitation link is for: project, role, the invited address and the name typed for it. */
export function getInvitation(token: string): Promise<InvitationInfo> {
  return unwrap(apiClient.GET('/api/invitations/{token}', { params: { path: { token } } }));
}

export const invitationQueryOptions = (token: string) =>
  queryOptions({ queryKey: invitationKeys.detail(token), queryFn: () => getInvitation(token), retry: false });

export function useInvitation(token: string) {
  return useQuery(invitationQueryOptions(token));
}

/**
 * Accepts: signed in (the client sends the session's bearer token) joins with that account, which must be
 * the invited address; not signed in, creates the account for the invited address.
 */
export function acceptInvitation(token: string, body: AcceptInvitationRequest): Promise<AcceptedInvitation> {
  // The client leaves tokens off public routes; this one reads the session when there is one.
  const session = getAccessToken();
  return unwrap(
    apiClient.POST('/api/invitations/{token}/accept', {
      params: { path: { token } },
      body,
      headers: session === null ? {} : { Authorization: `Bearer ${session}` },
    }),
  );
}

export function useAcceptInvitation(token: string) {
  return useMutation({
    mutationKey: [...invitationKeys.detail(token), 'accept'],
    mutationFn: (body: AcceptInvitationRequest) => acceptInvitation(token, body),
  });
}
