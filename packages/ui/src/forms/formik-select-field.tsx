import { Field, makeStyles, Select } from '@fluentui/react-components';
import { useField } from 'formik';
import type { ReactElement } from 'react';
import { TOUCH_TARGET_PX } from '../theme/touch';

export interface SelectOption {
  value: string;
  label: string;
}

export interface FormikSelectFieldProps {
  name: string;
  label: string;
  options: readonly SelectOption[];
  hint?: string | ReactElement;
  required?: boolean;
  disabled?: boolean;
  /** Called after Formik has the new value (e.g. to clear fields that no longer apply). */
  onValueChange?: (value: string) => void;
}

// A native <select> is as wide as its longest option; with the automatic minimum width of grid and flex items
// that width pushed the field out of its grid cell over the next one (a long time zone, issue 19 item 5).
// Zero minimum widths keep the field in its cell; the chosen text then has the cell's width.
const useStyles = makeStyles({
  field: { minWidth: 0 },
  select: { minWidth: 0, '& select': { minWidth: 0, minHeight: `${TOUCH_TARGET_PX}px` } },
});

/** A Fluent `Field` + native `Select` bound to a Formik field (large, for gloved hands). */
export function FormikSelectField({
  name,
  label,
  options,
  hint,
  required,
  disabled,
  onValueChange,
}: FormikSelectFieldProps) {
  const styles = useStyles();
  const [field, meta, helpers] = useField<string>(name);
  const showError = meta.touched && meta.error !== undefined;
  return (
    <Field
      className={styles.field}
      label={label}
      hint={hint}
      required={required}
      validationState={showError ? 'error' : 'none'}
      validationMessage={showError ? meta.error : undefined}
      size="large"
    >
      <Select
        className={styles.select}
        name={field.name}
        value={field.value ?? ''}
        size="large"
        disabled={disabled}
        onChange={(_event, data) => {
          void helpers.setValue(data.value);
          onValueChange?.(data.value);
        }}
        onBlur={field.onBlur}
      >
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </Select>
    </Field>
  );
}
