import { Global, Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { IdempotencyKey } from '../../common/idempotency/idempotency-key.entity.js';
import { ROUNDS_READ } from '../../common/ports/rounds-read.port.js';
import { AuditModule } from '../audit/audit.module.js';
import { HazardsModule } from '../hazards/hazards.module.js';
import { Heading } from '../headings/heading.entity.js';
import { HeadingsModule } from '../headings/headings.module.js';
import { NoticeSettingsModule } from '../notice-settings/notice-settings.module.js';
import { ProjectMember } from '../projects/project-member.entity.js';
import { ProjectsModule } from '../projects/projects.module.js';
import { SupportClassesModule } from '../support-classes/support-classes.module.js';
import { TriggerRulesModule } from '../trigger-rules/trigger-rules.module.js';
import { Joint } from './joint.entity.js';
import { ReviewQueueController, RoundReviewController } from './review.controller.js';
import { RoundAssessor } from './round-assessor.service.js';
import {
  RoundComment,
  RoundDecision,
  TriggerAcceptance,
  TriggerAcknowledgement,
} from './round-review.entity.js';
import { RoundRevision } from './round-revision.entity.js';
import { Round } from './round.entity.js';
import { RoundsExportController } from './rounds-export.controller.js';
import { RoundsExport } from './rounds-export.service.js';
import { RoundsReadAdapter } from './rounds-read.adapter.js';
import { RoundsAcceptances } from './rounds.acceptances.js';
import { RoundsCommands } from './rounds.commands.js';
import { RoundsController } from './rounds.controller.js';
import { RoundsQueries } from './rounds.queries.js';
import { RoundsReview } from './rounds.review.js';
import { SketchRenderController } from './sketch-render.controller.js';
import { SketchRenders } from './sketch-render.service.js';

/**
 * Rounds, their joints, sets (in the assessment) and revisions. Depends on the setup modules through their
 * exported services; provides the ROUNDS_READ port that setup asks (global, so setup never imports rounds).
 */
@Global()
@Module({
  imports: [
    TypeOrmModule.forFeature([
      Round,
      Joint,
      RoundRevision,
      RoundDecision,
      RoundComment,
      TriggerAcknowledgement,
      TriggerAcceptance,
      IdempotencyKey,
      ProjectMember,
      Heading,
    ]),
    AuditModule,
    ProjectsModule,
    HeadingsModule,
    SupportClassesModule,
    TriggerRulesModule,
    HazardsModule,
    NoticeSettingsModule,
  ],
  controllers: [
    RoundsController,
    RoundReviewController,
    ReviewQueueController,
    SketchRenderController,
    RoundsExportController,
  ],
  providers: [
    RoundAssessor,
    RoundsQueries,
    RoundsCommands,
    RoundsReview,
    RoundsAcceptances,
    RoundsExport,
    RoundsReadAdapter,
    SketchRenders,
    { provide: ROUNDS_READ, useExisting: RoundsReadAdapter },
  ],
  exports: [ROUNDS_READ, RoundsQueries, RoundAssessor],
})
export class RoundsModule {}
