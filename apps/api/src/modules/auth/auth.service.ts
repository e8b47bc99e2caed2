import { randomBytes } from 'node:crypto';
import { Inject, Injectable } from '@nestjs/common';
import { JwtService } from '@nestjs/jwt';
import { InjectRepository } from '@nestjs/typeorm';
import type { EntityManager, Repository } from 'typeorm';
import type { AuthUser, MembershipOfRequest, ProjectRole } from '../../common/auth/auth-user.js';
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
  /** The account's token version when this token was issued (User.tokenVersion) */
  tv?: number;
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
    await this.attempts.assertAllowed(email, address);
    const user = await this.users.findOne({ where: { email: email.trim().toLowerCase() } });
    // Verify even when the user is unknown, so response time does not reveal which e-mails exist.
    const ok = await verifyPassword(user?.passwordHash ?? (await dummyHash()), password);
    if (!user || !ok) {
      await this.attempts.failed(email, address);
      throw new DomainException(
        ErrorCode.InvalidCredentials,
        'That e-mail and password do not match an account.',
      );
    }
    await this.attempts.succeeded(email);
    return this.issue(user);
  }

  private async issue(user: User): Promise<TokenResponseDto> {
    const payload: JwtPayload = { sub: user.id, email: user.email, name: user.name, tv: user.tokenVersion };
    const accessToken = await this.jwt.signAsync(payload);
    const { exp } = this.jwt.decode<JwtPayload>(accessToken);
    return {
      accessToken,
      expiresAt: new Date((exp ?? 0) * 1000).toISOString(),
      user: { id: user.id, email: user.email, name: user.name },
    };
  }

  /** The user behind a valid token, or null when the account no longer exists or the token was revoked. */
  async userOfToken(payload: JwtPayload): Promise<AuthUser | null> {
    return (await this.userAndMembershipOfToken(payload)).user;
  }

  /**
   * The user behind a valid token and, when a project is named, the user's role there, read in one statement
   * (the account by primary key, the membership by its unique project + user key). Null user when the
   * account is gone or the token was revoked; null role when the account is no member of the project.
   */
  async userAndMembershipOfToken(
    payload: JwtPayload,
    projectId?: string,
  ): Promise<{ user: AuthUser | null; membership?: MembershipOfRequest }> {
    const qb = this.users
      .createQueryBuilder('u')
      .select(['u.id AS id', 'u.email AS email', 'u.name AS name', 'u.token_version AS tokenVersion'])
      .where('u.id = :id', { id: payload.sub });
    if (projectId)
      qb.leftJoin(ProjectMember, 'm', 'm.user_id = u.id AND m.project_id = :projectId', {
        projectId,
      }).addSelect('m.role', 'role');
    const row = await qb.getRawOne<{
      id: string;
      email: string;
      name: string;
      tokenVersion: number | string;
      role?: ProjectRole | null;
    }>();
    if (!row || (payload.tv ?? 0) !== Number(row.tokenVersion)) return { user: null };
    return {
      user: { id: row.id, email: row.email, name: row.name },
      ...(projectId ? { membership: { projectId, role: row.role ?? null } } : {}),
    };
  }

  /**
   * The account behind an optional `Authorization: Bearer …` on a public route: null when there is none,
   * it does not verify, or it was revoked (the same checks as the guard's strategy).
   */
  async userOfAuthorization(authorization?: string): Promise<AuthUser | null> {
    const [scheme, bearer] = (authorization ?? '').split(' ');
    if (scheme?.toLowerCase() !== 'bearer' || !bearer) return null;
    let payload: JwtPayload;
    try {
      payload = await this.jwt.verifyAsync<JwtPayload>(bearer, { algorithms: ['HS256'] });
    } catch {
      return null;
    }
    return this.userOfToken(payload);
  }

  /** Every token of the account stops working at its next request (this one included). */
  async signOutEverywhere(caller: AuthUser): Promise<void> {
    await revokeTokens(this.users.manager, caller.id);
  }

  /**
   * A new password: the current one is asked again, every earlier token is revoked, and this device gets a
   * new token so it stays signed in.
   */
  async changePassword(
    caller: AuthUser,
    current: string,
    next: string,
    address = 'unknown',
  ): Promise<TokenResponseDto> {
    const user = await this.users.findOneOrFail({ where: { id: caller.id } });
    // Counted with sign-in failures: per account, and per the caller's address (not one bucket for everyone).
    await this.attempts.assertAllowed(user.email, address);
    if (!(await verifyPassword(user.passwordHash, current))) {
      await this.attempts.failed(user.email, address);
      throw new DomainException(ErrorCode.ValidationFailed, 'Your current password is not right.', {
        currentPassword: 'Type the password you signed in with.',
      });
    }
    if (next === current)
      throw new DomainException(ErrorCode.ValidationFailed, 'Choose a password other than the current one.', {
        newPassword: 'Choose a new password.',
      });
    await this.attempts.succeeded(user.email);
    await this.users.update(
      { id: user.id },
      { passwordHash: await hashPassword(next), tokenVersion: () => 'token_version + 1' },
    );
    return this.issue(await this.users.findOneOrFail({ where: { id: user.id } }));
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

/** Raises the account's token version: every token issued before stops working at its next request. */
export async function revokeTokens(manager: EntityManager, userId: string): Promise<void> {
  await manager.update(User, { id: userId }, { tokenVersion: () => 'token_version + 1' });
}

/** A real argon2id hash of a random string, used to spend the same time on unknown e-mails. */
let dummy: Promise<string> | undefined;
const dummyHash = (): Promise<string> => (dummy ??= hashPassword(randomBytes(16).toString('hex')));
