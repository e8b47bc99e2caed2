import {
  Button,
  Field,
  makeStyles,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Radio,
  RadioGroup,
  Switch,
  Textarea,
  tokens,
} from '@fluentui/react-components';
import { BeakerRegular } from '@fluentui/react-icons';
import {
  FormikInputField,
  FormikSelectField,
  roleLabels,
  StaleVersionNotice,
  TOUCH_TARGET_PX,
  FormFooter,
} from '@roundbook/ui';
import { Form, Formik, useField, useFormikContext } from 'formik';
import type { FormikHelpers, FormikProps } from 'formik';
import { useState } from 'react';
import type { ProjectRole, TriggerFires, TriggerLevel, TriggerRule, WatchedQuantity } from '@/api/contract';
import type { TriggerPreview } from '@/features/trigger-rules/api/trigger-rules';
import {
  useChangeTriggerRule,
  usePreviewTriggerRule,
  useReloadTriggerRules,
} from '@/features/trigger-rules/api/trigger-rules';
import { LevelBadge } from '@/features/trigger-rules/components/level-badge';
import type { RoundPlaceFormat } from '@/features/trigger-rules/components/trigger-preview';
import {
  TriggerPreviewResult,
  TriggerPreviewWaiting,
} from '@/features/trigger-rules/components/trigger-preview';
import type { TriggerRuleFormValues } from '@/features/trigger-rules/schemas/trigger-rule.schema';
import {
  emptyTriggerRuleValues,
  toTriggerRuleRequest,
  triggerRuleFieldLabels,
  triggerRuleSchema,
  triggerRuleToFormValues,
  typedRuleSummary,
} from '@/features/trigger-rules/schemas/trigger-rule.schema';
import {
  CHANGE_COMPARISONS,
  changeComparisonLabels,
  changeUnit,
  COMPARISONS,
  comparisonLabels,
  hasChangeForm,
  LEVELS,
  WATCHED,
  watchInfo,
} from '@/features/trigger-rules/utils/watch';
import { applyServerErrors } from '@/lib/form-errors';
import { useStaleVersion } from '@/lib/use-stale-version';

export interface TriggerRuleFormProps {
  projectId: string;
  rule?: TriggerRule;
  onSaved: (rule: TriggerRule) => void;
  onCancel: () => void;
  /** How rounds' chainages and stages are shown in a try on recent rounds (the headings' own formats). */
  placeFormat?: RoundPlaceFormat;
}

const ROLES: ProjectRole[] = ['engineer', 'geologist', 'supervisor', 'admin', 'viewer'];

