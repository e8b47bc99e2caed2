import { Inject, Injectable, type CanActivate, type ExecutionContext } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import { JwtService } from '@nestjs/jwt';
import type { Request } from 'express';
import type { AuthUser } from '../../common/auth/auth-user.js';
import { IS_PUBLIC } from '../../common/auth/public.decorator.js';
import { DomainException, ErrorCode } from '../../common/errors/domain.exception.js';
import { AuthService, type JwtPayload } from './auth.service.js';

/**
 * Global guard: every route needs a valid bearer token unless marked @Public(). The token is verified with
 * the app's own JwtService (no process-wide strategy registry), and the account must still exist.
 */
@Injectable()
export class JwtAuthGuard implements CanActivate {
  constructor(
    @Inject(Reflector) private readonly reflector: Reflector,
    @Inject(JwtService) private readonly jwt: JwtService,
    @Inject(AuthService) private readonly auth: AuthService,
  ) {}

  async canActivate(context: ExecutionContext): Promise<boolean> {
    const isPublic = this.reflector.getAllAndOverride<boolean>(IS_PUBLIC, [
      context.getHandler(),
      context.getClass(),
    ]);
    if (isPublic) return true;
    const req = context.switchToHttp().getRequest<Request & { user?: AuthUser }>();
    const [scheme, token] = (req.headers.authorization ?? '').split(' ');
    if (scheme?.toLowerCase() !== 'bearer' || !token) {
      throw new DomainException(ErrorCode.Unauthenticated, 'Please sign in to continue.');
    }
    let payload: JwtPayload;
    try {
      payload = await this.jwt.verifyAsync<JwtPayload>(token, { algorithms: ['HS256'] });
    } catch (e) {
      const expired = e instanceof Error && e.name === 'TokenExpiredError';
      throw new DomainException(
        ErrorCode.Unauthenticated,
        expired ? 'Your session has expired. Please sign in again.' : 'Please sign in to continue.',
      );
    }
    const user = await this.auth.userOfToken(payload);
    if (!user)
      throw new DomainException(
        ErrorCode.Unauthenticated,
        'Your session has ended (signed out on every device, a new password, or the account was removed). Please sign in again.',
      );
    req.user = user;
    return true;
  }
}
