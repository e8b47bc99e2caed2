import { randomBytes } from 'node:crypto';
import { Inject, Injectable } from '@nestjs/common';
import { JwtService } from '@nestjs/jwt';
import { InjectRepository } from '@nestjs/typeorm';
import type { Repository } from 'typeorm';
import type { AuthUser } from '../../common/auth/auth-user.js';
import { DomainException, ErrorCode } from '../../common/errors/domain.exception.js';
import { APP_CONFIG, type AppConfig } from '../../config/app-config.js';
import { ProjectMember } from '../projects/project-member.entity.js';
import { hashPassword, verifyPassword } from '../users/password.js';
import { User } from '../users/user.entity.js';
import type { MeDto, TokenResponseDto } from './dto/token-response.dto.js';
import { LoginAttempts } from './login-attempts.js';

export interface JwtPayload {
  sub: string;
  email: string;
  name: string;
  exp?: number;
}

@Injectable()
export class AuthService {
  constructor(
    @InjectRepository(User) private readonly users: Repository<User>,
    @InjectRepository(ProjectMember) private readonly members: Repository<ProjectMember>,
    @Inject(JwtService) private readonly jwt: JwtService,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
    @Inject(LoginAttempts) private readonly attempts: LoginAttempts,
  ) {}

  async login(email: string, password: string, address = 'unknown'): Promise<TokenResponseDto> {
    email = email.trim().toLowerCase();
    this.attempts.assertAllowed(email, address);
    const user = await this.users.findOne({ where: { email: email.trim().toLowerCase() } });
    // Verify even when the user is unknown, so response time does not reveal which e-mails exist.
    const ok = await verifyPassword(user?.passwordHash ?? (await dummyHash()), password);
    if (!user || !ok) {
      this.attempts.failed(email, address);
      throw new DomainException(
        ErrorCode.InvalidCredentials,
        'That e-mail and password do not match an account.',
      );
    }
    this.attempts.succeeded(email);
    const payload: JwtPayload = { sub: user.id, email: user.email, name: user.name };
    const accessToken = await this.jwt.signAsync(payload);
    const { exp } = this.jwt.decode<JwtPayload>(accessToken);
    return {
      accessToken,
      expiresAt: new Date((exp ?? 0) * 1000).toISOString(),
      user: { id: user.id, email: user.email, name: user.name },
    };
  }

  /** The user behind a valid token, or null when the account no longer exists. */
  async userOfToken(payload: JwtPayload): Promise<AuthUser | null> {
    const user = await this.users.findOne({ where: { id: payload.sub } });
    return user ? { id: user.id, email: user.email, name: user.name } : null;
  }

  async me(caller: AuthUser): Promise<MeDto> {
    const [memberships, user] = await Promise.all([
      this.members.find({
        where: { userId: caller.id },
        relations: { project: true },
        order: { project: { name: 'ASC' } },
      }),
      this.users.findOne({ where: { id: caller.id }, select: { id: true, isOperator: true } }),
    ]);
    return {
      ...caller,
      // The same rule as ProjectCreationGuard (PROJECT_CREATION: anyone, or the instance operators only).
      canCreateProjects: this.config.projectCreation === 'anyone' || user?.isOperator === true,
      memberships: memberships.map((m) => ({
        projectId: m.projectId,
        projectName: m.project.name,
        role: m.role,
      })),
    };
  }
}

/** A real argon2id hash of a random string, used to spend the same time on unknown e-mails. */
let dummy: Promise<string> | undefined;
const dummyHash = (): Promise<string> => (dummy ??= hashPassword(randomBytes(16).toString('hex')));
