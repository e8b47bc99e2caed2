import { Global, Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { APP_CONFIG, type AppConfig } from '../../config/app-config.js';
import { JobHandlers } from './job-handlers.js';
import { Job } from './job.entity.js';
import { JobsService } from './jobs.service.js';
import { JobsWorker, WORKER_OPTIONS, type WorkerOptions } from './jobs.worker.js';

/** The jobs table, the handler registry and this process's worker (WORKER_ENABLED). */
@Global()
@Module({
  imports: [TypeOrmModule.forFeature([Job])],
  providers: [
    JobsService,
    JobHandlers,
    {
      provide: WORKER_OPTIONS,
      inject: [APP_CONFIG],
      useFactory: (config: AppConfig): WorkerOptions => workerOptions(config),
    },
    JobsWorker,
  ],
  exports: [JobsService, JobHandlers, JobsWorker],
})
export class JobsModule {}

export function workerOptions(config: AppConfig): WorkerOptions {
  const j = config.jobs;
  return {
    enabled: j.workerEnabled,
    pollIntervalMs: j.pollIntervalMs,
    concurrency: j.concurrency,
    leaseMs: j.leaseMs,
    retry: { maxAttempts: j.maxAttempts, baseMs: j.backoffBaseMs, maxMs: j.backoffMaxMs },
    shutdownGraceMs: 20_000,
  };
}