const useStyles = makeStyles({
  form: { display: 'flex', flexDirection: 'column', rowGap: tokens.spacingVerticalL, maxWidth: '60rem' },
  group: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fill, minmax(14rem, 1fr))',
    gap: tokens.spacingHorizontalL,
    rowGap: tokens.spacingVerticalM,
    padding: tokens.spacingHorizontalL,
    border: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke2}`,
    borderRadius: tokens.borderRadiusLarge,
    backgroundColor: tokens.colorNeutralBackground1,
  },
  wide: { gridColumn: '1 / -1' },
  radio: { minHeight: `${TOUCH_TARGET_PX}px`, display: 'inline-flex', alignItems: 'center' },
  note: { gridColumn: '1 / -1', color: tokens.colorNeutralForeground2, margin: 0 },
  button: { minHeight: `${TOUCH_TARGET_PX}px`, minWidth: '9rem' },
});

/** What decides where a rule fires; a try is out of date once one of these changes. */
function conditionKey(values: TriggerRuleFormValues): string {
  return JSON.stringify([values.watch, values.fires, values.comparison, values.threshold.trim()]);
}

/** Comparison and threshold appear only when what is watched has them. */
function ConditionFields() {
  const styles = useStyles();
  const { values, setFieldValue, setFieldTouched } = useFormikContext<TriggerRuleFormValues>();
  const info = watchInfo[values.watch];
  const change = values.fires === 'change' && hasChangeForm(values.watch);
  const onWatch = (value: string) => {
    const watch = value as WatchedQuantity;
    const kind = watchInfo[watch].kind;
    const fires = hasChangeForm(watch) ? values.fires : 'value';
    if (fires !== values.fires) void setFieldValue('fires', fires, false);
    const comparison = values.comparison || '<';
    void setFieldValue(
      'comparison',
      kind !== 'numeric' ? '' : fires === 'change' && comparison === '=' ? '<' : comparison,
      false,
    );
    if (kind === 'flag') void setFieldValue('threshold', '', false);
    void setFieldTouched('threshold', false, false);
  };
  const onFires = (fires: TriggerFires) => {
    void setFieldValue('fires', fires, false);
    if (info.kind === 'numeric') {
      // A value and a change are different numbers: the threshold is typed again.
      void setFieldValue('threshold', '', false);
      if (fires === 'change' && values.comparison === '=') void setFieldValue('comparison', '<', false);
    }
    void setFieldTouched('threshold', false, false);
  };
  const unit = changeUnit(values.watch);
  return (
    <div className={styles.group}>
      <div className={styles.wide}>
        <FormikSelectField
          name="watch"
          label="Watches"
          required
          options={WATCHED.map((w) => ({ value: w, label: watchInfo[w].label }))}
          onValueChange={onWatch}
        />
      </div>
      {hasChangeForm(values.watch) && (
        <div className={styles.wide}>
          <Field label="Fires" size="large">
            <RadioGroup
              layout="horizontal"
              value={values.fires}
              onChange={(_e, d) => onFires(d.value as TriggerFires)}
            >
              <Radio className={styles.radio} value="value" label="On this round’s value" />
              <Radio
                className={styles.radio}
                value="change"
                label="On a change from the last round of the heading and stage"
              />
            </RadioGroup>
          </Field>
        </div>
      )}
      {info.kind === 'numeric' && change && (
        <>
          <FormikSelectField
            name="comparison"
            label="Fires on"
            required
            options={CHANGE_COMPARISONS.map((c) => ({ value: c, label: changeComparisonLabels[c]! }))}
          />
          <FormikInputField
            name="threshold"
            label="Size of the change"
            inputMode="decimal"
            contentAfter={unit === '' ? undefined : unit}
            required
          />
          <p className={styles.note}>
            {values.watch === 'q'
              ? 'Q is compared by ratio, in percent of the last round’s Q: a fall of 50 % is Q halving, say from 4 to 2.'
              : `The change is this round’s value less the last round’s, in ${unit}.`}{' '}
            The first round of a stage has nothing to compare with and stays clear.
          </p>
        </>
      )}
      {info.kind === 'numeric' && !change && (
        <>
          <FormikSelectField
            name="comparison"
            label="Fires when the value is"
            required
            options={COMPARISONS.map((c) => ({ value: c, label: comparisonLabels[c] }))}
          />
          <FormikInputField
            name="threshold"
            label="Threshold"
            inputMode="decimal"
            contentAfter={info.unit === '' ? undefined : info.unit}
            required
          />
        </>
      )}
      {info.kind === 'distance' && (
        <FormikInputField
          name="threshold"
          label="Within this distance ahead of the face"
          inputMode="decimal"
          contentAfter="m"
          required
        />
      )}
      {info.kind === 'flag' && !change && (
        <p className={styles.note}>This is a yes/no condition: the rule fires whenever it is true.</p>
      )}
      {info.kind === 'flag' && change && (
        <p className={styles.note}>
          This is a yes/no condition: the rule fires only when it newly appears, that is when it was clear on
          the last round of this heading and stage. While it stays, the rule is clear.
        </p>
      )}
      <p
        className={styles.note}
        data-testid="trigger-rule-in-words"
      >{`In words: ${typedRuleSummary(values)}`}</p>
    </div>
  );
}

function LevelField() {
  const styles = useStyles();
  const [field, , helpers] = useField<TriggerLevel>('level');
  return (
    <Field label="Level" required size="large">
      <RadioGroup
        layout="horizontal"
        value={field.value}
        onChange={(_e, d) => void helpers.setValue(d.value as TriggerLevel)}
      >
        {LEVELS.map((level) => (
          <Radio key={level} className={styles.radio} value={level} label={<LevelBadge level={level} />} />
        ))}
      </RadioGroup>
    </Field>
  );
}

function ActionField() {
  const [field, meta] = useField<string>('action');
  const showError = meta.touched && meta.error !== undefined;
  return (
    <Field
      label="Action to take"
      required
      size="large"
      validationState={showError ? 'error' : 'none'}
      validationMessage={showError ? meta.error : undefined}
    >
      <Textarea
        name="action"
        value={field.value}
        onChange={field.onChange}
        onBlur={field.onBlur}
        resize="vertical"
      />
    </Field>
  );
}

function EnabledField() {
  const [field, , helpers] = useField<boolean>('enabled');
  return (
    <Switch
      label={
        field.value
          ? 'Switched on: the rule is checked on every round'
          : 'Switched off: the rule is kept but not checked'
      }
      checked={field.value}
      onChange={(_e, d) => void helpers.setValue(d.checked)}
    />
  );
}

/** Adds or changes a trigger rule: what it watches, when it fires, the level, the action, who acts and how soon. */
export function TriggerRuleForm({ projectId, rule, onSaved, onCancel, placeFormat }: TriggerRuleFormProps) {
  const styles = useStyles();
  const change = useChangeTriggerRule(projectId);
  const [problem, setProblem] = useState<string | null>(null);
  const preview = usePreviewTriggerRule(projectId);
  const reloadRules = useReloadTriggerRules(projectId);
  const [tried, setTried] = useState<{ key: string; result: TriggerPreview } | null>(null);
  const [previewProblem, setPreviewProblem] = useState<string | null>(null);
  const stale = useStaleVersion<TriggerRule, TriggerRuleFormValues>({
    initialVersion: rule?.version ?? 0,
    toValues: triggerRuleToFormValues,
    labels: triggerRuleFieldLabels,
    reload:
      rule === undefined
        ? undefined
        : async () => {
            const found = (await reloadRules()).find((r) => r.id === rule.id);
            if (found === undefined) throw new Error('gone');
            return found;
          },
  });

  const submit = async (values: TriggerRuleFormValues, helpers: FormikHelpers<TriggerRuleFormValues>) => {
    setProblem(null);
    const body = toTriggerRuleRequest(values);
    try {
      const saved =
        rule === undefined
          ? await change.mutateAsync({ kind: 'create', body })
          : await change.mutateAsync({
              kind: 'update',
              ruleId: rule.id,
              body: { ...body, version: stale.version },
            });
      if (saved !== null) {
        stale.saved(saved.version);
        onSaved(saved);
      }
    } catch (error) {
      if (await stale.handle(error, values)) return;
      setProblem(applyServerErrors(error, helpers, values));
    }
  };

  /** Tries the rule as typed on the recent rounds; nothing is saved. */
  const tryRule = async (formik: FormikProps<TriggerRuleFormValues>) => {
    setPreviewProblem(null);
    const errors = await formik.validateForm();
    if (Object.keys(errors).length > 0) {
      const touched = Object.fromEntries(Object.keys(errors).map((k) => [k, true]));
      void formik.setTouched(touched, false);
      setPreviewProblem('Complete the rule first: see the messages under the fields.');
      return;
    }
    const { values } = formik;
    try {
      const result = await preview.mutateAsync(toTriggerRuleRequest(values));
      setTried({ key: conditionKey(values), result });
    } catch (error) {
      setPreviewProblem(applyServerErrors(error, formik, values));
    }
  };

  return (
    <Formik<TriggerRuleFormValues>
      initialValues={rule === undefined ? emptyTriggerRuleValues : triggerRuleToFormValues(rule)}
      validationSchema={triggerRuleSchema}
      onSubmit={submit}
    >
      {(formik) => (
        <Form
          className={styles.form}
          noValidate
          aria-label={rule === undefined ? 'New trigger rule' : 'Change trigger rule'}
        >
          {stale.stale !== null && (
            <StaleVersionNotice
              message={stale.stale.message}
              differences={stale.stale.differences}
              state={stale.stale.state}
              onLoadTheirs={() => stale.loadTheirs((values) => formik.resetForm({ values }))}
              onKeepMine={stale.keepMine}
              onDismiss={stale.dismiss}
            />
          )}
          <ConditionFields />
          <div className={styles.group}>
            <div className={styles.wide}>
              <LevelField />
            </div>
            <div className={styles.wide}>
              <ActionField />
            </div>
            <FormikSelectField
              name="ownerRole"
              label="Who acts"
              required
              options={ROLES.map((r) => ({ value: r, label: roleLabels[r] }))}
            />
            <FormikInputField
              name="timeAllowedHours"
              label="Time allowed"
              inputMode="decimal"
              contentAfter="h"
              required
            />
            <div className={styles.wide}>
              <EnabledField />
            </div>
          </div>
          <FormFooter
            problem={problem}
            submitting={formik.isSubmitting}
            submitLabel={rule === undefined ? 'Add rule' : 'Save rule'}
            onCancel={onCancel}
            extra={
              <Button
                size="large"
                className={styles.button}
                icon={<BeakerRegular />}
                disabled={preview.isPending}
                onClick={() => void tryRule(formik)}
              >
                Try on recent rounds
              </Button>
            }
          />
          {previewProblem !== null && (
            <div role="alert">
              <MessageBar intent="error" layout="multiline">
                <MessageBarBody>
                  <MessageBarTitle>Not tried</MessageBarTitle>
                  {previewProblem}
                </MessageBarBody>
              </MessageBar>
            </div>
          )}
          {preview.isPending && <TriggerPreviewWaiting />}
          {tried !== null && !preview.isPending && previewProblem === null && (
            <TriggerPreviewResult
              placeFormat={placeFormat}
              result={tried.result}
              level={formik.values.level}
              outdated={tried.key !== conditionKey(formik.values)}
            />
          )}
        </Form>
      )}
    </Formik>
  );
}
