import { ApiProperty } from '@nestjs/swagger';
import { JOB_STATES } from '../../../infrastructure/jobs/job.entity.js';

export class JobDto {
  id: string;
  /** The handler, e.g. mail.send */
  kind: string;
  @ApiProperty({ enum: JOB_STATES, enumName: 'JobState' })
  state: (typeof JOB_STATES)[number];
  attempts: number;
  maxAttempts: number;
  nextAttemptAt: string;
  @ApiProperty({ type: String, nullable: true })
  lastError: string | null;
  /** For e-mails: to whom and about what */
  @ApiProperty({ type: String, nullable: true })
  summary: string | null;
  createdAt: string;
  updatedAt: string;
}

export class JobCountsDto {
  pending: number;
  running: number;
  done: number;
  dead: number;
}

export class JobsOverviewDto {
  counts: JobCountsDto;
  /** Jobs not done, most recently changed first */
  jobs: JobDto[];
}
