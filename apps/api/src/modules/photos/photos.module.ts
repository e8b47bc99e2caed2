import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { JobsModule } from '../../infrastructure/jobs/jobs.module.js';
import { AuditModule } from '../audit/audit.module.js';
import { ProjectMember } from '../projects/project-member.entity.js';
import { PhotoVariantsJob } from './photo-variants.job.js';
import { Photo } from './photo.entity.js';
import { PhotosController } from './photos.controller.js';
import { PhotosService } from './photos.service.js';

@Module({
  imports: [TypeOrmModule.forFeature([Photo, ProjectMember]), JobsModule, AuditModule],
  controllers: [PhotosController],
  providers: [PhotosService, PhotoVariantsJob],
  exports: [PhotosService],
})
export class PhotosModule {}
