import { Injectable } from '@nestjs/common';
import type { Job } from './job.entity.js';

export interface JobContext {
  job: Job;
  /** 1 for the first attempt */
  attempt: number;
  /** Aborted when the worker is stopping and will not wait any longer */
  signal: AbortSignal;
}

export type JobHandler = (payload: Record<string, unknown>, context: JobContext) => Promise<void>;

/** Thrown by a handler when retrying cannot help (bad payload, the thing is gone): the job dies at once. */
export class PermanentJobError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'PermanentJobError';
  }
}

/**
 * Handlers by job kind. A feature registers its handlers when its module starts
 * (`onModuleInit() { handlers.register('mail.send', …) }`); the worker looks them up by the row's kind.
 */
@Injectable()
export class JobHandlers {
  private readonly handlers = new Map<string, JobHandler>();

  register(kind: string, handler: JobHandler): void {
    if (this.handlers.has(kind)) throw new Error(`A job handler for "${kind}" is already registered.`);
    this.handlers.set(kind, handler);
  }

  get(kind: string): JobHandler | undefined {
    return this.handlers.get(kind);
  }

  kinds(): string[] {
    return [...this.handlers.keys()].sort();
  }
}
