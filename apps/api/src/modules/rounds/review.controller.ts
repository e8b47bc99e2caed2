import { Body, Controller, Get, HttpCode, Inject, Param, ParseUUIDPipe, Post, Query } from '@nestjs/common';
import {
  ApiBadRequestResponse,
  ApiBearerAuth,
  ApiConflictResponse,
  ApiForbiddenResponse,
  ApiOkResponse,
  ApiTags,
} from '@nestjs/swagger';
import type { AuthUser, ProjectAccess } from '../../common/auth/auth-user.js';
import { CurrentAccess, CurrentUser } from '../../common/auth/current-user.decorator.js';
import { ProjectRoles } from '../../common/auth/project-roles.decorator.js';
import { ErrorResponseDto } from '../../common/dto/error-response.dto.js';
import {
  AcceptConditionDto,
  AcknowledgeRuleDto,
  ConfirmRoundDto,
  CorrectRoundDto,
  ReturnRoundDto,
  ReviewQueueDto,
  ReviewQueueQueryDto,
  RoundReviewDto,
} from './dto/review.dto.js';
import { RoundsAcceptances } from './rounds.acceptances.js';
import { RoundsReview } from './rounds.review.js';

@ApiTags('review')
@ApiBearerAuth()
@Controller('projects/:projectId/rounds/:roundId')
export class RoundReviewController {
  constructor(
    @Inject(RoundsReview) private readonly review: RoundsReview,
    @Inject(RoundsAcceptances) private readonly acceptances: RoundsAcceptances,
  ) {}

  /** The round's review: confirmation, decisions, open return comments and what the caller may do (any member) */
  @Get('review')
  @ProjectRoles()
  @ApiOkResponse({ type: RoundReviewDto })
  get(
    @Param('projectId') _p: string,
    @Param('roundId', ParseUUIDPipe) roundId: string,
    @CurrentUser() user: AuthUser,
    @CurrentAccess() access: ProjectAccess,
  ): Promise<RoundReviewDto> {
    return this.review.review(user, access, roundId);
  }

  /** Confirms a submitted round with the class and next round length to build, signed with the password (engineers) */
  @Post('confirm')
  @HttpCode(200)
  @ProjectRoles('engineer')
  @ApiOkResponse({ type: RoundReviewDto })
  @ApiBadRequestResponse({
    type: ErrorResponseDto,
    description: 'A reason is needed, or the class is not usable',
  })
  @ApiForbiddenResponse({
    type: ErrorResponseDto,
    description: 'Wrong password, or the caller mapped the round (separation of duties)',
  })
  @ApiConflictResponse({ type: ErrorResponseDto, description: 'Not submitted, or STALE_VERSION' })
  confirm(
    @Param('projectId') _p: string,
    @Param('roundId', ParseUUIDPipe) roundId: string,
    @CurrentUser() user: AuthUser,
    @CurrentAccess() access: ProjectAccess,
    @Body() body: ConfirmRoundDto,
  ): Promise<RoundReviewDto> {
    return this.review.confirm(user, access, roundId, body);
  }

  /** Returns a submitted round to the geologist with comments per section: a draft of a new revision (engineers) */
  @Post('return')
  @HttpCode(200)
  @ProjectRoles('engineer')
  @ApiOkResponse({ type: RoundReviewDto })
  @ApiConflictResponse({ type: ErrorResponseDto, description: 'Not submitted, or STALE_VERSION' })
  return(
    @Param('projectId') _p: string,
    @Param('roundId', ParseUUIDPipe) roundId: string,
    @CurrentUser() user: AuthUser,
    @CurrentAccess() access: ProjectAccess,
    @Body() body: ReturnRoundDto,
  ): Promise<RoundReviewDto> {
    return this.review.return(user, access, roundId, body);
  }

  /** Opens a new revision of a confirmed round, with the reason; it is reviewed again (engineers, geologists) */
  @Post('correct')
  @HttpCode(200)
  @ProjectRoles('engineer', 'geologist')
  @ApiOkResponse({ type: RoundReviewDto })
  @ApiConflictResponse({ type: ErrorResponseDto, description: 'Not confirmed, or STALE_VERSION' })
  correct(
    @Param('projectId') _p: string,
    @Param('roundId', ParseUUIDPipe) roundId: string,
    @CurrentUser() user: AuthUser,
    @CurrentAccess() access: ProjectAccess,
    @Body() body: CorrectRoundDto,
  ): Promise<RoundReviewDto> {
    return this.review.correct(user, access, roundId, body);
  }

