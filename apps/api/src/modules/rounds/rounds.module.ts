import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuditModule } from '../audit/audit.module.js';
import { ProjectMember } from '../projects/project-member.entity.js';
import { Joint } from './joint.entity.js';
import { Round } from './round.entity.js';
import { RoundsController } from './rounds.controller.js';
import { RoundsService } from './rounds.service.js';

@Module({
  imports: [TypeOrmModule.forFeature([Round, Joint, ProjectMember]), AuditModule],
  controllers: [RoundsController],
  providers: [RoundsService],
})
export class RoundsModule {}
