import { Module } from '@nestjs/common';
import { LocalMailController } from './local-mail.controller.js';
import { LocalMailService } from './local-mail.service.js';
import { OperatorGuard } from './operator.guard.js';

@Module({
  controllers: [LocalMailController],
  providers: [LocalMailService, OperatorGuard],
})
export class LocalMailModule {}
