import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuditModule } from '../audit/audit.module.js';
import { ProjectMember } from '../projects/project-member.entity.js';
import { Heading } from './heading.entity.js';
import { HeadingsController } from './headings.controller.js';
import { HeadingsService } from './headings.service.js';

@Module({
  imports: [TypeOrmModule.forFeature([Heading, ProjectMember]), AuditModule],
  controllers: [HeadingsController],
  providers: [HeadingsService],
  exports: [HeadingsService],
})
export class HeadingsModule {}
