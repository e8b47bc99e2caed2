import { Inject, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { NOTICE_SETTINGS, redNoticeWords, type NoticeSetting } from '@roundbook/domain';
import { DataSource, In, type EntityManager } from 'typeorm';
import type { AuthUser, ProjectAccess } from '../../common/auth/auth-user.js';
import { DomainException, ErrorCode } from '../../common/errors/domain.exception.js';
import { AuditService } from '../audit/audit.service.js';
import type { NoticeSettingsDto, UpdateNoticeSettingsDto } from './dto/notice-settings.dto.js';
import { NoticePreference } from './notice-preference.entity.js';

/** A person a notice may go to. */
export interface NoticeRecipient {
  userId: string;
  email: string;
}

/**
 * Each person's choice of review notices per project, and the filter the notice senders apply. A red
 * notice passes whatever the choice; nothing else about a notice (its words, its link) depends on it.
 */
@Injectable()
export class NoticeSettingsService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @Inject(AuditService) private readonly audit: AuditService,
  ) {}

  async get(caller: AuthUser, access: ProjectAccess): Promise<NoticeSettingsDto> {
    const row = await this.dataSource.manager.findOne(NoticePreference, {
      where: { userId: caller.id, projectId: access.projectId },
    });
    return toDto(access.projectId, row);
  }

  async update(
    caller: AuthUser,
    access: ProjectAccess,
    dto: UpdateNoticeSettingsDto,
  ): Promise<NoticeSettingsDto> {
    if (!dto.red)
      throw new DomainException(ErrorCode.ValidationFailed, redNoticeWords.lockedReason, {
        red: redNoticeWords.lockedReason,
      });
    await this.dataSource.transaction(async (manager) => {
      const key = { userId: caller.id, projectId: access.projectId };
      const before = await manager.findOne(NoticePreference, {
        where: key,
        lock: { mode: 'pessimistic_write' },
      });
      const choice = pick(dto);
      const old = before ? pick(before) : allOn();
      if (before && NOTICE_SETTINGS.every((k) => old[k] === choice[k])) return;
      await manager.upsert(NoticePreference, { ...key, ...choice }, ['userId', 'projectId']);
      await this.audit.record(manager, {
        projectId: access.projectId,
        actorId: caller.id,
        entityType: 'notice-settings',
        entityId: caller.id,
        action: 'update',
        before: old,
        after: choice,
      });
    });
    return this.get(caller, access);
  }

  /**
   * The e-mail addresses of those who receive a notice of this setting in the project: everyone who has not
   * switched it off, and everyone at all when the notice is red.
   */
  async recipients(
    manager: EntityManager,
    projectId: string,
    setting: NoticeSetting,
    people: NoticeRecipient[],
    red: boolean,
  ): Promise<string[]> {
    const unique = [...new Map(people.map((p) => [p.userId, p])).values()];
    if (unique.length === 0) return [];
    if (red) return [...new Set(unique.map((p) => p.email))];
    const rows = await manager.find(NoticePreference, {
      where: { projectId, userId: In(unique.map((p) => p.userId)) },
    });
    const off = new Set(rows.filter((r) => !r[setting]).map((r) => r.userId));
    return [...new Set(unique.filter((p) => !off.has(p.userId)).map((p) => p.email))];
  }
}

function allOn(): Record<NoticeSetting, boolean> {
  return { submitted: true, ruleOverdue: true, returned: true, confirmedOtherClass: true };
}

function pick(source: Record<NoticeSetting, boolean>): Record<NoticeSetting, boolean> {
  return {
    submitted: Boolean(source.submitted),
    ruleOverdue: Boolean(source.ruleOverdue),
    returned: Boolean(source.returned),
    confirmedOtherClass: Boolean(source.confirmedOtherClass),
  };
}

function toDto(projectId: string, row: NoticePreference | null): NoticeSettingsDto {
  return {
    projectId,
    ...(row ? pick(row) : allOn()),
    red: true,
    redLockedReason: redNoticeWords.lockedReason,
    updatedAt: row?.updatedAt.toISOString() ?? null,
  };
}
