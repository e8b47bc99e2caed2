import {
  ArgumentsHost,
  Catch,
  HttpException,
  HttpStatus,
  Logger,
  type ExceptionFilter,
} from '@nestjs/common';
import type { Response } from 'express';
import { databaseFailure } from './database-errors.js';
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
    const { status, body } = this.toBody(exception);
    if (status >= 500)
      this.logger.error(
        exception instanceof Error ? (exception.stack ?? exception.message) : String(exception),
      );
    if (status === 503) res.setHeader('Retry-After', '5');
    res.status(status).json(body);
  }

  private toBody(exception: unknown): { status: number; body: ErrorBody } {
    if (exception instanceof DomainException) {
      return {
        status: exception.status,
        body: {
          code: exception.code,
          message: exception.message,
          fields: exception.fields,
          details: exception.details,
        },
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
    const typeOf = (exception as { type?: string } | null)?.type;
    if (typeOf === 'entity.too.large') {
      return {
        status: HttpStatus.PAYLOAD_TOO_LARGE,
        body: { code: ErrorCode.PayloadTooLarge, message: friendly[413]! },
      };
    }
    if (typeOf === 'entity.too.deep') {
      return {
        status: HttpStatus.BAD_REQUEST,
        body: { code: ErrorCode.ValidationFailed, message: 'The request body is nested too deeply.' },
      };
    }
    const db = databaseFailure(exception);
    if (db !== null) {
      const status =
        db.kind === 'conflict'
          ? HttpStatus.CONFLICT
          : db.kind === 'bad-value'
            ? HttpStatus.BAD_REQUEST
            : HttpStatus.SERVICE_UNAVAILABLE;
      const code =
        db.kind === 'conflict'
          ? ErrorCode.Conflict
          : db.kind === 'bad-value'
            ? ErrorCode.ValidationFailed
            : ErrorCode.ServiceUnavailable;
      return { status, body: { code, message: db.message } };
    }
    if (typeOf === 'entity.parse.failed') {
      return {
        status: HttpStatus.BAD_REQUEST,
        body: { code: ErrorCode.ValidationFailed, message: 'The request body is not valid JSON.' },
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
