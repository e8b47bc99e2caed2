import { Field, Input, makeStyles, Textarea, tokens } from '@fluentui/react-components';
import { FormikSelectField, TOUCH_TARGET_PX } from '@roundbook/ui';
import { useField } from 'formik';
import { createContext, useContext } from 'react';
import type { ReactElement } from 'react';

/** What every field of the Round editor needs to know: may it be changed, and what did the server say. */
export interface RoundEditState {
  readOnly: boolean;
  /** Messages from the server (save or submit), by API field name. */
  serverErrors: Record<string, string>;
}

export const RoundEditContext = createContext<RoundEditState>({ readOnly: true, serverErrors: {} });

export function useRoundEdit(): RoundEditState {
  return useContext(RoundEditContext);
}

const useStyles = makeStyles({
  input: { minHeight: `${TOUCH_TARGET_PX}px`, width: '100%' },
  number: { fontVariantNumeric: 'tabular-nums' },
  hint: { color: tokens.colorNeutralForeground2 },
});

interface BaseProps {
  name: string;
  label: string;
  hint?: string | ReactElement;
  /** API field name whose server message shows here (defaults to `name`). */
  apiName?: string;
  /** A warning shown under the field when there is no error. */
  warning?: string | null;
}

function useMessage(name: string, apiName: string | undefined, warning: string | null | undefined) {
  const [, meta] = useField<string>(name);
  const { serverErrors } = useRoundEdit();
  const server = serverErrors[apiName ?? name];
  const local = meta.error !== undefined && meta.touched ? meta.error : undefined;
  const error = local ?? server;
  if (error !== undefined) return { validationState: 'error' as const, validationMessage: error };
  if (warning) return { validationState: 'warning' as const, validationMessage: warning };
  return { validationState: 'none' as const, validationMessage: undefined };
}

export interface NumberFieldProps extends BaseProps {
  unit?: string;
  /** Text fields for chainages accept 1+250.0; numbers get the numeric keypad. */
  inputMode?: 'decimal' | 'numeric' | 'text';
  onValueChange?: (value: string) => void;
}

/** A number typed on the numeric keypad, kept as typed; large for gloved hands. */
export function NumberField({
  name,
  label,
  hint,
  apiName,
  warning,
  unit,
  inputMode = 'decimal',
  onValueChange,
}: NumberFieldProps) {
  const styles = useStyles();
  const [field, , helpers] = useField<string>(name);
  const { readOnly } = useRoundEdit();
  const message = useMessage(name, apiName, warning);
  return (
    <Field label={label} hint={hint} size="large" {...message}>
      <Input
        className={styles.input}
        input={{ className: styles.number }}
        name={field.name}
        value={field.value ?? ''}
        inputMode={inputMode}
        autoComplete="off"
        size="large"
        readOnly={readOnly}
        contentAfter={unit}
        onChange={(_e, data) => {
          void helpers.setValue(data.value);
          onValueChange?.(data.value);
        }}
        onBlur={field.onBlur}
      />
    </Field>
  );
}

export function TextField({
  name,
  label,
  hint,
  apiName,
  warning,
  multiline,
}: BaseProps & { multiline?: boolean }) {
  const styles = useStyles();
  const [field, , helpers] = useField<string>(name);
  const { readOnly } = useRoundEdit();
  const message = useMessage(name, apiName, warning);
  return (
    <Field label={label} hint={hint} size="large" {...message}>
      {multiline ? (
        <Textarea
          name={field.name}
          value={field.value ?? ''}
          size="large"
          resize="vertical"
          readOnly={readOnly}
          onChange={(_e, data) => void helpers.setValue(data.value)}
          onBlur={field.onBlur}
        />
      ) : (
        <Input
          className={styles.input}
          name={field.name}
          value={field.value ?? ''}
          size="large"
          readOnly={readOnly}
          onChange={(_e, data) => void helpers.setValue(data.value)}
          onBlur={field.onBlur}
        />
      )}
    </Field>
  );
}

export interface ChoiceFieldProps {
  name: string;
  label: string;
  hint?: string | ReactElement;
  options: readonly { value: string; label: string }[];
  /** Shown as the first, empty choice. */
  placeholder?: string;
  onValueChange?: (value: string) => void;
}

/** A choice from a list: the packages/ui Formik adapter, shut while the round is read only. */
export function ChoiceField({ name, label, hint, options, placeholder, onValueChange }: ChoiceFieldProps) {
  const { readOnly } = useRoundEdit();
  const choices = placeholder === undefined ? options : [{ value: '', label: placeholder }, ...options];
  return (
    <FormikSelectField
      name={name}
      label={label}
      hint={hint}
      options={choices}
      disabled={readOnly}
      onValueChange={onValueChange}
    />
  );
}
