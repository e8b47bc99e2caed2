import { Q_RANGE } from '@roundbook/domain';
import { boolean, number, object, string } from 'yup';
import type { ObjectSchema } from 'yup';
import type { CreateSupportClassRequest, SupportClass } from '@/api/contract';

export interface SupportClassFormValues {
  code: string;
  name: string;
  qMin: string;
  qMax: string;
  rmrMin: string;
  rmrMax: string;
  maxRoundLength: string;
  boltType: string;
  boltLength: string;
  boltPattern: string;
  shotcreteMm: string;
  steelSupport: string;
  probingRequired: boolean;
  notes: string;
}

export type SupportClassInput = Required<CreateSupportClassRequest>;

function typed(original: unknown): number | null | undefined {
  if (typeof original === 'number') return original;
  if (original === null) return null;
  if (typeof original !== 'string') return undefined;
  const text = original.trim().replace(',', '.');
  if (text === '') return null;
  return /^-?(\d+\.?\d*|\.\d+)$/.test(text) ? Number(text) : Number.NaN;
}

const optionalNumber = (typeError: string) =>
  number()
    .transform((_v: unknown, original: unknown) => typed(original))
    .typeError(typeError)
    .nullable()
    .default(null)
    .defined();

const RMR_RANGE = 'RMR89 is a whole number, 0 to 100.';

export const supportClassSchema: ObjectSchema<SupportClassInput> = object({
  code: string()
    .trim()
    .required('Give the class a code, e.g. SC2.')
    .matches(/^[A-Za-z0-9][A-Za-z0-9._/-]{0,19}$/, 'Use up to 20 letters, digits, dots, slashes or dashes.'),
  name: string()
    .trim()
    .required('Give the class a name (up to 120 characters).')
    .max(120, 'Give the class a name (up to 120 characters).'),
  qMin: optionalNumber(Q_RANGE.message)
    .min(Q_RANGE.min, Q_RANGE.message)
    .max(Q_RANGE.max, Q_RANGE.message)
    .test('some-range', 'Give a Q range, an RMR89 range, or both.', function check(qMin) {
      const p = this.parent as SupportClassFormValues;
      return qMin !== null || [p.qMax, p.rmrMin, p.rmrMax].some((v) => typed(v) !== null);
    }),
  qMax: optionalNumber(Q_RANGE.message)
    .min(Q_RANGE.min, Q_RANGE.message)
    .max(Q_RANGE.max, Q_RANGE.message)
    .test('above-min', 'The upper Q bound must be above the lower one.', function check(qMax) {
      const qMin = typed((this.parent as SupportClassFormValues).qMin);
      return qMax === null || qMin === null || qMin === undefined || Number.isNaN(qMin) || qMin < qMax;
    }),
  rmrMin: optionalNumber(RMR_RANGE).integer(RMR_RANGE).min(0, RMR_RANGE).max(100, RMR_RANGE),
  rmrMax: optionalNumber(RMR_RANGE)
    .integer(RMR_RANGE)
    .min(0, RMR_RANGE)
    .max(100, RMR_RANGE)
    .test('not-below-min', 'The upper RMR89 bound must not be below the lower one.', function check(rmrMax) {
      const rmrMin = typed((this.parent as SupportClassFormValues).rmrMin);
      return (
        rmrMax === null || rmrMin === null || rmrMin === undefined || Number.isNaN(rmrMin) || rmrMin <= rmrMax
      );
    }),
  maxRoundLength: number()
    .transform((_v: unknown, original: unknown) => typed(original) ?? undefined)
    .typeError('Maximum round length is 0.3 to 8 m.')
    .required('Give the maximum round length in metres.')
    .min(0.3, 'Maximum round length is 0.3 to 8 m.')
    .max(8, 'Maximum round length is 0.3 to 8 m.'),
  boltType: string().trim().max(120, 'Up to 120 characters.').default('').defined(),
  boltLength: optionalNumber('Bolt length is 0.5 to 20 m.')
    .min(0.5, 'Bolt length is 0.5 to 20 m.')
    .max(20, 'Bolt length is 0.5 to 20 m.'),
  boltPattern: string().trim().max(120, 'Up to 120 characters.').default('').defined(),
  shotcreteMm: number()
    .transform((_v: unknown, original: unknown) => typed(original) ?? 0)
    .typeError('Sprayed concrete is a whole number of millimetres, 0 to 1000.')
    .integer('Sprayed concrete is a whole number of millimetres, 0 to 1000.')
    .min(0, 'Sprayed concrete is a whole number of millimetres, 0 to 1000.')
    .max(1000, 'Sprayed concrete is a whole number of millimetres, 0 to 1000.')
    .default(0)
    .required(),
  steelSupport: string().trim().max(160, 'Up to 160 characters.').default('').defined(),
  probingRequired: boolean().required(),
  notes: string().trim().max(4000, 'Notes take up to 4000 characters.').default('').defined(),
});

export function toSupportClassRequest(values: SupportClassFormValues): SupportClassInput {
  return supportClassSchema.validateSync(values, { stripUnknown: true });
}

const text = (n: number | null) => (n === null ? '' : String(n));

export function supportClassToFormValues(c: SupportClass): SupportClassFormValues {
  return {
    code: c.code,
    name: c.name,
    qMin: text(c.qMin),
    qMax: text(c.qMax),
    rmrMin: text(c.rmrMin),
    rmrMax: text(c.rmrMax),
    maxRoundLength: String(c.maxRoundLength),
    boltType: c.boltType,
    boltLength: text(c.boltLength),
    boltPattern: c.boltPattern,
    shotcreteMm: String(c.shotcreteMm),
    steelSupport: c.steelSupport,
    probingRequired: c.probingRequired,
    notes: c.notes,
  };
}

export const emptySupportClassValues: SupportClassFormValues = {
  code: '',
  name: '',
  qMin: '',
  qMax: '',
  rmrMin: '',
  rmrMax: '',
  maxRoundLength: '',
  boltType: '',
  boltLength: '',
  boltPattern: '',
  shotcreteMm: '0',
  steelSupport: '',
  probingRequired: false,
  notes: '',
};

export const supportClassFieldLabels: Partial<Record<keyof SupportClassFormValues, string>> = {
  code: 'Code',
  name: 'Name',
  qMin: 'Q from',
  qMax: 'Q below',
  rmrMin: 'RMR89 from',
  rmrMax: 'RMR89 to',
  maxRoundLength: 'Maximum round length',
  boltType: 'Bolt type',
  boltLength: 'Bolt length',
  boltPattern: 'Bolt pattern',
  shotcreteMm: 'Sprayed concrete',
  steelSupport: 'Steel sets or lattice girders',
  probingRequired: 'Probing required',
  notes: 'Notes',
};
