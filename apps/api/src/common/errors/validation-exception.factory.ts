import type { ValidationError } from 'class-validator';
import { DomainException, ErrorCode } from './domain.exception.js';

/** Flattens class-validator errors into `fields: { 'path.to.field': 'message' }`. */
export function validationExceptionFactory(errors: ValidationError[]): DomainException {
  const fields: Record<string, string> = {};
  const walk = (list: ValidationError[], prefix: string): void => {
    for (const e of list) {
      const key = prefix ? `${prefix}.${e.property}` : e.property;
      if (e.constraints) fields[key] = Object.values(e.constraints)[0] ?? 'Not valid.';
      if (e.children?.length) walk(e.children, key);
    }
  };
  walk(errors, '');
  const names = Object.keys(fields);
  const message =
    names.length === 1
      ? `Check ${names[0]}: ${fields[names[0]]}`
      : `Check these fields: ${names.join(', ')}.`;
  return new DomainException(ErrorCode.ValidationFailed, message, fields);
}
