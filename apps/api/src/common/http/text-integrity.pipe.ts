import { Injectable, type ArgumentMetadata, type PipeTransform } from '@nestjs/common';
import { DomainException, ErrorCode } from '../errors/domain.exception.js';
import { loneSurrogatePath } from './json-guard.js';

/** Refuses a body whose text holds a lone UTF-16 surrogate (before validation, which would trip on it). */
@Injectable()
export class TextIntegrityPipe implements PipeTransform {
  transform(value: unknown, metadata: ArgumentMetadata): unknown {
    if (metadata.type !== 'body' && metadata.type !== 'query') return value;
    const where = loneSurrogatePath(value);
    if (where !== null) {
      const field = where.split(/[.[]/)[0] || where;
      throw new DomainException(
        ErrorCode.ValidationFailed,
        `${where} holds a character that is not valid text (a broken pair of UTF-16 surrogates).`,
        { [field]: 'This text holds a character that is not valid; type it again.' },
      );
    }
    return value;
  }
}
