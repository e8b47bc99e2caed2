import { HttpStatus } from '@nestjs/common';

/** Error codes the API returns in `{ code, message }`. The web app switches on these. */
export enum ErrorCode {
  ValidationFailed = 'VALIDATION_FAILED',
  InvalidCredentials = 'INVALID_CREDENTIALS',
  Unauthenticated = 'UNAUTHENTICATED',
  Forbidden = 'FORBIDDEN',
  NotFound = 'NOT_FOUND',
  Conflict = 'CONFLICT',
  StaleVersion = 'STALE_VERSION',
  NeedsConfirmation = 'NEEDS_CONFIRMATION',
  TooManyRequests = 'TOO_MANY_REQUESTS',
  PayloadTooLarge = 'PAYLOAD_TOO_LARGE',
  UnsupportedMediaType = 'UNSUPPORTED_MEDIA_TYPE',
  ServiceUnavailable = 'SERVICE_UNAVAILABLE',
  Internal = 'INTERNAL',
}

const statusOf: Record<ErrorCode, HttpStatus> = {
  [ErrorCode.ValidationFailed]: HttpStatus.BAD_REQUEST,
  [ErrorCode.InvalidCredentials]: HttpStatus.UNAUTHORIZED,
  [ErrorCode.Unauthenticated]: HttpStatus.UNAUTHORIZED,
  [ErrorCode.Forbidden]: HttpStatus.FORBIDDEN,
  [ErrorCode.NotFound]: HttpStatus.NOT_FOUND,
  [ErrorCode.Conflict]: HttpStatus.CONFLICT,
  [ErrorCode.StaleVersion]: HttpStatus.CONFLICT,
  [ErrorCode.NeedsConfirmation]: HttpStatus.CONFLICT,
  [ErrorCode.TooManyRequests]: HttpStatus.TOO_MANY_REQUESTS,
  [ErrorCode.PayloadTooLarge]: HttpStatus.PAYLOAD_TOO_LARGE,
  [ErrorCode.UnsupportedMediaType]: HttpStatus.UNSUPPORTED_MEDIA_TYPE,
  [ErrorCode.ServiceUnavailable]: HttpStatus.SERVICE_UNAVAILABLE,
  [ErrorCode.Internal]: HttpStatus.INTERNAL_SERVER_ERROR,
};

/** A typed domain error; the global filter turns it into `{ code, message, fields? }` with its status. */
export class DomainException extends Error {
  constructor(
    readonly code: ErrorCode,
    message: string,
    readonly fields?: Record<string, string>,
    readonly details?: Record<string, unknown>,
  ) {
    super(message);
    this.name = 'DomainException';
  }

  get status(): HttpStatus {
    return statusOf[this.code];
  }

  static notFound(what: string): DomainException {
    return new DomainException(ErrorCode.NotFound, `${what} was not found.`);
  }

  static forbidden(message: string): DomainException {
    return new DomainException(ErrorCode.Forbidden, message);
  }
}
