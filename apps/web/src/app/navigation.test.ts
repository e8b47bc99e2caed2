import { navigationFor, pickCurrentProject, rememberCurrentProject } from './navigation';
import type { Membership } from '@/api/contract';

const member = (projectId: string, role: Membership['role']): Membership => ({
  projectId,
  projectName: `Project ${projectId}`,
  role,
});

const labels = (ctx: Parameters<typeof navigationFor>[0]) => navigationFor(ctx).map((i) => i.label);

describe('navigationFor', () => {
  it('gives every role the Board, its own page and Setup (read-only for all but admins)', () => {
    expect(labels({ role: 'viewer', localAccess: { localMode: true, operator: false } })).toEqual([
      'Board',
      'Setup',
    ]);
    expect(labels({ role: 'geologist', localAccess: null })).toEqual(['Board', 'Setup']);
    expect(labels({ role: 'engineer', localAccess: null })).toEqual(['Board', 'To confirm', 'Setup']);
    expect(labels({ role: 'supervisor', localAccess: null })).toEqual(['Board', 'Received', 'Setup']);
    expect(labels({ role: 'admin', localAccess: null })).toEqual(['Board', 'Setup']);
  });

  it('shows Local mail only in local mode and only to an operator of this instance', () => {
    expect(labels({ role: 'viewer', localAccess: { localMode: true, operator: true } })).toEqual([
      'Board',
      'Setup',
      'Local mail',
    ]);
    expect(labels({ role: 'viewer', localAccess: { localMode: false, operator: true } })).toEqual([
      'Board',
      'Setup',
    ]);
    // A project admin who does not run the instance is not shown it (the API refuses them too).
    expect(labels({ role: 'admin', localAccess: { localMode: true, operator: false } })).toEqual([
      'Board',
      'Setup',
    ]);
    expect(labels({ role: null, localAccess: null })).toEqual(['Board']);
  });
});

describe('pickCurrentProject', () => {
  it('returns the remembered project while the person is still a member of it', () => {
    const memberships = [member('a', 'viewer'), member('b', 'engineer')];
    expect(pickCurrentProject(memberships)?.projectId).toBe('a');
    rememberCurrentProject('b');
    expect(pickCurrentProject(memberships)?.projectId).toBe('b');
    rememberCurrentProject('gone');
    expect(pickCurrentProject(memberships)?.projectId).toBe('a');
    expect(pickCurrentProject([])).toBeNull();
  });
});
