import {
  Body,
  Controller,
  Delete,
  Get,
  HttpCode,
  Inject,
  Param,
  ParseUUIDPipe,
  Patch,
  Post,
  Req,
} from '@nestjs/common';
import { UseGuards } from '@nestjs/common';
import {
  ApiBearerAuth,
  ApiConflictResponse,
  ApiCreatedResponse,
  ApiForbiddenResponse,
  ApiNoContentResponse,
  ApiOkResponse,
  ApiTags,
} from '@nestjs/swagger';
import { Throttle, ThrottlerGuard } from '@nestjs/throttler';
import type { Request } from 'express';
import type { AuthUser, ProjectAccess } from '../../common/auth/auth-user.js';
import { CurrentAccess, CurrentUser } from '../../common/auth/current-user.decorator.js';
import { ProjectRoles } from '../../common/auth/project-roles.decorator.js';
import { Public } from '../../common/auth/public.decorator.js';
import { ErrorResponseDto } from '../../common/dto/error-response.dto.js';
import {
  AcceptedInvitationDto,
  AcceptInvitationDto,
  ChangeRoleDto,
  InvitationDto,
  InvitationInfoDto,
  InviteDto,
  TeamDto,
} from './dto/team.dto.js';
import { TeamService } from './team.service.js';

@ApiTags('team')
@ApiBearerAuth()
@Controller('projects/:projectId')
export class TeamController {
  constructor(@Inject(TeamService) private readonly team: TeamService) {}

  /** Members and open invitations (any member) */
  @Get('team')
  @ProjectRoles()
  @ApiOkResponse({ type: TeamDto })
  get(@Param('projectId') _p: string, @CurrentAccess() access: ProjectAccess): Promise<TeamDto> {
    return this.team.team(access);
  }

  /** Invites someone by e-mail with a role (project admins). The link expires after 7 days. */
  @Post('invitations')
  @ProjectRoles('admin')
  @ApiCreatedResponse({ type: InvitationDto })
  @ApiConflictResponse({ type: ErrorResponseDto, description: 'Already a member' })
  invite(
    @Param('projectId') _p: string,
    @CurrentUser() user: AuthUser,
    @CurrentAccess() access: ProjectAccess,
    @Body() body: InviteDto,
  ): Promise<InvitationDto> {
    return this.team.invite(user, access, body);
  }

  /** Sends a fresh link for an open invitation (project admins) */
  @Post('invitations/:invitationId/resend')
  @HttpCode(200)
  @ProjectRoles('admin')
  @ApiOkResponse({ type: InvitationDto })
  resend(
    @Param('projectId') _p: string,
    @Param('invitationId', ParseUUIDPipe) invitationId: string,
    @CurrentUser() user: AuthUser,
    @CurrentAccess() access: ProjectAccess,
  ): Promise<InvitationDto> {
    return this.team.resend(user, access, invitationId);
  }

  /** Withdraws an open invitation (project admins) */
  @Delete('invitations/:invitationId')
  @HttpCode(204)
  @ProjectRoles('admin')
  @ApiNoContentResponse()
  revoke(
    @Param('projectId') _p: string,
    @Param('invitationId', ParseUUIDPipe) invitationId: string,
    @CurrentUser() user: AuthUser,
    @CurrentAccess() access: ProjectAccess,
  ): Promise<void> {
    return this.team.revoke(user, access, invitationId);
  }

  /** Changes a member's role (project admins); the last admin cannot be demoted */
  @Patch('members/:memberId')
  @ProjectRoles('admin')
  @ApiOkResponse({ type: TeamDto })
  @ApiConflictResponse({ type: ErrorResponseDto })
  changeRole(
    @Param('projectId') _p: string,
    @Param('memberId', ParseUUIDPipe) memberId: string,
    @CurrentUser() user: AuthUser,
    @CurrentAccess() access: ProjectAccess,
    @Body() body: ChangeRoleDto,
  ): Promise<TeamDto> {
    return this.team.changeRole(user, access, memberId, body);
  }

  /** Removes a member (project admins); their records stay, attributed to them */
  @Delete('members/:memberId')
  @ProjectRoles('admin')
  @ApiOkResponse({ type: TeamDto })
  @ApiConflictResponse({ type: ErrorResponseDto })
  remove(
    @Param('projectId') _p: string,
    @Param('memberId', ParseUUIDPipe) memberId: string,
    @CurrentUser() user: AuthUser,
    @CurrentAccess() access: ProjectAccess,
  ): Promise<TeamDto> {
    return this.team.remove(user, access, memberId);
  }
}

@ApiTags('team')
@Controller('invitations')
export class InvitationsController {
  constructor(@Inject(TeamService) private readonly team: TeamService) {}

  /** What an invitation link is for (public; the token is the secret) */
  @Public()
  @UseGuards(ThrottlerGuard)
  @Throttle({ login: {} })
  @Get(':token')
  @ApiOkResponse({ type: InvitationInfoDto })
  info(@Param('token') token: string): Promise<InvitationInfoDto> {
    return this.team.invitationInfo(token);
  }

  /**
   * Accepts an invitation, once, for the invited address only: signed in as that address, joins with the
   * account; not signed in, creates the account for it (refused if one exists: sign in first). Signed in
   * as anyone else: 403.
   */
  @Public()
  @UseGuards(ThrottlerGuard)
  @Throttle({ login: {} })
  @Post(':token/accept')
  @HttpCode(200)
  @ApiBearerAuth()
  @ApiOkResponse({ type: AcceptedInvitationDto })
  @ApiForbiddenResponse({ type: ErrorResponseDto, description: 'Signed in as another address' })
  @ApiConflictResponse({ type: ErrorResponseDto, description: 'The address has an account: sign in first' })
  accept(
    @Param('token') token: string,
    @Body() body: AcceptInvitationDto,
    @Req() req: Request,
  ): Promise<AcceptedInvitationDto> {
    return this.team.accept(token, body, req.headers.authorization);
  }
}
