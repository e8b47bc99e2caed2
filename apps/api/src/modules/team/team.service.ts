import { createHash, randomBytes } from 'node:crypto';
import { Inject, Injectable, Logger } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource, IsNull, MoreThan, type EntityManager } from 'typeorm';
import type { AuthUser, ProjectAccess } from '../../common/auth/auth-user.js';
import { DomainException, ErrorCode } from '../../common/errors/domain.exception.js';
import { APP_CONFIG, type AppConfig } from '../../config/app-config.js';
import { MailService } from '../../infrastructure/mail/mail.service.js';
import { invitationEmail } from '../../infrastructure/mail/templates/invitation.email.js';
import { AuditService } from '../audit/audit.service.js';
import { AuthService } from '../auth/auth.service.js';
import type { TokenResponseDto } from '../auth/dto/token-response.dto.js';
import { ProjectMember } from '../projects/project-member.entity.js';
import { Project } from '../projects/project.entity.js';
import { hashPassword, verifyPassword } from '../users/password.js';
import { User } from '../users/user.entity.js';
import type {
  AcceptInvitationDto,
  ChangeRoleDto,
  InvitationDto,
  InvitationInfoDto,
  InviteDto,
  TeamDto,
} from './dto/team.dto.js';
import { Invitation } from './invitation.entity.js';

const INVITATION_DAYS = 7;
const sha256 = (s: string): string => createHash('sha256').update(s).digest('hex');

