/** The caller, as the JWT strategy puts it on the request. */
export interface AuthUser {
  id: string;
  email: string;
  name: string;
}

export const PROJECT_ROLES = ['admin', 'geologist', 'engineer', 'supervisor', 'viewer'] as const;
export type ProjectRole = (typeof PROJECT_ROLES)[number];

/** The caller's membership in the project named by the route's :projectId (set by ProjectAccessGuard). */
export interface ProjectAccess {
  projectId: string;
  role: ProjectRole;
}

/**
 * The caller's membership in the route's project, read with the account in the same statement by the JWT
 * strategy (one query per request instead of two; `npm run load`). Fresh for this request only, never kept
 * between requests: a removed member or a revoked token is refused at the very next request.
 * `role: null` means the account is no member of that project.
 */
export interface MembershipOfRequest {
  projectId: string;
  role: ProjectRole | null;
}

/** The request as the JWT strategy and the project-access guard share it. */
export interface RequestWithMembership {
  params?: Record<string, string | undefined>;
  membershipOfRequest?: MembershipOfRequest;
}

/** A project id as routes take it (anything else is answered 404 without asking the database). */
export const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
