import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { ProjectMember } from '../projects/project-member.entity.js';
import { LocalMailController } from './local-mail.controller.js';
import { LocalMailService } from './local-mail.service.js';

@Module({
  imports: [TypeOrmModule.forFeature([ProjectMember])],
  controllers: [LocalMailController],
  providers: [LocalMailService],
})
export class LocalMailModule {}
