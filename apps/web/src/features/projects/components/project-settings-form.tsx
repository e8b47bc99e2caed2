import {
  Button,
  Checkbox,
  Field,
  Input,
  makeStyles,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Spinner,
  tokens,
} from '@fluentui/react-components';
import { AddRegular, DeleteRegular } from '@fluentui/react-icons';
import { FormikInputField, FormikSelectField, StaleVersionNotice, TOUCH_TARGET_PX } from '@roundbook/ui';
import { FieldArray, Form, Formik, getIn, useFormikContext } from 'formik';
import type { FormikHelpers } from 'formik';
import { useState } from 'react';
import type { ProjectSummary } from '@/api/contract';
import { useReloadProject } from '@/features/projects/api/get-project';
import { useUpdateProject } from '@/features/projects/api/save-project';
import type { ProjectSettingsValues } from '@/features/projects/schemas/project-settings.schema';
import {
  GROUND_SCALES,
  groundScaleLabels,
  notationLabels,
  PLANE_NOTATIONS,
  projectSettingsLabels,
  projectSettingsSchema,
  projectToSettingsValues,
  Q_EDITIONS,
} from '@/features/projects/schemas/project-settings.schema';
import { timeZoneChoices } from '@/features/projects/utils/time-zones';
import { applyServerErrors } from '@/lib/form-errors';
import { useStaleVersion } from '@/lib/use-stale-version';

export interface ProjectSettingsFormProps {
  project: ProjectSummary;
  canEdit: boolean;
}

