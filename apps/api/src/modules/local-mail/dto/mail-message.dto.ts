import { ApiProperty } from '@nestjs/swagger';

export class MailAttachmentDto {
  index: number;
  filename: string;
  contentType: string;
  size: number;
}

export class MailMessageDto {
  id: string;
  from: string;
  to: string[];
  subject: string;
  /** When the message was sent (ISO 8601) */
  date: string;
  text: string;
  @ApiProperty({ type: String, nullable: true })
  html: string | null;
  attachments: MailAttachmentDto[];
}
