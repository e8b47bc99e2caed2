import type { Membership, ProjectRole } from '@/api/contract';

export interface NavItem {
  to: string;
  label: string;
  /** Icon key, resolved to an icon in the shell. */
  icon: 'board' | 'confirm' | 'received' | 'setup' | 'mail';
}

export interface NavContext {
  /** The person's role in the project they are looking at (null: no project). */
  role: ProjectRole | null;
  /**
   * GET /api/local/access: local mode is on and the person is an operator of this instance (not a
   * project role). Absent or null while it is being read, or when it could not be read.
   */
  localAccess?: { localMode: boolean; operator: boolean } | null;
}

/** The pages each role works from (product design, "People and roles" and "Screens"). */
export function navigationFor({ role, localAccess = null }: NavContext): NavItem[] {
  const items: NavItem[] = [{ to: '/', label: 'Board', icon: 'board' }];
  if (role === 'engineer') items.push({ to: '/to-confirm', label: 'To confirm', icon: 'confirm' });
  if (role === 'supervisor') items.push({ to: '/received', label: 'Received', icon: 'received' });
  // Everyone in a project may read its setup; only admins (and engineers, for triggers) change it.
  if (role !== null) items.push({ to: '/setup', label: 'Setup', icon: 'setup' });
  // The local mail and jobs view is the instance operator's, as the API decides (OperatorGuard).
  if (localAccess?.localMode === true && localAccess.operator) {
    items.push({ to: '/mail', label: 'Local mail', icon: 'mail' });
  }
  return items;
}

const CURRENT_PROJECT_KEY = 'roundbook.currentProject';

/** The project the person last chose, if they are still a member; else their first project. */
export function pickCurrentProject(memberships: Membership[]): Membership | null {
  let stored: string | null = null;
  try {
    stored = window.localStorage.getItem(CURRENT_PROJECT_KEY);
  } catch {
    stored = null;
  }
  return memberships.find((m) => m.projectId === stored) ?? memberships[0] ?? null;
}

export function rememberCurrentProject(projectId: string): void {
  try {
    window.localStorage.setItem(CURRENT_PROJECT_KEY, projectId);
  } catch {
    // Without storage the choice lasts for this visit only.
  }
}
