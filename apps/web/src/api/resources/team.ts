import type { QueryClient } from '@tanstack/react-query';
import { queryOptions } from '@tanstack/react-query';
import type {
  AcceptInvitationRequest,
  Invitation,
  InvitationInfo,
  InviteRequest,
  ProjectRole,
  Team,
} from '@/api/contract';
import type { components } from '@/api/generated/schema';
import { invalidateResource } from '@/api/resources/invalidate';
import { resourceKeys } from '@/api/resources/keys';
import { apiClient, unwrap } from '@/lib/api-client';
import { getAccessToken } from '@/lib/session';

// GET /projects/{projectId}/team, POST …/invitations, POST …/invitations/{id}/resend,
// DELETE …/invitations/{id}, PATCH/DELETE …/members/{memberId}; GET/POST /invitations/{token}(/accept).

export function getTeam(projectId: string): Promise<Team> {
  return unwrap(apiClient.GET('/api/projects/{projectId}/team', { params: { path: { projectId } } }));
}

export const teamQueryOptions = (projectId: string) =>
  queryOptions({ queryKey: resourceKeys.team(projectId), queryFn: () => getTeam(projectId) });

export function invite(projectId: string, body: InviteRequest): Promise<Invitation> {
  return unwrap(
    apiClient.POST('/api/projects/{projectId}/invitations', { params: { path: { projectId } }, body }),
  );
}

export function resendInvitation(projectId: string, invitationId: string) {
  return unwrap(
    apiClient.POST('/api/projects/{projectId}/invitations/{invitationId}/resend', {
      params: { path: { projectId, invitationId } },
    }),
  );
}

export async function withdrawInvitation(projectId: string, invitationId: string): Promise<void> {
  await unwrap(
    apiClient.DELETE('/api/projects/{projectId}/invitations/{invitationId}', {
      params: { path: { projectId, invitationId } },
    }),
  );
}

export function changeMemberRole(projectId: string, memberId: string, role: ProjectRole) {
  return unwrap(
    apiClient.PATCH('/api/projects/{projectId}/members/{memberId}', {
      params: { path: { projectId, memberId } },
      body: { role },
    }),
  );
}

export async function removeMember(projectId: string, memberId: string): Promise<void> {
  await unwrap(
    apiClient.DELETE('/api/projects/{projectId}/members/{memberId}', {
      params: { path: { projectId, memberId } },
    }),
  );
}

/** After any change of the team: the team is read again. */
export function teamChanged(queryClient: QueryClient, projectId: string): Promise<void> {
  return invalidateResource(queryClient, resourceKeys.team(projectId), { exact: true });
}

/** What a (public) invitation link is for: project, role, the invited address and the name typed for it. */
export function getInvitation(token: string): Promise<InvitationInfo> {
  return unwrap(apiClient.GET('/api/invitations/{token}', { params: { path: { token } } }));
}

export const invitationQueryOptions = (token: string) =>
  queryOptions({
    queryKey: resourceKeys.invitation(token),
    queryFn: () => getInvitation(token),
    retry: false,
  });

/** The answer to accepting: the project joined, and a session when the account was created just now. */
export type AcceptedInvitation = components['schemas']['AcceptedInvitationDto'];

/**
 * Accepts: signed in (the session's bearer token is sent) joins with that account, which must be the
 * invited address; not signed in, creates the account for the invited address.
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
