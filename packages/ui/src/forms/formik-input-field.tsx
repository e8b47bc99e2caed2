import { Field, Input, makeStyles, Textarea } from '@fluentui/react-components';
import type { InputProps } from '@fluentui/react-components';
import { useField } from 'formik';
import type { ChangeEvent, ReactElement } from 'react';
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
  /** Shown and focusable but not editable (a record that is no longer a draft, a person who only reads). */
  readOnly?: boolean;
  /** A unit or short note shown inside the input, after the value (m, °, %). Not with multiline. */
  contentAfter?: string | ReactElement;
  /**
   * A message from outside the form's schema (the server's answer to a save or submit). Shown as the
   * field's error at once, touched or not; the schema's own error wins once the field is touched.
   */
  message?: string;
  /** A warning shown under the field while it has no error (worth a look, does not stop saving). */
  warning?: string | null;
  /** Called with the new text after Formik has it (to clear or set a field that depends on this one). */
  onValueChange?: (value: string) => void;
  /** A text area of this many rows instead of a one-line input. */
  multiline?: boolean | number;
}

// An <input> is about 20 characters wide by itself; with the automatic minimum width of grid items that width
// (and a unit after it) pushed the field over the next one in a narrow grid cell (Is50 over the next label,
// issue 19 item 5). Zero minimum widths keep the field and its input in their cell.
const useStyles = makeStyles({
  field: { minWidth: 0 },
  input: { minHeight: `${TOUCH_TARGET_PX}px`, minWidth: 0 },
});

/**
 * A Fluent `Field` + `Input` (or `Textarea`) bound to a Formik field: value, change and blur go to
 * Formik, and the field's error is shown once the field has been touched (or the form submitted).
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
  readOnly,
  contentAfter,
  message,
  warning,
  onValueChange,
  multiline,
}: FormikInputFieldProps) {
  const styles = useStyles();
  const [field, meta] = useField<string>(name);
  const schemaError = meta.touched && meta.error !== undefined ? meta.error : undefined;
  const error = schemaError ?? message;
  const onChange = (event: ChangeEvent<HTMLInputElement | HTMLTextAreaElement>) => {
    field.onChange(event);
    onValueChange?.(event.target.value);
  };
  const common = {
    className: styles.input,
    name: field.name,
    value: field.value ?? '',
    onChange,
    onBlur: field.onBlur,
    autoComplete,
    placeholder,
    disabled,
    readOnly,
    size: 'large' as const,
  };
  return (
    <Field
      className={styles.field}
      label={label}
      hint={hint}
      required={required}
      validationState={error !== undefined ? 'error' : warning ? 'warning' : 'none'}
      validationMessage={error ?? (warning || undefined)}
      size="large"
    >
      {multiline ? (
        <Textarea {...common} rows={typeof multiline === 'number' ? multiline : 3} resize="vertical" />
      ) : (
        <Input {...common} type={type} inputMode={inputMode} contentAfter={contentAfter} />
      )}
    </Field>
  );
}
