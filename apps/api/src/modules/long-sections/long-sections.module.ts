import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { HeadingsModule } from '../headings/headings.module.js';
import { ProjectMember } from '../projects/project-member.entity.js';
import { LongSectionsController } from './long-sections.controller.js';
import { LongSectionsService } from './long-sections.service.js';

/** Read model of a heading's long section (rounds, hazards, support records and joints, read only). */
@Module({
  imports: [TypeOrmModule.forFeature([ProjectMember]), HeadingsModule],
  controllers: [LongSectionsController],
  providers: [LongSectionsService],
})
export class LongSectionsModule {}
