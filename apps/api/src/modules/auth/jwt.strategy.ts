import { randomUUID } from 'node:crypto';
import { PassportStrategy } from '@nestjs/passport';
import passport from 'passport';
import { ExtractJwt, Strategy } from 'passport-jwt';
import { UUID, type AuthUser, type RequestWithMembership } from '../../common/auth/auth-user.js';
import { DomainException, ErrorCode } from '../../common/errors/domain.exception.js';
import type { AuthService, JwtPayload } from './auth.service.js';

/** Injection token of the app's bearer-token strategy. */
export const JWT_STRATEGY = Symbol('JWT_STRATEGY');

/** What the guard needs of the strategy: the name it is registered under in passport. */
export interface JwtStrategyHandle {
  readonly strategyName: string;
  /** Takes the strategy out of passport's registry (at shutdown). */
  unregister(): void;
}

export const SESSION_ENDED_MESSAGE =
  'Your session has ended (signed out on every device, a new password, or the account was removed). Please sign in again.';

/**
 * The bearer-token strategy (passport-jwt through @nestjs/passport): HS256 only, the token taken from
 * `Authorization: Bearer …`, and the account must still exist with the token version the token carries.
 *
 * passport keeps strategies in one process-wide registry. Each app registers its strategy under a name of
 * its own (`jwt-<uuid>`), so two apps in one process — an API and a worker, or the e2e tests that boot
 * apps with different settings — never answer with each other's secret or database (stack-notes §12).
 */
export function createJwtStrategy(secret: string, auth: AuthService): JwtStrategyHandle {
  const strategyName = `jwt-${randomUUID()}`;

  class JwtStrategy extends PassportStrategy(Strategy, strategyName) {
    readonly strategyName = strategyName;

    constructor() {
      super({
        jwtFromRequest: ExtractJwt.fromAuthHeaderAsBearerToken(),
        secretOrKey: secret,
        algorithms: ['HS256'],
        ignoreExpiration: false,
        passReqToCallback: true,
      });
    }

    async validate(req: RequestWithMembership, payload: JwtPayload): Promise<AuthUser> {
      // On a project's route the membership is read with the account (one statement, not two); the
      // project-access guard takes it from the request instead of asking again. A malformed id is left to
      // that guard (404 without asking the database).
      const projectId = req.params?.projectId;
      const { user, membership } = await auth.userAndMembershipOfToken(
        payload,
        projectId && UUID.test(projectId) ? projectId : undefined,
      );
      if (!user) throw new DomainException(ErrorCode.Unauthenticated, SESSION_ENDED_MESSAGE);
      if (membership) req.membershipOfRequest = membership;
      return user;
    }

    unregister(): void {
      passport.unuse(strategyName);
    }
  }

  return new JwtStrategy();
}
