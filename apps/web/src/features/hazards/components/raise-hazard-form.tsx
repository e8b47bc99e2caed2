import { Field, makeStyles, Radio, RadioGroup, tokens } from '@fluentui/react-components';
import { formatChainageFor, hazardKindLabels, HAZARD_KINDS, TRIGGER_LEVELS } from '@roundbook/domain';
import {
  FormFooter,
  FormikInputField,
  FormikSelectField,
  TOUCH_TARGET_PX,
  TriggerLevelBadge,
} from '@roundbook/ui';
import { Form, Formik, useField } from 'formik';
import type { FormikHelpers } from 'formik';
import { useMemo, useState } from 'react';
import type { Hazard, Heading, TriggerLevel } from '@/api/contract';
import { useRaiseHazard } from '@/features/hazards/api/hazards';
import type { HazardFormValues } from '@/features/hazards/schemas/hazard.schema';
import {
  emptyHazardValues,
  hazardSchema,
  toCreateHazardRequest,
} from '@/features/hazards/schemas/hazard.schema';
import { applyServerErrors } from '@/lib/form-errors';

export interface RaiseHazardFormProps {
  projectId: string;
  heading: Heading;
  /** The face chainage the range starts from (the round's face, or the heading's latest face). */
  faceChainage: number | null;
  /** Set when raised from a round: the hazard records it. */
  round?: { id: string; roundNumber: number };
  onRaised: (hazard: Hazard) => void;
  onCancel: () => void;
}

const useStyles = makeStyles({
  form: { display: 'flex', flexDirection: 'column', rowGap: tokens.spacingVerticalL },
  pair: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fit, minmax(12rem, 1fr))',
    gap: tokens.spacingHorizontalL,
  },
  levels: { display: 'flex', flexWrap: 'wrap', columnGap: tokens.spacingHorizontalXL },
  radio: { minHeight: `${TOUCH_TARGET_PX}px`, display: 'inline-flex', alignItems: 'center' },
  note: { margin: 0, color: tokens.colorNeutralForeground2 },
});

function LevelField() {
  const styles = useStyles();
  const [field, meta, helpers] = useField<TriggerLevel | ''>('level');
  const showError = meta.touched && meta.error !== undefined;
  return (
    <Field
      label="Level"
      required
      size="large"
      validationState={showError ? 'error' : 'none'}
      validationMessage={showError ? meta.error : undefined}
    >
      <RadioGroup
        className={styles.levels}
        layout="horizontal"
        value={field.value}
        onChange={(_, d) => {
          void helpers.setValue(d.value as TriggerLevel);
        }}
        onBlur={() => void helpers.setTouched(true)}
      >
        {[...TRIGGER_LEVELS].reverse().map((level) => (
          <Radio
            key={level}
            className={styles.radio}
            value={level}
            label={{ children: <TriggerLevelBadge level={level} /> }}
            aria-label={level}
          />
        ))}
      </RadioGroup>
    </Field>
  );
}

/** Raise a hazard on the heading: what, where (a chainage range) and how serious, in a few large fields. */
export function RaiseHazardForm({
  projectId,
  heading,
  faceChainage,
  round,
  onRaised,
  onCancel,
}: RaiseHazardFormProps) {
  const styles = useStyles();
  const raise = useRaiseHazard(projectId, heading.id);
  const [problem, setProblem] = useState<string | null>(null);
  // One id per form: a retry after a lost answer finds the hazard the first try made.
  const id = useMemo(() => crypto.randomUUID(), []);
  const face = faceChainage === null ? null : formatChainageFor(faceChainage, heading);
  const submit = async (values: HazardFormValues, helpers: FormikHelpers<HazardFormValues>) => {
    setProblem(null);
    try {
      const hazard = await raise.mutateAsync(
        toCreateHazardRequest(values, round ? { id, origin: 'round', roundId: round.id } : { id }),
      );
      onRaised(hazard);
    } catch (error) {
      setProblem(applyServerErrors(error, helpers, values));
    }
  };
  return (
    <Formik initialValues={emptyHazardValues(faceChainage)} validationSchema={hazardSchema} onSubmit={submit}>
      {({ isSubmitting }) => (
        <Form className={styles.form} aria-label="Raise hazard" noValidate>
          {round && (
            <p className={styles.note}>
              Raised on round {round.roundNumber}
              {face ? ` (face at ${face})` : ''}.
            </p>
          )}
          <FormikSelectField
            name="kind"
            label="Kind"
            required
            options={[
              { value: '', label: 'Choose…' },
              ...HAZARD_KINDS.map((k) => ({ value: k, label: hazardKindLabels[k] })),
            ]}
          />
          <LevelField />
          <div className={styles.pair}>
            <FormikInputField
              name="fromChainage"
              label="From chainage"
              inputMode="decimal"
              contentAfter="m"
              required
              hint={face ? `Face at ${face}` : undefined}
            />
            <FormikInputField
              name="toChainage"
              label="To chainage"
              inputMode="decimal"
              contentAfter="m"
              required
            />
          </div>
          <FormikInputField name="description" label="What and where" multiline={3} required />
          <FormFooter
            problem={problem}
            problemTitle="Not raised"
            submitting={isSubmitting}
            submitLabel="Raise hazard"
            onCancel={onCancel}
          />
        </Form>
      )}
    </Formik>
  );
}
