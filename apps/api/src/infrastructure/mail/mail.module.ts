import { Global, Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { APP_CONFIG, type AppConfig } from '../../config/app-config.js';
import { JobsModule } from '../jobs/jobs.module.js';
import { LogMailService } from './log-mail.service.js';
import { MailService } from './mail.service.js';
import { Notice } from './notice.entity.js';
import { NoticesService } from './notices.service.js';
import { SmtpMailService } from './smtp-mail.service.js';

/** E-mail: the transport (MailService) and the outbox (NoticesService), which sends through the jobs worker. */
@Global()
@Module({
  imports: [JobsModule, TypeOrmModule.forFeature([Notice])],
  providers: [
    {
      provide: MailService,
      inject: [APP_CONFIG],
      useFactory: (config: AppConfig): MailService =>
        config.mail.driver === 'smtp' ? new SmtpMailService(config) : new LogMailService(),
    },
    NoticesService,
  ],
  exports: [MailService, NoticesService, JobsModule],
})
export class MailModule {}
