import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { IdempotencyKey } from '../../common/idempotency/idempotency-key.entity.js';
import { AuditModule } from '../audit/audit.module.js';
import { HeadingsModule } from '../headings/headings.module.js';
import { ProjectMember } from '../projects/project-member.entity.js';
import { Hazard } from './hazard.entity.js';
import { HazardsController } from './hazards.controller.js';
import { HazardsService } from './hazards.service.js';

/** The hazard register of each heading; rounds (the trigger rules) and handovers read it through the service. */
@Module({
  imports: [TypeOrmModule.forFeature([Hazard, IdempotencyKey, ProjectMember]), AuditModule, HeadingsModule],
  controllers: [HazardsController],
  providers: [HazardsService],
  exports: [HazardsService],
})
export class HazardsModule {}
