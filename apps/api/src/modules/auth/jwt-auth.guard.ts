import { Inject, Injectable, type ExecutionContext } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import { AuthGuard } from '@nestjs/passport';
import { IS_PUBLIC } from '../../common/auth/public.decorator.js';
import { DomainException, ErrorCode } from '../../common/errors/domain.exception.js';

/** Global guard: every route needs a valid bearer token unless marked @Public(). */
@Injectable()
export class JwtAuthGuard extends AuthGuard('jwt') {
  constructor(@Inject(Reflector) private readonly reflector: Reflector) {
    super();
  }

  override canActivate(
    context: ExecutionContext,
  ): ReturnType<InstanceType<ReturnType<typeof AuthGuard>>['canActivate']> {
    const isPublic = this.reflector.getAllAndOverride<boolean>(IS_PUBLIC, [
      context.getHandler(),
      context.getClass(),
    ]);
    if (isPublic) return true;
    return super.canActivate(context);
  }

  override handleRequest<T>(err: unknown, user: T, info: unknown): T {
    if (err instanceof DomainException) throw err;
    if (err || !user) {
      const expired = info instanceof Error && info.name === 'TokenExpiredError';
      throw new DomainException(
        ErrorCode.Unauthenticated,
        expired ? 'Your session has expired. Please sign in again.' : 'Please sign in to continue.',
      );
    }
    return user;
  }
}
