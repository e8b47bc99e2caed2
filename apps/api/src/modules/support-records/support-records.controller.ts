import { Body, Controller, Get, Inject, Param, ParseUUIDPipe, Put } from '@nestjs/common';
import {
  ApiBadRequestResponse,
  ApiBearerAuth,
  ApiConflictResponse,
  ApiOkResponse,
  ApiTags,
} from '@nestjs/swagger';
import type { AuthUser, ProjectAccess } from '../../common/auth/auth-user.js';
import { CurrentAccess, CurrentUser } from '../../common/auth/current-user.decorator.js';
import { ProjectRoles } from '../../common/auth/project-roles.decorator.js';
import { ErrorResponseDto } from '../../common/dto/error-response.dto.js';
import { SaveSupportRecordDto, SupportRecordDto } from './dto/support-record.dto.js';
import { SupportRecordsService } from './support-records.service.js';

/** Support as built on a confirmed round: members read; supervisors, engineers and admins record. */
@ApiTags('support-records')
@ApiBearerAuth()
@Controller('projects/:projectId/rounds/:roundId/support-record')
export class SupportRecordsController {
  constructor(@Inject(SupportRecordsService) private readonly records: SupportRecordsService) {}

  /** The round's support checklist: as recorded, or prefilled from the confirmed class (any member) */
  @Get()
  @ProjectRoles()
  @ApiOkResponse({ type: SupportRecordDto })
  get(
    @Param('projectId') _p: string,
    @Param('roundId', ParseUUIDPipe) roundId: string,
    @CurrentAccess() access: ProjectAccess,
  ): Promise<SupportRecordDto> {
    return this.records.get(access, roundId);
  }

  /** Records what was installed, item by item, with the version read (supervisors, engineers, admins) */
  @Put()
  @ProjectRoles('supervisor', 'engineer', 'admin')
  @ApiOkResponse({ type: SupportRecordDto })
  @ApiBadRequestResponse({
    type: ErrorResponseDto,
    description: 'A quantity, length or reason that does not fit',
  })
  @ApiConflictResponse({
    type: ErrorResponseDto,
    description: 'Stale version (the current record is in details.current), or the round is not confirmed',
  })
  save(
    @Param('projectId') _p: string,
    @Param('roundId', ParseUUIDPipe) roundId: string,
    @CurrentUser() user: AuthUser,
    @CurrentAccess() access: ProjectAccess,
    @Body() body: SaveSupportRecordDto,
  ): Promise<SupportRecordDto> {
    return this.records.save(user, access, roundId, body);
  }
}
