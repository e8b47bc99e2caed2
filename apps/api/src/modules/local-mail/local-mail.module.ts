import { Module } from '@nestjs/common';
import { LocalAccessController } from './local-access.controller.js';
import { LocalMailController } from './local-mail.controller.js';
import { LocalMailService } from './local-mail.service.js';
import { OperatorGuard } from './operator.guard.js';

@Module({
  controllers: [LocalAccessController, LocalMailController],
  providers: [LocalMailService, OperatorGuard],
})
export class LocalMailModule {}
