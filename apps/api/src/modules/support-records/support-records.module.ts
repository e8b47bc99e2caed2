import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuditModule } from '../audit/audit.module.js';
import { ProjectMember } from '../projects/project-member.entity.js';
import { Round } from '../rounds/round.entity.js';
import { SupportClass } from '../support-classes/support-class.entity.js';
import { User } from '../users/user.entity.js';
import { SupportRecord } from './support-record.entity.js';
import { SupportRecordsController } from './support-records.controller.js';
import { SupportRecordsService } from './support-records.service.js';

/** Support as built per confirmed round; the Board and the handovers read it through the service. */
@Module({
  imports: [TypeOrmModule.forFeature([SupportRecord, Round, SupportClass, User, ProjectMember]), AuditModule],
  controllers: [SupportRecordsController],
  providers: [SupportRecordsService],
  exports: [SupportRecordsService],
})
export class SupportRecordsModule {}
