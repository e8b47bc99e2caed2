import { createHash, randomBytes } from 'node:crypto';
import { Inject, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource, IsNull, MoreThan, type EntityManager } from 'typeorm';
import type { AuthUser, ProjectAccess } from '../../common/auth/auth-user.js';
import { DomainException, ErrorCode } from '../../common/errors/domain.exception.js';
import { APP_CONFIG, type AppConfig } from '../../config/app-config.js';
import { Notice } from '../../infrastructure/mail/notice.entity.js';
import { NoticesService, type NoticeStatus } from '../../infrastructure/mail/notices.service.js';
import { invitationEmail } from '../../infrastructure/mail/templates/invitation.email.js';
import { AuditService } from '../audit/audit.service.js';
import { AuthService, revokeTokens } from '../auth/auth.service.js';
import { ProjectMember } from '../projects/project-member.entity.js';
import { Project } from '../projects/project.entity.js';
import { hashPassword } from '../users/password.js';
import { User } from '../users/user.entity.js';
import type {
  AcceptedInvitationDto,
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
const isDuplicateKey = (e: unknown): boolean =>
  typeof e === 'object' && e !== null && (e as { code?: unknown }).code === 'ER_DUP_ENTRY';

interface MailCount {
  oldest: Date | string | null;
  count: string | number;
}

@Injectable()
export class TeamService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @Inject(AuditService) private readonly audit: AuditService,
    @Inject(NoticesService) private readonly notices: NoticesService,
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
    const status = await this.notices.status(
      invitations.map((i) => i.noticeId).filter((id): id is string => id !== null),
    );
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
      invitations: invitations.map((i) => this.toInvitationDto(i, status)),
    };
  }

  /**
   * Invites by e-mail. The invitation and its e-mail (a notice with its job) are written in one transaction;
   * the worker sends it later, so a mail server that is down delays the e-mail, never the invitation. The
   * answer is the same whether the address has an account or not, and never shows an account holder's name.
   */
  async invite(caller: AuthUser, access: ProjectAccess, dto: InviteDto): Promise<InvitationDto> {
    const token = randomBytes(32).toString('base64url');
    const invitation = await this.dataSource.transaction(async (manager) => {
      await this.assertInvitationMailAllowed(manager, access.projectId, dto.email);
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
          name: dto.name?.trim() ?? '',
          role: dto.role,
          tokenHash: sha256(token),
          expiresAt: new Date(Date.now() + INVITATION_DAYS * 86_400_000),
          invitedBy: caller.id,
          acceptedAt: null,
          noticeId: null,
        }),
      );
      await this.queueEmail(manager, caller, saved, token);
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
    return this.toInvitationDto(invitation, new Map([[invitation.noticeId!, 'queued']]));
  }

  /** Queues a fresh link for an open invitation (the old link stops working). */
  async resend(caller: AuthUser, access: ProjectAccess, invitationId: string): Promise<InvitationDto> {
    const token = randomBytes(32).toString('base64url');
    const invitation = await this.dataSource.transaction(async (manager) => {
      const open = await manager.findOne(Invitation, {
        where: { id: invitationId, projectId: access.projectId, acceptedAt: IsNull() },
      });
      if (!open) throw DomainException.notFound('The invitation');
      await this.assertInvitationMailAllowed(manager, access.projectId, open.email);
      const found = await manager.findOne(Invitation, {
        where: { id: invitationId, projectId: access.projectId, acceptedAt: IsNull() },
        lock: { mode: 'pessimistic_write' },
      });
      if (!found) throw DomainException.notFound('The invitation');
      found.tokenHash = sha256(token);
      found.expiresAt = new Date(Date.now() + INVITATION_DAYS * 86_400_000);
      await this.queueEmail(manager, caller, found, token);
      return found;
    });
    return this.toInvitationDto(invitation, new Map([[invitation.noticeId!, 'queued']]));
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
      // Removed from their last project: their sessions end (they have nothing left to open).
      if ((await manager.count(ProjectMember, { where: { userId: member.userId } })) === 0)
        await revokeTokens(manager, member.userId);
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

  /** What an invitation link is for: the project, the invited address and the name the admin typed. */
  async invitationInfo(token: string): Promise<InvitationInfoDto> {
    const invitation = await this.openInvitation(this.dataSource.manager, token);
    const project = await this.dataSource
      .getRepository(Project)
      .findOneByOrFail({ id: invitation.projectId });
    return {
      projectName: project.name,
      email: invitation.email,
      name: invitation.name,
      role: invitation.role,
      expiresAt: invitation.expiresAt.toISOString(),
    };
  }

  /**
   * Accepts an invitation; only the owner of the invited address can. The token is single-use and bound to
   * the address. Signed in (a bearer token) as the invited address: joins with that account. Signed in as
   * anyone else: refused. Not signed in: creates the account for the invited address — refused when that
   * address already has an account (its owner signs in first; no password is checked here).
   */
  async accept(
    token: string,
    dto: AcceptInvitationDto,
    authorization?: string,
  ): Promise<AcceptedInvitationDto> {
    const caller = await this.auth.userOfAuthorization(authorization);
    try {
      return await this.dataSource
        .transaction(async (manager) => {
          const invitation = await this.openInvitation(manager, token, true);
          if (caller && caller.email !== invitation.email) {
            throw DomainException.forbidden(
              `This invitation was sent to ${invitation.email}, and you are signed in as ${caller.email}. Sign out, then open the link again.`,
            );
          }
          let user = await manager.findOne(User, { where: { email: invitation.email } });
          let created = false;
          if (caller) {
            if (!user || user.id !== caller.id)
              throw DomainException.forbidden('Sign in again, then open the link.');
          } else {
            if (user) {
              throw new DomainException(
                ErrorCode.Conflict,
                `${invitation.email} already has a Roundbook account. Sign in with it, then open this link again to join.`,
              );
            }
            const name = (dto.name ?? invitation.name).trim();
            if (!name)
              throw new DomainException(ErrorCode.ValidationFailed, 'Enter your name.', {
                name: 'Enter your name.',
              });
            if (!dto.password)
              throw new DomainException(ErrorCode.ValidationFailed, 'Choose a password.', {
                password: 'Choose a password of at least 10 characters.',
              });
            user = await manager.save(
              manager.create(User, {
                email: invitation.email,
                name,
                passwordHash: await hashPassword(dto.password),
              }),
            );
            created = true;
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
            after: { role: invitation.role, email: user.email, newAccount: created },
          });
          return { projectId: invitation.projectId, email: user.email, created };
        })
        .then(async (r) => ({
          projectId: r.projectId,
          newAccount: r.created,
          session: r.created ? await this.auth.login(r.email, dto.password!) : undefined,
        }));
    } catch (e) {
      // Two invitations to one new address accepted at once: the second finds the account taken.
      if (isDuplicateKey(e)) {
        throw new DomainException(
          ErrorCode.Conflict,
          'This address already has a Roundbook account. Sign in with it, then open this link again to join.',
        );
      }
      throw e;
    }
  }

  /** Renders the invitation e-mail and queues it (notice + job) in the caller's transaction. */
  private async queueEmail(
    manager: EntityManager,
    caller: AuthUser,
    invitation: Invitation,
    token: string,
  ): Promise<void> {
    const project = await manager.findOneByOrFail(Project, { id: invitation.projectId });
    const message = invitationEmail({
      inviteeName: invitation.name,
      inviterName: caller.name,
      projectName: project.name,
      role: invitation.role,
      link: `${this.config.appUrl}/invitation/${token}`,
      expiresAt: invitation.expiresAt,
      timeZone: project.timeZone,
    });
    const notice = await this.notices.queue(manager, {
      kind: 'invitation',
      projectId: invitation.projectId,
      to: [invitation.email],
      sensitive: true,
      ...message,
    });
    invitation.noticeId = notice.id;
    await manager.save(invitation);
  }

  /**
   * Invitation e-mails are limited (issue 18 item 6): per project per hour (INVITATION_EMAIL_LIMIT) and per
   * address per hour from all projects (INVITATION_ADDRESS_LIMIT), counted from the queued notices, so the
   * limit holds across API processes and restarts. Over it: 429 with the wait, and nothing is written.
   */
  private async assertInvitationMailAllowed(
    manager: EntityManager,
    projectId: string,
    email: string,
  ): Promise<void> {
    // The project row locked first: one project's invitations are counted one at a time, so the
    // per-project limit is exact even with several API processes.
    await manager.findOne(Project, { where: { id: projectId }, lock: { mode: 'pessimistic_write' } });
    const since = new Date(Date.now() - 3_600_000);
    const sent = manager
      .getRepository(Notice)
      .createQueryBuilder('n')
      .select('MIN(n.created_at)', 'oldest')
      .addSelect('COUNT(*)', 'count')
      .where('n.kind = :kind', { kind: 'invitation' })
      .andWhere('n.created_at > :since', { since });
    const [byProject, byAddress] = await Promise.all([
      sent.clone().andWhere('n.project_id = :projectId', { projectId }).getRawOne<MailCount>(),
      sent
        .clone()
        .andWhere('JSON_CONTAINS(n.to_addresses, JSON_QUOTE(:email))', { email })
        .getRawOne<MailCount>(),
    ]);
    const over = (c: MailCount | undefined, limit: number) => Number(c?.count ?? 0) >= limit;
    const waitOf = (c: MailCount | undefined) =>
      Math.max(60, Math.ceil((new Date(c?.oldest ?? Date.now()).getTime() + 3_600_000 - Date.now()) / 1000));
    if (over(byProject, this.config.auth.invitationEmailLimit)) {
      const seconds = waitOf(byProject);
      throw new DomainException(
        ErrorCode.TooManyRequests,
        `This project has sent ${this.config.auth.invitationEmailLimit} invitation e-mails in the last hour, the most allowed. Try again in ${Math.ceil(seconds / 60)} min.`,
        undefined,
        { retryAfterSeconds: seconds },
      );
    }
    if (over(byAddress, this.config.auth.invitationAddressLimit)) {
      const seconds = waitOf(byAddress);
      throw new DomainException(
        ErrorCode.TooManyRequests,
        `${email} has been sent ${this.config.auth.invitationAddressLimit} invitation e-mails in the last hour, the most allowed. Try again in ${Math.ceil(seconds / 60)} min.`,
        undefined,
        { retryAfterSeconds: seconds },
      );
    }
  }

  private toInvitationDto(i: Invitation, status: Map<string, NoticeStatus>): InvitationDto {
    const emailStatus: NoticeStatus = (i.noticeId && status.get(i.noticeId)) || 'failed';
    return {
      id: i.id,
      email: i.email,
      name: i.name,
      role: i.role,
      expiresAt: i.expiresAt.toISOString(),
      invitedBy: i.invitedBy,
      emailSent: emailStatus === 'sent',
      emailStatus,
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