const useStyles = makeStyles({
  form: { display: 'flex', flexDirection: 'column', rowGap: tokens.spacingVerticalL, maxWidth: '60rem' },
  group: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fill, minmax(16rem, 1fr))',
    gap: tokens.spacingHorizontalL,
    rowGap: tokens.spacingVerticalM,
    padding: tokens.spacingHorizontalL,
    border: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke2}`,
    borderRadius: tokens.borderRadiusLarge,
    backgroundColor: tokens.colorNeutralBackground1,
  },
  wide: { gridColumn: '1 / -1' },
  row: {
    display: 'flex',
    gap: tokens.spacingHorizontalS,
    alignItems: 'flex-start',
    marginBottom: tokens.spacingVerticalS,
  },
  address: { flexGrow: 1 },
  input: { minHeight: `${TOUCH_TARGET_PX}px`, width: '100%' },
  button: { minHeight: `${TOUCH_TARGET_PX}px`, minWidth: `${TOUCH_TARGET_PX}px` },
  actions: { display: 'flex', gap: tokens.spacingHorizontalM },
  checkbox: { minHeight: `${TOUCH_TARGET_PX}px` },
  explain: { margin: 0, color: tokens.colorNeutralForeground2 },
});

function DistributionList({ disabled }: { disabled: boolean }) {
  const styles = useStyles();
  const formik = useFormikContext<ProjectSettingsValues>();
  const { values, errors, touched } = formik;
  const listError = typeof errors.distributionList === 'string' ? errors.distributionList : undefined;
  return (
    <FieldArray name="distributionList">
      {(list) => (
        <div role="group" aria-label="Handover distribution list">
          {values.distributionList.length === 0 && <p>No addresses yet: handovers go only to the shifts.</p>}
          {values.distributionList.map((address, index) => {
            const name = `distributionList.${index}`;
            const error = getIn(errors, name) as string | undefined;
            const shown = getIn(touched, name) === true && error !== undefined;
            return (
              <div className={styles.row} key={index}>
                <Field
                  className={styles.address}
                  label={`Address ${index + 1}`}
                  size="large"
                  validationState={shown ? 'error' : 'none'}
                  validationMessage={shown ? error : undefined}
                >
                  <Input
                    className={styles.input}
                    name={name}
                    type="email"
                    inputMode="email"
                    value={address}
                    disabled={disabled}
                    onChange={(event) => formik.handleChange(event)}
                    onBlur={(event) => formik.handleBlur(event)}
                  />
                </Field>
                {!disabled && (
                  <Button
                    className={styles.button}
                    size="large"
                    icon={<DeleteRegular />}
                    aria-label={`Remove address ${index + 1}`}
                    onClick={() => list.remove(index)}
                  />
                )}
              </div>
            );
          })}
          {listError !== undefined && <div role="alert">{listError}</div>}
          {!disabled && (
            <Button
              className={styles.button}
              size="large"
              icon={<AddRegular />}
              onClick={() => list.push('')}
            >
              Add address
            </Button>
          )}
        </div>
      )}
    </FieldArray>
  );
}

/** Separation of duties as a checkbox, with what it means in plain words. */
function SeparationOfDuties({ disabled }: { disabled: boolean }) {
  const styles = useStyles();
  const formik = useFormikContext<ProjectSettingsValues>();
  return (
    <div className={styles.wide}>
      <Checkbox
        className={styles.checkbox}
        name="separationOfDuties"
        size="large"
        label="Separation of duties: the person who mapped or submitted a round does not confirm it"
        checked={formik.values.separationOfDuties}
        disabled={disabled}
        onChange={(_, data) => void formik.setFieldValue('separationOfDuties', data.checked === true)}
      />
      <p className={styles.explain}>
        On (the default): a geologist who also holds the engineer role may return their own round but another
        engineer of the project confirms it. Off: any engineer may confirm any round, their own included.
        Either way every decision is signed and kept in the audit trail.
      </p>
    </div>
  );
}

/** The project's own settings: name, client, time zone, notation, Q edition, grid, distribution list. */
export function ProjectSettingsForm({ project, canEdit }: ProjectSettingsFormProps) {
  const styles = useStyles();
  const update = useUpdateProject(project.id);
  const reloadProject = useReloadProject(project.id);
  const [problem, setProblem] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);
  const stale = useStaleVersion<ProjectSummary, ProjectSettingsValues>({
    initialVersion: project.version,
    toValues: projectToSettingsValues,
    labels: projectSettingsLabels,
    reload: reloadProject,
  });

  const submit = async (values: ProjectSettingsValues, helpers: FormikHelpers<ProjectSettingsValues>) => {
    setProblem(null);
    setSaved(false);
    const body = projectSettingsSchema.validateSync(values);
    try {
      const next = await update.mutateAsync({ ...body, version: stale.version });
      stale.saved(next.version);
      helpers.resetForm({ values: projectToSettingsValues(next) });
      setSaved(true);
    } catch (error) {
      if (await stale.handle(error, values)) return;
      setProblem(applyServerErrors(error, helpers, values));
    }
  };

  return (
    <Formik<ProjectSettingsValues>
      initialValues={projectToSettingsValues(project)}
      validationSchema={projectSettingsSchema}
      onSubmit={submit}
    >
      {({ isSubmitting, resetForm, dirty }) => (
        <Form className={styles.form} noValidate aria-label="Project settings">
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
          <div className={styles.group}>
            <FormikInputField name="name" label="Project name" required disabled={!canEdit} />
            <FormikInputField name="client" label="Client" disabled={!canEdit} />
            <FormikSelectField
              name="timeZone"
              label="Time zone"
              hint="Shift dates and times follow it"
              required
              disabled={!canEdit}
              options={timeZoneChoices(project.timeZone).map((z) => ({ value: z, label: z }))}
            />
            <FormikSelectField
              name="defaultNotation"
              label="Orientation notation for entry"
              disabled={!canEdit}
              options={PLANE_NOTATIONS.map((n) => ({ value: n, label: notationLabels[n] }))}
            />
            <FormikSelectField
              name="qTableEdition"
              label="Q table edition"
              disabled={!canEdit}
              options={Q_EDITIONS.map((e) => ({ value: e, label: `Q tables, ${e} edition` }))}
            />
            <FormikSelectField
              name="groundScale"
              label="Weathering and strength grades"
              disabled={!canEdit}
              options={GROUND_SCALES.map((g) => ({ value: g, label: groundScaleLabels[g] }))}
            />
            <FormikInputField
              name="coordinateGrid"
              label="Coordinate grid"
              hint="The grid in which the headings' start coordinates are given"
              disabled={!canEdit}
            />
          </div>
          <div className={styles.group}>
            <div className={styles.wide}>
              <strong>Handover distribution list</strong>
              <p>Every handover is also sent to these addresses.</p>
              <DistributionList disabled={!canEdit} />
            </div>
            <FormikInputField
              name="handoverAckMinutes"
              label="Time to acknowledge a handover"
              hint="After this many minutes unacknowledged, a handover is flagged overdue and the outgoing supervisor and the engineers are told (60 is our default)"
              inputMode="numeric"
              contentAfter="min"
              required
              disabled={!canEdit}
            />
          </div>
          <div className={styles.group}>
            <SeparationOfDuties disabled={!canEdit} />
          </div>
          {problem !== null && (
            <div role="alert">
              <MessageBar intent="error" layout="multiline">
                <MessageBarBody>
                  <MessageBarTitle>Not saved</MessageBarTitle>
                  {problem}
                </MessageBarBody>
              </MessageBar>
            </div>
          )}
          {saved && !dirty && (
            <div role="status">
              <MessageBar intent="success">
                <MessageBarBody>Project settings saved.</MessageBarBody>
              </MessageBar>
            </div>
          )}
          {canEdit && (
            <div className={styles.actions}>
              <Button
                type="submit"
                appearance="primary"
                size="large"
                className={styles.button}
                disabled={isSubmitting}
                icon={isSubmitting ? <Spinner size="tiny" /> : undefined}
              >
                Save settings
              </Button>
            </div>
          )}
        </Form>
      )}
    </Formik>
  );
}
