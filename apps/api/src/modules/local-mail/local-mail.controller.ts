import { Controller, Get, Inject, Param, ParseIntPipe } from '@nestjs/common';
import type { StreamableFile } from '@nestjs/common';
import { ApiBearerAuth, ApiOkResponse, ApiProduces, ApiTags } from '@nestjs/swagger';
import type { AuthUser } from '../../common/auth/auth-user.js';
import { CurrentUser } from '../../common/auth/current-user.decorator.js';
import { MailMessageDto } from './dto/mail-message.dto.js';
import { LocalMailService } from './local-mail.service.js';

@ApiTags('local-mail')
@ApiBearerAuth()
@Controller('local/mail')
export class LocalMailController {
  constructor(@Inject(LocalMailService) private readonly mail: LocalMailService) {}

  /** E-mails received by the local SMTP fake, newest first (local mode, project admins) */
  @Get()
  @ApiOkResponse({ type: [MailMessageDto] })
  list(@CurrentUser() user: AuthUser): Promise<MailMessageDto[]> {
    return this.mail.list(user);
  }

  /** One attachment of a received e-mail */
  @Get(':id/attachments/:index')
  @ApiProduces('application/octet-stream')
  @ApiOkResponse({ description: 'The attachment file' })
  attachment(
    @CurrentUser() user: AuthUser,
    @Param('id') id: string,
    @Param('index', ParseIntPipe) index: number,
  ): Promise<StreamableFile> {
    return this.mail.attachment(user, id, index);
  }
}
