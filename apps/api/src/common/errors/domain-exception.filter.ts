import {
  ArgumentsHost,
  Catch,
  HttpException,
  HttpStatus,
  Logger,
  type ExceptionFilter,
} from '@nestjs/common';
import type { Response } from 'express';
import { PoolWaitTimeoutError, RequestAbandonedError } from '../../database/pool-wait.js';
import { JsonTooDeepError } from '../http/guarded-json.js';
import { LONE_SURROGATE_MESSAGE } from '../http/well-formed-text.js';
import { answerOfDatabaseError } from './database-errors.js';
import { DomainException, ErrorCode } from './domain.exception.js';

export interface ErrorBody {
  code: string;
  message: string;
  fields?: Record<string, string>;
  details?: Record<string, unknown>;
}

const codeOfStatus: Partial<Record<number, ErrorCode>> = {
  400: ErrorCode.ValidationFailed,
  401: ErrorCode.Unauthenticated,
  403: ErrorCode.Forbidden,
  404: ErrorCode.NotFound,
  409: ErrorCode.Conflict,
  413: ErrorCode.PayloadTooLarge,
  415: ErrorCode.UnsupportedMediaType,
  429: ErrorCode.TooManyRequests,
  503: ErrorCode.ServiceUnavailable,
};

const friendly: Partial<Record<number, string>> = {
  401: 'Please sign in again.',
  403: 'Your role in this project does not allow this.',
  404: 'Nothing was found at this address.',
  413: 'The request is too large.',
  429: 'Too many attempts. Wait a minute and try again.',
};

/** One error body for the whole API (immich's GlobalExceptionFilter; twenty's CustomException). */
@Catch()
export class DomainExceptionFilter implements ExceptionFilter {
  private readonly logger = new Logger('Errors');

  catch(exception: unknown, host: ArgumentsHost): void {
    const res = host.switchToHttp().getResponse<Response>();
    const { status, body, retryAfterSeconds } = this.toBody(exception);
    // Every 503 says when to try again (a dependency is down, not the request wrong).
    // A header already set by the part that knows better (e.g. photos when storage is away) is kept.
    const alreadySaid = typeof res.getHeader === 'function' && res.getHeader('Retry-After') !== undefined;
    if (!alreadySaid && (status === 503 || (status === 429 && retryAfterSeconds !== undefined)))
      res.setHeader('Retry-After', String(retryAfterSeconds ?? 10));
    // Overload answers are one line each (a stack per shed request would add to the load); a request whose
    // client has gone is not worth a line at all.
    if (exception instanceof RequestAbandonedError) {
      // nothing to log
    } else if (exception instanceof PoolWaitTimeoutError) this.logger.warn(`503: ${exception.message}`);
    else if (status >= 500)
      this.logger.error(
        exception instanceof Error ? (exception.stack ?? exception.message) : String(exception),
      );
    else if (status === 409 && !(exception instanceof DomainException) && exception instanceof Error)
      this.logger.warn(`409 from the database: ${exception.message}`);
    res.status(status).json(body);
  }

  private toBody(exception: unknown): { status: number; body: ErrorBody; retryAfterSeconds?: number } {
    if (exception instanceof DomainException) {
      return {
        status: exception.status,
        body: {
          code: exception.code,
          message: exception.message,
          fields: exception.fields,
          details: exception.details,
        },
        retryAfterSeconds:
          typeof exception.details?.retryAfterSeconds === 'number'
            ? exception.details.retryAfterSeconds
            : undefined,
      };
    }
    if (exception instanceof HttpException) {
      const status = exception.getStatus();
      const response = exception.getResponse();
      const raw =
        typeof response === 'object' && response && 'message' in response ? response.message : undefined;
      const message = friendly[status] ?? (typeof raw === 'string' ? raw : exception.message);
      return { status, body: { code: codeOfStatus[status] ?? `HTTP_${status}`, message } };
    }
    if (exception instanceof JsonTooDeepError) {
      return { status: 400, body: { code: ErrorCode.ValidationFailed, message: exception.message } };
    }
    const db = answerOfDatabaseError(exception);
    if (db) {
      const code = {
        400: ErrorCode.ValidationFailed,
        409: ErrorCode.Conflict,
        503: ErrorCode.ServiceUnavailable,
      }[db.status];
      return {
        status: db.status,
        body: { code, message: db.message },
        retryAfterSeconds: db.retryAfterSeconds,
      };
    }
    const typeOf = (exception as { type?: string } | null)?.type;
    if (typeOf === 'entity.too.large') {
      return {
        status: HttpStatus.PAYLOAD_TOO_LARGE,
        body: { code: ErrorCode.PayloadTooLarge, message: friendly[413]! },
      };
    }
    if (typeOf === 'entity.parse.failed') {
      return {
        status: HttpStatus.BAD_REQUEST,
        body: {
          code: ErrorCode.ValidationFailed,
          message:
            (exception as Error).message === LONE_SURROGATE_MESSAGE
              ? LONE_SURROGATE_MESSAGE
              : 'The request body is not valid JSON.',
        },
      };
    }
    return {
      status: HttpStatus.INTERNAL_SERVER_ERROR,
      body: {
        code: ErrorCode.Internal,
        message: 'Something went wrong on the server. Nothing you entered was lost; try again.',
      },
    };
  }
}
