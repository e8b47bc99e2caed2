import { registerDecorator, type ValidationOptions } from 'class-validator';

/** True for a real calendar date written YYYY-MM-DD, years 1900–2999 (no 2026-02-30, no 0000-00-00). */
export function isCalendarDate(value: unknown): boolean {
  if (typeof value !== 'string') return false;
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(value);
  if (!m) return false;
  const [y, mo, d] = [Number(m[1]), Number(m[2]), Number(m[3])];
  if (y < 1900 || y > 2999) return false;
  const date = new Date(Date.UTC(y, mo - 1, d));
  return date.getUTCFullYear() === y && date.getUTCMonth() === mo - 1 && date.getUTCDate() === d;
}

/** A date field: a real calendar date such as 2026-11-30. */
export function IsCalendarDate(options?: ValidationOptions): PropertyDecorator {
  return (target, propertyName) =>
    registerDecorator({
      name: 'isCalendarDate',
      target: target.constructor,
      propertyName: propertyName as string,
      options: { message: '$property is a real calendar date such as 2026-11-30.', ...options },
      validator: { validate: isCalendarDate },
    });
}
