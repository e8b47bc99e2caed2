import {
  Controller,
  Get,
  HttpCode,
  Inject,
  Param,
  ParseIntPipe,
  ParseUUIDPipe,
  Post,
  UseGuards,
} from '@nestjs/common';
import type { StreamableFile } from '@nestjs/common';
import {
  ApiBearerAuth,
  ApiForbiddenResponse,
  ApiNotFoundResponse,
  ApiOkResponse,
  ApiProduces,
  ApiTags,
} from '@nestjs/swagger';
import { ErrorResponseDto } from '../../common/dto/error-response.dto.js';
import { JobDto, JobsOverviewDto } from './dto/job.dto.js';
import { MailMessageDto } from './dto/mail-message.dto.js';
import { LocalMailService } from './local-mail.service.js';
import { OperatorGuard } from './operator.guard.js';

@ApiTags('local-mail')
@ApiBearerAuth()
@UseGuards(OperatorGuard)
@ApiNotFoundResponse({ type: ErrorResponseDto, description: 'Not in local mode (LOCAL_MODE=true)' })
@ApiForbiddenResponse({ type: ErrorResponseDto, description: 'Not the instance operator' })
@Controller('local')
export class LocalMailController {
  constructor(@Inject(LocalMailService) private readonly mail: LocalMailService) {}

  /** E-mails received by the local SMTP fake, newest first (local mode, the instance operator) */
  @Get('mail')
  @ApiOkResponse({ type: [MailMessageDto] })
  list(): Promise<MailMessageDto[]> {
    return this.mail.list();
  }

  /** One attachment of a received e-mail */
  @Get('mail/:id/attachments/:index')
  @ApiProduces('application/octet-stream')
  @ApiOkResponse({ description: 'The attachment file' })
  attachment(@Param('id') id: string, @Param('index', ParseIntPipe) index: number): Promise<StreamableFile> {
    return this.mail.attachment(id, index);
  }

  /** Background jobs not done yet: waiting, running and failed (with their last error), and counts */
  @Get('jobs')
  @ApiOkResponse({ type: JobsOverviewDto })
  jobs(): Promise<JobsOverviewDto> {
    return this.mail.jobs();
  }

  /** Runs a waiting job now, or starts a failed one over */
  @Post('jobs/:jobId/retry')
  @HttpCode(200)
  @ApiOkResponse({ type: JobDto })
  retry(@Param('jobId', ParseUUIDPipe) jobId: string): Promise<JobDto> {
    return this.mail.retry(jobId);
  }
}
