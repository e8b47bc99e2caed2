import { Checkbox, Field, makeStyles, Textarea, tokens } from '@fluentui/react-components';
import {
  FormikInputField,
  StaleVersionNotice,
  TOUCH_TARGET_PX,
  FormFooter,
  FormSection,
} from '@roundbook/ui';
import { Form, Formik, useField } from 'formik';
import type { FormikHelpers } from 'formik';
import { useState } from 'react';
import type { SupportClass, SupportClassLibrary } from '@/api/contract';
import {
  useChangeSupportClasses,
  useReloadSupportClasses,
} from '@/features/support-classes/api/support-classes';
import type { SupportClassFormValues } from '@/features/support-classes/schemas/support-class.schema';
import {
  emptySupportClassValues,
  supportClassFieldLabels,
  supportClassSchema,
  supportClassToFormValues,
  toSupportClassRequest,
} from '@/features/support-classes/schemas/support-class.schema';
import { applyServerErrors } from '@/lib/form-errors';
import { useStaleVersion } from '@/lib/use-stale-version';

export interface SupportClassFormProps {
  projectId: string;
  /** The class to change; without it the form adds one at the end of the list. */
  supportClass?: SupportClass;
  onSaved: (library: SupportClassLibrary) => void;
  onCancel: () => void;
}

const useStyles = makeStyles({
  form: { display: 'flex', flexDirection: 'column', rowGap: tokens.spacingVerticalL, maxWidth: '72rem' },
  wide: { gridColumn: '1 / -1' },
  check: { minHeight: `${TOUCH_TARGET_PX}px`, display: 'inline-flex', alignItems: 'center' },
});

function ProbingField() {
  const styles = useStyles();
  const [field, , helpers] = useField<boolean>('probingRequired');
  return (
    <Checkbox
      className={styles.check}
      size="large"
      label="Probe ahead of the face before each round"
      checked={field.value}
      onChange={(_event, data) => void helpers.setValue(data.checked === true)}
    />
  );
}

function NotesField() {
  const [field, meta] = useField<string>('notes');
  const showError = meta.touched && meta.error !== undefined;
  return (
    <Field
      label="Notes"
      size="large"
      validationState={showError ? 'error' : 'none'}
      validationMessage={showError ? meta.error : undefined}
    >
      <Textarea
        name="notes"
        value={field.value}
        onChange={field.onChange}
        onBlur={field.onBlur}
        resize="vertical"
      />
    </Field>
  );
}

/** Adds or changes one support class of the project's library. */
export function SupportClassForm({ projectId, supportClass, onSaved, onCancel }: SupportClassFormProps) {
  const styles = useStyles();
  const change = useChangeSupportClasses(projectId);
  const reloadLibrary = useReloadSupportClasses(projectId);
  const [problem, setProblem] = useState<string | null>(null);
  const stale = useStaleVersion<SupportClass, SupportClassFormValues>({
    initialVersion: supportClass?.version ?? 0,
    toValues: supportClassToFormValues,
    labels: supportClassFieldLabels,
    reload:
      supportClass === undefined
        ? undefined
        : async () => {
            const library = await reloadLibrary();
            const found = library.classes.find((c) => c.id === supportClass.id);
            if (found === undefined) throw new Error('gone');
            return found;
          },
  });

  const submit = async (values: SupportClassFormValues, helpers: FormikHelpers<SupportClassFormValues>) => {
    setProblem(null);
    const body = toSupportClassRequest(values);
    try {
      const library =
        supportClass === undefined
          ? await change.mutateAsync({ kind: 'create', body })
          : await change.mutateAsync({
              kind: 'update',
              classId: supportClass.id,
              body: { ...body, version: stale.version },
            });
      const saved = library.classes.find((c) => c.code === body.code);
      stale.saved(saved?.version ?? stale.version);
      onSaved(library);
    } catch (error) {
      if (await stale.handle(error, values)) return;
      setProblem(applyServerErrors(error, helpers, values));
    }
  };

  return (
    <Formik<SupportClassFormValues>
      initialValues={
        supportClass === undefined ? emptySupportClassValues : supportClassToFormValues(supportClass)
      }
      validationSchema={supportClassSchema}
      onSubmit={submit}
    >
      {({ isSubmitting, resetForm }) => (
        <Form
          className={styles.form}
          noValidate
          aria-label={
            supportClass === undefined ? 'New support class' : `Change support class ${supportClass.code}`
          }
        >
          {stale.stale !== null && (
            <StaleVersionNotice
              message={stale.stale.message}
              differences={stale.stale.differences}
              state={stale.stale.state}
              onLoadTheirs={() => stale.loadTheirs((values) => resetForm({ values }))}
              onKeepMine={stale.keepMine}
              onDismiss={stale.dismiss}
            />
          )}
          <FormSection title="Class">
            <FormikInputField name="code" label="Code" hint="e.g. SC2" required />
            <div className={styles.wide}>
              <FormikInputField name="name" label="Name" required />
            </div>
          </FormSection>
          <FormSection title="Where it applies (Q, RMR89 or both)">
            <FormikInputField name="qMin" label="Q from" inputMode="decimal" hint="Empty: no lower bound" />
            <FormikInputField name="qMax" label="Q below" inputMode="decimal" hint="Empty: no upper bound" />
            <FormikInputField
              name="rmrMin"
              label="RMR89 from"
              inputMode="numeric"
              hint="Whole number, 0–100"
            />
            <FormikInputField
              name="rmrMax"
              label="RMR89 to"
              inputMode="numeric"
              hint="Included in the class"
            />
          </FormSection>
          <FormSection title="Rounds and support">
            <FormikInputField
              name="maxRoundLength"
              label="Maximum round length"
              inputMode="decimal"
              contentAfter="m"
              required
            />
            <FormikInputField name="boltType" label="Bolt type" />
            <FormikInputField name="boltLength" label="Bolt length" inputMode="decimal" contentAfter="m" />
            <FormikInputField name="boltPattern" label="Bolt pattern" hint="e.g. 1.5 × 1.5 m" />
            <FormikInputField
              name="shotcreteMm"
              label="Sprayed concrete"
              inputMode="numeric"
              contentAfter="mm"
            />
            <FormikInputField name="steelSupport" label="Steel sets or lattice girders" />
            <div className={styles.wide}>
              <ProbingField />
            </div>
            <div className={styles.wide}>
              <NotesField />
            </div>
          </FormSection>
          <FormFooter
            problem={problem}
            submitting={isSubmitting}
            submitLabel={supportClass === undefined ? 'Add class' : 'Save class'}
            onCancel={onCancel}
          />
        </Form>
      )}
    </Formik>
  );
}
