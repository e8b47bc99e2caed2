import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { JobsModule } from '../../infrastructure/jobs/jobs.module.js';
import { AuditModule } from '../audit/audit.module.js';
import { HazardsModule } from '../hazards/hazards.module.js';
import { ProjectMember } from '../projects/project-member.entity.js';
import { SupportRecordsModule } from '../support-records/support-records.module.js';
import { Handover, HandoverHeading } from './handover.entity.js';
import { HandoversController, ReceivedHandoversController } from './handovers.controller.js';
import { HandoversService } from './handovers.service.js';

@Module({
  imports: [
    TypeOrmModule.forFeature([Handover, HandoverHeading, ProjectMember]),
    JobsModule,
    AuditModule,
    HazardsModule,
    SupportRecordsModule,
  ],
  controllers: [HandoversController, ReceivedHandoversController],
  providers: [HandoversService],
  exports: [HandoversService],
})
export class HandoversModule {}
