import {
  Body,
  Controller,
  Get,
  Headers,
  HttpCode,
  Inject,
  Param,
  ParseUUIDPipe,
  Post,
  Put,
  Query,
} from '@nestjs/common';
import {
  ApiBearerAuth,
  ApiConflictResponse,
  ApiCreatedResponse,
  ApiHeader,
  ApiOkResponse,
  ApiQuery,
  ApiTags,
} from '@nestjs/swagger';
import type { AuthUser, ProjectAccess } from '../../common/auth/auth-user.js';
import { CurrentAccess, CurrentUser } from '../../common/auth/current-user.decorator.js';
import { ProjectRoles } from '../../common/auth/project-roles.decorator.js';
import { ErrorResponseDto } from '../../common/dto/error-response.dto.js';
import { DomainException, ErrorCode } from '../../common/errors/domain.exception.js';
import { IDEMPOTENCY_HEADER, readIdempotencyKey } from '../../common/idempotency/idempotency.js';
import { STAGES, type Stage } from '../headings/heading.entity.js';
import {
  CreateRoundDto,
  NearbyJointDto,
  NearbyJointsQueryDto,
  NextRoundDto,
  RoundDto,
  RoundPageDto,
  RoundQueryDto,
  RoundRevisionDto,
  SaveRoundDto,
  SubmitRoundDto,
} from './dto/round.dto.js';
import { RoundsCommands } from './rounds.commands.js';
import { RoundsQueries } from './rounds.queries.js';

@ApiTags('rounds')
@ApiBearerAuth()
@Controller('projects/:projectId')
export class RoundsController {
  constructor(
    @Inject(RoundsCommands) private readonly commands: RoundsCommands,
    @Inject(RoundsQueries) private readonly queries: RoundsQueries,
  ) {}

  /** A page of the heading's rounds, sorted and filtered in the database (any member) */
  @Get('headings/:headingId/rounds')
  @ProjectRoles()
  @ApiOkResponse({ type: RoundPageDto })
  list(
    @Param('projectId') _p: string,
    @Param('headingId', ParseUUIDPipe) headingId: string,
    @CurrentAccess() access: ProjectAccess,
    @Query() query: RoundQueryDto,
  ): Promise<RoundPageDto> {
    return this.queries.list(access, headingId, query);
  }

  /** The number and previous chainage a new round of this stage would get (geologists) */
  @Get('headings/:headingId/rounds/next')
  @ProjectRoles('geologist')
  @ApiQuery({ name: 'stage', enum: STAGES, enumName: 'Stage' })
  @ApiOkResponse({ type: NextRoundDto })
  next(
    @Param('projectId') _p: string,
    @Param('headingId', ParseUUIDPipe) headingId: string,
    @CurrentAccess() access: ProjectAccess,
    @Query('stage') stage: string,
  ): Promise<NextRoundDto> {
    if (!(STAGES as readonly string[]).includes(stage)) {
      throw new DomainException(ErrorCode.ValidationFailed, 'Choose a stage.', {
        stage: `One of: ${STAGES.join(', ')}.`,
      });
    }
    return this.commands.next(access, headingId, stage as Stage);
  }

  /** Opens a new round (draft) on the heading (geologists). A retry with the same Idempotency-Key (or round id) returns the first result. */
  @Post('headings/:headingId/rounds')
  @ProjectRoles('geologist')
  @ApiHeader({
    name: 'Idempotency-Key',
    required: false,
    description:
      'A key (e.g. a UUID) the client keeps for this create; a retried request returns the round the first one made',
  })
  @ApiCreatedResponse({ type: RoundDto })
  create(
    @Param('projectId') _p: string,
    @Param('headingId', ParseUUIDPipe) headingId: string,
    @CurrentUser() user: AuthUser,
    @CurrentAccess() access: ProjectAccess,
    @Body() body: CreateRoundDto,
    @Headers(IDEMPOTENCY_HEADER) key: string | undefined,
  ): Promise<RoundDto> {
    return this.commands.create(user, access, headingId, body, readIdempotencyKey(key));
  }

  /** Every frozen revision of the round (at each submit, and later confirm or return), oldest first (any member) */
  @Get('rounds/:roundId/revisions')
  @ProjectRoles()
  @ApiOkResponse({ type: [RoundRevisionDto] })
  revisions(
    @Param('projectId') _p: string,
    @Param('roundId', ParseUUIDPipe) roundId: string,
    @CurrentAccess() access: ProjectAccess,
  ): Promise<RoundRevisionDto[]> {
    return this.queries.revisions(access, roundId);
  }

  /** Readable joints of the heading over a chainage window, for finding sets (any member) */
  @Get('headings/:headingId/joints')
  @ProjectRoles()
  @ApiOkResponse({ type: [NearbyJointDto] })
  joints(
    @Param('projectId') _p: string,
    @Param('headingId', ParseUUIDPipe) headingId: string,
    @CurrentAccess() access: ProjectAccess,
    @Query() query: NearbyJointsQueryDto,
  ): Promise<NearbyJointDto[]> {
    return this.queries.nearbyJoints(access, headingId, query);
  }

  /** One round with joints, computed ratings, suggested classes and warnings (any member) */
  @Get('rounds/:roundId')
  @ProjectRoles()
  @ApiOkResponse({ type: RoundDto })
  get(
    @Param('projectId') _p: string,
    @Param('roundId', ParseUUIDPipe) roundId: string,
    @CurrentAccess() access: ProjectAccess,
  ): Promise<RoundDto> {
    return this.queries.get(access, roundId);
  }

  /** Saves the round as a whole (geologists; drafts and returned rounds). 409 STALE_VERSION carries the current version. */
  @Put('rounds/:roundId')
  @ProjectRoles('geologist')
  @ApiOkResponse({ type: RoundDto })
  @ApiConflictResponse({
    type: ErrorResponseDto,
    description: 'STALE_VERSION (details.current) or not editable',
  })
  save(
    @Param('projectId') _p: string,
    @Param('roundId', ParseUUIDPipe) roundId: string,
    @CurrentUser() user: AuthUser,
    @CurrentAccess() access: ProjectAccess,
    @Body() body: SaveRoundDto,
  ): Promise<RoundDto> {
    return this.commands.save(user, access, roundId, body);
  }

  /** Submits the round for review (geologists): draft → submitted */
  @Post('rounds/:roundId/submit')
  @HttpCode(200)
  @ProjectRoles('geologist')
  @ApiOkResponse({ type: RoundDto })
  @ApiConflictResponse({ type: ErrorResponseDto })
  submit(
    @Param('projectId') _p: string,
    @Param('roundId', ParseUUIDPipe) roundId: string,
    @CurrentUser() user: AuthUser,
    @CurrentAccess() access: ProjectAccess,
    @Body() body: SubmitRoundDto,
  ): Promise<RoundDto> {
    return this.commands.submit(user, access, roundId, body);
  }
}
