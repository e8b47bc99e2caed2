import {
  Button,
  makeStyles,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Spinner,
  tokens,
} from '@fluentui/react-components';
import { FormikInputField, FormikSelectField, TOUCH_TARGET_PX } from '@roundbook/ui';
import { Form, Formik } from 'formik';
import type { FormikHelpers } from 'formik';
import { useMemo, useState } from 'react';
import type { ProjectSummary } from '@/api/contract';
import { useCreateProject } from '@/features/projects/api/save-project';
import type { NewProjectValues } from '@/features/projects/schemas/new-project.schema';
import { emptyNewProject, newProjectSchema } from '@/features/projects/schemas/new-project.schema';
import {
  GROUND_SCALES,
  groundScaleLabels,
  notationLabels,
  PLANE_NOTATIONS,
} from '@/features/projects/schemas/project-settings.schema';
import { supportedTimeZones, timeZoneChoices } from '@/features/projects/utils/time-zones';
import { applyServerErrors } from '@/lib/form-errors';

export interface NewProjectFormProps {
  /** Called once the server has the project (the caller is its admin). */
  onCreated: (project: ProjectSummary) => void | Promise<void>;
  onCancel: () => void;
  /** Starting values (tests; otherwise this device's time zone and the usual defaults). */
  initialValues?: NewProjectValues;
  /** The zones to offer; an empty list gives a typed field instead (browsers that cannot list them). */
  timeZones?: string[];
}

const useStyles = makeStyles({
  form: { display: 'flex', flexDirection: 'column', rowGap: tokens.spacingVerticalL, maxWidth: '52rem' },
  group: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fill, minmax(18rem, 1fr))',
    alignItems: 'start',
    gap: tokens.spacingHorizontalL,
    rowGap: tokens.spacingVerticalM,
    padding: tokens.spacingHorizontalL,
    border: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke2}`,
    borderRadius: tokens.borderRadiusLarge,
    backgroundColor: tokens.colorNeutralBackground1,
  },
  actions: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalM },
  button: { minHeight: `${TOUCH_TARGET_PX}px`, minWidth: '10rem' },
});

/** A new project in six fields; headings, classes, triggers and the team follow in its Setup. */
export function NewProjectForm({ onCreated, onCancel, initialValues, timeZones }: NewProjectFormProps) {
  const styles = useStyles();
  const create = useCreateProject();
  const [problem, setProblem] = useState<string | null>(null);
  const start = useMemo(() => initialValues ?? emptyNewProject(), [initialValues]);
  const zones = useMemo(() => timeZones ?? supportedTimeZones(), [timeZones]);

  const submit = async (values: NewProjectValues, helpers: FormikHelpers<NewProjectValues>) => {
    setProblem(null);
    const body = newProjectSchema.validateSync(values);
    try {
      const project = await create.mutateAsync(body);
      await onCreated(project);
    } catch (error) {
      setProblem(applyServerErrors(error, helpers, values));
    }
  };

  return (
    <Formik<NewProjectValues> initialValues={start} validationSchema={newProjectSchema} onSubmit={submit}>
      {({ isSubmitting }) => (
        <Form className={styles.form} noValidate aria-label="New project">
          <div className={styles.group}>
            <FormikInputField
              name="code"
              label="Project code"
              hint="Short and unique, e.g. BRH; it cannot be changed later"
              autoComplete="off"
              required
            />
            <FormikInputField name="name" label="Project name" autoComplete="off" required />
            <FormikInputField name="client" label="Client" autoComplete="off" />
            {zones.length > 0 ? (
              <FormikSelectField
                name="timeZone"
                label="Time zone"
                hint="Shift dates and times follow it"
                required
                options={timeZoneChoices(start.timeZone, zones).map((z) => ({ value: z, label: z }))}
              />
            ) : (
              <FormikInputField
                name="timeZone"
                label="Time zone"
                hint="A zone name such as Europe/Zurich; shift dates and times follow it"
                autoComplete="off"
                required
              />
            )}
            <FormikSelectField
              name="defaultNotation"
              label="Orientation notation for entry"
              hint="Offered first when joints are typed; any notation can still be chosen per joint"
              options={PLANE_NOTATIONS.map((n) => ({ value: n, label: notationLabels[n] }))}
            />
            <FormikSelectField
              name="groundScale"
              label="Weathering and strength grades"
              hint="One scale for the whole project"
              options={GROUND_SCALES.map((g) => ({ value: g, label: groundScaleLabels[g] }))}
            />
          </div>
          {problem !== null && (
            <div role="alert">
              <MessageBar intent="error" layout="multiline">
                <MessageBarBody>
                  <MessageBarTitle>Project not created</MessageBarTitle>
                  {problem}
                </MessageBarBody>
              </MessageBar>
            </div>
          )}
          <div className={styles.actions}>
            <Button
              type="submit"
              appearance="primary"
              size="large"
              className={styles.button}
              disabled={isSubmitting}
              icon={isSubmitting ? <Spinner size="tiny" /> : undefined}
            >
              Create project
            </Button>
            <Button size="large" className={styles.button} disabled={isSubmitting} onClick={onCancel}>
              Cancel
            </Button>
          </div>
        </Form>
      )}
    </Formik>
  );
}
