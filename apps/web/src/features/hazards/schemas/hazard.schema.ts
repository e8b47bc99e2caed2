import { HAZARD_KINDS, TRIGGER_LEVELS } from '@roundbook/domain';
import { mixed, number, object, string } from 'yup';
import type { ObjectSchema } from 'yup';
import type { CreateHazardRequest, HazardKind, TriggerLevel } from '@/api/contract';

/** What the raise form holds: numbers as typed (a comma is read as the decimal point). */
export interface HazardFormValues {
  kind: HazardKind | '';
  level: TriggerLevel | '';
  fromChainage: string;
  toChainage: string;
  description: string;
}

export const emptyHazardValues = (faceChainage: number | null = null): HazardFormValues => ({
  kind: '',
  level: '',
  fromChainage: faceChainage === null ? '' : String(faceChainage),
  toChainage: faceChainage === null ? '' : String(faceChainage),
  description: '',
});

function typed(_value: unknown, original: unknown): number | null {
  if (typeof original === 'number') return original;
  if (typeof original !== 'string' || original.trim() === '') return null;
  const text = original.trim().replace(',', '.');
  return /^-?(\d+\.?\d*|\.\d+)$/.test(text) ? Number(text) : Number.NaN;
}

const chainage = number()
  .transform(typed)
  .typeError('Give the chainage in metres, e.g. 1234.5.')
  .nullable()
  .required('Give the chainage in metres.');

type HazardInput = Pick<
  CreateHazardRequest,
  'kind' | 'level' | 'fromChainage' | 'toChainage' | 'description'
>;

/** The form's checks; the heading's own limits (start, face) are checked by the server and shown on the field. */
export const hazardSchema: ObjectSchema<HazardInput> = object({
  kind: mixed<HazardKind>()
    .oneOf(HAZARD_KINDS, 'Choose the kind of hazard.')
    .required('Choose the kind of hazard.'),
  level: mixed<TriggerLevel>().oneOf(TRIGGER_LEVELS, 'Choose the level.').required('Choose the level.'),
  fromChainage: chainage.defined(),
  toChainage: chainage.defined(),
  description: string()
    .trim()
    .min(3, 'Say what the hazard is and where (at least 3 characters).')
    .max(2000, 'At most 2000 characters.')
    .required('Say what the hazard is and where.'),
}) as ObjectSchema<HazardInput>;

export function toCreateHazardRequest(
  values: HazardFormValues,
  extra: Pick<CreateHazardRequest, 'id' | 'roundId' | 'origin'>,
): CreateHazardRequest {
  const v = hazardSchema.cast(values);
  return { ...extra, ...v, description: v.description.trim() };
}
