import {
  Body,
  Controller,
  Get,
  HttpCode,
  Inject,
  Param,
  ParseUUIDPipe,
  Post,
  Query,
  UseInterceptors,
} from '@nestjs/common';
import {
  ApiBearerAuth,
  ApiConflictResponse,
  ApiCreatedResponse,
  ApiOkResponse,
  ApiServiceUnavailableResponse,
  ApiTags,
} from '@nestjs/swagger';
import type { AuthUser, ProjectAccess } from '../../common/auth/auth-user.js';
import { CurrentAccess, CurrentUser } from '../../common/auth/current-user.decorator.js';
import { ProjectRoles } from '../../common/auth/project-roles.decorator.js';
import { ErrorResponseDto } from '../../common/dto/error-response.dto.js';
import { StorageUnavailableInterceptor } from '../photos/storage-unavailable.interceptor.js';
import {
  AcknowledgeHandoverDto,
  ComposeHandoverDto,
  HandoverDraftDto,
  HandoverDraftQueryDto,
  HandoverDto,
  HandoverUrlDto,
} from './dto/handover.dto.js';
import { HandoversService } from './handovers.service.js';

/** Shift handovers of a project: supervisors (and admins) compose and send; the named incoming supervisor acknowledges. */
@ApiTags('handovers')
@ApiBearerAuth()
@Controller('projects/:projectId')
export class HandoversController {
  constructor(@Inject(HandoversService) private readonly handovers: HandoversService) {}

  /** What the composer opens with: each heading's figures from the data now, and who can receive it */
  @Get('handovers/draft')
  @ProjectRoles('supervisor', 'admin')
  @ApiOkResponse({ type: HandoverDraftDto })
  draft(
    @Param('projectId', ParseUUIDPipe) _projectId: string,
    @CurrentAccess() access: ProjectAccess,
    @CurrentUser() user: AuthUser,
    @Query() query: HandoverDraftQueryDto,
  ): Promise<HandoverDraftDto> {
    return this.handovers.draft(access, user, query.headingIds);
  }

  /** Saves the handover (figures frozen as they are now) and sends it: the PDF and the e-mail follow by job */
  @Post('handovers')
  @ProjectRoles('supervisor', 'admin')
  @ApiCreatedResponse({ type: HandoverDto })
  compose(
    @Param('projectId', ParseUUIDPipe) _projectId: string,
    @CurrentAccess() access: ProjectAccess,
    @CurrentUser() user: AuthUser,
    @Body() dto: ComposeHandoverDto,
  ): Promise<HandoverDto> {
    return this.handovers.compose(access, user, dto);
  }

  /** One handover as it was sent, with its acknowledgement (any member) */
  @Get('handovers/:handoverId')
  @ProjectRoles()
  @ApiOkResponse({ type: HandoverDto })
  get(
    @CurrentAccess() access: ProjectAccess,
    @Param('handoverId', ParseUUIDPipe) handoverId: string,
  ): Promise<HandoverDto> {
    return this.handovers.get(access, handoverId);
  }

  /** A signed address, valid a few minutes, of the handover's PDF (any member) */
  @Get('handovers/:handoverId/pdf')
  @ProjectRoles()
  @UseInterceptors(StorageUnavailableInterceptor)
  @ApiOkResponse({ type: HandoverUrlDto })
  @ApiConflictResponse({ type: ErrorResponseDto, description: 'The PDF is still being made' })
  @ApiServiceUnavailableResponse({
    type: ErrorResponseDto,
    description: 'Object storage unreachable (Retry-After)',
  })
  pdf(
    @CurrentAccess() access: ProjectAccess,
    @Param('handoverId', ParseUUIDPipe) handoverId: string,
  ): Promise<HandoverUrlDto> {
    return this.handovers.pdfUrl(access, handoverId);
  }

  /** The incoming supervisor named on it acknowledges, once, optionally with a comment (others 403) */
  @Post('handovers/:handoverId/acknowledge')
  @HttpCode(200)
  @ProjectRoles('supervisor')
  @ApiOkResponse({ type: HandoverDto })
  @ApiConflictResponse({ type: ErrorResponseDto, description: 'Already acknowledged' })
  acknowledge(
    @CurrentAccess() access: ProjectAccess,
    @CurrentUser() user: AuthUser,
    @Param('handoverId', ParseUUIDPipe) handoverId: string,
    @Body() dto: AcknowledgeHandoverDto,
  ): Promise<HandoverDto> {
    return this.handovers.acknowledge(access, user, handoverId, dto);
  }

  /** Every handover of a heading, newest first (any member) */
  @Get('headings/:headingId/handovers')
  @ProjectRoles()
  @ApiOkResponse({ type: [HandoverDto] })
  history(
    @CurrentAccess() access: ProjectAccess,
    @Param('headingId', ParseUUIDPipe) headingId: string,
  ): Promise<HandoverDto[]> {
    return this.handovers.history(access, headingId);
  }
}

/** The signed-in person's Received list, across their projects. */
@ApiTags('handovers')
@ApiBearerAuth()
@Controller('handovers')
export class ReceivedHandoversController {
  constructor(@Inject(HandoversService) private readonly handovers: HandoversService) {}

  /** Handovers addressed to the caller: those waiting for acknowledgement first, then the newest */
  @Get('received')
  @ApiOkResponse({ type: [HandoverDto] })
  received(@CurrentUser() user: AuthUser): Promise<HandoverDto[]> {
    return this.handovers.received(user);
  }
}
