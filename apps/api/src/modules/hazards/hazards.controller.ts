import {
  Body,
  Controller,
  Get,
  Headers,
  HttpCode,
  Inject,
  Param,
  ParseUUIDPipe,
  Patch,
  Post,
  Query,
} from '@nestjs/common';
import {
  ApiBearerAuth,
  ApiConflictResponse,
  ApiCreatedResponse,
  ApiHeader,
  ApiOkResponse,
  ApiTags,
} from '@nestjs/swagger';
import type { AuthUser, ProjectAccess } from '../../common/auth/auth-user.js';
import { CurrentAccess, CurrentUser } from '../../common/auth/current-user.decorator.js';
import { ProjectRoles } from '../../common/auth/project-roles.decorator.js';
import { ErrorResponseDto } from '../../common/dto/error-response.dto.js';
import { IDEMPOTENCY_HEADER, readIdempotencyKey } from '../../common/idempotency/idempotency.js';
import {
  CloseHazardDto,
  CreateHazardDto,
  HazardDto,
  HazardQueryDto,
  UpdateHazardDto,
} from './dto/hazard.dto.js';
import { HazardsService } from './hazards.service.js';

/** A heading's hazard register: members read; everyone but viewers raises; engineers, supervisors and admins close. */
@ApiTags('hazards')
@ApiBearerAuth()
@Controller('projects/:projectId/headings/:headingId/hazards')
export class HazardsController {
  constructor(@Inject(HazardsService) private readonly hazards: HazardsService) {}

  /** The heading's hazards: open ones first (red, amber, green; then by chainage), then closed, latest first (any member) */
  @Get()
  @ProjectRoles()
  @ApiOkResponse({ type: [HazardDto] })
  list(
    @Param('projectId') _p: string,
    @Param('headingId', ParseUUIDPipe) headingId: string,
    @CurrentAccess() access: ProjectAccess,
    @Query() query: HazardQueryDto,
  ): Promise<HazardDto[]> {
    return this.hazards.list(access, headingId, query);
  }

  /** Raises a hazard on the heading, directly, from a round or from a handover (geologists, engineers, supervisors, admins). A retry with the same Idempotency-Key (or hazard id) returns the first result. */
  @Post()
  @ProjectRoles('geologist', 'engineer', 'supervisor', 'admin')
  @ApiHeader({
    name: 'Idempotency-Key',
    required: false,
    description:
      'A key (e.g. a UUID) the client keeps for this create; a retried request returns the hazard the first one made',
  })
  @ApiCreatedResponse({ type: HazardDto })
  create(
    @Param('projectId') _p: string,
    @Param('headingId', ParseUUIDPipe) headingId: string,
    @CurrentUser() user: AuthUser,
    @CurrentAccess() access: ProjectAccess,
    @Body() body: CreateHazardDto,
    @Headers(IDEMPOTENCY_HEADER) key: string | undefined,
  ): Promise<HazardDto> {
    return this.hazards.create(user, access, headingId, body, readIdempotencyKey(key));
  }

  /** One hazard (any member) */
  @Get(':hazardId')
  @ProjectRoles()
  @ApiOkResponse({ type: HazardDto })
  get(
    @Param('projectId') _p: string,
    @Param('headingId', ParseUUIDPipe) headingId: string,
    @Param('hazardId', ParseUUIDPipe) hazardId: string,
    @CurrentAccess() access: ProjectAccess,
  ): Promise<HazardDto> {
    return this.hazards.get(access, headingId, hazardId);
  }

  /** Changes an open hazard: kind, range, level, description, photos (geologists, engineers, supervisors, admins) */
  @Patch(':hazardId')
  @ProjectRoles('geologist', 'engineer', 'supervisor', 'admin')
  @ApiOkResponse({ type: HazardDto })
  @ApiConflictResponse({ type: ErrorResponseDto, description: 'Stale version, or the hazard is closed' })
  update(
    @Param('projectId') _p: string,
    @Param('headingId', ParseUUIDPipe) headingId: string,
    @Param('hazardId', ParseUUIDPipe) hazardId: string,
    @CurrentUser() user: AuthUser,
    @CurrentAccess() access: ProjectAccess,
    @Body() body: UpdateHazardDto,
  ): Promise<HazardDto> {
    return this.hazards.update(user, access, headingId, hazardId, body);
  }

  /** Closes the hazard with the reason it no longer stands (engineers, supervisors, admins) */
  @Post(':hazardId/close')
  @HttpCode(200)
  @ProjectRoles('engineer', 'supervisor', 'admin')
  @ApiOkResponse({ type: HazardDto })
  @ApiConflictResponse({ type: ErrorResponseDto, description: 'Stale version, or already closed' })
  close(
    @Param('projectId') _p: string,
    @Param('headingId', ParseUUIDPipe) headingId: string,
    @Param('hazardId', ParseUUIDPipe) hazardId: string,
    @CurrentUser() user: AuthUser,
    @CurrentAccess() access: ProjectAccess,
    @Body() body: CloseHazardDto,
  ): Promise<HazardDto> {
    return this.hazards.close(user, access, headingId, hazardId, body);
  }
}
