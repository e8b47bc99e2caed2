import { Field, Input, makeStyles } from '@fluentui/react-components';
import type { InputProps } from '@fluentui/react-components';
import { useField } from 'formik';
import type { ReactElement } from 'react';
import { TOUCH_TARGET_PX } from '../theme/touch';

export interface FormikInputFieldProps {
  /** Formik field name. */
  name: string;
  label: string;
  type?: InputProps['type'];
  hint?: string | ReactElement;
  required?: boolean;
  autoComplete?: string;
  inputMode?: InputProps['inputMode'];
  placeholder?: string;
  disabled?: boolean;
  /** A unit or short note shown inside the input, after the value (m, °, %). */
  contentAfter?: string | ReactElement;
}

const useStyles = makeStyles({
  input: { minHeight: `${TOUCH_TARGET_PX}px` },
});

/**
 * A Fluent `Field` + `Input` bound to a Formik field: value, change and blur go to Formik, and
 * the field's error is shown once the field has been touched (or the form submitted).
 */
export function FormikInputField({
  name,
  label,
  type = 'text',
  hint,
  required,
  autoComplete,
  inputMode,
  placeholder,
  disabled,
  contentAfter,
}: FormikInputFieldProps) {
  const styles = useStyles();
  const [field, meta] = useField<string>(name);
  const showError = meta.touched && meta.error !== undefined;
  return (
    <Field
      label={label}
      hint={hint}
      required={required}
      validationState={showError ? 'error' : 'none'}
      validationMessage={showError ? meta.error : undefined}
      size="large"
    >
      <Input
        className={styles.input}
        name={field.name}
        value={field.value ?? ''}
        onChange={field.onChange}
        onBlur={field.onBlur}
        type={type}
        autoComplete={autoComplete}
        inputMode={inputMode}
        placeholder={placeholder}
        disabled={disabled}
        contentAfter={contentAfter}
        size="large"
      />
    </Field>
  );
}
