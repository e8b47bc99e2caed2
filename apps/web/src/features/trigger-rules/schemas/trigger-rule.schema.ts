import { Q_RANGE, RMR_RANGE, triggerRuleSummary } from '@roundbook/domain';
import { boolean, mixed, number, object, string } from 'yup';
import type { ObjectSchema } from 'yup';
import type {
  Comparison,
  CreateTriggerRuleRequest,
  ProjectRole,
  TriggerFires,
  TriggerLevel,
  TriggerRule,
  WatchedQuantity,
} from '@/api/contract';
import {
  CHANGE_COMPARISONS,
  COMPARISONS,
  hasChangeForm,
  LEVELS,
  WATCHED,
  watchInfo,
} from '@/features/trigger-rules/utils/watch';

export interface TriggerRuleFormValues {
  watch: WatchedQuantity;
  /** On the round's value, or on a change from the last round (only where the watch has a change form). */
  fires: TriggerFires;
  comparison: Comparison | '';
  /** On a change of a numeric watch: the size of the fall or rise, without a sign (the comparison says which). */
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
  fires: mixed<TriggerFires>()
    .oneOf(['value', 'change'], 'Choose how the rule fires.')
    .default('value')
    .defined()
    .when('watch', ([watch]: WatchedQuantity[], schema) =>
      hasChangeForm(watch) ? schema : schema.transform(() => 'value'),
    ),
  comparison: mixed<Comparison>()
    .transform((value: unknown) => (value === '' ? null : value))
    .oneOf(COMPARISONS)
    .nullable()
    .default(null)
    .defined()
    .when(['watch', 'fires'], (keys: unknown[], schema) => {
      const [watch, fires] = keys as [WatchedQuantity, TriggerFires];
      return watchInfo[watch]?.kind !== 'numeric'
        ? schema.transform(() => null)
        : fires === 'change' && hasChangeForm(watch)
          ? schema
              .nonNullable('Choose whether the rule fires on a fall or on a rise.')
              .oneOf(CHANGE_COMPARISONS, 'Choose whether the rule fires on a fall or on a rise.')
          : schema.nonNullable('Choose how the value is compared with the threshold.');
    }),
  threshold: number()
    .transform((_v: unknown, original: unknown) => typed(original))
    .typeError('The threshold is a number.')
    .nullable()
    .default(null)
    .defined()
    .when(['watch', 'fires', 'comparison'], (keys: unknown[], schema) => {
      const [watch, fires, comparison] = keys as [WatchedQuantity, TriggerFires, string];
      if (fires === 'change' && hasChangeForm(watch) && watchInfo[watch]?.kind === 'numeric') {
        const s = schema
          .typeError('The change is a number.')
          .nonNullable('Give the change that fires the rule.')
          .min(0, 'Give the size of the change without a sign: the choice beside it says fall or rise.');
        const falls = comparison === '<' || comparison === '<=';
        if (watch === 'q' && falls)
          return s.lessThan(100, 'Q cannot fall by 100 % or more: give a fall between 0 and 99 %.');
        if (watch === 'rmr89') return s.max(100, 'RMR89 changes by at most 100 points.');
        return s.max(1e6, 'That change is too large.');
      }
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

/** The request as the API takes it: a fall of a change rule is sent as a negative change. */
export function toTriggerRuleRequest(values: TriggerRuleFormValues): TriggerRuleInput {
  const body = triggerRuleSchema.validateSync(values, { stripUnknown: true });
  const falls = body.comparison === '<' || body.comparison === '<=';
  return body.fires === 'change' && falls && body.threshold !== null && body.threshold !== 0
    ? { ...body, threshold: -body.threshold }
    : body;
}

/** The rule as typed, in words ("Q falls by more than 50 % from the last round → amber"); "?" where a number is missing. */
export function typedRuleSummary(values: TriggerRuleFormValues): string {
  const kind = watchInfo[values.watch].kind;
  const fires = hasChangeForm(values.watch) ? values.fires : 'value';
  const comparison = kind === 'numeric' && values.comparison !== '' ? values.comparison : null;
  const typedNumber = kind === 'flag' ? null : typed(values.threshold);
  const size = typedNumber === null || Number.isNaN(typedNumber) ? null : typedNumber;
  const falls = comparison === '<' || comparison === '<=';
  const threshold = fires === 'change' && falls && size !== null && size !== 0 ? -Math.abs(size) : size;
  return triggerRuleSummary({ watch: values.watch, comparison, threshold, level: values.level, fires });
}

export const emptyTriggerRuleValues: TriggerRuleFormValues = {
  watch: 'q',
  fires: 'value',
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
    fires: r.fires,
    comparison: r.comparison ?? '',
    // A change rule's fall is stored as a negative change; the form shows its size.
    threshold: r.threshold === null ? '' : String(r.fires === 'change' ? Math.abs(r.threshold) : r.threshold),
    level: r.level,
    action: r.action,
    ownerRole: r.ownerRole,
    timeAllowedHours: String(r.timeAllowedHours),
    enabled: r.enabled,
  };
}

export const triggerRuleFieldLabels: Partial<Record<keyof TriggerRuleFormValues, string>> = {
  watch: 'Watches',
  fires: 'Fires',
  comparison: 'Comparison',
  threshold: 'Threshold',
  level: 'Level',
  action: 'Action',
  ownerRole: 'Who acts',
  timeAllowedHours: 'Time allowed',
  enabled: 'Switched on',
};