@Injectable()
export class TeamService {
  private readonly logger = new Logger('Team');

  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @Inject(AuditService) private readonly audit: AuditService,
    @Inject(MailService) private readonly mail: MailService,
    @Inject(AuthService) private readonly auth: AuthService,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
  ) {}

  async team(access: ProjectAccess): Promise<TeamDto> {
    const members = await this.dataSource.getRepository(ProjectMember).find({
      where: { projectId: access.projectId },
      relations: { user: true },
    });
    const invitations = await this.dataSource.getRepository(Invitation).find({
      where: { projectId: access.projectId, acceptedAt: IsNull(), expiresAt: MoreThan(new Date()) },
      order: { createdAt: 'DESC' },
    });
    return {
      members: members
        .map((m) => ({
          memberId: m.id,
          userId: m.userId,
          name: m.user.name,
          email: m.user.email,
          role: m.role,
          since: m.createdAt.toISOString(),
        }))
        .sort((a, b) => a.name.localeCompare(b.name)),
      invitations: invitations.map((i) => this.toInvitationDto(i)),
    };
  }

  /** Invites by e-mail. The invitation is kept even when the mail server is down; it can be resent. */
  async invite(caller: AuthUser, access: ProjectAccess, dto: InviteDto): Promise<InvitationDto> {
    const token = randomBytes(32).toString('base64url');
    const invitation = await this.dataSource.transaction(async (manager) => {
      const existing = await manager.findOne(User, { where: { email: dto.email } });
      if (
        existing &&
        (await manager.exists(ProjectMember, { where: { projectId: access.projectId, userId: existing.id } }))
      ) {
        throw new DomainException(ErrorCode.Conflict, `${dto.email} is already a member of this project.`, {
          email: 'Already a member.',
        });
      }
      // A new invitation replaces an open one for the same address.
      await manager.delete(Invitation, {
        projectId: access.projectId,
        email: dto.email,
        acceptedAt: IsNull(),
      });
      const saved = await manager.save(
        manager.create(Invitation, {
          projectId: access.projectId,
          email: dto.email,
          name: dto.name ?? existing?.name ?? '',
          role: dto.role,
          tokenHash: sha256(token),
          expiresAt: new Date(Date.now() + INVITATION_DAYS * 86_400_000),
          invitedBy: caller.id,
          acceptedAt: null,
          emailSentAt: null,
        }),
      );
      await this.audit.record(manager, {
        projectId: access.projectId,
        actorId: caller.id,
        entityType: 'invitation',
        entityId: saved.id,
        action: 'invite',
        after: { email: saved.email, role: saved.role, expiresAt: saved.expiresAt.toISOString() },
      });
      return saved;
    });
    await this.send(caller, invitation, token);
    return this.toInvitationDto(invitation);
  }

  /** Sends a fresh link for an open invitation (the old link stops working). */
  async resend(caller: AuthUser, access: ProjectAccess, invitationId: string): Promise<InvitationDto> {
    const token = randomBytes(32).toString('base64url');
    const invitation = await this.dataSource
      .getRepository(Invitation)
      .findOne({ where: { id: invitationId, projectId: access.projectId, acceptedAt: IsNull() } });
    if (!invitation) throw DomainException.notFound('The invitation');
    invitation.tokenHash = sha256(token);
    invitation.expiresAt = new Date(Date.now() + INVITATION_DAYS * 86_400_000);
    invitation.emailSentAt = null;
    await this.dataSource.getRepository(Invitation).save(invitation);
    await this.send(caller, invitation, token);
    return this.toInvitationDto(invitation);
  }

  async revoke(caller: AuthUser, access: ProjectAccess, invitationId: string): Promise<void> {
    await this.dataSource.transaction(async (manager) => {
      const invitation = await manager.findOne(Invitation, {
        where: { id: invitationId, projectId: access.projectId, acceptedAt: IsNull() },
      });
      if (!invitation) throw DomainException.notFound('The invitation');
      await manager.delete(Invitation, { id: invitationId });
      await this.audit.record(manager, {
        projectId: access.projectId,
        actorId: caller.id,
        entityType: 'invitation',
        entityId: invitationId,
        action: 'revoke',
        before: { email: invitation.email, role: invitation.role },
      });
    });
  }

  async changeRole(
    caller: AuthUser,
    access: ProjectAccess,
    memberId: string,
    dto: ChangeRoleDto,
  ): Promise<TeamDto> {
    await this.dataSource.transaction(async (manager) => {
      const member = await this.findMember(manager, access, memberId);
      if (member.role === dto.role) return;
      if (member.role === 'admin') await this.assertAnotherAdmin(manager, access.projectId, member.id);
      const before = member.role;
      member.role = dto.role;
      await manager.save(member);
      await this.audit.record(manager, {
        projectId: access.projectId,
        actorId: caller.id,
        entityType: 'member',
        entityId: member.userId,
        action: 'change-role',
        before: { role: before },
        after: { role: dto.role },
      });
    });
    return this.team(access);
  }

  /** Removes a member from the project. Their account and everything they recorded stay, attributed to them. */
  async remove(caller: AuthUser, access: ProjectAccess, memberId: string): Promise<TeamDto> {
    await this.dataSource.transaction(async (manager) => {
      const member = await this.findMember(manager, access, memberId);
      if (member.role === 'admin') await this.assertAnotherAdmin(manager, access.projectId, member.id);
      await manager.delete(ProjectMember, { id: member.id });
      await this.audit.record(manager, {
        projectId: access.projectId,
        actorId: caller.id,
        entityType: 'member',
        entityId: member.userId,
        action: 'remove',
        before: { role: member.role },
      });
    });
    return this.team(access);
  }

  async invitationInfo(token: string): Promise<InvitationInfoDto> {
    const invitation = await this.openInvitation(this.dataSource.manager, token);
    const project = await this.dataSource
      .getRepository(Project)
      .findOneByOrFail({ id: invitation.projectId });
    const accountExists = await this.dataSource
      .getRepository(User)
      .exists({ where: { email: invitation.email } });
    return {
      projectName: project.name,
      email: invitation.email,
      name: invitation.name,
      role: invitation.role,
      expiresAt: invitation.expiresAt.toISOString(),
      accountExists,
    };
  }

  /** Accepts an invitation: creates the account (or checks the existing password) and joins the project. */
  async accept(token: string, dto: AcceptInvitationDto): Promise<TokenResponseDto> {
    const email = await this.dataSource.transaction(async (manager) => {
      const invitation = await this.openInvitation(manager, token, true);
      let user = await manager.findOne(User, { where: { email: invitation.email } });
      if (user) {
        if (!(await verifyPassword(user.passwordHash, dto.password))) {
          throw new DomainException(
            ErrorCode.InvalidCredentials,
            'This e-mail already has an account: enter its password to join.',
            {
              password: 'Not the password of this account.',
            },
          );
        }
      } else {
        const name = (dto.name ?? invitation.name).trim();
        if (!name)
          throw new DomainException(ErrorCode.ValidationFailed, 'Enter your name.', {
            name: 'Enter your name.',
          });
        user = await manager.save(
          manager.create(User, {
            email: invitation.email,
            name,
            passwordHash: await hashPassword(dto.password),
          }),
        );
      }
      if (
        !(await manager.exists(ProjectMember, {
          where: { projectId: invitation.projectId, userId: user.id },
        }))
      ) {
        await manager.save(
          manager.create(ProjectMember, {
            projectId: invitation.projectId,
            userId: user.id,
            role: invitation.role,
          }),
        );
      }
      invitation.acceptedAt = new Date();
      await manager.save(invitation);
      await this.audit.record(manager, {
        projectId: invitation.projectId,
        actorId: user.id,
        entityType: 'member',
        entityId: user.id,
        action: 'join',
        after: { role: invitation.role, email: user.email },
      });
      return user.email;
    });
    return this.auth.login(email, dto.password);
  }

  private async send(caller: AuthUser, invitation: Invitation, token: string): Promise<void> {
    const project = await this.dataSource
      .getRepository(Project)
      .findOneByOrFail({ id: invitation.projectId });
    const message = invitationEmail({
      inviteeName: invitation.name,
      inviterName: caller.name,
      projectName: project.name,
      role: invitation.role,
      link: `${this.config.appUrl}/invitation/${token}`,
      expiresAt: invitation.expiresAt,
    });
    try {
      await this.mail.send({ to: [invitation.email], ...message });
      invitation.emailSentAt = new Date();
    } catch (e) {
      invitation.emailSentAt = null;
      this.logger.warn(
        `Invitation e-mail to ${invitation.email} not sent: ${e instanceof Error ? e.message : String(e)}`,
      );
    }
    await this.dataSource
      .getRepository(Invitation)
      .update({ id: invitation.id }, { emailSentAt: invitation.emailSentAt });
  }

  private toInvitationDto(i: Invitation): InvitationDto {
    return {
      id: i.id,
      email: i.email,
      name: i.name,
      role: i.role,
      expiresAt: i.expiresAt.toISOString(),
      invitedBy: i.invitedBy,
      emailSent: i.emailSentAt !== null,
    };
  }

  private async openInvitation(manager: EntityManager, token: string, lock = false): Promise<Invitation> {
    const invitation = await manager.findOne(Invitation, {
      where: { tokenHash: sha256(token) },
      ...(lock ? { lock: { mode: 'pessimistic_write' as const } } : {}),
    });
    if (!invitation || invitation.acceptedAt) throw DomainException.notFound('This invitation link');
    if (invitation.expiresAt.getTime() < Date.now()) {
      throw new DomainException(
        ErrorCode.NotFound,
        'This invitation has expired. Ask the project admin to send a new one.',
      );
    }
    return invitation;
  }

  private async findMember(
    manager: EntityManager,
    access: ProjectAccess,
    memberId: string,
  ): Promise<ProjectMember> {
    const member = await manager.findOne(ProjectMember, {
      where: { id: memberId, projectId: access.projectId },
      lock: { mode: 'pessimistic_write' },
    });
    if (!member) throw DomainException.notFound('The member');
    return member;
  }

  private async assertAnotherAdmin(
    manager: EntityManager,
    projectId: string,
    exceptMemberId: string,
  ): Promise<void> {
    const admins = await manager.find(ProjectMember, { where: { projectId, role: 'admin' } });
    if (!admins.some((a) => a.id !== exceptMemberId)) {
      throw new DomainException(
        ErrorCode.Conflict,
        'A project needs at least one admin. Make someone else admin first.',
      );
    }
  }
}
