import type { ExecutionContext } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import { Test } from '@nestjs/testing';
import { getRepositoryToken } from '@nestjs/typeorm';
import { ProjectMember } from '../../modules/projects/project-member.entity';
import { DomainException } from '../errors/domain.exception';
import { ProjectAccessGuard } from './project-access.guard';

const PROJECT = '3f1b2c4d-1111-4222-8333-944455556666';

function context(params: Record<string, string>, roles: string[] | undefined) {
  const req: Record<string, unknown> = { user: { id: 'u1' }, params };
  const handler = () => undefined;
  Reflect.defineMetadata('projectRoles', roles, handler);
  const ctx = {
    switchToHttp: () => ({ getRequest: () => req }),
    getHandler: () => handler,
    getClass: () => class {},
  } as unknown as ExecutionContext;
  return { ctx, req };
}

describe('ProjectAccessGuard', () => {
  let sut: ProjectAccessGuard;
  const findOne = jest.fn();

  beforeEach(async () => {
    findOne.mockReset();
    const moduleRef = await Test.createTestingModule({
      providers: [
        ProjectAccessGuard,
        Reflector,
        { provide: getRepositoryToken(ProjectMember), useValue: { findOne } },
      ],
    }).compile();
    sut = moduleRef.get(ProjectAccessGuard);
  });

  it('answers 404 to a non-member', async () => {
    findOne.mockResolvedValue(null);
    const { ctx } = context({ projectId: PROJECT }, ['admin']);
    await expect(sut.canActivate(ctx)).rejects.toMatchObject({ code: 'NOT_FOUND' });
  });

  it('answers 404 to a malformed project id without asking the database', async () => {
    const { ctx } = context({ projectId: '1 OR 1=1' }, undefined);
    await expect(sut.canActivate(ctx)).rejects.toBeInstanceOf(DomainException);
    expect(findOne).not.toHaveBeenCalled();
  });

  it('answers 403 to a member without one of the roles, naming the roles needed', async () => {
    findOne.mockResolvedValue({ role: 'viewer' });
    const { ctx } = context({ projectId: PROJECT }, ['admin', 'engineer']);
    await expect(sut.canActivate(ctx)).rejects.toMatchObject({
      code: 'FORBIDDEN',
      message: expect.stringMatching(/admin or engineer/),
    });
  });

  it('lets a member with the role through and records the access on the request', async () => {
    findOne.mockResolvedValue({ role: 'engineer' });
    const { ctx, req } = context({ projectId: PROJECT }, ['admin', 'engineer']);
    await expect(sut.canActivate(ctx)).resolves.toBe(true);
    expect(req.projectAccess).toEqual({ projectId: PROJECT, role: 'engineer' });
  });

  it('lets any member through when no role is listed', async () => {
    findOne.mockResolvedValue({ role: 'viewer' });
    const { ctx } = context({ projectId: PROJECT }, []);
    await expect(sut.canActivate(ctx)).resolves.toBe(true);
  });

  it('takes the membership the JWT strategy read with the account in this request, asking nothing more', async () => {
    const { ctx, req } = context({ projectId: PROJECT }, ['engineer']);
    req.membershipOfRequest = { projectId: PROJECT, role: 'engineer' };
    await expect(sut.canActivate(ctx)).resolves.toBe(true);
    expect(req.projectAccess).toEqual({ projectId: PROJECT, role: 'engineer' });
    expect(findOne).not.toHaveBeenCalled();
  });

  it('answers 404 when the membership read with the account says the caller is no member', async () => {
    const { ctx, req } = context({ projectId: PROJECT }, undefined);
    req.membershipOfRequest = { projectId: PROJECT, role: null };
    await expect(sut.canActivate(ctx)).rejects.toMatchObject({ code: 'NOT_FOUND' });
    expect(findOne).not.toHaveBeenCalled();
  });

  it('asks the database when the membership on the request is of another project', async () => {
    findOne.mockResolvedValue(null);
    const { ctx, req } = context({ projectId: PROJECT }, undefined);
    req.membershipOfRequest = { projectId: '3f1b2c4d-2222-4222-8333-944455556666', role: 'admin' };
    await expect(sut.canActivate(ctx)).rejects.toMatchObject({ code: 'NOT_FOUND' });
    expect(findOne).toHaveBeenCalledTimes(1);
  });
});
