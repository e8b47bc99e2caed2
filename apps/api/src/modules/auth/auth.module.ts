import { Module } from '@nestjs/common';
import { JwtModule } from '@nestjs/jwt';
import { PassportModule } from '@nestjs/passport';
import { ThrottlerModule } from '@nestjs/throttler';
import { TypeOrmModule } from '@nestjs/typeorm';
import { APP_CONFIG, type AppConfig } from '../../config/app-config.js';
import { ProjectMember } from '../projects/project-member.entity.js';
import { User } from '../users/user.entity.js';
import { AuthController } from './auth.controller.js';
import { AuthService } from './auth.service.js';
import { JwtAuthGuard } from './jwt-auth.guard.js';
import { createJwtStrategy, JWT_STRATEGY } from './jwt.strategy.js';
import { LoginAttempts } from './login-attempts.js';

@Module({
  imports: [
    PassportModule.register({ session: false }),
    TypeOrmModule.forFeature([User, ProjectMember]),
    JwtModule.registerAsync({
      inject: [APP_CONFIG],
      useFactory: (config: AppConfig) => ({
        secret: config.auth.jwtSecret,
        signOptions: { expiresIn: config.auth.jwtExpiresIn as `${number}h`, algorithm: 'HS256' },
      }),
    }),
    ThrottlerModule.forRootAsync({
      inject: [APP_CONFIG],
      useFactory: (config: AppConfig) => ({
        // `login`: invitation pages and accepts, per address; `public`: request volume on anonymous routes.
        throttlers: [
          { name: 'login', ttl: 60_000, limit: config.auth.loginRateLimit },
          { name: 'public', ttl: 60_000, limit: config.auth.publicRateLimit },
        ],
      }),
    }),
  ],
  controllers: [AuthController],
  providers: [
    AuthService,
    LoginAttempts,
    {
      provide: JWT_STRATEGY,
      inject: [APP_CONFIG, AuthService],
      useFactory: (config: AppConfig, auth: AuthService) => createJwtStrategy(config.auth.jwtSecret, auth),
    },
    JwtAuthGuard,
  ],
  exports: [AuthService, JwtAuthGuard, JWT_STRATEGY, JwtModule],
})
export class AuthModule {}
