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
