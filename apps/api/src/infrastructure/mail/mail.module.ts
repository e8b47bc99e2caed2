import { Global, Module } from '@nestjs/common';
import { APP_CONFIG, type AppConfig } from '../../config/app-config.js';
import { LogMailService } from './log-mail.service.js';
import { MailService } from './mail.service.js';
import { SmtpMailService } from './smtp-mail.service.js';

@Global()
@Module({
  providers: [
    {
      provide: MailService,
      inject: [APP_CONFIG],
      useFactory: (config: AppConfig): MailService =>
        config.mail.driver === 'smtp' ? new SmtpMailService(config) : new LogMailService(),
    },
  ],
  exports: [MailService],
})
export class MailModule {}
