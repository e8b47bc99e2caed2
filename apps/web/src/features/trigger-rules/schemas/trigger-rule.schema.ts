import { Q_RANGE, RMR_RANGE } from '@roundbook/domain';
import { boolean, mixed, number, object, string } from 'yup';
import type { ObjectSchema } from 'yup';
import type {
  Comparison,
  CreateTriggerRuleRequest,
  ProjectRole,
  TriggerLevel,
  TriggerRule,
  WatchedQuantity,
} from '@/api/contract';
import { COMPARISONS, LEVELS, WATCHED, watchInfo } from '@/features/trigger-rules/utils/watch';

export interface TriggerRuleFormValues {
  watch: WatchedQuantity;
  comparison: Comparison | '';
  threshold: string;
  level: TriggerLevel;
  action: string;
  ownerRole: ProjectRole;
  timeAllowedHours: string;
  enabled: boolean;
}

export type TriggerRuleInput = Required<CreateTriggerRuleRequest>;

const ROLES: ProjectRole[] = ['admin', 'geologist', 'engineer', 'supervisor', 'viewer'];

function typed(original: unknown): number | null {
  if (typeof original === 'number') return original;
  if (typeof original !== 'string' || original.trim() === '') return null;
  const text = original.trim().replace(',', '.');
  return /^-?(\d+\.?\d*|\.\d+)$/.test(text) ? Number(text) : Number.NaN;
}

export const triggerRuleSchema: ObjectSchema<TriggerRuleInput> = object({
  watch: mixed<WatchedQuantity>()
    .oneOf(WATCHED, 'Choose what the rule watches.')
    .required('Choose what the rule watches.'),
  comparison: mixed<Comparison>()
    .transform((value: unknown) => (value === '' ? null : value))
    .oneOf(COMPARISONS)
    .nullable()
    .default(null)
    .defined()
    .when('watch', ([watch]: WatchedQuantity[], schema) =>
      watchInfo[watch]?.kind === 'numeric'
        ? schema.nonNullable('Choose how the value is compared with the threshold.')
        : schema.transform(() => null),
    ),
  threshold: number()
    .transform((_v: unknown, original: unknown) => typed(original))
    .typeError('The threshold is a number.')
    .nullable()
    .default(null)
    .defined()
    .when('watch', ([watch]: WatchedQuantity[], schema) => {
      switch (watchInfo[watch]?.kind) {
        case 'numeric': {
          const s = schema.nonNullable('Give the threshold.');
          if (watch === 'q') return s.min(Q_RANGE.min, Q_RANGE.message).max(Q_RANGE.max, Q_RANGE.message);
          if (watch === 'rmr89')
            return s.min(RMR_RANGE.min, RMR_RANGE.message).max(RMR_RANGE.max, RMR_RANGE.message);
          return s.min(0, 'The threshold cannot be negative.').max(1e6, 'That threshold is too large.');
        }
        case 'distance':
          return schema
            .nonNullable('Give the distance ahead of the face, in metres.')
            .moreThan(0, 'Give the distance ahead of the face, in metres.')
            .max(1e6, 'That distance is too large.');
        case 'flag':
        case undefined:
          return schema.transform(() => null);
      }
    }),
  level: mixed<TriggerLevel>()
    .oneOf(LEVELS, 'Choose green, amber or red.')
    .required('Choose green, amber or red.'),
  action: string()
    .trim()
    .required('Say what is to be done when the rule fires.')
    .min(3, 'Say what is to be done when the rule fires.')
    .max(2000, 'The action takes up to 2000 characters.'),
  ownerRole: mixed<ProjectRole>()
    .oneOf(ROLES, 'Choose the role that acts.')
    .required('Choose the role that acts.'),
  timeAllowedHours: number()
    .transform((_v: unknown, original: unknown) => typed(original) ?? undefined)
    .typeError('Time allowed is 0 to 720 hours.')
    .required('Give the time allowed to act, in hours.')
    .min(0, 'Time allowed is 0 to 720 hours.')
    .max(720, 'Time allowed is 0 to 720 hours.'),
  enabled: boolean().required(),
});

export function toTriggerRuleRequest(values: TriggerRuleFormValues): TriggerRuleInput {
  return triggerRuleSchema.validateSync(values, { stripUnknown: true });
}

export const emptyTriggerRuleValues: TriggerRuleFormValues = {
  watch: 'q',
  comparison: '<',
  threshold: '',
  level: 'amber',
  action: '',
  ownerRole: 'engineer',
  timeAllowedHours: '4',
  enabled: true,
};

export function triggerRuleToFormValues(r: TriggerRule): TriggerRuleFormValues {
  return {
    watch: r.watch,
    comparison: r.comparison ?? '',
    threshold: r.threshold === null ? '' : String(r.threshold),
    level: r.level,
    action: r.action,
    ownerRole: r.ownerRole,
    timeAllowedHours: String(r.timeAllowedHours),
    enabled: r.enabled,
  };
}

export const triggerRuleFieldLabels: Partial<Record<keyof TriggerRuleFormValues, string>> = {
  watch: 'Watches',
  comparison: 'Comparison',
  threshold: 'Threshold',
  level: 'Level',
  action: 'Action',
  ownerRole: 'Who acts',
  timeAllowedHours: 'Time allowed',
  enabled: 'Switched on',
};