  /** Acknowledges a fired trigger rule of a submitted or confirmed round, with what was done (the rule's owner role) */
  @Post('triggers/:ruleId/acknowledge')
  @HttpCode(200)
  @ProjectRoles()
  @ApiOkResponse({ type: RoundReviewDto })
  @ApiForbiddenResponse({ type: ErrorResponseDto, description: 'The rule is owned by another role' })
  @ApiConflictResponse({
    type: ErrorResponseDto,
    description: 'Already acknowledged, or the round is not submitted',
  })
  acknowledge(
    @Param('projectId') _p: string,
    @Param('roundId', ParseUUIDPipe) roundId: string,
    @Param('ruleId', ParseUUIDPipe) ruleId: string,
    @CurrentUser() user: AuthUser,
    @CurrentAccess() access: ProjectAccess,
    @Body() body: AcknowledgeRuleDto,
  ): Promise<RoundReviewDto> {
    return this.review.acknowledge(user, access, roundId, ruleId, body);
  }

  /** Accepts a fired rule's standing condition for a chainage range or until a date, with a reason (engineers) */
  @Post('triggers/:ruleId/accept')
  @HttpCode(200)
  @ProjectRoles('engineer')
  @ApiOkResponse({ type: RoundReviewDto })
  @ApiBadRequestResponse({
    type: ErrorResponseDto,
    description: 'No range or date, a date passed, or no reason (a red rule needs a written one)',
  })
  @ApiConflictResponse({
    type: ErrorResponseDto,
    description: 'The round is not submitted or confirmed, or the rule is already accepted on it',
  })
  accept(
    @Param('projectId') _p: string,
    @Param('roundId', ParseUUIDPipe) roundId: string,
    @Param('ruleId', ParseUUIDPipe) ruleId: string,
    @CurrentUser() user: AuthUser,
    @CurrentAccess() access: ProjectAccess,
    @Body() body: AcceptConditionDto,
  ): Promise<RoundReviewDto> {
    return this.acceptances.accept(user, access, roundId, ruleId, body);
  }

  /** Withdraws an acceptance of a standing condition: the rule raises the level again (engineers) */
  @Post('acceptances/:acceptanceId/withdraw')
  @HttpCode(200)
  @ProjectRoles('engineer')
  @ApiOkResponse({ type: RoundReviewDto })
  withdraw(
    @Param('projectId') _p: string,
    @Param('roundId', ParseUUIDPipe) roundId: string,
    @Param('acceptanceId', ParseUUIDPipe) acceptanceId: string,
    @CurrentUser() user: AuthUser,
    @CurrentAccess() access: ProjectAccess,
  ): Promise<RoundReviewDto> {
    return this.acceptances.withdraw(user, access, roundId, acceptanceId);
  }

  /** Marks a return comment resolved (geologists, engineers); the next submit resolves the rest */
  @Post('review/comments/:commentId/resolve')
  @HttpCode(200)
  @ProjectRoles('geologist', 'engineer')
  @ApiOkResponse({ type: RoundReviewDto })
  resolve(
    @Param('projectId') _p: string,
    @Param('roundId', ParseUUIDPipe) roundId: string,
    @Param('commentId', ParseUUIDPipe) commentId: string,
    @CurrentUser() user: AuthUser,
    @CurrentAccess() access: ProjectAccess,
  ): Promise<RoundReviewDto> {
    return this.review.resolve(user, access, roundId, commentId);
  }
}

@ApiTags('review')
@ApiBearerAuth()
@Controller('review')
export class ReviewQueueController {
  constructor(@Inject(RoundsReview) private readonly review: RoundsReview) {}

  /** The caller's queue: submitted rounds of every project where they are an engineer, red first, then oldest */
  @Get('queue')
  @ApiOkResponse({ type: ReviewQueueDto })
  queue(@CurrentUser() user: AuthUser, @Query() query: ReviewQueueQueryDto): Promise<ReviewQueueDto> {
    return this.review.queue(user, query.headingId);
  }
}
