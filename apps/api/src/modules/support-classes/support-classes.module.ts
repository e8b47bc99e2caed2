import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuditModule } from '../audit/audit.module.js';
import { ProjectMember } from '../projects/project-member.entity.js';
import { SupportClass } from './support-class.entity.js';
import { SupportClassesController } from './support-classes.controller.js';
import { SupportClassesService } from './support-classes.service.js';

@Module({
  imports: [TypeOrmModule.forFeature([SupportClass, ProjectMember]), AuditModule],
  controllers: [SupportClassesController],
  providers: [SupportClassesService],
  exports: [SupportClassesService],
})
export class SupportClassesModule {}
