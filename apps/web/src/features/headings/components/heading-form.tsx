import {
  Checkbox,
  Field,
  makeStyles,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Radio,
  RadioGroup,
  Subtitle2,
  Textarea,
  tokens,
} from '@fluentui/react-components';
import { formatChainage, gradientDegreesToPercent, gradientPercentToDegrees } from '@roundbook/geomath';
import {
  ConfirmDialog,
  FormikInputField,
  FormikSelectField,
  StaleVersionNotice,
  TOUCH_TARGET_PX,
  FormFooter,
  FormSection,
} from '@roundbook/ui';
import { Form, Formik, useField, useFormikContext } from 'formik';
import type { FormikHelpers } from 'formik';
import { useState } from 'react';
import type { ExcavationStage, Heading } from '@/api/contract';
import { useReloadHeading } from '@/features/headings/api/get-headings';
import { useSaveHeading } from '@/features/headings/api/save-heading';
import { ProfilePreview } from '@/features/headings/components/profile-preview';
import type { GradientUnit, HeadingFormValues } from '@/features/headings/schemas/heading.schema';
import {
  convertGradient,
  emptyHeadingValues,
  headingFieldLabels,
  headingSchema,
  headingToFormValues,
  toHeadingRequest,
  trimmed,
  typedNumber,
} from '@/features/headings/schemas/heading.schema';
import {
  chainageStyleLabels,
  PROFILE_SHAPES,
  profileShapeLabels,
  STAGES,
  stageLabels,
} from '@/features/headings/utils/labels';
import type { RecomputeQuestion } from '@/features/headings/utils/needs-confirmation';
import { changedFieldsText, recomputeQuestionOf } from '@/features/headings/utils/needs-confirmation';
import { isApiError, NETWORK_ERROR_CODE } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';
import { useStaleVersion } from '@/lib/use-stale-version';

export interface HeadingFormProps {
  projectId: string;
  /** The heading to change; without it the form adds a new one. */
  heading?: Heading;
  /** Name of the project's coordinate grid, shown with the start coordinates. */
  coordinateGrid: string;
  onSaved: (heading: Heading) => void;
  onCancel: () => void;
}

const useStyles = makeStyles({
  layout: {
    display: 'grid',
    gridTemplateColumns: 'minmax(0, 3fr) minmax(18rem, 2fr)',
    gap: tokens.spacingHorizontalXXL,
    alignItems: 'start',
    '@media (max-width: 900px)': { gridTemplateColumns: 'minmax(0, 1fr)' },
  },
  fields: { display: 'flex', flexDirection: 'column', rowGap: tokens.spacingVerticalL },
  wide: { gridColumn: '1 / -1' },
  // Two of the section's 12rem columns, where there are two, so the choice reads whole (issue 19 item 5).
  double: { minWidth: 0, '@media (min-width: 40rem)': { gridColumn: 'span 2' } },
  aside: {
    position: 'sticky',
    top: tokens.spacingVerticalL,
    display: 'flex',
    flexDirection: 'column',
    rowGap: tokens.spacingVerticalM,
  },
  choices: { display: 'flex', flexWrap: 'wrap', columnGap: tokens.spacingHorizontalL },
  plain: { border: 'none', margin: 0, padding: 0 },
  plainLegend: { padding: 0, marginBottom: tokens.spacingVerticalXS, fontWeight: tokens.fontWeightSemibold },
  error: { color: tokens.colorPaletteRedForeground1, marginTop: tokens.spacingVerticalXS },
  check: { minHeight: `${TOUCH_TARGET_PX}px`, display: 'inline-flex', alignItems: 'center' },
  facts: {
    display: 'grid',
    gridTemplateColumns: 'max-content 1fr',
    columnGap: tokens.spacingHorizontalM,
    rowGap: tokens.spacingVerticalXXS,
    margin: `${tokens.spacingVerticalM} 0 0`,
    '& dt': { fontWeight: tokens.fontWeightSemibold },
    '& dd': { margin: 0 },
  },
});

const GRADIENT_RENAME = { gradientPercent: 'gradient' };

/** A change the server asked to be confirmed, with what is needed to send it again. */
interface PendingRecompute {
  question: RecomputeQuestion;
  values: HeadingFormValues;
  helpers: FormikHelpers<HeadingFormValues>;
}

