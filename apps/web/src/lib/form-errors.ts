import type { FormikHelpers, FormikTouched } from 'formik';
import { isApiError, NETWORK_ERROR_CODE } from '@/lib/api-client';

export const STALE_VERSION_CODE = 'STALE_VERSION';

/** A saved record someone else changed first: the server's sentence and, when sent, their version. */
export interface StaleVersion<T> {
  message: string;
  current: T | null;
}

/** The 409 STALE_VERSION of a save, or null for any other outcome. */
export function staleVersionOf<T>(error: unknown): StaleVersion<T> | null {
  if (!isApiError(error) || error.code !== STALE_VERSION_CODE) return null;
  const current = error.details?.current;
  return {
    message: error.message,
    current: typeof current === 'object' && current !== null ? (current as T) : null,
  };
}

/**
 * Puts the API's per-field messages on the form's fields (renaming API field names where the form
 * uses its own) and returns what to show above the form, or null when the fields say it all.
 */
export function applyServerErrors<V extends object>(
  error: unknown,
  helpers: Pick<FormikHelpers<V>, 'setErrors' | 'setTouched'>,
  values: V,
  rename: Record<string, string> = {},
): string {
  if (!isApiError(error)) return 'Something unexpected went wrong. Try again.';
  if (error.code === NETWORK_ERROR_CODE) {
    return 'The Roundbook server could not be reached. Your typing is kept; try again when the connection is back.';
  }
  const fields = error.fields ?? {};
  const known = Object.keys(values);
  const errors: Record<string, string> = {};
  const unplaced: string[] = [];
  for (const [apiName, message] of Object.entries(fields)) {
    const name = rename[apiName] ?? apiName.split('.')[0];
    if (known.includes(name)) errors[name] = message;
    else unplaced.push(message);
  }
  if (Object.keys(errors).length > 0) {
    const touched = Object.fromEntries(Object.keys(errors).map((k) => [k, true])) as FormikTouched<V>;
    void helpers.setTouched(touched, false);
    helpers.setErrors(errors as Parameters<typeof helpers.setErrors>[0]);
  }
  if (unplaced.length > 0) return unplaced.join(' ');
  if (Object.keys(errors).length > 0) return `${error.message} See the messages under the fields.`;
  if (error.status === 403) return 'Your role in this project does not allow this change.';
  return error.message;
}

/** Text of a form value for the "your typing / saved by them" comparison. */
function shown(value: unknown): string {
  if (value === null || value === undefined || value === '') return '(empty)';
  if (Array.isArray(value)) return value.length === 0 ? '(none)' : value.map(shown).join(', ');
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  if (typeof value === 'string' || typeof value === 'number') return String(value);
  return JSON.stringify(value);
}

/** The labelled fields where two sets of form values differ. */
export function differencesBetween<V extends object>(
  yours: V,
  theirs: V,
  labels: Partial<Record<keyof V, string>>,
): { label: string; yours: string; theirs: string }[] {
  const out: { label: string; yours: string; theirs: string }[] = [];
  for (const key of Object.keys(labels) as (keyof V)[]) {
    const a = shown(yours[key]);
    const b = shown(theirs[key]);
    if (a !== b) out.push({ label: labels[key] ?? String(key), yours: a, theirs: b });
  }
  return out;
}
