import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuditModule } from '../audit/audit.module.js';
import { AuthModule } from '../auth/auth.module.js';
import { ProjectMember } from '../projects/project-member.entity.js';
import { Invitation } from './invitation.entity.js';
import { InvitationsController, TeamController } from './team.controller.js';
import { TeamService } from './team.service.js';

@Module({
  imports: [TypeOrmModule.forFeature([Invitation, ProjectMember]), AuditModule, AuthModule],
  controllers: [TeamController, InvitationsController],
  providers: [TeamService],
})
export class TeamModule {}