function GradientField() {
  const styles = useStyles();
  const [field, , helpers] = useField<string>('gradient');
  const [unitField, , unitHelpers] = useField<GradientUnit>('gradientUnit');
  const value = typedNumber(field.value);
  let other = '';
  if (value !== undefined && !Number.isNaN(value)) {
    if (unitField.value === 'percent') other = `= ${trimmed(gradientPercentToDegrees(value), 2)}°`;
    else if (Math.abs(value) < 90) other = `= ${trimmed(gradientDegreesToPercent(value), 2)} %`;
  }
  return (
    <>
      <FormikInputField
        name="gradient"
        label="Gradient (rising +, falling −)"
        inputMode="decimal"
        contentAfter={unitField.value === 'percent' ? '%' : '°'}
        hint={other === '' ? 'In the direction of advance.' : `${other}, in the direction of advance.`}
        required
      />
      <Field label="Gradient typed in" size="large">
        <RadioGroup
          layout="horizontal"
          value={unitField.value}
          onChange={(_event, data) => {
            const to = data.value as GradientUnit;
            if (to === unitField.value) return;
            void helpers.setValue(convertGradient(field.value, to), false);
            void unitHelpers.setValue(to);
          }}
        >
          <Radio className={styles.check} value="percent" label="per cent" />
          <Radio className={styles.check} value="degrees" label="degrees" />
        </RadioGroup>
      </Field>
    </>
  );
}

/** A multi-line text field bound to the form (the alignment segments, one a line). */
function FormikTextareaField({ name, label, hint }: { name: string; label: string; hint: string }) {
  const [field, meta] = useField<string>(name);
  const error = meta.touched && meta.error ? meta.error : undefined;
  return (
    <Field
      label={label}
      hint={hint}
      size="large"
      validationState={error ? 'error' : 'none'}
      validationMessage={error}
    >
      <Textarea {...field} value={field.value} resize="vertical" rows={3} />
    </Field>
  );
}

function StagesField() {
  const styles = useStyles();
  const [field, meta, helpers] = useField<ExcavationStage[]>('stages');
  const showError = meta.touched && typeof meta.error === 'string';
  return (
    <fieldset className={styles.plain} aria-describedby={showError ? 'stages-error' : undefined}>
      <legend className={styles.plainLegend}>Stages in use</legend>
      <div className={styles.choices}>
        {STAGES.map((stage) => (
          <Checkbox
            key={stage}
            className={styles.check}
            size="large"
            label={stageLabels[stage]}
            checked={field.value.includes(stage)}
            onChange={(_event, data) => {
              const next =
                data.checked === true
                  ? STAGES.filter((s) => s === stage || field.value.includes(s))
                  : field.value.filter((s) => s !== stage);
              void helpers.setValue(next);
              void helpers.setTouched(true, false);
            }}
          />
        ))}
      </div>
      {showError && (
        <div id="stages-error" role="alert" className={styles.error}>
          {meta.error}
        </div>
      )}
    </fieldset>
  );
}

function chainageHintText(values: HeadingFormValues): string {
  try {
    const metres = headingSchema.fields.startChainage.cast(values.startChainage) as number;
    const decimals = Number(values.chainageDecimals);
    return `Shown as ${formatChainage(metres, { style: values.chainageStyle, decimals })}`;
  } catch {
    return 'Type 1+250.0 or 1250.0';
  }
}

function ChainageHint() {
  const { values } = useFormikContext<HeadingFormValues>();
  return <>{chainageHintText(values)}</>;
}

function Preview() {
  const { values } = useFormikContext<HeadingFormValues>();
  const n = (s: string) => {
    const v = typedNumber(s);
    return v === undefined || Number.isNaN(v) ? undefined : v;
  };
  return (
    <ProfilePreview
      shape={values.profileShape === '' ? undefined : values.profileShape}
      width={n(values.profileWidth)}
      height={n(values.profileHeight)}
      axisHeight={n(values.axisHeight)}
    />
  );
}

