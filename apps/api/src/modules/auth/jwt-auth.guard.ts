import { Inject, Injectable, type CanActivate, type ExecutionContext } from '@nestjs/common';
import type { OnModuleDestroy } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import { AuthGuard } from '@nestjs/passport';
import type { IAuthGuard } from '@nestjs/passport';
import type { AuthUser } from '../../common/auth/auth-user.js';
import { IS_PUBLIC } from '../../common/auth/public.decorator.js';
import { answerOfDatabaseError } from '../../common/errors/database-errors.js';
import { DomainException, ErrorCode } from '../../common/errors/domain.exception.js';
import { JWT_STRATEGY, type JwtStrategyHandle } from './jwt.strategy.js';

/**
 * Global guard: every route needs a valid bearer token unless marked @Public(). The token goes through
 * passport-jwt (`@nestjs/passport`'s AuthGuard with this app's strategy); failures read as words a person
 * can act on.
 */
@Injectable()
export class JwtAuthGuard implements CanActivate, OnModuleDestroy {
  private readonly passportGuard: IAuthGuard;

  constructor(
    @Inject(Reflector) private readonly reflector: Reflector,
    @Inject(JWT_STRATEGY) private readonly strategy: JwtStrategyHandle,
  ) {
    const PassportGuard = AuthGuard(strategy.strategyName);
    // `session: false`: bearer tokens only, nothing kept on the server between requests.
    this.passportGuard = new (class extends PassportGuard {
      override handleRequest<TUser = AuthUser>(err: unknown, user: TUser | false, info: unknown): TUser {
        if (err instanceof DomainException) throw err;
        // The token could not be checked (the database did not answer while reading its account): that is the
        // server's trouble, answered 503 with Retry-After by the exception filter, never "please sign in"
        // (found by the cluster proof: a Galera node killed mid-load sent signed-in people to sign-in).
        if (err instanceof Error && answerOfDatabaseError(err)?.status === 503) throw err;
        if (err || !user) {
          const expired = info instanceof Error && info.name === 'TokenExpiredError';
          throw new DomainException(
            ErrorCode.Unauthenticated,
            expired ? 'Your session has expired. Please sign in again.' : 'Please sign in to continue.',
          );
        }
        return user;
      }
    })({ session: false });
  }

  async canActivate(context: ExecutionContext): Promise<boolean> {
    const isPublic = this.reflector.getAllAndOverride<boolean>(IS_PUBLIC, [
      context.getHandler(),
      context.getClass(),
    ]);
    if (isPublic) return true;
    return (await this.passportGuard.canActivate(context)) as boolean;
  }

  onModuleDestroy(): void {
    this.strategy.unregister();
  }
}
