import { Inject, Injectable } from '@nestjs/common';
import { PassportStrategy } from '@nestjs/passport';
import { ExtractJwt, Strategy } from 'passport-jwt';
import type { AuthUser } from '../../common/auth/auth-user.js';
import { DomainException, ErrorCode } from '../../common/errors/domain.exception.js';
import { APP_CONFIG, type AppConfig } from '../../config/app-config.js';
import { AuthService, type JwtPayload } from './auth.service.js';

@Injectable()
export class JwtStrategy extends PassportStrategy(Strategy) {
  constructor(
    @Inject(APP_CONFIG) config: AppConfig,
    @Inject(AuthService) private readonly auth: AuthService,
  ) {
    super({
      jwtFromRequest: ExtractJwt.fromAuthHeaderAsBearerToken(),
      ignoreExpiration: false,
      secretOrKey: config.auth.jwtSecret,
      algorithms: ['HS256'],
    });
  }

  async validate(payload: JwtPayload): Promise<AuthUser> {
    const user = await this.auth.userOfToken(payload);
    if (!user)
      throw new DomainException(
        ErrorCode.Unauthenticated,
        'This account no longer exists. Please sign in again.',
      );
    return user;
  }
}
