import { createParamDecorator, type ExecutionContext } from '@nestjs/common';
import type { AuthUser, ProjectAccess } from './auth-user.js';

export const CurrentUser = createParamDecorator((_: unknown, ctx: ExecutionContext): AuthUser => {
  return ctx.switchToHttp().getRequest<{ user: AuthUser }>().user;
});

export const CurrentAccess = createParamDecorator((_: unknown, ctx: ExecutionContext): ProjectAccess => {
  return ctx.switchToHttp().getRequest<{ projectAccess: ProjectAccess }>().projectAccess;
});
