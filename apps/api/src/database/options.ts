import type { DataSourceOptions } from 'typeorm';
import { IdempotencyKey } from '../common/idempotency/idempotency-key.entity.js';
import type { AppConfig } from '../config/app-config.js';
import { Job } from '../infrastructure/jobs/job.entity.js';
import { Notice } from '../infrastructure/mail/notice.entity.js';
import { AuditEvent } from '../modules/audit/audit-event.entity.js';
import { Handover, HandoverHeading } from '../modules/handovers/handover.entity.js';
import { Hazard } from '../modules/hazards/hazard.entity.js';
import { Heading } from '../modules/headings/heading.entity.js';
import { NoticePreference } from '../modules/notice-settings/notice-preference.entity.js';
import { Photo } from '../modules/photos/photo.entity.js';
import { ProjectMember } from '../modules/projects/project-member.entity.js';
import { Project } from '../modules/projects/project.entity.js';
import { Joint } from '../modules/rounds/joint.entity.js';
import {
  RoundComment,
  RoundDecision,
  TriggerAcceptance,
  TriggerAcknowledgement,
} from '../modules/rounds/round-review.entity.js';
import { RoundRevision } from '../modules/rounds/round-revision.entity.js';
import { Round } from '../modules/rounds/round.entity.js';
import { SupportClass } from '../modules/support-classes/support-class.entity.js';
import { SupportRecord } from '../modules/support-records/support-record.entity.js';
import { Invitation } from '../modules/team/invitation.entity.js';
import { TriggerRule } from '../modules/trigger-rules/trigger-rule.entity.js';
import { User } from '../modules/users/user.entity.js';
import { migrations } from './migrations/index.js';

export const entities = [
  User,
  Project,
  ProjectMember,
  Heading,
  AuditEvent,
  SupportClass,
  TriggerRule,
  Invitation,
  Round,
  Joint,
  RoundRevision,
  RoundDecision,
  RoundComment,
  TriggerAcknowledgement,
  TriggerAcceptance,
  IdempotencyKey,
  Job,
  Notice,
  Photo,
  Hazard,
  Handover,
  HandoverHeading,
  SupportRecord,
  NoticePreference,
];

/** One set of options for the app, the CLI and the tests. Schema changes go through migrations only. */
export function databaseOptions(config: AppConfig): DataSourceOptions {
  return {
    type: 'mariadb',
    host: config.database.host,
    port: config.database.port,
    username: config.database.user,
    password: config.database.password,
    database: config.database.name,
    charset: 'utf8mb4_unicode_ci',
    timezone: 'Z',
    entities,
    migrations,
    synchronize: false,
    migrationsTableName: 'migrations',
    connectTimeout: 10000,
    // mysql2's connectionLimit (DB_POOL_SIZE). The wait for one is bounded by boundPoolWaits (pool-wait.ts).
    poolSize: config.database.poolSize,
  };
}
