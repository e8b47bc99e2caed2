import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuditModule } from '../audit/audit.module.js';
import { ProjectMember } from '../projects/project-member.entity.js';
import { TriggerRule } from './trigger-rule.entity.js';
import { TriggerRulesController } from './trigger-rules.controller.js';
import { TriggerRulesService } from './trigger-rules.service.js';

@Module({
  imports: [TypeOrmModule.forFeature([TriggerRule, ProjectMember]), AuditModule],
  controllers: [TriggerRulesController],
  providers: [TriggerRulesService],
  exports: [TriggerRulesService],
})
export class TriggerRulesModule {}
