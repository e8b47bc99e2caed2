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
    expect(labels({ role: 'viewer', localMode: true, memberships: [member('a', 'viewer')] })).toEqual([
      'Board',
      'Setup',
    ]);
    expect(labels({ role: 'geologist', localMode: false, memberships: [member('a', 'geologist')] })).toEqual([
      'Board',
      'Setup',
    ]);
    expect(labels({ role: 'engineer', localMode: false, memberships: [member('a', 'engineer')] })).toEqual([
      'Board',
      'To confirm',
      'Setup',
    ]);
    expect(
      labels({ role: 'supervisor', localMode: false, memberships: [member('a', 'supervisor')] }),
    ).toEqual(['Board', 'Received', 'Setup']);
    expect(labels({ role: 'admin', localMode: false, memberships: [member('a', 'admin')] })).toEqual([
      'Board',
      'Setup',
    ]);
  });

  it('shows Local mail only in local mode and only to someone who is admin somewhere', () => {
    const adminElsewhere = [member('a', 'viewer'), member('b', 'admin')];
    expect(labels({ role: 'viewer', localMode: true, memberships: adminElsewhere })).toEqual([
      'Board',
      'Setup',
      'Local mail',
    ]);
    expect(labels({ role: 'viewer', localMode: false, memberships: adminElsewhere })).toEqual([
      'Board',
      'Setup',
    ]);
    expect(labels({ role: null, localMode: false, memberships: [] })).toEqual(['Board']);
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
