import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuditModule } from '../audit/audit.module.js';
import { ProjectMember } from '../projects/project-member.entity.js';
import { NoticePreference } from './notice-preference.entity.js';
import { NoticeSettingsController } from './notice-settings.controller.js';
import { NoticeSettingsService } from './notice-settings.service.js';

/** Each person's choice of review notices per project; the rounds module's senders ask it who receives. */
@Module({
  imports: [TypeOrmModule.forFeature([NoticePreference, ProjectMember]), AuditModule],
  controllers: [NoticeSettingsController],
  providers: [NoticeSettingsService],
  exports: [NoticeSettingsService],
})
export class NoticeSettingsModule {}
