import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { ProjectAccessGuard } from '../../common/auth/project-access.guard.js';
import { AuditModule } from '../audit/audit.module.js';
import { Heading } from '../headings/heading.entity.js';
import { ProjectMember } from './project-member.entity.js';
import { Project } from './project.entity.js';
import { ProjectsController } from './projects.controller.js';
import { ProjectsService } from './projects.service.js';

@Module({
  imports: [TypeOrmModule.forFeature([Project, ProjectMember, Heading]), AuditModule],
  controllers: [ProjectsController],
  providers: [ProjectsService, ProjectAccessGuard],
  exports: [ProjectAccessGuard, ProjectsService, TypeOrmModule],
})
export class ProjectsModule {}
