import type { ExecutionContext } from '@nestjs/common';
import type { DataSource } from 'typeorm';
import type { AppConfig } from '../../config/app-config';
import { ProjectCreationGuard } from '../users/project-creation.guard';
import { OperatorGuard } from './operator.guard';

const contextFor = (user?: { id: string }): ExecutionContext =>
  ({ switchToHttp: () => ({ getRequest: () => ({ user }) }) }) as unknown as ExecutionContext;

/** A DataSource whose users table holds the given operator flags. */
function usersTable(flags: Record<string, boolean>): { ds: DataSource; reads: string[] } {
  const reads: string[] = [];
  const ds = {
    getRepository: () => ({
      findOne: ({ where }: { where: { id: string } }) => {
        reads.push(where.id);
        return Promise.resolve(where.id in flags ? { id: where.id, isOperator: flags[where.id] } : null);
      },
    }),
  } as unknown as DataSource;
  return { ds, reads };
}

const config = (over: Partial<AppConfig>): AppConfig =>
  ({
    localMode: true,
    mail: { localInboxDir: '/tmp/mail' },
    projectCreation: 'anyone',
    ...over,
  }) as AppConfig;

describe('OperatorGuard (local mail and jobs view)', () => {
  it('lets the instance operator in, read fresh from the users table', async () => {
    const { ds, reads } = usersTable({ op: true });
    const sut = new OperatorGuard(ds, config({}));
    await expect(sut.canActivate(contextFor({ id: 'op' }))).resolves.toBe(true);
    expect(reads).toEqual(['op']);
  });

  it('refuses a project admin who is not the operator with 403, and an unknown account too', async () => {
    const { ds } = usersTable({ admin: false });
    const sut = new OperatorGuard(ds, config({}));
    await expect(sut.canActivate(contextFor({ id: 'admin' }))).rejects.toMatchObject({ status: 403 });
    await expect(sut.canActivate(contextFor({ id: 'gone' }))).rejects.toMatchObject({ status: 403 });
    await expect(sut.canActivate(contextFor(undefined))).rejects.toMatchObject({ status: 403 });
  });

  it('answers 404 outside local mode, even to the operator, without reading the table', async () => {
    const { ds, reads } = usersTable({ op: true });
    const off = new OperatorGuard(ds, config({ localMode: false }));
    await expect(off.canActivate(contextFor({ id: 'op' }))).rejects.toMatchObject({ status: 404 });
    const noInbox = new OperatorGuard(
      ds,
      config({ mail: { localInboxDir: undefined } as AppConfig['mail'] }),
    );
    await expect(noInbox.canActivate(contextFor({ id: 'op' }))).rejects.toMatchObject({ status: 404 });
    expect(reads).toEqual([]);
  });
});

describe('ProjectCreationGuard (PROJECT_CREATION)', () => {
  it('lets anyone signed in create projects with PROJECT_CREATION=anyone', async () => {
    const { ds, reads } = usersTable({});
    await expect(new ProjectCreationGuard(ds, config({})).canActivate(contextFor({ id: 'x' }))).resolves.toBe(
      true,
    );
    expect(reads).toEqual([]);
  });

  it('lets only operators create projects with PROJECT_CREATION=operators', async () => {
    const { ds } = usersTable({ op: true, member: false });
    const sut = new ProjectCreationGuard(ds, config({ projectCreation: 'operators' }));
    await expect(sut.canActivate(contextFor({ id: 'op' }))).resolves.toBe(true);
    await expect(sut.canActivate(contextFor({ id: 'member' }))).rejects.toMatchObject({ status: 403 });
  });
});
