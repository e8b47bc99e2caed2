import { randomUUID } from 'node:crypto';
import { Injectable, Logger } from '@nestjs/common';
import { MailService, type MailMessage } from './mail.service.js';

/** MAIL_DRIVER=log: writes messages to the log instead of sending them. */
@Injectable()
export class LogMailService extends MailService {
  private readonly logger = new Logger('Mail');

  send(message: MailMessage): Promise<{ messageId: string }> {
    this.logger.log(`(not sent, MAIL_DRIVER=log) to ${message.to.join(', ')}: ${message.subject}`);
    return Promise.resolve({ messageId: message.messageId ?? `<${randomUUID()}@log>` });
  }

  check(): Promise<string> {
    return Promise.resolve('log driver: messages are written to the log, not sent');
  }
}
