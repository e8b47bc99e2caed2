import { applyDecorators } from '@nestjs/common';
import type { ValidationOptions } from 'class-validator';
import { ValidateIf, registerDecorator, type ValidationArguments } from 'class-validator';

/**
 * A field that may be left out, but not sent as null. class-validator's IsOptional skips the checks for
 * null too, so `{"name": null}` reached the database (500) or wiped a value; here null is refused with a
 * clear message, and every other check still runs on a value that is given. Fields that may hold null use
 * IsOptional (their type says `| null`).
 */
export function Optional(options?: ValidationOptions): PropertyDecorator {
  return applyDecorators(
    ValidateIf((_object: object, value: unknown) => value !== undefined),
    NotNull(options),
  );
}

function NotNull(options?: ValidationOptions): PropertyDecorator {
  return (target: object, propertyName: string | symbol) => {
    registerDecorator({
      name: 'notNull',
      target: target.constructor,
      propertyName: String(propertyName),
      options: {
        message: 'Leave this out to keep it, or give a value; it cannot be empty (null).',
        ...options,
      },
      validator: { validate: (value: unknown, _args: ValidationArguments) => value !== null },
    });
  };
}
