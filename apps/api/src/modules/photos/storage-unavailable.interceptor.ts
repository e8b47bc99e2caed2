import { Injectable, type CallHandler, type ExecutionContext, type NestInterceptor } from '@nestjs/common';
import type { Response } from 'express';
import { catchError, type Observable, throwError } from 'rxjs';
import { DomainException, ErrorCode } from '../../common/errors/domain.exception.js';

/** Seconds a client is asked to wait when object storage is away. */
export const STORAGE_RETRY_AFTER_S = 30;

/** A 503 from these routes tells the client when to try again (the global filter writes the body). */
@Injectable()
export class StorageUnavailableInterceptor implements NestInterceptor {
  intercept(context: ExecutionContext, next: CallHandler): Observable<unknown> {
    return next.handle().pipe(
      catchError((e: unknown) => {
        if (e instanceof DomainException && e.code === ErrorCode.ServiceUnavailable)
          context
            .switchToHttp()
            .getResponse<Response>()
            .setHeader('Retry-After', String(STORAGE_RETRY_AFTER_S));
        return throwError(() => e);
      }),
    );
  }
}