/** Adds or changes a heading: position, direction, profile (with a to-scale preview), stages, start point. */
export function HeadingForm({ projectId, heading, coordinateGrid, onSaved, onCancel }: HeadingFormProps) {
  const styles = useStyles();
  const save = useSaveHeading(projectId);
  const [problem, setProblem] = useState<string | null>(null);
  const [pending, setPending] = useState<PendingRecompute | null>(null);
  const [pendingProblem, setPendingProblem] = useState<string | null>(null);
  const [declined, setDeclined] = useState(false);
  const reloadHeading = useReloadHeading(projectId);
  const stale = useStaleVersion<Heading, HeadingFormValues>({
    initialVersion: heading?.version ?? 0,
    toValues: headingToFormValues,
    labels: headingFieldLabels,
    reload: heading === undefined ? undefined : () => reloadHeading(heading.id),
  });
  const initialValues = heading === undefined ? emptyHeadingValues : headingToFormValues(heading);

  const submit = async (values: HeadingFormValues, helpers: FormikHelpers<HeadingFormValues>) => {
    setProblem(null);
    setDeclined(false);
    const body = toHeadingRequest(values);
    try {
      const saved =
        heading === undefined
          ? await save.mutateAsync({ kind: 'create', body })
          : await save.mutateAsync({
              kind: 'update',
              headingId: heading.id,
              body: { ...body, version: stale.version },
            });
      stale.saved(saved.version);
      onSaved(saved);
    } catch (error) {
      const question = recomputeQuestionOf(error);
      if (question !== null && heading !== undefined) {
        // Rounds exist: ask first. The typing stays in the form whatever the answer.
        setPendingProblem(null);
        setPending({ question, values, helpers });
        return;
      }
      if (await stale.handle(error, values)) return;
      setProblem(applyServerErrors(error, helpers, values, GRADIENT_RENAME));
    }
  };

  /** The same change again, now with the person's yes to reworking the rounds. */
  const confirmRecompute = async () => {
    if (pending === null || heading === undefined) return;
    const { values, helpers } = pending;
    setPendingProblem(null);
    try {
      const saved = await save.mutateAsync({
        kind: 'update',
        headingId: heading.id,
        body: { ...toHeadingRequest(values), version: stale.version, confirmRecompute: true },
      });
      setPending(null);
      stale.saved(saved.version);
      onSaved(saved);
    } catch (error) {
      if (isApiError(error) && error.code === NETWORK_ERROR_CODE) {
        // Nothing was decided by the server: stay in the dialog so the person can try again.
        setPendingProblem(applyServerErrors(error, helpers, values, GRADIENT_RENAME));
        return;
      }
      setPending(null);
      if (await stale.handle(error, values)) return;
      setProblem(applyServerErrors(error, helpers, values, GRADIENT_RENAME));
    }
  };

  const declineRecompute = () => {
    setPending(null);
    setPendingProblem(null);
    setDeclined(true);
  };

  return (
    <Formik<HeadingFormValues>
      initialValues={initialValues}
      validationSchema={headingSchema}
      onSubmit={submit}
    >
      {({ isSubmitting, resetForm }) => (
        <Form
          noValidate
          aria-label={heading === undefined ? 'New heading' : `Change heading ${heading.code}`}
        >
          <div className={styles.layout}>
            <div className={styles.fields}>
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
              <FormSection title="Name and start">
                <FormikInputField name="code" label="Code" hint="Short, e.g. HR-U" required />
                <div className={styles.wide}>
                  <FormikInputField name="name" label="Name" required />
                </div>
                <FormikInputField
                  name="startChainage"
                  label="Start chainage"
                  inputMode="decimal"
                  placeholder="1+250.0"
                  hint={<ChainageHint />}
                  required
                />
                <FormikSelectField
                  name="chainageStyle"
                  label="Chainage shown as"
                  options={(['km+m', 'metres'] as const).map((s) => ({
                    value: s,
                    label: chainageStyleLabels[s],
                  }))}
                />
                <FormikSelectField
                  name="chainageDecimals"
                  label="Decimals shown"
                  options={['0', '1', '2', '3'].map((d) => ({ value: d, label: d }))}
                />
              </FormSection>

              <FormSection title="Direction">
                <FormikInputField
                  name="driveTrend"
                  label="Drive direction (trend)"
                  inputMode="decimal"
                  contentAfter="°"
                  hint="Clockwise from north, 0 to 359.99"
                  required
                />
                <GradientField />
                <div className={styles.double}>
                  <FormikSelectField
                    name="chainageSense"
                    label="Chainage in the drive direction"
                    options={[
                      { value: 'increasing', label: 'Increases (driven with the chainage)' },
                      { value: 'decreasing', label: 'Decreases (driven against the chainage)' },
                    ]}
                  />
                </div>
                <FormikInputField
                  name="initialBearing"
                  label="Bearing at the start (optional)"
                  inputMode="decimal"
                  contentAfter="°"
                  hint="When a curve begins at the start; empty: the drive direction"
                />
                <div className={styles.wide}>
                  <FormikTextareaField
                    name="alignmentSegments"
                    label="Alignment from the start (optional)"
                    hint="One segment a line, in the drive direction: a straight is its length (120); an arc its length, radius and side (80 300 right). Straight on after the last."
                  />
                </div>
              </FormSection>

              <FormSection title="Excavation profile">
                <FormikSelectField
                  name="profileShape"
                  label="Shape"
                  required
                  options={PROFILE_SHAPES.map((s) => ({ value: s, label: profileShapeLabels[s] }))}
                />
                <FormikInputField
                  name="profileWidth"
                  label="Width"
                  inputMode="decimal"
                  contentAfter="m"
                  required
                />
                <FormikInputField
                  name="profileHeight"
                  label="Height"
                  inputMode="decimal"
                  contentAfter="m"
                  hint="Invert to crown"
                  required
                />
                <FormikInputField
                  name="axisHeight"
                  label="Axis above invert"
                  inputMode="decimal"
                  contentAfter="m"
                  required
                />
              </FormSection>

              <FormSection title="Stages and rounds">
                <div className={styles.wide}>
                  <StagesField />
                </div>
                <FormikInputField
                  name="benchHeight"
                  label="Bench line above invert (staged profiles)"
                  inputMode="decimal"
                  contentAfter="m"
                  hint="Top heading above it, bench below; empty: at the axis"
                />
                <FormikInputField
                  name="plannedRoundLength"
                  label="Planned round length"
                  inputMode="decimal"
                  contentAfter="m"
                  required
                />
              </FormSection>

              <FormSection title={`Start point (optional, ${coordinateGrid || 'project grid'})`}>
                <FormikInputField name="startEasting" label="Easting" inputMode="decimal" contentAfter="m" />
                <FormikInputField
                  name="startNorthing"
                  label="Northing"
                  inputMode="decimal"
                  contentAfter="m"
                />
                <FormikInputField
                  name="startElevation"
                  label="Elevation"
                  inputMode="decimal"
                  contentAfter="m"
                />
              </FormSection>

              {declined && (
                <div role="status" data-testid="recompute-declined">
                  <MessageBar intent="info" layout="multiline">
                    <MessageBarBody>
                      <MessageBarTitle>Nothing was saved</MessageBarTitle>
                      The heading and its rounds are as they were. Your typing is still in the form: put the
                      old values back, or save again and confirm.
                    </MessageBarBody>
                  </MessageBar>
                </div>
              )}
              <FormFooter
                problem={problem}
                submitting={isSubmitting}
                submitLabel={heading === undefined ? 'Add heading' : 'Save heading'}
                onCancel={onCancel}
              />
            </div>
            <aside className={styles.aside} aria-label="Profile to scale">
              <Subtitle2>Profile to scale</Subtitle2>
              <Preview />
            </aside>
          </div>
          <ConfirmDialog
            open={pending !== null}
            title={
              pending === null || heading === undefined
                ? ''
                : `Change the ${changedFieldsText(pending.question.fields) || 'drive or profile'} of ${heading.code}?`
            }
            confirmLabel="Save and recompute"
            cancelLabel="Don't save"
            busy={save.isPending}
            problem={pendingProblem}
            onConfirm={() => void confirmRecompute()}
            onCancel={declineRecompute}
          >
            <p>{pending?.question.message}</p>
            {pending !== null && (
              <dl className={styles.facts}>
                {pending.question.rounds !== null && (
                  <>
                    <dt>Rounds recorded</dt>
                    <dd data-testid="recompute-rounds">{pending.question.rounds}</dd>
                  </>
                )}
                {pending.question.fields.length > 0 && (
                  <>
                    <dt>Changed</dt>
                    <dd>{changedFieldsText(pending.question.fields)}</dd>
                  </>
                )}
              </dl>
            )}
          </ConfirmDialog>
        </Form>
      )}
    </Formik>
  );
}
