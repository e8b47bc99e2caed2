import { Global, Module } from '@nestjs/common';
import { HEADING_PROGRESS } from '../../common/ports/heading-progress.port.js';
import { SupportRecordsModule } from '../support-records/support-records.module.js';
import { BoardService } from './board.service.js';

/** Read model of the Board; provides the heading-progress port that the projects module asks. */
@Global()
@Module({
  imports: [SupportRecordsModule],
  providers: [BoardService, { provide: HEADING_PROGRESS, useExisting: BoardService }],
  exports: [HEADING_PROGRESS],
})
export class BoardModule {}
